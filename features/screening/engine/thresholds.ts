/**
 * THE threshold table: every number that turns a measurement or a ticked
 * criterion into a flag. Nothing else in the engine holds a cut-off.
 *
 * Each row names its source in full (author, year, title, journal; see
 * sources.ts), or says `common practice, no source` or `our choice, no source`.
 * `sourceKind` says what kind of basis the value has, `certainty` how sure we
 * are of it, `note` how we use the source. `population` describes who the
 * source's numbers come from, which is not always who we apply them to
 * (juniors); `populationNote` says so beside the flag. A derived value names
 * its published parts in `derivedFrom`, and they add up to the value (tested).
 *
 * The engine README's threshold table is generated from this table
 * (`npm run docs:thresholds`); a test fails when the two disagree.
 */
import {
  BACKMAN_DANIELSON_2011,
  BENNELL_1998,
  COMMON_PRACTICE,
  CROSSLEY_2011,
  HERRINGTON_MUNRO_2010,
  MUNRO_HERRINGTON_CAROLAN_2012,
  OUR_CHOICE,
  POWDEN_2015,
  shortSource,
} from './sources';
import type { Certainty, Comparison, MetricId, PairId, PatternId, Severity, Sex, SourceKind, TaskId, Unit } from './types';

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
  sourceKind: SourceKind;
  /** How sure we are of the value: 'no source' for common practice and our choices. */
  certainty: Certainty;
  /** Only for sourceKind 'derived': the published parts, which add up to `value`. */
  derivedFrom?: readonly DerivedPart[];
  /** Shown beside the flag when the source's people differ from ours. */
  populationNote?: string;
  note: string;
}

export interface DerivedPart {
  what: string;
  value: number;
  /** How the part was computed from the published figure, when it was (e.g. "1.96 x 2.72"). */
  formula?: string;
  source: string;
  certainty: Certainty;
}

/** Smallest detectable difference for 2D FPPA, lower end of 7.54-8.93 deg (Munro, Herrington, Carolan 2012, checked). */
export const FPPA_SMALLEST_DETECTABLE_DIFFERENCE_DEG = 7.54;
/** Standard error of measurement for 2D FPPA, lower end of 2.72-3.01 deg (Munro, Herrington, Carolan 2012, checked). */
export const FPPA_SEM_DEG = 2.72;
/**
 * 95% margin for ONE measurement against a cut-off: 1.96 x SEM = 5.33 deg (rounded to 0.01). A change
 * between two screens uses the smallest detectable difference instead (1.96 x sqrt(2) x SEM).
 */
export const FPPA_SINGLE_MEASUREMENT_MARGIN_DEG = Math.round(1.96 * FPPA_SEM_DEG * 100) / 100;

const ADULT_POPULATION_NOTE = 'Adult norms (100 physically active adults), applied to a junior: no junior norms were found.';

const BILATERAL_FPPA_TASKS: readonly Scope[] = ['two-leg-squat', 'drop-landing'];
const SINGLE_LEG_FPPA_TASKS: readonly Scope[] = ['single-leg-squat-left', 'single-leg-squat-right', 'racket-side-lunge'];
const ADULT_NORMS_NOTE =
  'Adult norms (100 physically active adults), applied to juniors for want of junior norms. Using the upper end of the normal range as the cut-off is our choice: no validated cut-off exists.';
const CONCERN_FPPA_NOTE =
  'Concern = upper end of the adult normal range plus the 95% measurement-error margin of one measurement (1.96 x SEM, SEM 2.72 deg = lower end of 2.72-3.01), i.e. beyond normal by more than measurement error. Derived by us; no published cut-off.';
const OBSERVED_NOTE = 'One ticked criterion that describes the pattern raises a watch flag: our design.';

