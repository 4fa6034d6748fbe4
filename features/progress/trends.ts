/**
 * Squad trends: the response shape of `GET /api/squads/:id/trends`, and the pure rules both the server
 * and the screen use (age groups, re-screen due, filters, sorting, the CSV table), so the table on screen
 * and the CSV download can never disagree.
 */
import type { MaturityBand, PatternId, Sex } from '@/features/screening/engine';
import { DEFAULT_RESCREEN_WEEKS } from '@/features/screening/engine/defaults';
import { CLEARANCE_LABELS } from '@/features/care/choices';
import { TAKING_PART_TAGS } from '@/features/athletes/taking-part';
import { daysBetween } from './compare';
import { BAND_LABELS, PATTERN_SHORT } from './labels';

export type TrendRound = {
  id: string;
  name: string;
  screenedOn: string;
  /** Athletes with a submitted screen in the round. */
  screened: number;
  /** Per pattern: how many of the screened athletes had that flag (an athlete with it on both sides counts once). */
  flagged: Partial<Record<PatternId, number>>;
};

/**
 * Knee angles from the front (FPPA, degrees, 0.1 precision) of everyone screened in the squad's rounds,
 * each angle once: per round they draw the squad's distribution, per athlete the change between two
 * rounds. (Athletes who have since left the squad are in the distributions, not in the table.)
 */
export type TrendKneeAngles = {
  /** Everyone screened in the rounds, in the order of the values below. */
  athleteIds: string[];
  /**
   * By measurement id (e.g. 'single-leg-squat-left/fppa/left'): per round of the response's `rounds`
   * (same order), one value per athlete of `athleteIds`, null where not measured; an empty list where
   * nobody was.
   */
  values: Record<string, (number | null)[][]>;
};

export type SidedPatterns = { left: PatternId[]; right: PatternId[]; both: PatternId[]; unsided: PatternId[] };

export type TrendAthlete = {
  id: string;
  firstName: string;
  lastName: string;
  sex: Sex;
  dateOfBirth: string;
  ageGroup: string;
  maturityBand: MaturityBand | null;
  /** The care team's clearance, where the club records one; null otherwise. */
  clearance: string | null;
  /**
   * Pain was reported at the newest screen and no clearance has been recorded since: loaded and landing
   * work wait (the training sheet's hold, `strengthBlock`).
   */
  awaitingClearance: boolean;
  /** The family agreed to screening and exercises (none on record: false); without it no re-screen is due. */
  takingPart: boolean;
  /** The family's decision in force is a no (false where none is recorded). */
  screeningRefused: boolean;
  latestAssessmentId: string | null;
  lastScreenedOn: string | null;
  daysSinceLastScreen: number | null;
  rescreenDate: string | null;
  rescreenDue: boolean;
  /** An open round of the squad in which the athlete's screen is not submitted yet (its name), or null. */
  openRound?: string | null;
  latestFlags: SidedPatterns;
  /**
   * The squad's corrective sessions recorded after the newest screen (`held`; our choice: not on the
   * screen's own day) and how many of them the athlete took part in; null when never screened. `held` is
   * 0 where the squad records no sessions.
   */
  sessionsSinceScreen: { attended: number; held: number } | null;
};

export type TrendsResponse = {
  squad: { id: string; name: string };
  /** The day "days since" and "re-screen due" were counted on. */
  today: string;
  rounds: TrendRound[];
  athletes: TrendAthlete[];
  kneeAngles: TrendKneeAngles;
};

/** The knee-angle measurements with at least one value in the season, sorted. */
export function kneeMeasurementIds(k: TrendKneeAngles): string[] {
  return Object.keys(k.values)
    .filter((id) => k.values[id]!.some((round) => round.some((v) => v !== null)))
    .sort();
}

/** One round's knee angles of one measurement, everyone screened, sorted (for quartiles and dot plots). */
export function roundKneeAngles(k: TrendKneeAngles, measurementId: string, roundIndex: number): number[] {
  const values = k.values[measurementId]?.[roundIndex] ?? [];
  return values.filter((v): v is number => v !== null).sort((a, b) => a - b);
}

/** One athlete's knee angle of one measurement per round (same order as `rounds`), null where not measured. */
export function athleteKneeSeries(k: TrendKneeAngles, athleteId: string, measurementId: string, roundCount: number): (number | null)[] {
  const at = k.athleteIds.indexOf(athleteId);
  const rounds = k.values[measurementId] ?? [];
  return Array.from({ length: roundCount }, (_, r) => (at < 0 ? null : (rounds[r]?.[at] ?? null)));
}

