ALTER TABLE "assessment_results" ADD COLUMN "flag_ids" jsonb GENERATED ALWAYS AS (jsonb_path_query_array(result, '$.flags[*].id')) STORED;--> statement-breakpoint
ALTER TABLE "assessment_results" ADD COLUMN "flag_sides" jsonb GENERATED ALWAYS AS (jsonb_path_query_array(result, '$.flags[*].side')) STORED;--> statement-breakpoint
ALTER TABLE "assessment_results" ADD COLUMN "fppa_ids" jsonb GENERATED ALWAYS AS (jsonb_path_query_array(result, '$.measurements[*] ? (@.metric == "fppa").id')) STORED;--> statement-breakpoint
ALTER TABLE "assessment_results" ADD COLUMN "fppa_values" jsonb GENERATED ALWAYS AS (jsonb_path_query_array(result, '$.measurements[*] ? (@.metric == "fppa").value')) STORED;--> statement-breakpoint
ALTER TABLE "assessment_results" ADD COLUMN "maturity_band" text GENERATED ALWAYS AS (result #>> '{maturity,band}') STORED;--> statement-breakpoint
ALTER TABLE "assessment_results" ADD COLUMN "rescreen_date" text GENERATED ALWAYS AS (result #>> '{plan,rescreenDate}') STORED;--> statement-breakpoint
CREATE INDEX "assessment_results_current_idx" ON "assessment_results" USING btree ("assessment_id") WHERE is_current;--> statement-breakpoint
CREATE INDEX "assessments_round_submitted_idx" ON "assessments" USING btree ("round_id","athlete_id","id") WHERE status = 'submitted';--> statement-breakpoint
CREATE INDEX "assessments_athlete_submitted_idx" ON "assessments" USING btree ("athlete_id","round_id","id") WHERE status = 'submitted';--> statement-breakpoint
CREATE INDEX "rounds_squad_idx" ON "rounds" USING btree ("squad_id","screened_on");