/**
 * Validation of evaluateAssessment's input. Missing things are fine (a task
 * not done, a landmark not placed yet); impossible things throw an
 * EngineInputError whose `field` is a dotted path into the input.
 */
import { BATTERY, getTask, isTaskId, type TaskSpec } from './battery';
import { EngineInputError, requireFinite } from './errors';
import { checkPoint, isValidPoint } from './geometry';
import { isLandmarkId } from './landmarks';
import { DEFAULT_LOAD_INCREMENT_KG, DEFAULT_MATURITY_METHOD, DEFAULT_RESCREEN_WEEKS } from './defaults';
import type { AssessmentInput, AthleteInput, LandmarkId, MaturityMethod, Point, Side, TaskId, View } from './types';

export { DEFAULT_LOAD_INCREMENT_KG, DEFAULT_MATURITY_METHOD, DEFAULT_RESCREEN_WEEKS };

export type Landmarks = Partial<Record<LandmarkId, Point>>;

export interface NormalizedTask {
  spec: TaskSpec;
  criteria: readonly string[];
  front: Landmarks;
  side: Landmarks;
  distanceCm: number | undefined;
  painReported: boolean;
}

export interface NormalizedAssessment {
  athlete: AthleteInput;
  /** In battery order. */
  tasks: Map<TaskId, NormalizedTask>;
  oneRepMaxKg: number | undefined;
  rescreenWeeks: number;
  /** Days since 1970-01-01 (UTC), or null. */
  todayDay: number | null;
  maturityMethod: MaturityMethod | 'none';
  loadIncrementKg: number;
  painCleared: boolean;
  /** Titles of the tasks that hurt at an earlier, uncleared screen, each with its day. */
  earlierPainTitles: string[];
}

const MS_PER_DAY = 86_400_000;

function isRecord(v: unknown): v is Record<string, unknown> {
  return typeof v === 'object' && v !== null && !Array.isArray(v);
}

function optionalInRange(field: string, v: unknown, min: number, max: number, unit: string): number | undefined {
  if (v === undefined) return undefined;
  const n = requireFinite(field, v);
  if (n < min || n > max) {
    throw new EngineInputError(field, `must be between ${min} and ${max} ${unit}, got ${n}`);
  }
  return n;
}

function validateAthlete(a: unknown): AthleteInput {
  if (!isRecord(a)) throw new EngineInputError('athlete', 'is missing');
  const sex = a['sex'];
  if (sex !== 'female' && sex !== 'male') {
    throw new EngineInputError('athlete.sex', `must be 'female' or 'male', got ${String(sex)}`);
  }
  const ageYears = requireFinite('athlete.ageYears', a['ageYears']);
  if (ageYears <= 0 || ageYears > 100) {
    throw new EngineInputError('athlete.ageYears', `must be more than 0 and at most 100, got ${ageYears}`);
  }
  const statureCm = optionalInRange('athlete.statureCm', a['statureCm'], 80, 230, 'cm');
  const sittingHeightCm = optionalInRange('athlete.sittingHeightCm', a['sittingHeightCm'], 40, 130, 'cm');
  const massKg = optionalInRange('athlete.massKg', a['massKg'], 10, 200, 'kg');
  if (statureCm !== undefined && sittingHeightCm !== undefined && sittingHeightCm >= statureCm) {
    throw new EngineInputError('athlete.sittingHeightCm', `must be less than stature (${statureCm} cm), got ${sittingHeightCm}`);
  }
  const racketHand = a['racketHand'];
  if (racketHand !== undefined && racketHand !== 'left' && racketHand !== 'right') {
    throw new EngineInputError('athlete.racketHand', `must be 'left' or 'right', got ${String(racketHand)}`);
  }
  const out: AthleteInput = { sex, ageYears };
  if (statureCm !== undefined) out.statureCm = statureCm;
  if (sittingHeightCm !== undefined) out.sittingHeightCm = sittingHeightCm;
  if (massKg !== undefined) out.massKg = massKg;
  if (racketHand !== undefined) out.racketHand = racketHand as Side;
  return out;
}