/** Age groups by whole years on the day: under-11, -13, -15, -17, -19 (our choice; clubs' own cut-off dates differ). */
const AGE_GROUP_LIMITS = [11, 13, 15, 17, 19] as const;
export function ageGroupOf(ageYears: number): string {
  const limit = AGE_GROUP_LIMITS.find((n) => ageYears < n);
  return limit ? `U${limit}` : 'Open';
}
export const AGE_GROUPS = [...AGE_GROUP_LIMITS.map((n) => `U${n}`), 'Open'] as const;

export function addDays(iso: string, days: number): string {
  const d = new Date(Date.UTC(+iso.slice(0, 4), +iso.slice(5, 7) - 1, +iso.slice(8, 10) + days));
  return d.toISOString().slice(0, 10);
}

/**
 * The re-screen date: the one the engine set with the plan, or (a result without one) the last screen plus
 * the engine's default interval. Due from that day on.
 */
export function rescreenOf(lastScreenedOn: string | null, planDate: string | null, today: string): { date: string | null; due: boolean } {
  if (!lastScreenedOn) return { date: null, due: true };
  const date = planDate ?? addDays(lastScreenedOn, DEFAULT_RESCREEN_WEEKS * 7);
  return { date, due: daysBetween(date, today) >= 0 };
}

/**
 * The pattern a flag id names: flag ids start with it ('pattern/scope/side', stable identifiers of the
 * engine). Cut at the first slash rather than split: a squad's season has thousands of flag ids, and
 * splitting each into three strings was most of the time spent counting them.
 */
export function patternOfFlag(flagId: string): PatternId {
  const cut = flagId.indexOf('/');
  return (cut < 0 ? flagId : flagId.slice(0, cut)) as PatternId;
}

/** Sorts flags into sides from the flags' ids and sides. */
export function sidedPatterns(flagIds: readonly string[], flagSides: readonly (string | null)[]): SidedPatterns {
  const out: SidedPatterns = { left: [], right: [], both: [], unsided: [] };
  flagIds.forEach((id, i) => {
    const pattern = patternOfFlag(id);
    const side = flagSides[i];
    const list = side === 'left' ? out.left : side === 'right' ? out.right : side === 'both' ? out.both : out.unsided;
    if (!list.includes(pattern)) list.push(pattern);
  });
  return out;
}

/** The movement flags of an athlete: every pattern but the growth-spurt window. */
export function movementPatterns(f: SidedPatterns): PatternId[] {
  return allPatterns(f).filter((p) => p !== 'growth-spurt-window');
}

export function allPatterns(f: SidedPatterns): PatternId[] {
  return [...new Set([...f.left, ...f.right, ...f.both, ...f.unsided])];
}

export type TrendFilters = {
  sex?: Sex | '';
  ageGroup?: string;
  maturityBand?: MaturityBand | 'unknown' | '';
  flag?: PatternId | 'any' | 'none' | '';
};
export const FILTER_KEYS = ['sex', 'ageGroup', 'maturityBand', 'flag'] as const;

export function filterAthletes(rows: readonly TrendAthlete[], f: TrendFilters): TrendAthlete[] {
  return rows.filter((a) => {
    if (f.sex && a.sex !== f.sex) return false;
    if (f.ageGroup && a.ageGroup !== f.ageGroup) return false;
    if (f.maturityBand && (a.maturityBand ?? 'unknown') !== f.maturityBand) return false;
    if (f.flag) {
      // "Any" and "none" are about how the athlete moved: the growth-spurt window is a stage, with its
      // own filters (the maturity band and its own flag), not a movement fault (our choice).
      const patterns = f.flag === 'any' || f.flag === 'none' ? movementPatterns(a.latestFlags) : allPatterns(a.latestFlags);
      if (f.flag === 'any' && patterns.length === 0) return false;
      // "No movement flag" means screened and none raised: never screened is not "none" (our rule).
      if (f.flag === 'none' && (patterns.length > 0 || a.latestAssessmentId === null)) return false;
      if (f.flag !== 'any' && f.flag !== 'none' && !patterns.includes(f.flag)) return false;
    }
    return true;
  });
}

export type SortKey = 'name' | 'ageGroup' | 'maturityBand' | 'flags' | 'daysSinceLastScreen' | 'rescreenDue' | 'clearance' | 'sessions';
export const SORT_KEYS: readonly SortKey[] = ['name', 'ageGroup', 'maturityBand', 'flags', 'daysSinceLastScreen', 'rescreenDue', 'clearance', 'sessions'];

/**
 * Share of the sessions since the screen that the athlete took part in, 0-1; null where there is
 * nothing to share (never screened, or no session recorded since).
 */
export function sessionShare(a: Pick<TrendAthlete, 'sessionsSinceScreen'>): number | null {
  const s = a.sessionsSinceScreen;
  return s && s.held > 0 ? s.attended / s.held : null;
}