function fppaRows(kind: 'bilateral' | 'single-leg', sex: Sex, upperNormal: number, normalRange: string, task: string): ThresholdRow[] {
  const appliesTo = kind === 'bilateral' ? BILATERAL_FPPA_TASKS : SINGLE_LEG_FPPA_TASKS;
  const base = {
    pattern: 'dynamic-knee-valgus' as const,
    metric: 'fppa' as const,
    comparison: 'greater-than' as const,
    unit: 'deg' as const,
    population: { sex, ageGroup: 'adults (physically active)' },
    appliesTo,
    certainty: 'checked' as const,
    populationNote: ADULT_POPULATION_NOTE,
  };
  const who = sex === 'female' ? 'females' : 'males';
  return [
    {
      ...base,
      id: `fppa-${kind}-${sex}-watch`,
      value: upperNormal,
      severity: 'watch',
      source: HERRINGTON_MUNRO_2010,
      sourceKind: 'published-other-population',
      note: `${task} normal range, ${who} ${normalRange} deg; we use the upper end. ${ADULT_NORMS_NOTE}`,
    },
    {
      ...base,
      id: `fppa-${kind}-${sex}-concern`,
      // Written as a sum so the origin of the number stays visible.
      value: Math.round((upperNormal + FPPA_SINGLE_MEASUREMENT_MARGIN_DEG) * 100) / 100,
      severity: 'concern',
      source: `${HERRINGTON_MUNRO_2010}; ${MUNRO_HERRINGTON_CAROLAN_2012}`,
      sourceKind: 'derived',
      derivedFrom: [
        { what: `upper end of the adult normal range, ${task.toLowerCase()}, ${who}`, value: upperNormal, source: HERRINGTON_MUNRO_2010, certainty: 'checked' },
        {
          what: '95% margin of one measurement, 1.96 x the standard error of measurement of 2.72 deg (lower end of 2.72-3.01)',
          value: FPPA_SINGLE_MEASUREMENT_MARGIN_DEG,
          formula: '1.96 x 2.72',
          source: MUNRO_HERRINGTON_CAROLAN_2012,
          certainty: 'checked',
        },
      ],
      note: `${upperNormal} + 1.96 x 2.72 deg. ${CONCERN_FPPA_NOTE} ${ADULT_NORMS_NOTE}`,
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
    source: OUR_CHOICE,
    sourceKind: 'our-choice',
    certainty: 'no source',
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
    source: OUR_CHOICE,
    sourceKind: 'our-choice',
    certainty: 'no source',
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
    source: OUR_CHOICE,
    sourceKind: 'our-choice',
    certainty: 'no source',
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
    source: OUR_CHOICE,
    sourceKind: 'our-choice',
    certainty: 'no source',
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
    certainty: 'no source',
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
    sourceKind: 'published-other-population',
    certainty: 'checked',
    populationNote: 'Published for junior elite basketball players, applied to junior badminton players.',
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
    certainty: 'no source',
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
    sourceKind: 'derived',
    certainty: 'checked',
    derivedFrom: [
      {
        what: 'smallest detectable difference of 2D knee angles, 1.96 x sqrt(2) x SEM, lower end of 7.54-8.93 deg: the statistic for a difference between two measurements',
        value: FPPA_SMALLEST_DETECTABLE_DIFFERENCE_DEG,
        source: MUNRO_HERRINGTON_CAROLAN_2012,
        certainty: 'checked',
      },
    ],
    populationNote: 'Measurement error from adults, applied to a junior.',
    note: 'Herrington & Munro 2010: values should be symmetrical. A left-right gap compares two measurements, so the smallest detectable difference (7.54 deg, lower end), not 1.96 x SEM, is the margin; a larger gap is unlikely to be measurement error. Using it as the asymmetry cut-off is our choice.',
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
    source: OUR_CHOICE,
    sourceKind: 'our-choice',
    certainty: 'no source',
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
    source: OUR_CHOICE,
    sourceKind: 'our-choice',
    certainty: 'no source',
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
    source: OUR_CHOICE,
    sourceKind: 'our-choice',
    certainty: 'no source',
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
    source: OUR_CHOICE,
    sourceKind: 'our-choice',
    certainty: 'no source',
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
    certainty: 'no source',
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
    source: OUR_CHOICE,
    sourceKind: 'our-choice',
    certainty: 'no source',
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
    appliesTo: ['two-leg-squat', 'single-leg-squat-left', 'single-leg-squat-right', 'single-leg-stance-left', 'single-leg-stance-right', 'racket-side-lunge'],
    source: OUR_CHOICE,
    sourceKind: 'our-choice',
    certainty: 'no source',
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
    source: OUR_CHOICE,
    sourceKind: 'our-choice',
    certainty: 'no source',
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
    source: OUR_CHOICE,
    sourceKind: 'our-choice',
    certainty: 'no source',
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
    source: OUR_CHOICE,
    sourceKind: 'our-choice',
    certainty: 'no source',
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
    population: { sex: 'any', ageGroup: "youth within the maturity equations' age range" },
    appliesTo: 'all',
    source: COMMON_PRACTICE,
    sourceKind: 'common-practice',
    certainty: 'no source',
    note: 'Band "circa" PHV: -1 to +1 years from peak height velocity, inclusive. Not a fault: it lowers loading and jump volume in the plan. The offset comes from Mirwald 2002 or Moore 2015.',
  },
];

const UNIT_WORDS: Record<Unit, string> = { deg: '°', cm: ' cm', percent: '%', years: ' years', grades: ' grades', criteria: ' criteria' };

/**
 * A derived value in words, its published parts named:
 * "13° (upper end of ..., Herrington & Munro 2010) + 5.33° (1.96 x 2.72 ...; Munro, Herrington & Carolan 2012) = 18.33°".
 * Undefined for a row that is not derived.
 */
export function derivationText(row: ThresholdRow): string | undefined {
  if (!row.derivedFrom || row.derivedFrom.length === 0) return undefined;
  const u = UNIT_WORDS[row.unit];
  const parts = row.derivedFrom.map((p) => `${p.value}${u} (${p.what}; ${shortSource(p.source)})`);
  return row.derivedFrom.length === 1 ? `${parts[0]}` : `${parts.join(' + ')} = ${row.value}${u}`;
}

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
