ALTER TABLE "revisions" ADD COLUMN "checked_with" text;--> statement-breakpoint
ALTER TABLE "trial_matrix_results" ADD COLUMN "reference_growth" double precision;