const BAND_ORDER: Record<string, number> = { pre: 0, circa: 1, post: 2 };
const CLEARANCE_ORDER: Record<string, number> = { referred: 1, modified: 2, cleared: 3 };

function sortValue(a: TrendAthlete, key: SortKey): string | number {
  switch (key) {
    case 'name':
      return `${a.lastName} ${a.firstName}`.toLowerCase();
    case 'ageGroup':
      return AGE_GROUPS.indexOf(a.ageGroup as (typeof AGE_GROUPS)[number]);
    case 'maturityBand':
      return a.maturityBand ? BAND_ORDER[a.maturityBand]! : 9;
    case 'flags':
      // Most flags first (our choice: the first tap answers "who needs work most").
      return -movementPatterns(a.latestFlags).length;
    case 'daysSinceLastScreen':
      return a.daysSinceLastScreen ?? Number.MAX_SAFE_INTEGER;
    case 'rescreenDue':
      // Due first, the longest overdue first (never screened before any date), then the next due; those
      // not to be screened last (our choice). ISO dates sort as strings.
      if (!a.takingPart) return '2';
      return a.rescreenDue ? `0 ${a.rescreenDate ?? ''}` : `1 ${a.rescreenDate ?? '~'}`;
    case 'clearance':
      // The most held back first: pain waiting for a clearance, referred on, training with changes, cleared,
      // then no decision (our choice).
      return a.awaitingClearance ? 0 : a.clearance ? (CLEARANCE_ORDER[a.clearance] ?? 8) : 9;
    case 'sessions':
      // Lowest share first: who is missing the corrective work (our choice); nothing to count goes last.
      return sessionShare(a) ?? 2;
  }
}

export function sortAthletes(rows: readonly TrendAthlete[], key: SortKey, descending = false): TrendAthlete[] {
  const dir = descending ? -1 : 1;
  return [...rows].sort((x, y) => {
    const a = sortValue(x, key);
    const b = sortValue(y, key);
    if (a < b) return -dir;
    if (a > b) return dir;
    return `${x.lastName} ${x.firstName}`.localeCompare(`${y.lastName} ${y.firstName}`);
  });
}

export const CSV_HEADER = [
  'last_name',
  'first_name',
  'sex',
  'age_group',
  'maturity_band',
  'clearance',
  'flags_left',
  'flags_right',
  'flags_both_or_unsided',
  'last_screened_on',
  'days_since_last_screen',
  'rescreen_date',
  'rescreen_due',
  'sessions_since_screen_taken_part',
  'sessions_since_screen_held',
] as const;

const names = (patterns: PatternId[]) => patterns.map((p) => PATTERN_SHORT[p]).join('; ');

/** Where the athlete stands with the care team, in the screen's words; null when nothing is recorded or waiting. */
export function clearanceWords(a: Pick<TrendAthlete, 'clearance' | 'awaitingClearance'>): string | null {
  if (a.awaitingClearance) return 'Pain reported: waiting for clearance';
  if (!a.clearance) return null;
  return (CLEARANCE_LABELS as Record<string, string>)[a.clearance] ?? a.clearance;
}

/** 'single-leg-squat-left/fppa/left' -> 'knee_angle_deg_single_leg_squat_left_left_knee': a spreadsheet's column name. */
export function kneeColumnName(measurementId: string): string {
  const [scope = '', , side] = measurementId.split('/');
  return `knee_angle_deg_${scope.replace(/[^a-z0-9]+/gi, '_').toLowerCase()}${side ? `_${side}_knee` : ''}`;
}

/**
 * The knee angles of the newest round in which the athlete has any knee angle: that round's name and
 * date, and one value per measurement (empty where not measured in that round). A value from an older
 * round is never mixed in (our choice: one row of the CSV reads as one screen).
 */
export function newestKneeAngles(k: TrendKneeAngles, rounds: readonly TrendRound[], athleteId: string, ids: readonly string[]) {
  const series = ids.map((id) => athleteKneeSeries(k, athleteId, id, rounds.length));
  for (let r = rounds.length - 1; r >= 0; r--) {
    if (series.some((values) => values[r] !== null)) return { round: rounds[r]!, values: series.map((values) => values[r] ?? null) };
  }
  return null;
}

/**
 * The table as CSV rows (header first), in the screen's words; values only, the CSV writer does the
 * quoting. With the season's knee angles, each row ends with the athlete's newest ones (degrees, as measured)
 * and the round they come from.
 */
