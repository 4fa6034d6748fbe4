-- Summaries for squad trends (tables `round_summaries` and `athlete_latest_screens`,
-- db/schema/progress.ts), kept by PostgreSQL: whenever a result, a screen's status or a round's date
-- changes, the rounds and athletes it touches are worked out again, in the same transaction.

-- Works out the summaries of the given rounds again. The summary row is locked first, so that two
-- transactions submitting in the same round take turns; the sums are then read by a later statement,
-- whose snapshot (READ COMMITTED) sees what the transaction that held the lock before has committed.
CREATE FUNCTION refresh_round_summaries(round_ids uuid[]) RETURNS void
LANGUAGE plpgsql AS $$
DECLARE
  rid uuid;
BEGIN
  IF round_ids IS NULL THEN
    RETURN;
  END IF;
  FOREACH rid IN ARRAY round_ids LOOP
    INSERT INTO round_summaries (round_id, club_id)
      SELECT r.id, r.club_id FROM rounds r WHERE r.id = rid
      ON CONFLICT (round_id) DO NOTHING;
    PERFORM 1 FROM round_summaries WHERE round_id = rid FOR UPDATE;
    WITH cur AS (
      SELECT a.athlete_id,
        coalesce(ar.flag_ids, '[]'::jsonb) AS flag_ids,
        coalesce(ar.fppa_ids, '[]'::jsonb) AS fppa_ids,
        coalesce(ar.fppa_values, '[]'::jsonb) AS fppa_values
      FROM assessments a
      JOIN assessment_results ar ON ar.assessment_id = a.id AND ar.is_current
      WHERE a.round_id = rid AND a.status = 'submitted'
    )
    UPDATE round_summaries SET
      screened = (SELECT count(*) FROM cur),
      -- A flag id starts with its pattern ('pattern/task/side'); an athlete counts once per pattern.
      flagged = coalesce((
        SELECT jsonb_object_agg(pattern, n)
        FROM (
          SELECT split_part(f, '/', 1) AS pattern, count(DISTINCT cur.athlete_id)::int AS n
          FROM cur, jsonb_array_elements_text(cur.flag_ids) f
          GROUP BY 1
        ) p
      ), '{}'::jsonb)::json,
      -- Knee angles as parallel arrays: the screened athletes' ids (sorted), and per measurement one
      -- value per athlete (null where not measured), rounded to 0.1 degree exactly as the browser's
      -- Math.round(v * 10) / 10 does (double arithmetic; PostgreSQL prints doubles shortest-exact, as
      -- JavaScript does; they part only for v * 10 = 0.49999999999999994, where floor(x + 0.5) gives 1).
      -- A third of the size of one object per athlete, and read on every trends request.
      knee_angles = coalesce((
        WITH angle AS (
          SELECT cur.athlete_id, e.id AS measurement, floor((cur.fppa_values ->> (e.o::int - 1))::float8 * 10 + 0.5) / 10 AS v
          FROM cur, jsonb_array_elements_text(cur.fppa_ids) WITH ORDINALITY e(id, o)
          WHERE jsonb_typeof(cur.fppa_values -> (e.o::int - 1)) = 'number'
        ),
        who AS (SELECT athlete_id, (row_number() OVER (ORDER BY athlete_id)) - 1 AS i FROM (SELECT DISTINCT athlete_id FROM angle) d)
        SELECT jsonb_build_object(
          'athletes', (SELECT jsonb_agg(athlete_id ORDER BY i) FROM who),
          'angles', (
            SELECT jsonb_object_agg(measurement, vs)
            FROM (
              SELECT m.measurement, jsonb_agg(to_jsonb(angle.v) ORDER BY who.i) AS vs
              FROM (SELECT DISTINCT measurement FROM angle) m
              CROSS JOIN who
              LEFT JOIN angle ON angle.athlete_id = who.athlete_id AND angle.measurement = m.measurement
              GROUP BY m.measurement
            ) per
          )
        )
        WHERE EXISTS (SELECT 1 FROM angle)
      ), '{"athletes": [], "angles": {}}'::jsonb)::json,
      refreshed_at = now()
    WHERE round_id = rid;
  END LOOP;
END
$$;
--> statement-breakpoint
-- Works out again each given athlete's newest submitted screen (by its round's date, then the round's
-- creation, then the screen's id), with the flags, maturity band and re-screen date of its current
-- result; nulls when they have none. Locked and summed in turn, as above.
CREATE FUNCTION refresh_latest_screens(athlete_ids uuid[]) RETURNS void
LANGUAGE plpgsql AS $$
DECLARE
  aid uuid;
