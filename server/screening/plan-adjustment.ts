import { array, mixed, number, object, string, ValidationError } from 'yup';
import type { PlanAdjustmentInput, PlanOverrideView } from '@/features/screening/contract';
import {
  checkPlan,
  EXERCISES,
  librarySpec,
  loadRuleText,
  type LoadingContext,
  type PatternId,
  type PlannedExercise,
  type Prescription,
} from '@/features/screening/engine';
import { can } from '@/features/access/permissions';
import { finalizeAdjustment, fromLibrary } from '@/features/screening/plan-edits';
import type { Role } from '@/db/schema';
import { badRequest, forbidden } from '@/server/http/errors';
import { fieldErrors } from '@/server/http/validate';

const LIBRARY = new Map(EXERCISES.map((e) => [e.id, e]));

const range = (min: number, max: number, what: string, integer = true) => {
  const n = number()
    .typeError(`${what} must be a number.`)
    .required(`${what} is required.`)
    .min(min, `${what} must be at least ${min}.`)
    .max(max, `${what} must be at most ${max}.`);
  return integer ? n.integer(`${what} must be a whole number.`) : n;
};
const minMax = (min: number, max: number, what: string, integer = true) =>
  object({ min: range(min, max, `${what} (from)`, integer), max: range(min, max, `${what} (to)`, integer) })
    .required()
    .test('ordered', `${what}: "from" must not be more than "to".`, (v) => !v || v.min <= v.max);

// What the tester may change: which exercises, their order, and each one's dose and load. The
// exercise's words (how-to, cues) always come from the library, and its tempo, the load's words and
// the lines saying what changed from the engine's plan (`withServerWords`), so a stored plan cannot
// carry text nobody wrote for it.
const prescriptionSchema = object({
  sets: minMax(1, 10, 'Sets'),
  dose: mixed()
    .required()
    .test('dose', 'Dose must be repetitions or seconds, with a range.', (v) => {
      if (typeof v !== 'object' || v === null) return false;
      const d = v as Record<string, unknown>;
      const ok = (lo: number, hi: number) =>
        Number.isInteger(d.min) && Number.isInteger(d.max) && (d.min as number) >= lo && (d.max as number) <= hi && (d.min as number) <= (d.max as number);
      if (d.kind === 'reps') return ok(1, 100) && typeof d.perSide === 'boolean' && typeof d.toNearFatigue === 'boolean';
      if (d.kind === 'seconds') return ok(1, 600) && typeof d.perSide === 'boolean';
      return false;
    }),
  tempo: string().max(200).default(''),
  load: mixed()
    .required()
    .test('load', 'Load must be bodyweight, a band, or a percentage of 1RM.', (v) => {
      if (typeof v !== 'object' || v === null) return false;
      const l = v as Record<string, unknown>;
      if (l.kind === 'bodyweight') return l.note === undefined || typeof l.note === 'string';
      if (l.kind === 'band') return (l.resistance === 'light' || l.resistance === 'medium') && typeof l.placement === 'string';
      if (l.kind === 'percent-1rm') {
        const pct = (n: unknown) => typeof n === 'number' && n > 0 && n <= 100;
        const kg = l.kg as Record<string, unknown> | null | undefined;
        const kgOk =
          kg === null ||
          (typeof kg === 'object' &&
            kg !== undefined &&
            [kg.min, kg.max, kg.incrementKg].every((n) => typeof n === 'number' && n >= 0 && n <= 500) &&
            (kg.min as number) <= (kg.max as number));
        return pct(l.minPercent) && pct(l.maxPercent) && (l.minPercent as number) <= (l.maxPercent as number) && kgOk && typeof l.note === 'string';
      }
      return false;
    }),
  restSeconds: range(0, 600, 'Rest (s)'),
  perWeek: range(1, 7, 'Sessions per week'),
});

const exerciseSchema = object({
  id: string()
    .required('Choose an exercise.')
    .test('library', 'Not an exercise of the library.', (id) => id !== undefined && LIBRARY.has(id)),
  prescription: prescriptionSchema,
  flagIds: array(string().required()).default([]),
  patterns: array(string().required()).default([]),
  adjustments: array(string().max(300).required()).default([]),
});

