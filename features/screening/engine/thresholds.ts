/**
 * THE threshold table: every number that turns a measurement or a ticked
 * criterion into a flag. Nothing else in the engine holds a cut-off.
 *
 * Each row names its source in full (a published study from
 * /work/shared/REFERENCES.md), or says `common practice, no source`, or
 * `from memory`. `note` says how we use the source and which part is our own
 * choice. `population` describes who the source's numbers come from, which is
 * not always who we apply them to (juniors).
 */
import {
  BACKMAN_DANIELSON_2011,
  BENNELL_1998,
  COMMON_PRACTICE,
  CROSSLEY_2011,
  HERRINGTON_MUNRO_2010,
  MUNRO_HERRINGTON_CAROLAN_2012,
  POWDEN_2015,
} from './sources';
import type { Comparison, MetricId, PairId, PatternId, Severity, Sex, TaskId, Unit } from './types';

export type Scope = TaskId | PairId;

export interface ThresholdRow {
  id: string;
  pattern: PatternId;
  metric: MetricId;
  /** Flag when `measured <comparison> value` holds (for 'within': value <= measured <= upperValue). */
  comparison: Comparison;
  value: number;
  upperValue?: number;
  unit: Unit;
  severity: Severity;
  population: { sex: Sex | 'any'; ageGroup: string };
  /** Tasks or pairs the row applies to; 'all' for observed criteria and athlete-level values. */
  appliesTo: readonly Scope[] | 'all';
  source: string;
  sourceKind: 'published' | 'common-practice' | 'from-memory';
  /** How sure we are of the published value (REFERENCES.md); null when there is no source. */
  certainty: 'checked' | 'secondary' | 'from memory' | null;
  note: string;
}

/** Smallest detectable difference for 2D FPPA, lower end of 7.54-8.93 deg (Munro, Herrington, Carolan 2012, checked). */
export const FPPA_SMALLEST_DETECTABLE_DIFFERENCE_DEG = 7.54;

const BILATERAL_FPPA_TASKS: readonly Scope[] = ['two-leg-squat', 'drop-landing'];
const SINGLE_LEG_FPPA_TASKS: readonly Scope[] = ['single-leg-squat-left', 'single-leg-squat-right', 'racket-side-lunge'];
const ADULT_NORMS_NOTE =
  'Adult norms (100 physically active adults), applied to juniors for want of junior norms. Using the upper end of the normal range as the cut-off is our choice: no validated cut-off exists.';
const CONCERN_FPPA_NOTE =
  'Concern = upper end of the adult normal range plus the smallest detectable difference (7.54 deg, lower end of 7.54-8.93), i.e. beyond normal by more than measurement error: our choice.';
const OBSERVED_NOTE =
  'One ticked criterion that describes the pattern raises a watch flag: our design.';

function fppaRows(
  kind: 'bilateral' | 'single-leg',
  sex: Sex,
  upperNormal: number,
  normalRange: string,
  task: string,
): ThresholdRow[] {
  const appliesTo = kind === 'bilateral' ? BILATERAL_FPPA_TASKS : SINGLE_LEG_FPPA_TASKS;
  const base = {
    pattern: 'dynamic-knee-valgus' as const,
    metric: 'fppa' as const,
    comparison: 'greater-than' as const,
    unit: 'deg' as const,
    population: { sex, ageGroup: 'adults (physically active)' },
    appliesTo,
    sourceKind: 'published' as const,
    certainty: 'checked' as const,
  };
  return [
    {
      ...base,
      id: `fppa-${kind}-${sex}-watch`,
      value: upperNormal,
      severity: 'watch',
      source: HERRINGTON_MUNRO_2010,
      note: `${task} normal range, ${sex === 'female' ? 'females' : 'males'} ${normalRange} deg; we use the upper end. ${ADULT_NORMS_NOTE}`,
    },
    {
      ...base,
      id: `fppa-${kind}-${sex}-concern`,
      // Written as a sum so the origin of the number stays visible.
      value: Math.round((upperNormal + FPPA_SMALLEST_DETECTABLE_DIFFERENCE_DEG) * 100) / 100,
      severity: 'concern',
      source: `${HERRINGTON_MUNRO_2010}; ${MUNRO_HERRINGTON_CAROLAN_2012}`,
      note: `${upperNormal} + 7.54 deg. ${CONCERN_FPPA_NOTE} ${ADULT_NORMS_NOTE}`,
    },
  ];
}