BEGIN
  IF athlete_ids IS NULL THEN
    RETURN;
  END IF;
  FOREACH aid IN ARRAY athlete_ids LOOP
    INSERT INTO athlete_latest_screens (athlete_id, club_id)
      SELECT p.id, p.club_id FROM athletes p WHERE p.id = aid
      ON CONFLICT (athlete_id) DO NOTHING;
    PERFORM 1 FROM athlete_latest_screens WHERE athlete_id = aid FOR UPDATE;
    UPDATE athlete_latest_screens SET
      (assessment_id, screened_on, flag_ids, flag_sides, maturity_band, rescreen_date, refreshed_at) = (
        SELECT newest.id, newest.screened_on, ar.flag_ids::json, ar.flag_sides::json, ar.maturity_band, ar.rescreen_date, now()
        FROM (SELECT 1) one
        LEFT JOIN LATERAL (
          SELECT a.id, r.screened_on
          FROM assessments a JOIN rounds r ON r.id = a.round_id
          WHERE a.athlete_id = aid AND a.status = 'submitted'
          ORDER BY r.screened_on DESC, r.created_at DESC, a.id DESC
          LIMIT 1
        ) newest ON true
        LEFT JOIN assessment_results ar ON ar.assessment_id = newest.id AND ar.is_current
      )
    WHERE athlete_id = aid;
  END LOOP;
END
$$;
--> statement-breakpoint
CREATE FUNCTION progress_summaries_after_results() RETURNS trigger
LANGUAGE plpgsql AS $$
BEGIN
  PERFORM refresh_round_summaries((
    SELECT array_agg(DISTINCT a.round_id ORDER BY a.round_id)
    FROM changed c JOIN assessments a ON a.id = c.assessment_id
  ));
  PERFORM refresh_latest_screens((SELECT array_agg(DISTINCT athlete_id ORDER BY athlete_id) FROM changed));
  RETURN NULL;
END
$$;
--> statement-breakpoint
CREATE TRIGGER progress_summaries_results_insert AFTER INSERT ON assessment_results
  REFERENCING NEW TABLE AS changed FOR EACH STATEMENT EXECUTE FUNCTION progress_summaries_after_results();
--> statement-breakpoint
CREATE TRIGGER progress_summaries_results_update AFTER UPDATE ON assessment_results
  REFERENCING NEW TABLE AS changed FOR EACH STATEMENT EXECUTE FUNCTION progress_summaries_after_results();
--> statement-breakpoint
CREATE TRIGGER progress_summaries_results_delete AFTER DELETE ON assessment_results
  REFERENCING OLD TABLE AS changed FOR EACH STATEMENT EXECUTE FUNCTION progress_summaries_after_results();
--> statement-breakpoint
-- A screen leaving or entering 'submitted' (or moved to another round) changes who counts. Draft saves
-- update the same rows and do not touch the summaries.
CREATE FUNCTION progress_summaries_after_assessment_update() RETURNS trigger
LANGUAGE plpgsql AS $$
BEGIN
  PERFORM refresh_round_summaries((
    SELECT array_agg(DISTINCT id ORDER BY id) FROM unnest(ARRAY[OLD.round_id, NEW.round_id]) AS ids(id)
  ));
  PERFORM refresh_latest_screens((
    SELECT array_agg(DISTINCT id ORDER BY id) FROM unnest(ARRAY[OLD.athlete_id, NEW.athlete_id]) AS ids(id)
  ));
  RETURN NULL;
END
$$;
--> statement-breakpoint
CREATE TRIGGER progress_summaries_assessment_update AFTER UPDATE ON assessments
  FOR EACH ROW WHEN (OLD.status IS DISTINCT FROM NEW.status OR OLD.round_id IS DISTINCT FROM NEW.round_id OR OLD.athlete_id IS DISTINCT FROM NEW.athlete_id)
  EXECUTE FUNCTION progress_summaries_after_assessment_update();
--> statement-breakpoint
CREATE FUNCTION progress_summaries_after_assessment_delete() RETURNS trigger
LANGUAGE plpgsql AS $$
BEGIN
  PERFORM refresh_round_summaries((SELECT array_agg(DISTINCT round_id ORDER BY round_id) FROM changed));
  PERFORM refresh_latest_screens((SELECT array_agg(DISTINCT athlete_id ORDER BY athlete_id) FROM changed));
  RETURN NULL;
END
$$;
--> statement-breakpoint
CREATE TRIGGER progress_summaries_assessment_delete AFTER DELETE ON assessments
  REFERENCING OLD TABLE AS changed FOR EACH STATEMENT EXECUTE FUNCTION progress_summaries_after_assessment_delete();
--> statement-breakpoint
-- A round's date decides which screen is an athlete's newest.
CREATE FUNCTION progress_summaries_after_round_update() RETURNS trigger
LANGUAGE plpgsql AS $$
BEGIN
  PERFORM refresh_latest_screens((
    SELECT array_agg(DISTINCT a.athlete_id ORDER BY a.athlete_id) FROM assessments a WHERE a.round_id = NEW.id AND a.status = 'submitted'
  ));
  RETURN NULL;
END
$$;
--> statement-breakpoint
CREATE TRIGGER progress_summaries_round_update AFTER UPDATE ON rounds
  FOR EACH ROW WHEN (OLD.screened_on IS DISTINCT FROM NEW.screened_on)
  EXECUTE FUNCTION progress_summaries_after_round_update();
--> statement-breakpoint
-- What was screened before this migration.
SELECT refresh_round_summaries((SELECT array_agg(DISTINCT a.round_id ORDER BY a.round_id) FROM assessments a WHERE a.status = 'submitted'));
--> statement-breakpoint
SELECT refresh_latest_screens((SELECT array_agg(DISTINCT a.athlete_id ORDER BY a.athlete_id) FROM assessments a WHERE a.status = 'submitted'));
