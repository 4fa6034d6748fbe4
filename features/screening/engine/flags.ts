/**
 * Pattern flags from measurements and ticked criteria, through the threshold
 * table only. One flag per pattern, task (or pair) and side; when several
 * rows are met the most severe sets the severity and all are listed.
 */
import { criterionSide, getTask } from './battery';
import { derivationText, meetsThreshold, rowApplies, THRESHOLDS, type Scope, type ThresholdRow } from './thresholds';
import type { Evidence, Flag, FlagSide, Measurement, PatternId, Severity, Sex, TaskId, ThresholdRef } from './types';
import type { NormalizedAssessment } from './validate';

export const PATTERN_ORDER: readonly PatternId[] = [
  'dynamic-knee-valgus',
  'contralateral-pelvic-drop',
  'limited-ankle-dorsiflexion',
  'left-right-asymmetry',
  'heels-lifting',
  'squat-depth-not-reached',
  'excessive-trunk-lean',
  'growth-spurt-window',
];

export const PATTERN_TITLES: Readonly<Record<PatternId, string>> = {
  'dynamic-knee-valgus': 'Knee collapsing inward (dynamic knee valgus)',
  'contralateral-pelvic-drop': 'Pelvis dropping on the free-leg side (contralateral pelvic drop)',
  'limited-ankle-dorsiflexion': 'Limited forward bend of the ankle (limited ankle dorsiflexion)',
  'left-right-asymmetry': 'Left-right difference (asymmetry)',
  'heels-lifting': 'Heels lifting in the full squat',
  'squat-depth-not-reached': 'Full squat depth not reached',
  'excessive-trunk-lean': 'Excessive trunk lean',
  'growth-spurt-window': 'Growth-spurt window (around peak height velocity)',
};

const SEVERITY_RANK: Record<Severity, number> = { watch: 1, concern: 2 };

// Indexes over the threshold table, built once: detectFlags runs per assessment.
const ROW_ORDER = new Map<ThresholdRow, number>(THRESHOLDS.map((r, i) => [r, i]));
const ROWS_BY_METRIC = new Map<string, ThresholdRow[]>();
for (const r of THRESHOLDS) {
  const list = ROWS_BY_METRIC.get(r.metric) ?? [];
  list.push(r);
  ROWS_BY_METRIC.set(r.metric, list);
}
const NO_ROWS: readonly ThresholdRow[] = [];

/** A ticked criterion that indicates a pattern. */
export interface Observation {
  taskId: TaskId;
  criterionId: string;
  text: string;
  pattern: PatternId;
  side: FlagSide;
}

interface Hit {
  row: ThresholdRow;
  measured: boolean;
}

interface Group {
  pattern: PatternId;
  scope: Scope | null;
  taskId: TaskId | null;
  comparesTasks?: readonly [TaskId, TaskId];
  side: FlagSide;
  hits: Hit[];
  evidence: Evidence[];
}

function scopeOf(m: Measurement): Scope | null {
  if (m.taskId) return m.taskId;
  if (m.comparesTasks) return getTask(m.comparesTasks[0]).pair;
  return null;
}

function keyOf(pattern: PatternId, scope: Scope | null, side: FlagSide): string {
  let key: string = pattern;
  if (scope !== null) key += `/${scope}`;
  if (side !== null) key += `/${side}`;
  return key;
}

function makeRef(row: ThresholdRow): ThresholdRef {
  const ref: ThresholdRef = {
    rowId: row.id,
    comparison: row.comparison,
    value: row.value,
    unit: row.unit,
    severity: row.severity,
    source: row.source,
    sourceKind: row.sourceKind,
    certainty: row.certainty,
  };
  if (row.upperValue !== undefined) ref.upperValue = row.upperValue;
  const derivation = derivationText(row);
  if (derivation !== undefined) ref.derivation = derivation;
  if (row.populationNote !== undefined) ref.populationNote = row.populationNote;
  return Object.freeze(ref);
}

/** One frozen reference per row, shared by every flag that cites it (saves allocation per assessment). */
const REF_BY_ROW = new Map<ThresholdRow, ThresholdRef>(THRESHOLDS.map((r) => [r, makeRef(r)]));

function toRef(row: ThresholdRow): ThresholdRef {
  return REF_BY_ROW.get(row) ?? makeRef(row);
}

