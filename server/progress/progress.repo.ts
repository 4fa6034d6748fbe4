import type { ScreenForComparison } from '@/features/progress/compare';
import type { AssessmentResult } from '@/features/screening/engine';
import { preparedRows } from '@/db/client';
import { asc, eq } from 'drizzle-orm';
import { squads, type RoundKneeAngles } from '@/db/schema';
import type { ClubScope } from '@/server/access/scope';
import type { Executor } from '@/server/screening/screening.repo';

/**
 * One round of the squad, in date order, with its summary (`round_summaries`; nulls for a round nobody
 * has been screened in yet): [id, name, screenedOn, screened, athletes flagged per pattern, knee angles:
 * the screened athletes' ids and per measurement one value (0.1 degree) per athlete].
 */
export type SeasonRound = [
  id: string,
  name: string,
  screenedOn: string,
  screened: number,
  flagged: Record<string, number> | null,
  kneeAngles: RoundKneeAngles | null,
];
/**
 * One current member of the squad with their newest submitted screen anywhere (or nulls):
 * [id, first name, last name, sex, date of birth, clearance, latest assessment id, screened on, flag ids,
 * flag sides, maturity band, re-screen date, sessions attended and held, awaiting a clearance, screening consent].
 */
export type SeasonAthlete = [
  id: string,
  firstName: string,
  lastName: string,
  sex: 'female' | 'male',
  dateOfBirth: string,
  clearance: string | null,
  latestAssessmentId: string | null,
  lastScreenedOn: string | null,
  flagIds: string[] | null,
  flagSides: (string | null)[] | null,
  maturityBand: string | null,
  rescreenDate: string | null,
  /** Sessions of the squad recorded after the newest screen, and those the athlete took part in. */
  sessionsAttended: number,
  sessionsHeld: number,
  /** Pain was reported at the newest screen and no clearance has been recorded since its current result. */
  awaitingClearance: boolean,
  /** The family's decision about screening and exercises in force: yes, no, or null when none is recorded. */
  screeningConsent: boolean | null,
];
export type Season = { squad: { id: string; name: string }; rounds: SeasonRound[]; athletes: SeasonAthlete[] };

/**
 * The parts of a stored result that an athlete's history shows and compares: the measurements, each
 * flag without its evidence and thresholds (half of a stored result is their sources and derivations),
 * the maturity estimate and the plan's status, interval, date and number of exercises.
 */
export type HistoryResult = ScreenForComparison['result'] & {
  plan: Pick<AssessmentResult['plan'], 'status' | 'rescreenWeeks' | 'rescreenDate'> & { exerciseCount: number };
};

export type HistoryRow = {
  athleteId: string;
  sex: 'female' | 'male';
  assessmentId: string | null;
  roundId: string | null;
  roundName: string | null;
  screenedOn: string | null;
  taskIds: string[] | null;
  result: HistoryResult | null;
};

/**
 * Reads for progress and trends, each one statement (one round trip, planned once per connection).
 * Every statement filters by the scope's club. Trends read one summary row per round and, for each
 * member's newest screen, the small generated columns of `assessment_results` (flag ids and sides,
 * maturity band, re-screen date) through `assessment_results_current_summary_idx`, never the full
 * result; one athlete's history
 * reads the full results the comparison needs (a handful of rows) and only the task names of their inputs.
 */
