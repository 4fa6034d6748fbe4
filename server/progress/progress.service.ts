import { decimalAge } from '@/features/athletes/age';
import { compareScreens, daysBetween, ERROR_MARGINS, type ScreenForComparison } from '@/features/progress/compare';
import type { ProgressResponse, ProgressScreen } from '@/features/progress/progress-types';
import {
  ageGroupOf,
  filterAthletes,
  patternOfFlag,
  rescreenOf,
  sidedPatterns,
  type TrendAthlete,
  type TrendFilters,
  type TrendRound,
  type TrendsResponse,
} from '@/features/progress/trends';
import type { MaturityBand, PatternId, TaskId } from '@/features/screening/engine';
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

      const rounds: TrendRound[] = season.rounds.map(([id, name, screenedOn]) => ({ id, name, screenedOn, screened: 0, flagged: {}, kneeAngles: {} }));
      const anglesByAthlete = new Map<string, Record<string, (number | null)[]>>();
      for (const [index, athleteId, flagIds, fppaIds, fppaValues] of season.results) {
        const round = rounds[index];
        if (!round) continue;
        round.screened += 1;
        // One count per athlete and pattern, however many tasks or sides show it.
        const counted: PatternId[] = [];
        for (const id of flagIds ?? []) {
          const p = patternOfFlag(id);
          if (counted.includes(p)) continue;
          counted.push(p);
          round.flagged[p] = (round.flagged[p] ?? 0) + 1;
        }
        const ids = fppaIds ?? [];
        const values = fppaValues ?? [];
        let mine = anglesByAthlete.get(athleteId);
        if (!mine) anglesByAthlete.set(athleteId, (mine = {}));
        for (let i = 0; i < ids.length; i++) {
          const v = values[i];
          if (typeof v !== 'number') continue;
          const id = ids[i]!;
          const angle = Math.round(v * 10) / 10;
          (round.kneeAngles[id] ??= []).push(angle);
          (mine[id] ??= rounds.map(() => null))[index] = angle;
        }
      }
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