function validateLandmarks(path: string, spec: TaskSpec, view: View, photo: unknown): Landmarks {
  if (photo === undefined) return {};
  if (!spec.views.some((v) => v.view === view)) {
    throw new EngineInputError(path, `the task ${spec.id} has no ${view} photo`);
  }
  if (!isRecord(photo) || !isRecord(photo['landmarks'])) {
    throw new EngineInputError(`${path}.landmarks`, 'must be an object of landmark id to {x, y}');
  }
  const out: Landmarks = {};
  for (const [id, point] of Object.entries(photo['landmarks'])) {
    if (!isLandmarkId(id)) throw new EngineInputError(`${path}.landmarks.${id}`, 'is not a known landmark id');
    if (point === undefined) continue;
    // Build the error path only when a point is bad.
    const q = isValidPoint(point) ? point : checkPoint(`${path}.landmarks.${id}`, point);
    out[id] = { x: q.x, y: q.y };
  }
  const swapped = view === 'front' ? swappedFrontPair(out) : null;
  if (swapped) {
    const [right, left] = swapped;
    throw new EngineInputError(
      `${path}.landmarks.${right}`,
      `${right} must be on the image's left of ${left}: in a front view the athlete's right appears on the image's left`,
    );
  }
  return out;
}

const FRONT_PAIRS = [
  ['right-hip', 'left-hip'],
  ['right-asis', 'left-asis'],
] as const satisfies readonly (readonly [LandmarkId, LandmarkId])[];

/**
 * In a front photo (camera facing the athlete) the athlete's right is on the image's left. The first pair
 * placed the other way round (or one on top of the other), or null: such a pair was labelled mirrored,
 * which would flip every sign. Exported so that a screen can say so before anything is sent.
 */
export function swappedFrontPair(marks: Landmarks): readonly [LandmarkId, LandmarkId] | null {
  for (const pair of FRONT_PAIRS) {
    const r = marks[pair[0]];
    const l = marks[pair[1]];
    if (r && l && !(r.x < l.x)) return pair;
  }
  return null;
}

function validateTask(id: TaskId, raw: unknown): NormalizedTask {
  const path = `tasks.${id}`;
  const spec = getTask(id);
  if (!isRecord(raw)) throw new EngineInputError(path, 'must be an object');

  const criteria = raw['criteria'];
  if (!Array.isArray(criteria)) throw new EngineInputError(`${path}.criteria`, 'must be an array of criterion ids');
  const known = new Set(spec.criteria.map((c) => c.id));
  const seen = new Set<string>();
  for (const c of criteria) {
    if (typeof c !== 'string' || !known.has(c)) {
      throw new EngineInputError(`${path}.criteria`, `${String(c)} is not a criterion of ${id}`);
    }
    seen.add(c);
  }

  const photos = raw['photos'];
  if (photos !== undefined && !isRecord(photos)) throw new EngineInputError(`${path}.photos`, 'must be an object');
  const front = validateLandmarks(`${path}.photos.front`, spec, 'front', photos?.['front']);
  const side = validateLandmarks(`${path}.photos.side`, spec, 'side', photos?.['side']);

  let distanceCm: number | undefined;
  if (raw['distanceCm'] !== undefined) {
    if (!spec.distance) throw new EngineInputError(`${path}.distanceCm`, `the task ${id} takes no distance`);
    const d = requireFinite(`${path}.distanceCm`, raw['distanceCm']);
    if (d < spec.distance.minCm) throw new EngineInputError(`${path}.distanceCm`, `cannot be negative, got ${d}`);
    if (d > spec.distance.maxCm) {
      throw new EngineInputError(`${path}.distanceCm`, `must be at most ${spec.distance.maxCm} cm (check the unit is cm), got ${d}`);
    }
    distanceCm = d;
  }

  const pain = raw['painReported'];
  if (pain !== undefined && typeof pain !== 'boolean') {
    throw new EngineInputError(`${path}.painReported`, 'must be true or false');
  }

  return { spec, criteria: [...seen], front, side, distanceCm, painReported: pain === true };
}

/** Parse YYYY-MM-DD (optionally followed by a time) into a UTC day number, rejecting impossible dates. */
export function parseIsoDay(field: string, value: unknown): number {
  const m = typeof value === 'string' ? /^(\d{4})-(\d{2})-(\d{2})(?:$|T)/.exec(value) : null;
  if (!m) throw new EngineInputError(field, `must be an ISO date like 2025-03-14, got ${String(value)}`);
  const y = Number(m[1]);
  const mo = Number(m[2]);
  const d = Number(m[3]);
  const ms = Date.UTC(y, mo - 1, d);
  const check = new Date(ms);
  if (check.getUTCFullYear() !== y || check.getUTCMonth() !== mo - 1 || check.getUTCDate() !== d) {
    throw new EngineInputError(field, `${String(value)} is not a calendar date`);
  }
  return Math.round(ms / MS_PER_DAY);
}

