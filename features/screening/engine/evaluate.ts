import { withField } from './errors';
import { detectFlags, observationsOf } from './flags';
import { maturityInputsNeeded, maturityOffset } from './maturity';
import { measureTasks, rateTasks } from './measurements';
import { buildPlan } from './plan';
import type { AssessmentInput, AssessmentResult, Measurement, MaturityResult } from './types';
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

function maturityMeasurements(m: MaturityResult): Measurement[] {
  return [
    {
      id: 'athlete/maturity-offset',
      metric: 'maturity-offset',
      taskId: null,
      side: null,
      value: m.offsetYears,
      unit: 'years',
      label: `Years from peak height velocity (${m.method}), band ${m.band}`,
    },
    {
      id: 'athlete/age-at-phv',
      metric: 'age-at-phv',
      taskId: null,
      side: null,
      value: m.ageAtPhvYears,
      unit: 'years',
      label: `Predicted age at peak height velocity (${m.method})`,
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
  const painTaskTitles = [...n.tasks.values()].filter((t) => t.painReported).map((t) => t.spec.title);
  const plan = buildPlan(flags, {
    oneRepMaxKg: n.oneRepMaxKg,
    loadIncrementKg: n.loadIncrementKg,
    painTaskTitles,
    rescreenWeeks: n.rescreenWeeks,
    todayDay: n.todayDay,
    maturity,
  });
  return { engineVersion: ENGINE_VERSION, measurements, flags, ratings, maturity, plan };
}
