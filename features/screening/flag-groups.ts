// Flags as a coach reads them: one card per pattern and side, the tasks that showed it listed as
// evidence inside. Pure.
import type { Evidence, Flag, FlagSide, PatternId, Severity, TaskId, ThresholdRef } from './engine';
import { getTask } from './engine/battery';

export type FlagEvidenceGroup = {
  /** Where it was seen: a task, a left/right comparison, or the whole assessment. */
  where: string;
  flagId: string;
  severity: Severity;
  evidence: Evidence[];
};

export type FlagGroup = {
  key: string;
  pattern: PatternId;
  title: string;
  side: FlagSide;
  /** The most severe of the grouped flags. */
  severity: Severity;
  /** One entry per task (or comparison) that showed the pattern on this side. */
  tasks: FlagEvidenceGroup[];
  /** Every threshold met, each once, deciding ones first. */
  thresholds: ThresholdRef[];
  /** Where each threshold (by `rowId`) was met: the tasks or comparisons, in the order of `tasks`. */
  thresholdWhere: Record<string, string[]>;
};

const SEVERITY_RANK: Record<Severity, number> = { watch: 1, concern: 2 };

export function flagWhere(flag: Pick<Flag, 'taskId' | 'comparesTasks'>): string {
  if (flag.taskId) return getTask(flag.taskId).title;
  if (flag.comparesTasks) return `${pairTitle(flag.comparesTasks)}, left compared with right`;
  return 'Whole assessment';
}

/** "Single-leg squat" from "Single-leg squat, left" and "Single-leg squat, right". */
function pairTitle([a]: readonly [TaskId, TaskId]): string {
  return getTask(a).title.replace(/,\s*(left|right)(\s+(leg|ankle|side))?$/i, '');
}

/** Groups flags by pattern and side, most severe first, keeping the engine's order otherwise. */
export function groupFlags(flags: readonly Flag[]): FlagGroup[] {
  const groups = new Map<string, FlagGroup>();
  for (const f of flags) {
    const key = `${f.pattern}/${f.side ?? 'none'}`;
    let g = groups.get(key);
    if (!g) {
      g = { key, pattern: f.pattern, title: f.title, side: f.side, severity: f.severity, tasks: [], thresholds: [], thresholdWhere: {} };
      groups.set(key, g);
    }
    if (SEVERITY_RANK[f.severity] > SEVERITY_RANK[g.severity]) g.severity = f.severity;
    g.tasks.push({ where: flagWhere(f), flagId: f.id, severity: f.severity, evidence: f.evidence });
    const where = flagWhere(f);
    for (const t of f.thresholdsMet) {
      if (!g.thresholds.some((x) => x.rowId === t.rowId)) g.thresholds.push(t);
      const at = (g.thresholdWhere[t.rowId] ??= []);
      if (!at.includes(where)) at.push(where);
    }
  }
  const out = [...groups.values()];
  for (const g of out) {
    g.tasks.sort((a, b) => SEVERITY_RANK[b.severity] - SEVERITY_RANK[a.severity]);
    g.thresholds.sort((a, b) => SEVERITY_RANK[b.severity] - SEVERITY_RANK[a.severity]);
  }
  return out.sort((a, b) => SEVERITY_RANK[b.severity] - SEVERITY_RANK[a.severity]);
}

/**
 * The "Met in" line of one threshold on a card of several tasks: the tasks by name where only some
 * met it, "Met in both tasks" / "Met in all 3 tasks" where every task on the card did (our choice:
 * the list would repeat the card's tasks word for word). Null on a card of one task.
 */
export function thresholdWhereText(where: readonly string[], taskCount: number): string | null {
  if (taskCount < 2 || where.length === 0) return null;
  if (where.length >= taskCount) return taskCount === 2 ? 'Met in both tasks' : `Met in all ${taskCount} tasks`;
  return `Met in: ${where.join('; ')}`;
}
