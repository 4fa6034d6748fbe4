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
import type { MaturityBand, PatternId, TaskId } from '@/features/screening/engine';
import type { ClubScope } from '@/server/access/scope';
import { notFound } from '@/server/http/errors';
import type { Executor } from '@/server/screening/screening.repo';
import { progressRepo } from './progress.repo';

export function progressService(db: Executor, scope: ClubScope) {
  const repo = progressRepo(db, scope);

  return {
    /** Every screen of the athlete over time and the comparison of the last two. */
    async athleteProgress(athleteId: string): Promise<ProgressResponse> {
      const athlete = await repo.athlete(athleteId);
      if (!athlete) throw notFound('The athlete');
      const rows = await repo.history(athleteId);
      const forComparison: ScreenForComparison[] = rows.map((r) => ({
        assessmentId: r.assessmentId,
        screenedOn: r.screenedOn,
        tasksDone: Object.keys(r.input.tasks ?? {}) as TaskId[],
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
          exercises: r.result.plan.exercises.length,
        },
      }));
      const n = forComparison.length;
      const comparison = n >= 2 ? compareScreens(forComparison[n - 2]!, forComparison[n - 1]!) : null;
      return { athlete: { id: athlete.id, sex: athlete.sex }, screens, comparison, errorMargins: ERROR_MARGINS };
    },

    /** The squad's rounds with flag counts and knee angles, and one row per current athlete. */
    async squadTrends(squadId: string, today: string, filters: TrendFilters = {}): Promise<TrendsResponse> {
      const squad = await repo.squad(squadId);
      if (!squad) throw notFound('The squad');
      const [roundRows, results, people, latest] = await Promise.all([
        repo.squadRounds(squadId),
        repo.squadResults(squadId),
        repo.squadAthletes(squadId),
        repo.latestOfSquadAthletes(squadId),
      ]);

      const rounds = new Map<string, TrendRound>(
        roundRows.map((r) => [r.id, { id: r.id, name: r.name, screenedOn: r.screenedOn, screened: 0, flagged: {}, kneeAngles: {} }]),
      );
      const roundIndex = new Map(roundRows.map((r, i) => [r.id, i]));
      const anglesByAthlete = new Map<string, Record<string, (number | null)[]>>();
      for (const r of results) {
        const round = rounds.get(r.roundId);
        const index = roundIndex.get(r.roundId);
        if (!round || index === undefined) continue;
        round.screened += 1;
        // One count per athlete and pattern, however many tasks or sides show it.
        const patterns = new Set((r.flagIds ?? []).map((id) => id.split('/')[0] as PatternId));
        for (const p of patterns) round.flagged[p] = (round.flagged[p] ?? 0) + 1;
        const ids = r.fppaIds ?? [];
        const values = r.fppaValues ?? [];
        const mine = anglesByAthlete.get(r.athleteId) ?? {};
        ids.forEach((id, i) => {
          const v = values[i];
          if (typeof v !== 'number') return;
          const angle = Math.round(v * 10) / 10;
          (round.kneeAngles[id] ??= []).push(angle);
          (mine[id] ??= roundRows.map(() => null))[index] = angle;
        });
        anglesByAthlete.set(r.athleteId, mine);
      }
      // Distributions are read sorted (quartiles, strip plots).
      for (const round of rounds.values()) for (const list of Object.values(round.kneeAngles)) list.sort((a, b) => a - b);

      const latestBy = new Map(latest.map((l) => [l.athleteId, l]));
      const athletes: TrendAthlete[] = people.map((p) => {
        const l = latestBy.get(p.id);
        const lastScreenedOn = l?.screenedOn ?? null;
        const rescreen = rescreenOf(lastScreenedOn, l?.rescreenDate ?? null, today);
        return {
          id: p.id,
          firstName: p.firstName,
          lastName: p.lastName,
          sex: p.sex,
          dateOfBirth: p.dateOfBirth,
          ageGroup: ageGroupOf(Math.floor(decimalAge(p.dateOfBirth, today))),
          maturityBand: (l?.maturityBand as MaturityBand | null) ?? null,
          clearance: clearanceText(p.clearance),
          latestAssessmentId: l?.assessmentId ?? null,
          lastScreenedOn,
          daysSinceLastScreen: lastScreenedOn ? daysBetween(lastScreenedOn, today) : null,
          rescreenDate: rescreen.date,
          rescreenDue: rescreen.due,
          latestFlags: sidedPatterns(l?.flagIds ?? [], l?.flagSides ?? []),
          kneeAngles: anglesByAthlete.get(p.id) ?? {},
        };
      });
      return { squad, today, rounds: [...rounds.values()], athletes: filterAthletes(athletes, filters) };
    },
  };
}

/** The clearance as words, whatever shape the column takes (a status string, or a record with one). */
function clearanceText(value: unknown): string | null {
  if (value === null || value === undefined) return null;
  if (typeof value === 'string') return value;
  if (typeof value === 'object' && 'status' in value && typeof (value as { status: unknown }).status === 'string') {
    return (value as { status: string }).status;
  }
  return String(value);
}
