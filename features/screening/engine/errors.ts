/**
 * Thrown for impossible input: a missing or non-finite value, two coincident
 * points, a negative distance, an age outside the range an equation was
 * derived on. `field` names the offending input (a dotted path inside
 * evaluateAssessment, a parameter name in the standalone functions) so a form
 * or the server's error middleware can point at it.
 */
export class EngineInputError extends Error {
  override readonly name = 'EngineInputError';
  readonly code = 'ENGINE_INPUT';
  readonly field: string;
  /** The message without the field prefix. */
  readonly reason: string;

  constructor(field: string, reason: string) {
    super(`${field}: ${reason}`);
    this.field = field;
    this.reason = reason;
  }
}

/** Re-throw an EngineInputError from a helper with the caller's path in front of its field. */
export function withField<T>(path: string, run: () => T): T {
  try {
    return run();
  } catch (error) {
    if (error instanceof EngineInputError) {
      throw new EngineInputError(`${path}.${error.field}`, error.reason);
    }
    throw error;
  }
}

export function requireFinite(field: string, value: unknown): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new EngineInputError(field, `must be a finite number, got ${String(value)}`);
  }
  return value;
}

export function requirePositive(field: string, value: unknown): number {
  const n = requireFinite(field, value);
  if (n <= 0) throw new EngineInputError(field, `must be greater than 0, got ${n}`);
  return n;
}

export function requireRange(field: string, value: unknown, min: number, max: number, unit = ''): number {
  const n = requireFinite(field, value);
  if (n < min || n > max) {
    const u = unit ? ` ${unit}` : '';
    throw new EngineInputError(field, `must be between ${min} and ${max}${u}, got ${n}${u}`);
  }
  return n;
}
