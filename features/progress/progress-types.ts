/** The response of `GET /api/athletes/:id/progress`, shared by the server and the athlete page. */
import type { Flag, MaturityResult, Measurement, Plan, Sex } from '@/features/screening/engine';
import type { ErrorMargin, FlagRef, ScreenComparison } from './compare';

export type ProgressScreen = {
  assessmentId: string;
  roundId: string;
  roundName: string;
  screenedOn: string;
  measurements: Measurement[];
  flags: FlagRef[];
  maturity: Pick<MaturityResult, 'offsetYears' | 'band' | 'method'> | null;
  plan: Pick<Plan, 'status' | 'rescreenWeeks' | 'rescreenDate'> & { exercises: number };
};

export type ProgressResponse = {
  athlete: { id: string; sex: Sex };
  /** Oldest first. */
  screens: ProgressScreen[];
  /** The last two screens compared; null with fewer than two. */
  comparison: ScreenComparison | null;
  /**
   * Corrective sessions recorded on the training sheet between the two compared screens: those the
   * athlete's current squad held, and how many of them the athlete took part in (never more); null without
   * a comparison.
   */
  sessionsBetween: { attended: number; held: number } | null;
  /**
   * Corrective sessions recorded after the newest screen, up to today, counted the same way; null with no
   * screen.
   */
  sessionsSinceLatest: { attended: number; held: number } | null;
  /** The published error of each metric that has one (what the charts draw as a band). */
  errorMargins: Partial<Record<Measurement['metric'], ErrorMargin>>;
};

export type { Flag };