export function observationsOf(n: NormalizedAssessment): Observation[] {
  const out: Observation[] = [];
  for (const t of n.tasks.values()) {
    for (const c of t.spec.criteria) {
      if (!c.indicates || !t.criteria.includes(c.id)) continue;
      out.push({
        taskId: t.spec.id,
        criterionId: c.id,
        text: c.text,
        pattern: c.indicates,
        side: criterionSide(t.spec, c, n.athlete.racketHand),
      });
    }
  }
  return out;
}

/**
 * Flags from measurements (measured rows) and observations (observed-criteria
 * rows). Exported apart from evaluateAssessment so threshold tests can feed
 * exact values.
 */
export function detectFlags(measurements: readonly Measurement[], observations: readonly Observation[], sex: Sex): Flag[] {
  const groups = new Map<string, Group>();
  const groupFor = (pattern: PatternId, scope: Scope | null, taskId: TaskId | null, side: FlagSide, compares?: readonly [TaskId, TaskId]): Group => {
    const key = keyOf(pattern, scope, side);
    let g = groups.get(key);
    if (!g) {
      g = { pattern, scope, taskId, side, hits: [], evidence: [] };
      if (compares) g.comparesTasks = compares;
      groups.set(key, g);
    }
    return g;
  };

  for (const m of measurements) {
    if (m.metric === 'observed-criteria') continue;
    const scope = scopeOf(m);
    for (const row of ROWS_BY_METRIC.get(m.metric) ?? NO_ROWS) {
      if (!rowApplies(row, scope, sex) || !meetsThreshold(row, m.value)) continue;
      const g = groupFor(row.pattern, scope, m.taskId, m.side, m.comparesTasks);
      g.hits.push({ row, measured: true });
      if (!g.evidence.some((e) => e.kind === 'measurement' && e.measurementId === m.id)) {
        g.evidence.push({ kind: 'measurement', measurementId: m.id, label: m.label, value: m.value, unit: m.unit });
      }
    }
  }

  // Count ticked criteria per pattern, task and side, then compare the count with the observed row.
  const counted = new Map<string, Observation[]>();
  for (const o of observations) {
    const key = keyOf(o.pattern, o.taskId, o.side);
    const list = counted.get(key) ?? [];
    list.push(o);
    counted.set(key, list);
  }
  for (const list of counted.values()) {
    const first = list[0];
    if (!first) continue;
    const row = (ROWS_BY_METRIC.get('observed-criteria') ?? NO_ROWS).find((r) => r.pattern === first.pattern && rowApplies(r, first.taskId, sex));
    if (!row || !meetsThreshold(row, list.length)) continue;
    const g = groupFor(first.pattern, first.taskId, first.taskId, first.side);
    g.hits.push({ row, measured: false });
    for (const o of list) {
      g.evidence.push({ kind: 'criterion', criterionId: o.criterionId, taskId: o.taskId, label: o.text });
    }
  }

  const flags: Flag[] = [];
  for (const [id, g] of groups) {
    const hits = [...g.hits].sort(
      (a, b) =>
        SEVERITY_RANK[b.row.severity] - SEVERITY_RANK[a.row.severity] ||
        Number(b.measured) - Number(a.measured) ||
        (ROW_ORDER.get(a.row) ?? 0) - (ROW_ORDER.get(b.row) ?? 0),
    );
    const deciding = hits[0];
    if (!deciding) continue;
    const flag: Flag = {
      id,
      pattern: g.pattern,
      title: PATTERN_TITLES[g.pattern],
      taskId: g.taskId,
      side: g.side,
      severity: deciding.row.severity,
      evidence: g.evidence,
      threshold: toRef(deciding.row),
      source: deciding.row.source,
      thresholdsMet: hits.map((h) => toRef(h.row)),
    };
    if (g.comparesTasks) flag.comparesTasks = g.comparesTasks;
    flags.push(flag);
  }
  return flags.sort(
    (a, b) =>
      SEVERITY_RANK[b.severity] - SEVERITY_RANK[a.severity] ||
      PATTERN_ORDER.indexOf(a.pattern) - PATTERN_ORDER.indexOf(b.pattern) ||
      (a.id < b.id ? -1 : a.id > b.id ? 1 : 0),
  );
}
