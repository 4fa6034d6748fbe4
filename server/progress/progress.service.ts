import { decimalAge } from '@/features/athletes/age';
import { compareScreens, daysBetween, ERROR_MARGINS, type ScreenForComparison } from '@/features/progress/compare';
import type { ProgressResponse, ProgressScreen } from '@/features/progress/progress-types';
import {
  addDays,
  ageGroupOf,
  filterAthletes,
  rescreenOf,
  sidedPatterns,
  type TrendAthlete,
  type TrendFilters,
  type TrendKneeAngles,
  type TrendRound,
  type TrendsResponse,
} from '@/features/progress/trends';
import type { MaturityBand, TaskId } from '@/features/screening/engine';
import type { ClubScope } from '@/server/access/scope';
import { notFound } from '@/server/http/errors';
import type { Executor } from '@/server/screening/screening.repo';
import { progressRepo, type HistoryRow } from './progress.repo';
import { watchOf, type SquadWatch } from '@/features/progress/watch';

export function progressService(db: Executor, scope: ClubScope) {
  const repo = progressRepo(db, scope);

  return {
    /** Every screen of the athlete over time and the comparison of the last two. */
    async athleteProgress(athleteId: string, today: string): Promise<ProgressResponse> {
      const all = await repo.history(athleteId);
      const first = all[0];
      if (!first) throw notFound('The athlete');
      const rows = all.filter((r): r is ScreenRow => r.assessmentId !== null && r.result !== null);
      const forComparison: ScreenForComparison[] = rows.map((r) => ({
        assessmentId: r.assessmentId,
        screenedOn: r.screenedOn,
        tasksDone: (r.taskIds ?? []) as TaskId[],
        result: r.result,
      }));
      const screens: ProgressScreen[] = rows.map((r) => ({
        assessmentId: r.assessmentId,
        roundId: r.roundId,
        roundName: r.roundName,
        screenedOn: r.screenedOn,
        measurements: r.result.measurements,
        flags: r.result.flags.map((f) => ({ id: f.id, pattern: f.pattern, title: f.title, taskId: f.taskId, side: f.side, severity: f.severity })),
        maturity: r.result.maturity ? { offsetYears: r.result.maturity.offsetYears, band: r.result.maturity.band, method: r.result.maturity.method } : null,
        plan: {
          status: r.result.plan.status,
          rescreenWeeks: r.result.plan.rescreenWeeks,
          rescreenDate: r.result.plan.rescreenDate,
          exercises: r.result.plan.exerciseCount,
        },
      }));
      const n = forComparison.length;
      const comparison = n >= 2 ? compareScreens(forComparison[n - 2]!, forComparison[n - 1]!) : null;
      const newest = forComparison[n - 1];
      const [sessionsBetween, sessionsSinceLatest] = await Promise.all([
        n >= 2 ? repo.sessionsBetween(athleteId, forComparison[n - 2]!.screenedOn, newest!.screenedOn) : null,
        // Up to and including today: the bound is the day after.
        newest ? repo.sessionsBetween(athleteId, newest.screenedOn, addDays(today, 1)) : null,
      ]);
      return { athlete: { id: first.athleteId, sex: first.sex }, screens, comparison, sessionsBetween, sessionsSinceLatest, errorMargins: ERROR_MARGINS };
    },

    /** The squad's rounds with flag counts and knee angles, and one row per current athlete. */
    /** Every squad of the club, each squad's trends table summed by `watchOf` (the head coach's home). */
    async squadsWatch(today: string): Promise<SquadWatch[]> {
      const out: SquadWatch[] = [];
      // One after another: a club has a handful of squads, and each season is one statement.
      for (const s of await repo.squadsOfClub()) out.push(watchOf(s.id, s.name, (await this.squadTrends(s.id, today)).athletes));
      return out;
    },

    async squadTrends(squadId: string, today: string, filters: TrendFilters = {}): Promise<TrendsResponse> {
      const season = await repo.season(squadId);
      if (!season) throw notFound('The squad');
      const waiting = await repo.waitingInOpenRounds(squadId);

      const rounds: TrendRound[] = season.rounds.map(([id, name, screenedOn, screened, flagged]) => ({
        id,
        name,
        screenedOn,
        screened,
        flagged: (flagged ?? {}) as TrendRound['flagged'],
      }));
      // Each round's summary lists its own screened athletes; the response lists everyone once and
      // places each round's values (already rounded to 0.1 degree by PostgreSQL) in that order.
      const athleteIds: string[] = [];
      const at = new Map<string, number>();
      for (const [, , , , , k] of season.rounds) {
        for (const id of k?.athletes ?? []) {
          if (!at.has(id)) at.set(id, athleteIds.push(id) - 1);
        }
      }
      const values: TrendKneeAngles['values'] = {};
      season.rounds.forEach(([, , , , , k], r) => {
        if (!k) return;
        const where = k.athletes.map((id) => at.get(id)!);
        for (const measurementId in k.angles) {
          const theirs = k.angles[measurementId]!;
          const all: (number | null)[] = new Array(athleteIds.length).fill(null);
          for (let i = 0; i < theirs.length; i++) all[where[i]!] = theirs[i] ?? null;
          (values[measurementId] ??= season.rounds.map(() => []))[r] = all;
        }
      });

      const athletes: TrendAthlete[] = season.athletes.map(
        ([
          id,
          firstName,
          lastName,
          sex,
          dateOfBirth,
          clearance,
          latestAssessmentId,
          lastScreenedOn,
          flagIds,
          flagSides,
          maturityBand,
          rescreenDate,
          attended,
          held,
          awaitingClearance,
          screeningConsent,
        ]) => {
          const takingPart = screeningConsent === true;
          const rescreen = rescreenOf(lastScreenedOn, rescreenDate, today);
          return {
            id,
            firstName,
            lastName,
            sex,
            dateOfBirth,
            ageGroup: ageGroupOf(Math.floor(decimalAge(dateOfBirth, today))),
            maturityBand: (maturityBand as MaturityBand | null) ?? null,
            clearance,
            awaitingClearance: awaitingClearance === true,
            latestAssessmentId,
            lastScreenedOn,
            daysSinceLastScreen: lastScreenedOn ? daysBetween(lastScreenedOn, today) : null,
            rescreenDate: rescreen.date,
            // No re-screen is asked of an athlete whose family has not agreed to take part (our rule).
            rescreenDue: takingPart && rescreen.due,
            openRound: waiting.get(id) ?? null,
            takingPart,
            screeningRefused: screeningConsent === false,
            latestFlags: sidedPatterns(flagIds ?? [], flagSides ?? []),
            sessionsSinceScreen: lastScreenedOn ? { attended, held } : null,
          };
        },
      );
      return { squad: season.squad, today, rounds, athletes: filterAthletes(athletes, filters), kneeAngles: { athleteIds, values } };
    },
  };
}

type ScreenRow = HistoryRow & { assessmentId: string; roundId: string; roundName: string; screenedOn: string; result: NonNullable<HistoryRow['result']> };
