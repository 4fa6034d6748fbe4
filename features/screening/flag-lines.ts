import type { Flag } from '@/features/screening/engine';

export type FlagGroup = { key: string; flag: Flag; sides: Set<string>; count: number };

/**
 * One line per pattern and severity, each side at its highest severity over the tasks (as the result's
 * flag cards count it): a left knee of concern in one task and of watch in another is one concern on the
 * left, not a concern and a watch for the same knee. The same pattern seen in several tasks is one line.
 */
export function groupFlags(flags: Flag[]): FlagGroup[] {
  const rank = (s: Flag['severity']) => (s === 'concern' ? 2 : 1);
  // Per pattern and side: the highest severity, and how many findings.
  const perSide = new Map<string, { flag: Flag; side: string | null; severity: Flag['severity']; count: number }>();
  for (const f of flags) {
    const sides: (string | null)[] = f.side === 'both' ? ['left', 'right'] : [f.side ?? null];
    sides.forEach((side, i) => {
      const key = `${f.pattern}|${side ?? 'none'}`;
      const at = perSide.get(key) ?? { flag: f, side, severity: f.severity, count: 0 };
      if (rank(f.severity) > rank(at.severity)) at.severity = f.severity;
      // A finding on both sides is one finding.
      if (i === 0) at.count += 1;
      perSide.set(key, at);
    });
  }
  const groups = new Map<string, FlagGroup>();
  for (const { flag, side, severity, count } of perSide.values()) {
    const key = `${flag.pattern}|${severity}`;
    const g = groups.get(key) ?? { key, flag: { ...flag, severity }, sides: new Set<string>(), count: 0 };
    if (side) g.sides.add(side);
    g.count += count;
    groups.set(key, g);
  }
  return [...groups.values()].sort((a, b) => rank(b.flag.severity) - rank(a.flag.severity));
}

export function sidesText(sides: Set<string>): string {
  if (sides.size === 2) return 'both sides';
  if (sides.size === 1) return `${[...sides][0]} side`;
  return '';
}
