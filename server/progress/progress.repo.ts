import type { ScreenForComparison } from '@/features/progress/compare';
import type { AssessmentResult } from '@/features/screening/engine';
import { preparedRows } from '@/db/client';
import type { ClubScope } from '@/server/access/scope';
import type { Executor } from '@/server/screening/screening.repo';

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
 * Every statement filters by the scope's club. Trends read the small generated columns of
 * `assessment_results` (flag ids and sides, knee angles, maturity band, re-screen date) through the
 * covering index `assessment_results_current_summary_idx`, never the full result; one athlete's history
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
     * A squad's season in two statements run side by side: the squad, its rounds and each current member
     * with their newest screen (wherever it was: an athlete may have changed squad) and the clearance in
     * force, as one small JSON value; and the current result summaries of every submitted screen in the
     * squad's rounds, as plain rows (PostgreSQL writes 300-odd rows faster than it builds them into JSON).
     * Null when the squad is not in the club.
     */
    async season(squadId: string): Promise<Season | null> {
      const [[head], results] = await Promise.all([
        preparedRows<{ squad: Season['squad'] | null; rounds: SeasonRound[]; athletes: SeasonAthlete[] }>(
          db,
          'progress_squad_season',
          `select
            (select json_build_object('id', s.id, 'name', s.name) from squads s where s.id = $1 and s.club_id = $2) as squad,
            (select coalesce(json_agg(json_build_array(r.id, r.name, r.screened_on) order by r.screened_on, r.created_at, r.id), '[]')
              from rounds r where r.squad_id = $1 and r.club_id = $2) as rounds,
            (select coalesce(json_agg(json_build_array(m.id, m.first_name, m.last_name, m.sex, m.date_of_birth, c.status,
                l.id, l.screened_on, ar.flag_ids, ar.flag_sides, ar.maturity_band, ar.rescreen_date) order by m.last_name, m.first_name, m.id), '[]')
              from athletes m
              left join (
                -- Each member's newest submitted screen by its round's date: their screens (index-only) and
                -- the rounds joined once for all 40, then one row per athlete. (A lateral search per athlete
                -- had the planner scan every round of the club once per member.)
                select distinct on (a.athlete_id) a.athlete_id, a.id, r.screened_on
                from athletes m2
                join assessments a on a.athlete_id = m2.id and a.status = 'submitted'
                join rounds r on r.id = a.round_id
                where m2.squad_id = $1 and m2.club_id = $2 and m2.archived_at is null
                order by a.athlete_id, r.screened_on desc, r.created_at desc, a.id desc
              ) l on l.athlete_id = m.id
              left join assessment_results ar on ar.assessment_id = l.id and ar.is_current
              left join lateral (
                select status from clearances where athlete_id = m.id and club_id = $2 order by created_at desc limit 1
              ) c on true
              where m.squad_id = $1 and m.club_id = $2 and m.archived_at is null) as athletes`,
          [squadId, clubId],
        ),
        preparedRows<{ roundId: string; athleteId: string; flagIds: string[] | null; fppaIds: string[] | null; fppaValues: (number | null)[] | null }>(
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