/** The adjusted plan as stored: library words, the tester's order and doses. */
export function normaliseAdjustment(input: PlanAdjustmentInput): PlannedExercise[] {
  const out: PlannedExercise[] = [];
  const fields: Record<string, string> = {};
  input.exercises.forEach((raw, i) => {
    try {
      const e = exerciseSchema.validateSync(raw, { abortEarly: false, stripUnknown: true });
      const { addresses: _addresses, prescription: _library, ...words } = LIBRARY.get(e.id)!;
      out.push({
        ...words,
        order: i + 1,
        prescription: e.prescription as Prescription,
        flagIds: e.flagIds,
        patterns: e.patterns as PatternId[],
        adjustments: e.adjustments,
        loadRule: loadRuleText(librarySpec(e.id)!, e.prescription as Prescription),
      });
    } catch (error) {
      if (!(error instanceof ValidationError)) throw error;
      for (const [field, message] of Object.entries(fieldErrors(error))) fields[`exercises[${i}].${field}`] = message;
    }
  });
  const ids = out.map((e) => e.id);
  const repeated = ids.find((id, i) => ids.indexOf(id) !== i);
  if (repeated) fields.exercises = `"${LIBRARY.get(repeated)!.name}" is in the plan twice.`;
  if (Object.keys(fields).length > 0) throw badRequest('Some fields need attention.', fields);
  return out;
}

const OVERRIDE_NEEDED = 'Going past it needs an override by a head coach or physiotherapist, with a reason.';

/**
 * The same youth and growth-spurt limits the engine applied to its own plan (engine `limits.ts`), on the
 * adjusted plan: every limit passed needs an override with a reason, and only a head coach or a
 * physiotherapist may give one. Overrides for limits that are not passed are dropped. Returns the
 * overrides as kept in the plan's history.
 */
export function enforceLimits(exercises: PlannedExercise[], input: PlanAdjustmentInput, ctx: LoadingContext, role: Role): PlanOverrideView[] {
  const overrides = input.overrides ?? [];
  const { breaches, uncovered } = checkPlan(exercises, ctx, overrides);
  if (uncovered.length > 0) {
    const fields: Record<string, string> = {};
    for (const b of uncovered) {
      const i = exercises.findIndex((e) => e.id === b.exerciseId);
      const key = b.field === 'id' ? `exercises[${i}]` : `exercises[${i}].${b.field}`;
      fields[key] = fields[key] ? `${fields[key]} ${b.message}` : `${b.message} ${OVERRIDE_NEEDED}`;
    }
    throw badRequest('The plan goes past a limit for this athlete.', fields);
  }
  const used = breaches.map((b) => {
    const o = overrides.find((x) => x.exerciseId === b.exerciseId && x.limit === b.limit)!;
    return { exerciseId: b.exerciseId, limit: b.limit, reason: o.reason.trim(), message: b.message, role };
  });
  if (used.length > 0 && !can(role, 'plan.override')) {
    throw forbidden('Only a head coach or a physiotherapist may go past a youth or growth-spurt limit.');
  }
  return used;
}

/**
 * The words of each exercise as the server writes them: tempo, the load's note, placement and shares of
 * 1RM, and the lines saying what changed come from the engine's plan for this result (or, for an
 * exercise added back, the library as the engine would plan it), never from the request; from the request
 * only the numbers the editor changes (sets, dose, rest, sessions a week, the kg or the band). A load of
 * another kind than the plan's is refused.
 */
export function withServerWords(exercises: PlannedExercise[], proposal: readonly PlannedExercise[], ctx: LoadingContext): PlannedExercise[] {
  const fields: Record<string, string> = {};
  const merged = exercises.map((e, i) => {
    const spec = librarySpec(e.id)!;
    const base = proposal.find((p) => p.id === e.id) ?? fromLibrary(spec, ctx, e.order);
    const sent = e.prescription.load;
    const was = base.prescription.load;
    let load: Prescription['load'] = was;
    if (sent.kind !== was.kind)
      fields[`exercises[${i}].prescription.load`] =
        `${spec.name}: the load stays ${was.kind === 'percent-1rm' ? 'a share of 1RM' : was.kind === 'band' ? 'a band' : 'body weight'}.`;
    else if (sent.kind === 'percent-1rm' && was.kind === 'percent-1rm') load = { ...was, kg: sent.kg };
    else if (sent.kind === 'band' && was.kind === 'band') load = { ...was, resistance: sent.resistance };
    const prescription: Prescription = { ...e.prescription, tempo: base.prescription.tempo, load };
    return { ...e, prescription, adjustments: base.adjustments, loadRule: loadRuleText(spec, prescription) };
  });
  if (Object.keys(fields).length > 0) throw badRequest('Some fields need attention.', fields);
  return finalizeAdjustment(merged, [...proposal]);
}