export const THRESHOLDS: readonly ThresholdRow[] = [
  // --- Dynamic knee valgus ------------------------------------------------
  // Two-leg tasks take the drop-jump norms, single-leg tasks the step-landing
  // norms (the closest single-leg task in the source): our choice.
  ...fppaRows('bilateral', 'female', 13, '7-13', 'Drop jump'),
  ...fppaRows('bilateral', 'male', 8, '3-8', 'Drop jump'),
  ...fppaRows('single-leg', 'female', 12, '5-12', 'Step landing'),
  ...fppaRows('single-leg', 'male', 9, '1-9', 'Step landing'),
  {
    id: 'knee-valgus-observed',
    pattern: 'dynamic-knee-valgus',
    metric: 'observed-criteria',
    comparison: 'at-least',
    value: 1,
    unit: 'criteria',
    severity: 'watch',
    population: { sex: 'any', ageGroup: 'not specified' },
    appliesTo: 'all',
    source: COMMON_PRACTICE,
    sourceKind: 'common-practice',
    certainty: null,
    note: `${OBSERVED_NOTE} The single-leg squat criteria follow the areas of ${CROSSLEY_2011}`,
  },

  // --- Contralateral pelvic drop -------------------------------------------
  {
    id: 'pelvic-drop-watch',
    pattern: 'contralateral-pelvic-drop',
    metric: 'pelvic-obliquity',
    comparison: 'greater-than',
    value: 5,
    unit: 'deg',
    severity: 'watch',
    population: { sex: 'any', ageGroup: 'not specified' },
    appliesTo: ['single-leg-squat-left', 'single-leg-squat-right', 'single-leg-stance-left', 'single-leg-stance-right'],
    source: COMMON_PRACTICE,
    sourceKind: 'common-practice',
    certainty: null,
    note: 'No normative degree threshold for 2D pelvic drop was found; the value is our choice.',
  },
  {
    id: 'pelvic-drop-concern',
    pattern: 'contralateral-pelvic-drop',
    metric: 'pelvic-obliquity',
    comparison: 'greater-than',
    value: 10,
    unit: 'deg',
    severity: 'concern',
    population: { sex: 'any', ageGroup: 'not specified' },
    appliesTo: ['single-leg-squat-left', 'single-leg-squat-right', 'single-leg-stance-left', 'single-leg-stance-right'],
    source: COMMON_PRACTICE,
    sourceKind: 'common-practice',
    certainty: null,
    note: 'No normative degree threshold for 2D pelvic drop was found; the value is our choice.',
  },
  {
    id: 'pelvic-drop-observed',
    pattern: 'contralateral-pelvic-drop',
    metric: 'observed-criteria',
    comparison: 'at-least',
    value: 1,
    unit: 'criteria',
    severity: 'watch',
    population: { sex: 'any', ageGroup: 'not specified' },
    appliesTo: 'all',
    source: COMMON_PRACTICE,
    sourceKind: 'common-practice',
    certainty: null,
    note: OBSERVED_NOTE,
  },

  // --- Limited ankle dorsiflexion ------------------------------------------
  {
    id: 'knee-to-wall-short',
    pattern: 'limited-ankle-dorsiflexion',
    metric: 'knee-to-wall',
    comparison: 'less-than',
    value: 10,
    unit: 'cm',
    severity: 'watch',
    population: { sex: 'any', ageGroup: 'not specified' },
    appliesTo: ['knee-to-wall-left', 'knee-to-wall-right'],
    source: COMMON_PRACTICE,
    sourceKind: 'common-practice',
    certainty: null,
    note: '"Under about 10 cm is restricted". At about 3.6 deg per cm (secondary, Bennell 1998) 10 cm is close to the 36.5 deg junior threshold below.',
  },
  {
    id: 'lunge-angle-low',
    pattern: 'limited-ankle-dorsiflexion',
    metric: 'tibial-inclination',
    comparison: 'less-than',
    value: 36.5,
    unit: 'deg',
    severity: 'concern',
    population: { sex: 'any', ageGroup: 'junior elite basketball players' },
    appliesTo: ['knee-to-wall-left', 'knee-to-wall-right'],
    source: BACKMAN_DANIELSON_2011,
    sourceKind: 'published',
    certainty: 'checked',
    note: `Dorsiflexion below 36.5 deg carried a much higher risk of patellar tendinopathy (18.5-29.4% vs 1.8-2.1%). Junior-specific. We read the shin angle from vertical on the optional side photo as the weight-bearing lunge angle (as in the inclinometer version of ${BENNELL_1998}); that this matches the source's measuring method is from memory.`,
  },

  // --- Left-right asymmetry -------------------------------------------------
  {
    id: 'knee-to-wall-difference',
    pattern: 'left-right-asymmetry',
    metric: 'knee-to-wall-difference',
    comparison: 'at-least',
    value: 2,
    unit: 'cm',
    severity: 'watch',
    population: { sex: 'any', ageGroup: 'not specified' },
    appliesTo: ['knee-to-wall'],
    source: COMMON_PRACTICE,
    sourceKind: 'common-practice',
    certainty: null,
    note: `"A side difference of 2 cm or more". It sits just above the minimal detectable change of 1.6-1.9 cm reported by ${POWDEN_2015}`,
  },
  {
    id: 'fppa-difference',
    pattern: 'left-right-asymmetry',
    metric: 'fppa-difference',
    comparison: 'greater-than',
    value: FPPA_SMALLEST_DETECTABLE_DIFFERENCE_DEG,
    unit: 'deg',
    severity: 'watch',
    population: { sex: 'any', ageGroup: 'not specified in our notes' },
    appliesTo: ['single-leg-squat', 'two-leg-squat', 'drop-landing'],
    source: `${MUNRO_HERRINGTON_CAROLAN_2012}; ${HERRINGTON_MUNRO_2010}`,
    sourceKind: 'published',
    certainty: 'checked',
    note: 'Herrington & Munro 2010: values should be symmetrical. A left-right gap larger than the smallest detectable difference (7.54 deg, lower end) is unlikely to be measurement error; using it as the asymmetry cut-off is our choice.',
  },
  {
    id: 'squat-pelvic-tilt',
    pattern: 'left-right-asymmetry',
    metric: 'pelvic-tilt',
    comparison: 'greater-than',
    value: 5,
    unit: 'deg',
    severity: 'watch',
    population: { sex: 'any', ageGroup: 'not specified' },
    appliesTo: ['two-leg-squat'],
    source: COMMON_PRACTICE,
    sourceKind: 'common-practice',
    certainty: null,
    note: 'Pelvis not level at the bottom of a two-leg squat; the value is our choice, the same as for pelvic drop.',
  },
  {
    id: 'single-leg-squat-rating-gap',
    pattern: 'left-right-asymmetry',
    metric: 'rating-gap',
    comparison: 'at-least',
    value: 2,
    unit: 'grades',
    severity: 'watch',
    population: { sex: 'any', ageGroup: 'not specified' },
    appliesTo: ['single-leg-squat'],
    source: COMMON_PRACTICE,
    sourceKind: 'common-practice',
    certainty: null,
    note: 'One side rated good and the other poor (good/fair/poor, two grades apart). The rating and this rule are our design.',
  },
  {
    id: 'asymmetry-observed',
    pattern: 'left-right-asymmetry',
    metric: 'observed-criteria',
    comparison: 'at-least',
    value: 1,
    unit: 'criteria',
    severity: 'watch',
    population: { sex: 'any', ageGroup: 'not specified' },
    appliesTo: 'all',
    source: COMMON_PRACTICE,
    sourceKind: 'common-practice',
    certainty: null,
    note: OBSERVED_NOTE,
  },

  // --- Heels lifting in the full squat ---------------------------------------
  {
    id: 'heels-lifting-observed',
    pattern: 'heels-lifting',
    metric: 'observed-criteria',
    comparison: 'at-least',
    value: 1,
    unit: 'criteria',
    severity: 'watch',
    population: { sex: 'any', ageGroup: 'not specified' },
    appliesTo: 'all',
    source: COMMON_PRACTICE,
    sourceKind: 'common-practice',
    certainty: null,
    note: `${OBSERVED_NOTE} Heels are observed only; no landmark measures them.`,
  },

  // --- Squat depth not reached -------------------------------------------------
  {
    id: 'squat-depth-thigh',
    pattern: 'squat-depth-not-reached',
    metric: 'thigh-angle',
    comparison: 'greater-than',
    value: 0,
    unit: 'deg',
    severity: 'watch',
    population: { sex: 'any', ageGroup: 'not specified' },
    appliesTo: ['two-leg-squat'],
    source: COMMON_PRACTICE,
    sourceKind: 'common-practice',
    certainty: null,
    note: 'A full squat brings the thigh at least level (hip not above knee) at the lowest point.',
  },
  {
    id: 'squat-depth-observed',
    pattern: 'squat-depth-not-reached',
    metric: 'observed-criteria',
    comparison: 'at-least',
    value: 1,
    unit: 'criteria',
    severity: 'watch',
    population: { sex: 'any', ageGroup: 'not specified' },
    appliesTo: 'all',
    source: COMMON_PRACTICE,
    sourceKind: 'common-practice',
    certainty: null,
    note: OBSERVED_NOTE,
  },

  // --- Excessive trunk lean ------------------------------------------------
  {
    id: 'trunk-lean-sideways',
    pattern: 'excessive-trunk-lean',
    metric: 'trunk-lean-lateral',
    comparison: 'greater-than',
    value: 10,
    unit: 'deg',
    severity: 'watch',
    population: { sex: 'any', ageGroup: 'not specified' },
    appliesTo: [
      'two-leg-squat',
      'single-leg-squat-left',
      'single-leg-squat-right',
      'single-leg-stance-left',
      'single-leg-stance-right',
      'racket-side-lunge',
    ],
    source: COMMON_PRACTICE,
    sourceKind: 'common-practice',
    certainty: null,
    note: 'Sideways lean of the shoulders over the hips in a front view; the value is our choice.',
  },
  {
    id: 'trunk-ahead-of-shin',
    pattern: 'excessive-trunk-lean',
    metric: 'trunk-tibia-difference',
    comparison: 'greater-than',
    value: 15,
    unit: 'deg',
    severity: 'watch',
    population: { sex: 'any', ageGroup: 'not specified' },
    appliesTo: ['two-leg-squat'],
    source: COMMON_PRACTICE,
    sourceKind: 'common-practice',
    certainty: null,
    note: 'Coaching rule that the trunk stays roughly parallel to the shin in a full squat; the 15 deg allowance is our choice.',
  },
  {
    id: 'lunge-trunk-forward',
    pattern: 'excessive-trunk-lean',
    metric: 'trunk-lean-forward',
    comparison: 'greater-than',
    value: 30,
    unit: 'deg',
    severity: 'watch',
    population: { sex: 'any', ageGroup: 'not specified' },
    appliesTo: ['racket-side-lunge'],
    source: COMMON_PRACTICE,
    sourceKind: 'common-practice',
    certainty: null,
    note: 'Upper body folding forward over the front thigh in the lunge; the value is our choice.',
  },
  {
    id: 'trunk-lean-observed',
    pattern: 'excessive-trunk-lean',
    metric: 'observed-criteria',
    comparison: 'at-least',
    value: 1,
    unit: 'criteria',
    severity: 'watch',
    population: { sex: 'any', ageGroup: 'not specified' },
    appliesTo: 'all',
    source: COMMON_PRACTICE,
    sourceKind: 'common-practice',
    certainty: null,
    note: OBSERVED_NOTE,
  },

  // --- Growth-spurt window -------------------------------------------------
  {
    id: 'growth-spurt-window',
    pattern: 'growth-spurt-window',
    metric: 'maturity-offset',
    comparison: 'within',
    value: -1,
    upperValue: 1,
    unit: 'years',
    severity: 'watch',
    population: { sex: 'any', ageGroup: 'youth within the maturity equations\' age range' },
    appliesTo: 'all',
    source: COMMON_PRACTICE,
    sourceKind: 'common-practice',
    certainty: null,
    note: 'Band "circa" PHV: -1 to +1 years from peak height velocity, inclusive. Not a fault: it lowers loading and jump volume in the plan. The offset comes from Mirwald 2002 or Moore 2015.',
  },
];

/** Whether `measured` meets the row's condition. */
export function meetsThreshold(row: ThresholdRow, measured: number): boolean {
  switch (row.comparison) {
    case 'greater-than':
      return measured > row.value;
    case 'less-than':
      return measured < row.value;
    case 'at-least':
      return measured >= row.value;
    case 'at-most':
      return measured <= row.value;
    case 'within':
      return measured >= row.value && measured <= (row.upperValue ?? row.value);
  }
}

export function rowApplies(row: ThresholdRow, scope: Scope | null, sex: Sex): boolean {
  if (row.population.sex !== 'any' && row.population.sex !== sex) return false;
  if (row.appliesTo === 'all') return true;
  return scope !== null && row.appliesTo.includes(scope);
}
