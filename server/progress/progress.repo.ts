import type { AssessmentResult } from '@/features/screening/engine';
import type { ClubScope } from '@/server/access/scope';
import type { Executor } from '@/server/screening/screening.repo';

type Queryable = { query<T>(config: { name: string; text: string; values: unknown[] }): Promise<{ rows: T[] }> };

/**
 * Runs one statement as a named prepared statement: PostgreSQL parses and plans it once per pooled
 * connection, not on every request, and the text is a constant here, not rebuilt per request. The pool
 * (`$client`) or, inside a transaction, the transaction's own connection.
 */
async function rowsOf<T>(db: Executor, name: string, text: string, values: unknown[]): Promise<T[]> {
  const holder = db as unknown as { $client?: Queryable; session?: { client?: Queryable } };
  const client = holder.$client ?? holder.session?.client;
  if (!client) throw new Error('progressRepo needs a node-postgres executor.');
  return (await client.query<T>({ name, text, values })).rows;
}

/** One round of the squad: [id, name, screenedOn], in date order. */
export type SeasonRound = [id: string, name: string, screenedOn: string];
/** One current result in one of those rounds: [round index, athlete id, flag ids, knee-angle ids, knee-angle values]. */
export type SeasonResult = [round: number, athleteId: string, flagIds: string[] | null, fppaIds: string[] | null, fppaValues: (number | null)[] | null];
/**
 * One current member of the squad with their newest submitted screen anywhere (or nulls):
 * [id, first name, last name, sex, date of birth, clearance, latest assessment id, screened on, flag ids,
 * flag sides, maturity band, re-screen date].
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
];
export type Season = { squad: { id: string; name: string }; rounds: SeasonRound[]; results: SeasonResult[]; athletes: SeasonAthlete[] };

export type HistoryRow = {
  athleteId: string;
  sex: 'female' | 'male';
  assessmentId: string | null;
  roundId: string | null;
  roundName: string | null;
  screenedOn: string | null;
  taskIds: string[] | null;
  result: AssessmentResult | null;
};

/**
 * Reads for progress and trends, each one statement (one round trip, planned once per connection).
 * Every statement filters by the scope's club. Trends read the small generated columns of
 * `assessment_results` (flag ids and sides, knee angles, maturity band, re-screen date) through the
 * covering index `assessment_results_current_summary_idx`, never the full result; one athlete's history
 * reads the full results the comparison needs (a handful of rows) and only the task names of their inputs.
 */
export function progressRepo(db: Executor, scope: ClubScope) {
  const clubId = scope.clubId;

  return {
    /**
     * Every submitted screen of one athlete with its current result and the names of the tasks done
     * (not the whole stored input, landmarks and all), oldest first; one row with null screen columns when there is none, no row when
     * the athlete is not in the club.
     */
    history(athleteId: string) {
      return rowsOf<HistoryRow>(
        db,
        'progress_athlete_history',
        `select p.id as "athleteId", p.sex, h.*
          from athletes p
          left join lateral (
            select a.id as "assessmentId", r.id as "roundId", r.name as "roundName", r.screened_on::text as "screenedOn",
              (select coalesce(array_agg(k), '{}') from jsonb_object_keys(coalesce(ar.input -> 'tasks', '{}')) k) as "taskIds",
              ar.result,
              r.screened_on, ar.created_at
            from assessments a
            join rounds r on r.id = a.round_id
            join assessment_results ar on ar.assessment_id = a.id and ar.is_current
            where a.athlete_id = p.id and a.club_id = p.club_id and a.status = 'submitted'
          ) h on true
          where p.id = $1 and p.club_id = $2
          order by h.screened_on, h.created_at`,
        [athleteId, clubId],
      );
    },

    /**
     * A squad's season in two statements run side by side: the squad, its rounds and each current member
     * with their newest screen (wherever it was: an athlete may have changed squad) and the clearance in
     * force, as one small JSON value; and the current result summaries of every submitted screen in the
     * squad's rounds, as plain rows (PostgreSQL writes 300-odd rows faster than it builds them into JSON).
     * Null when the squad is not in the club.
     */
    async season(squadId: string): Promise<Season | null> {
      const [[head], results] = await Promise.all([
        rowsOf<{ squad: Season['squad'] | null; rounds: SeasonRound[]; athletes: SeasonAthlete[] }>(
          db,
          'progress_squad_season',
          `select
            (select json_build_object('id', s.id, 'name', s.name) from squads s where s.id = $1 and s.club_id = $2) as squad,
            (select coalesce(json_agg(json_build_array(r.id, r.name, r.screened_on) order by r.screened_on, r.created_at, r.id), '[]')
              from rounds r where r.squad_id = $1 and r.club_id = $2) as rounds,
            (select coalesce(json_agg(json_build_array(m.id, m.first_name, m.last_name, m.sex, m.date_of_birth, c.status,
                l.id, l.screened_on, l.flag_ids, l.flag_sides, l.maturity_band, l.rescreen_date) order by m.last_name, m.first_name, m.id), '[]')
              from athletes m
              left join lateral (
                -- The newest submitted screen by its round's date (the round by its primary key, once per
                -- screen of the athlete), then that one screen's current result: one result read per athlete.
                select n.id, n.screened_on, ar.flag_ids, ar.flag_sides, ar.maturity_band, ar.rescreen_date
                from (
                  select a.id, rd.screened_on
                  from assessments a
                  join lateral (select screened_on, created_at from rounds where id = a.round_id) rd on true
                  where a.athlete_id = m.id and a.status = 'submitted'
                  order by rd.screened_on desc, rd.created_at desc, a.id desc
                  limit 1
                ) n
                join assessment_results ar on ar.assessment_id = n.id and ar.is_current
              ) l on true
              left join lateral (
                select status from clearances where athlete_id = m.id and club_id = $2 order by created_at desc limit 1
              ) c on true
              where m.squad_id = $1 and m.club_id = $2 and m.archived_at is null) as athletes`,
          [squadId, clubId],
        ),
        rowsOf<{ roundId: string; athleteId: string; flagIds: string[] | null; fppaIds: string[] | null; fppaValues: (number | null)[] | null }>(
          db,
          'progress_squad_results',
          `select a.round_id as "roundId", a.athlete_id as "athleteId", ar.flag_ids as "flagIds", ar.fppa_ids as "fppaIds", ar.fppa_values as "fppaValues"
            from rounds r
            join assessments a on a.round_id = r.id and a.status = 'submitted'
            join assessment_results ar on ar.assessment_id = a.id and ar.is_current
            where r.squad_id = $1 and r.club_id = $2`,
          [squadId, clubId],
        ),
      ]);
      if (!head?.squad) return null;
      const index = new Map(head.rounds.map(([id], i) => [id, i]));
      return {
        squad: head.squad,
        rounds: head.rounds,
        athletes: head.athletes,
        results: results.flatMap((r): SeasonResult[] => {
          const i = index.get(r.roundId);
          return i === undefined ? [] : [[i, r.athleteId, r.flagIds, r.fppaIds, r.fppaValues]];
        }),
      };
    },
  };
}

export type ProgressRepo = ReturnType<typeof progressRepo>;