export function formatIsoDay(day: number): string {
  return new Date(day * MS_PER_DAY).toISOString().slice(0, 10);
}

export function validateAssessment(input: AssessmentInput): NormalizedAssessment {
  if (!isRecord(input)) throw new EngineInputError('input', 'must be an object');
  const athlete = validateAthlete(input.athlete);

  const rawTasks: unknown = input.tasks;
  if (!isRecord(rawTasks)) throw new EngineInputError('tasks', 'must be an object keyed by task id');
  for (const key of Object.keys(rawTasks)) {
    if (!isTaskId(key)) throw new EngineInputError(`tasks.${key}`, 'is not a known task id');
  }
  const tasks = new Map<TaskId, NormalizedTask>();
  for (const spec of BATTERY) {
    const raw = rawTasks[spec.id];
    if (raw === undefined) continue;
    tasks.set(spec.id, validateTask(spec.id, raw));
  }

  const options: unknown = input.options ?? {};
  if (!isRecord(options)) throw new EngineInputError('options', 'must be an object');

  let rescreenWeeks = DEFAULT_RESCREEN_WEEKS;
  if (options['rescreenWeeks'] !== undefined) {
    const w = requireFinite('options.rescreenWeeks', options['rescreenWeeks']);
    if (!Number.isInteger(w) || w < 1 || w > 52) {
      throw new EngineInputError('options.rescreenWeeks', `must be a whole number of weeks from 1 to 52, got ${w}`);
    }
    rescreenWeeks = w;
  }

  const todayDay = options['today'] === undefined ? null : parseIsoDay('options.today', options['today']);

  const method = options['maturityMethod'] ?? DEFAULT_MATURITY_METHOD;
  if (method !== 'mirwald2002' && method !== 'moore2015' && method !== 'none') {
    throw new EngineInputError('options.maturityMethod', `must be 'mirwald2002', 'moore2015' or 'none', got ${String(method)}`);
  }

  let loadIncrementKg = DEFAULT_LOAD_INCREMENT_KG;
  if (options['loadIncrementKg'] !== undefined) {
    const inc = requireFinite('options.loadIncrementKg', options['loadIncrementKg']);
    if (inc <= 0 || inc > 25) {
      throw new EngineInputError('options.loadIncrementKg', `must be more than 0 and at most 25 kg, got ${inc}`);
    }
    loadIncrementKg = inc;
  }

  let oneRepMaxKg: number | undefined;
  if (input.oneRepMaxKg !== undefined) {
    const orm = requireFinite('oneRepMaxKg', input.oneRepMaxKg);
    // A 1RM smaller than the load step is allowed: the plan then says no step fits and prescribes bodyweight.
    if (orm <= 0 || orm > 500) {
      throw new EngineInputError('oneRepMaxKg', `must be more than 0 and at most 500 kg, got ${orm}`);
    }
    oneRepMaxKg = orm;
  }

  const painCleared = options['painCleared'] ?? false;
  if (typeof painCleared !== 'boolean') {
    throw new EngineInputError('options.painCleared', `must be true or false, got ${String(painCleared)}`);
  }

  const earlierPainTitles: string[] = [];
  const earlier = options['earlierPain'];
  if (earlier !== undefined) {
    if (!isRecord(earlier)) throw new EngineInputError('options.earlierPain', 'must be an object with day and taskIds');
    const day = formatIsoDay(parseIsoDay('options.earlierPain.day', earlier['day']));
    const ids = earlier['taskIds'];
    if (!Array.isArray(ids) || ids.length === 0) throw new EngineInputError('options.earlierPain.taskIds', 'must be a non-empty list of task ids');
    for (const id of ids) {
      if (typeof id !== 'string' || !isTaskId(id)) throw new EngineInputError('options.earlierPain.taskIds', `${String(id)} is not a known task id`);
      earlierPainTitles.push(`${getTask(id).title} (at the screen of ${day})`);
    }
  }

  return { athlete, tasks, oneRepMaxKg, rescreenWeeks, todayDay, maturityMethod: method, loadIncrementKg, painCleared, earlierPainTitles };
}
