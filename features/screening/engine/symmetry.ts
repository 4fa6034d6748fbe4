import { EngineInputError, requireFinite } from './errors';

/**
 * Limb symmetry index in percent, in the "smaller over larger" form:
 * min(left, right) / max(left, right) x 100, so 100 is perfectly even and the
 * value does not depend on which side is called involved. Both values must be
 * zero or more; two equal values (zeros included) give 100.
 */
export function limbSymmetryIndex(left: number, right: number): number {
  const l = requireFinite('left', left);
  const r = requireFinite('right', right);
  if (l < 0) throw new EngineInputError('left', `must be 0 or more, got ${l}`);
  if (r < 0) throw new EngineInputError('right', `must be 0 or more, got ${r}`);
  if (l === r) return 100;
  return (Math.min(l, r) / Math.max(l, r)) * 100;
}

/** Absolute left-right difference, in the unit of the inputs. */
export function asymmetry(left: number, right: number): number {
  const l = requireFinite('left', left);
  const r = requireFinite('right', right);
  const d = Math.abs(l - r);
  if (!Number.isFinite(d)) throw new EngineInputError('right', 'the difference is too large to represent');
  return d;
}