export function progressRepo(db: Executor, scope: ClubScope) {
  const clubId = scope.clubId;

  return {
    /**
     * Every submitted screen of one athlete with the parts of its current result the history uses
     * (`HistoryResult`, built by PostgreSQL: a third of the stored result) and the names of the tasks done
     * (not the whole stored input, landmarks and all), oldest first; one row with null screen columns when there is none, no row when
     * the athlete is not in the club.
     */
    history(athleteId: string) {
      return preparedRows<HistoryRow>(
        db,
        'progress_athlete_history',
        `select p.id as "athleteId", p.sex, h.*
          from athletes p
          left join lateral (
            select a.id as "assessmentId", r.id as "roundId", r.name as "roundName", r.screened_on::text as "screenedOn",
              (select coalesce(array_agg(k), '{}') from jsonb_object_keys(coalesce(ar.input -> 'tasks', '{}')) k) as "taskIds",
              jsonb_build_object(
                'measurements', x.res -> 'measurements',
                'flags', (select coalesce(jsonb_agg(jsonb_build_object('id', f -> 'id', 'pattern', f -> 'pattern', 'title', f -> 'title',
                    'taskId', f -> 'taskId', 'side', f -> 'side', 'severity', f -> 'severity', 'comparesTasks', f -> 'comparesTasks') order by o), '[]')
                  from jsonb_array_elements(x.res -> 'flags') with ordinality t(f, o)),
                'maturity', x.res -> 'maturity',
                'plan', jsonb_build_object('status', x.res #> '{plan,status}', 'rescreenWeeks', x.res #> '{plan,rescreenWeeks}',
                  'rescreenDate', x.res #> '{plan,rescreenDate}', 'exerciseCount', jsonb_array_length(x.res #> '{plan,exercises}'))
              ) as result,
              r.screened_on, ar.created_at
            from assessments a
            join rounds r on r.id = a.round_id
            join assessment_results ar on ar.assessment_id = a.id and ar.is_current
            -- The stored result decompressed once into memory (the concatenation makes the copy; OFFSET 0
            -- keeps it one value per row), then picked apart without decompressing it again for each part.
            cross join lateral (select ar.result || '{}'::jsonb as res offset 0) x
            where a.athlete_id = p.id and a.club_id = p.club_id and a.status = 'submitted'
          ) h on true
          where p.id = $1 and p.club_id = $2
          order by h.screened_on, h.created_at`,
        [athleteId, clubId],
      );
    },

    /**
     * Between the days of two screens (a session on a screen's own day counts for neither: our choice),
     * recorded from the training sheet: the sessions the athlete's current squad held, and how many of
     * those they took part in (so never more than were held, even after a change of squad).
     */
    async sessionsBetween(athleteId: string, after: string, before: string): Promise<{ attended: number; held: number }> {
      const [row] = await preparedRows<{ attended: number; held: number }>(
        db,
        'progress_sessions_between',
        // The current squad's sessions between the two days (one range of the squad-and-day index), and
        // for each one primary-key probe for the athlete's attendance.
        `select count(*)::int as held, count(a.athlete_id)::int as attended
          from athletes p
          join training_sessions s on s.squad_id = p.squad_id and s.club_id = $2 and s.held_on > $3::date and s.held_on < $4::date
          left join training_attendance a on a.session_id = s.id and a.athlete_id = p.id
          where p.id = $1 and p.club_id = $2`,
        [athleteId, clubId, after, before],
      );
      return row ?? { attended: 0, held: 0 };
    },

    /** The club's squads, by name. */
    squadsOfClub() {
      return db.select({ id: squads.id, name: squads.name }).from(squads).where(eq(squads.clubId, clubId)).orderBy(asc(squads.name));
    },

    /**
     * The squad's open rounds in which a member's screen is not submitted yet: athlete id to the round's
     * name (the newest round when there are several). One index range per open round.
     */
    async waitingInOpenRounds(squadId: string): Promise<Map<string, string>> {
      const rows = await preparedRows<{ athlete_id: string; name: string }>(
        db,
        'progress_waiting_in_open_rounds',
        `select distinct on (a.athlete_id) a.athlete_id, r.name
          from rounds r
          join assessments a on a.round_id = r.id and a.status <> 'submitted'
          where r.squad_id = $1 and r.club_id = $2 and r.closed_at is null
          order by a.athlete_id, r.screened_on desc, r.created_at desc`,
        [squadId, clubId],
      );
      return new Map(rows.map((r) => [r.athlete_id, r.name]));
    },

    /**
     * A squad's season in one statement: the squad, its rounds with their summaries, and each current
     * member with their newest screen (wherever it was: an athlete may have changed squad), the
     * clearance in force and the squad's sessions since that screen (held, and taken part in), as one
     * small JSON value. The summaries (`round_summaries`, `athlete_latest_screens`) are kept by PostgreSQL
     * on every write of what they sum. Null when the squad is not in the club.
     */
    async season(squadId: string): Promise<Season | null> {
      const [head] = await preparedRows<{ squad: Season['squad'] | null; rounds: SeasonRound[]; athletes: SeasonAthlete[] }>(
        db,
        'progress_squad_season',
        // The squad's sessions after its oldest newest-screen (\`recent\`: one range of the squad-and-day
        // index) and, per athlete, the days they took part (\`taken\`: one primary-key range per session),
        // read once for the squad rather than once per athlete.
        `with recent as (
          select ts.id, ts.held_on from training_sessions ts
          where ts.squad_id = $1 and ts.club_id = $2 and ts.held_on > (
            select min(l.screened_on) from athletes m join athlete_latest_screens l on l.athlete_id = m.id
            where m.squad_id = $1 and m.club_id = $2 and m.archived_at is null)
        ),
        taken as (
          select a.athlete_id, array_agg(r.held_on) as days from recent r join training_attendance a on a.session_id = r.id group by a.athlete_id
        )
        select
          (select json_build_object('id', s.id, 'name', s.name) from squads s where s.id = $1 and s.club_id = $2) as squad,
          (select coalesce(json_agg(json_build_array(r.id, r.name, r.screened_on, coalesce(rs.screened, 0), rs.flagged, rs.knee_angles)
              order by r.screened_on, r.created_at, r.id), '[]')
            from rounds r
            left join round_summaries rs on rs.round_id = r.id
            where r.squad_id = $1 and r.club_id = $2) as rounds,
          (select coalesce(json_agg(json_build_array(m.id, m.first_name, m.last_name, m.sex, m.date_of_birth, c.status,
              l.assessment_id, l.screened_on, l.flag_ids, l.flag_sides, l.maturity_band, l.rescreen_date,
              (select count(*) from unnest(tk.days) d where d > l.screened_on)::int,
              (select count(*) from recent r where r.held_on > l.screened_on)::int,
              coalesce(ar.plan_status = 'clearance-needed' and c.status is distinct from 'referred' and (c.created_at is null or c.created_at < ar.created_at), false),
              (select k.granted from consents k where k.athlete_id = m.id and k.kind = 'screening' order by k.created_at desc limit 1))
              order by m.last_name, m.first_name, m.id), '[]')
            from athletes m
            left join athlete_latest_screens l on l.athlete_id = m.id
            left join lateral (
              select status, created_at from clearances where athlete_id = m.id and club_id = $2 order by created_at desc limit 1
            ) c on true
            -- The newest screen's current result: only its small generated column and time are read.
            left join assessment_results ar on ar.assessment_id = l.assessment_id and ar.is_current and ar.club_id = $2
            left join taken tk on tk.athlete_id = m.id
            where m.squad_id = $1 and m.club_id = $2 and m.archived_at is null) as athletes`,
        [squadId, clubId],
      );
      if (!head?.squad) return null;
      return { squad: head.squad, rounds: head.rounds, athletes: head.athletes };
    },
  };
}

export type ProgressRepo = ReturnType<typeof progressRepo>;
