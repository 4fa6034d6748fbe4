import { withField } from './errors';
import { detectFlags, observationsOf } from './flags';
import { MATURITY_AGE_RANGE, maturityInputsNeeded, maturityOffset } from './maturity';
import { measureTasks, rateTasks } from './measurements';
import { buildPlan } from './plan';
import type { AssessmentInput, AssessmentResult, GrowthUnknownReason, MaturityBand, MaturityMethod, Measurement, MaturityResult } from './types';
import { validateAssessment, type NormalizedAssessment } from './validate';
import { ENGINE_VERSION } from './version';

/**
 * Maturity is requested when the method is not 'none' and the athlete record
 * holds what the method needs; an age outside the equation's range then
 * throws (pass maturityMethod 'none' for such athletes).
 */
function maturityOf(n: NormalizedAssessment): MaturityResult | null {
  const method = n.maturityMethod;
  if (method === 'none') return null;
  const a = n.athlete;
  if (maturityInputsNeeded(method, a.sex).some((field) => a[field] === undefined)) return null;
  return withField('athlete', () => maturityOffset(a, method));
}

/** Why there is no growth estimate, in the plan's terms. */
function unknownReasonOf(n: NormalizedAssessment): GrowthUnknownReason {
  const a = n.athlete;
  const range = MATURITY_AGE_RANGE[a.sex];
  if (a.ageYears < range.min || a.ageYears > range.max) return 'age-outside-range';
  if (n.maturityMethod === 'none') return 'not-estimated';
  return 'measures-missing';
}

/** The equation's name as a coach reads it (never its internal key). */
export const METHOD_WORDS: Record<MaturityMethod, string> = {
  moore2015: 'Moore et al. 2015 equation',
  mirwald2002: 'Mirwald et al. 2002 equation',
};
const BAND_WORDS: Record<MaturityBand, string> = {
  pre: 'before the growth spurt',
  circa: 'in the growth-spurt window',
  post: 'after the growth spurt',
};

function maturityMeasurements(m: MaturityResult): Measurement[] {
  return [
    {
      id: 'athlete/maturity-offset',
      metric: 'maturity-offset',
      taskId: null,
      side: null,
      value: m.offsetYears,
      unit: 'years',
      label: `Years from peak height velocity (${METHOD_WORDS[m.method]}): ${BAND_WORDS[m.band]}`,
    },
    {
      id: 'athlete/age-at-phv',
      metric: 'age-at-phv',
      taskId: null,
      side: null,
      value: m.ageAtPhvYears,
      unit: 'years',
      label: `Predicted age at peak height velocity (${METHOD_WORDS[m.method]})`,
    },
  ];
}

/**
 * The whole screen in one call: validate, measure, flag, plan. Pure and
 * deterministic: the same input always gives the same result (the re-screen
 * date comes from options.today, never from the clock).
 */
export function evaluateAssessment(input: AssessmentInput): AssessmentResult {
  const n = validateAssessment(input);
  const maturity = maturityOf(n);
  const ratings = rateTasks(n);
  const measurements = [...measureTasks(n, ratings), ...(maturity ? maturityMeasurements(maturity) : [])];
  const flags = detectFlags(measurements, observationsOf(n), n.athlete.sex);
  // Pain at this screen, and pain at an earlier one that no physiotherapist has cleared since.
  const painTaskTitles = [...[...n.tasks.values()].filter((t) => t.painReported).map((t) => t.spec.title), ...n.earlierPainTitles];
  const plan = buildPlan(flags, {
    oneRepMaxKg: n.oneRepMaxKg,
    loadIncrementKg: n.loadIncrementKg,
    painTaskTitles,
    painCleared: n.painCleared,
    unknownReason: maturity ? null : unknownReasonOf(n),
    rescreenWeeks: n.rescreenWeeks,
    todayDay: n.todayDay,
    maturity,
  });
  return { engineVersion: ENGINE_VERSION, measurements, flags, ratings, maturity, plan };
}