export function csvRows(rows: readonly TrendAthlete[], season?: { kneeAngles: TrendKneeAngles; rounds: readonly TrendRound[] }): string[][] {
  const ids = season ? kneeMeasurementIds(season.kneeAngles) : [];
  const knee = (a: TrendAthlete): string[] => {
    if (!season) return [];
    const newest = newestKneeAngles(season.kneeAngles, season.rounds, a.id, ids);
    if (!newest) return ['', ...ids.map(() => '')];
    return [`${newest.round.name} (${newest.round.screenedOn})`, ...newest.values.map((v) => (v === null ? '' : v.toFixed(1)))];
  };
  return [
    [...CSV_HEADER, ...(season ? ['knee_angles_from_round', ...ids.map(kneeColumnName)] : [])],
    ...rows.map((a) => [
      a.lastName,
      a.firstName,
      a.sex,
      a.ageGroup,
      a.maturityBand ? BAND_LABELS[a.maturityBand] : '',
      clearanceWords(a) ?? '',
      names(a.latestFlags.left),
      names(a.latestFlags.right),
      names([...a.latestFlags.both, ...a.latestFlags.unsided]),
      a.lastScreenedOn ?? '',
      a.daysSinceLastScreen === null ? '' : String(a.daysSinceLastScreen),
      a.rescreenDate ?? '',
      a.takingPart ? (a.rescreenDue ? 'yes' : 'no') : TAKING_PART_TAGS[a.screeningRefused ? 'refused' : 'unrecorded'].toLowerCase(),
      a.sessionsSinceScreen ? String(a.sessionsSinceScreen.attended) : '',
      a.sessionsSinceScreen ? String(a.sessionsSinceScreen.held) : '',
      ...knee(a),
    ]),
  ];
}

/** Share of the screened athletes with a pattern, 0-1; null when nobody was screened. */
export function shareOf(round: TrendRound, pattern: PatternId): number | null {
  if (round.screened === 0) return null;
  return (round.flagged[pattern] ?? 0) / round.screened;
}

/**
 * One flag's share per round. Each flag's points sit a little to the side of the round's date (at most
 * 0.2 of the gap between rounds, in the legend's order), so that flags with the same share in a round
 * stay visible side by side instead of hiding each other (our choice).
 */
export function shareSeries(rounds: readonly TrendRound[], pattern: PatternId, index: number, count: number): { x: number; y: number }[] {
  const step = count > 1 ? Math.min(0.06, 0.4 / (count - 1)) : 0;
  const offset = (index - (count - 1) / 2) * step;
  return rounds.map((r, i) => ({ x: i + offset, y: shareOf(r, pattern) })).filter((d): d is { x: number; y: number } => d.y !== null);
}

/** The flag-share chart's caption names at most this many rounds (our choice). */
const CAPTION_ROUNDS = 8;

/**
 * How many were screened in each round with data, for the flag-share chart's caption: a share of 2
 * screened reads like one of 12 on the chart (our wording). `dateText` formats a round's date.
 */
export function screenedCaption(rounds: readonly TrendRound[], dateText: (day: string) => string): string | null {
  const withData = rounds.filter((r) => r.screened > 0);
  if (withData.length === 0) return null;
  // The newest eight at most: a caption, not a table (the numbers table has every round).
  const shown = withData.slice(-CAPTION_ROUNDS);
  const counts = shown.map((r) => `${dateText(r.screenedOn)}: ${r.screened}`).join(' · ');
  const which = withData.length > shown.length ? `Screened in the latest ${shown.length} rounds` : 'Screened per round';
  return `${which}: ${counts}. Each share is of those screened in that round, so a round with few screened moves a lot.`;
}

/**
 * The two rounds the change chart compares first: the newest two in which at least half as many were
 * screened as in the squad's fullest round, so a round just started (two screened) or a small extra
 * round does not empty the chart; the two newest with anyone screened otherwise (our choice). Ids, ''
 * where there is no such round.
 */
export function defaultRoundPair(rounds: readonly TrendRound[]): { from: string; to: string } {
  const pick = fullRounds(rounds).rounds;
  return { from: pick.at(-2)?.id ?? '', to: pick.at(-1)?.id ?? '' };
}

/**
 * The rounds in which at least half as many were screened as in the squad's fullest round, in order, and
 * how many rounds with anyone screened that leaves out; every round with anyone screened where fewer than
 * two are that full (our choice). A share of one or two screened swings between 0 and 100 % and hid the
 * season's line on the flag-share chart; the numbers table keeps every round.
 */
export function fullRounds<R extends TrendRound>(rounds: readonly R[]): { rounds: R[]; leftOut: number } {
  const screened = rounds.filter((r) => r.screened > 0);
  const most = Math.max(0, ...screened.map((r) => r.screened));
  const full = screened.filter((r) => r.screened * 2 >= most);
  return full.length >= 2 ? { rounds: full, leftOut: screened.length - full.length } : { rounds: screened, leftOut: 0 };
}
