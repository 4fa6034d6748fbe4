import { decimalAge } from '@/features/athletes/age';
import { compareScreens, daysBetween, ERROR_MARGINS, type ScreenForComparison } from '@/features/progress/compare';
import type { ProgressResponse, ProgressScreen } from '@/features/progress/progress-types';
import {
  ageGroupOf,
  filterAthletes,
  rescreenOf,
  sidedPatterns,
  type TrendAthlete,
  type TrendFilters,
  type TrendRound,
  type TrendsResponse,
} from '@/features/progress/trends';
import type { MaturityBand, TaskId } from '@/features/screening/engine';
import type { ClubScope } from '@/server/access/scope';
import { notFound } from '@/server/http/errors';
import type { Executor } from '@/server/screening/screening.repo';
import { progressRepo, type HistoryRow } from './progress.repo';

export function progressService(db: Executor, scope: ClubScope) {
  const repo = progressRepo(db, scope);

  return {
    /** Every screen of the athlete over time and the comparison of the last two. */
    async athleteProgress(athleteId: string): Promise<ProgressResponse> {
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
      return { athlete: { id: first.athleteId, sex: first.sex }, screens, comparison, errorMargins: ERROR_MARGINS };
    },

    /** The squad's rounds with flag counts and knee angles, and one row per current athlete. */
    async squadTrends(squadId: string, today: string, filters: TrendFilters = {}): Promise<TrendsResponse> {
      const season = await repo.season(squadId);
      if (!season) throw notFound('The squad');

      const rounds: TrendRound[] = [];
      const anglesByAthlete = new Map<string, Record<string, (number | null)[]>>();
      season.rounds.forEach(([id, name, screenedOn, screened, flagged, kneeAngles], index) => {
        const round: TrendRound = { id, name, screenedOn, screened, flagged: (flagged ?? {}) as TrendRound['flagged'], kneeAngles: {} };
        rounds.push(round);
        // Parallel arrays (see `round_summaries`), already rounded to 0.1 degree by PostgreSQL.
        const screenedIds = kneeAngles?.athletes ?? [];
        for (const measurementId in kneeAngles?.angles) {
          const values = kneeAngles.angles[measurementId]!;
          const all: number[] = (round.kneeAngles[measurementId] = []);
          for (let i = 0; i < values.length; i++) {
            const angle = values[i];
            if (typeof angle !== 'number') continue;
            all.push(angle);
            const athleteId = screenedIds[i]!;
            let mine = anglesByAthlete.get(athleteId);
            if (!mine) anglesByAthlete.set(athleteId, (mine = {}));
            (mine[measurementId] ??= season.rounds.map(() => null))[index] = angle;
          }
        }
      });
      // Distributions are read sorted (quartiles, strip plots).
      for (const round of rounds) for (const list of Object.values(round.kneeAngles)) list.sort((a, b) => a - b);

      const athletes: TrendAthlete[] = season.athletes.map(
        ([id, firstName, lastName, sex, dateOfBirth, clearance, latestAssessmentId, lastScreenedOn, flagIds, flagSides, maturityBand, rescreenDate]) => {
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
            latestAssessmentId,
            lastScreenedOn,
            daysSinceLastScreen: lastScreenedOn ? daysBetween(lastScreenedOn, today) : null,
            rescreenDate: rescreen.date,
            rescreenDue: rescreen.due,
            latestFlags: sidedPatterns(flagIds ?? [], flagSides ?? []),
            kneeAngles: anglesByAthlete.get(id) ?? {},
          };
        },
      );
      return { squad: season.squad, today, rounds, athletes: filterAthletes(athletes, filters) };
    },
  };
}

type ScreenRow = HistoryRow & { assessmentId: string; roundId: string; roundName: string; screenedOn: string; result: NonNullable<HistoryRow['result']> };
