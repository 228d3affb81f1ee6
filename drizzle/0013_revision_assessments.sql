CREATE TABLE "revision_assessments" (
	"id" serial PRIMARY KEY NOT NULL,
	"revision_id" integer NOT NULL,
	"criteria_version" integer,
	"results_key" text NOT NULL,
	"assessor" text NOT NULL,
	"source" jsonb NOT NULL,
	"assessment" jsonb NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "revision_assessments_key" UNIQUE NULLS NOT DISTINCT("revision_id","criteria_version","results_key","assessor")
);
--> statement-breakpoint
ALTER TABLE "signatures" ADD COLUMN "assessment_id" integer;--> statement-breakpoint
ALTER TABLE "revision_assessments" ADD CONSTRAINT "revision_assessments_revision_id_study_revisions_id_fk" FOREIGN KEY ("revision_id") REFERENCES "public"."study_revisions"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "revision_assessments_revision_idx" ON "revision_assessments" USING btree ("revision_id","id");--> statement-breakpoint
ALTER TABLE "signatures" ADD CONSTRAINT "signatures_assessment_id_revision_assessments_id_fk" FOREIGN KEY ("assessment_id") REFERENCES "public"."revision_assessments"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "study_revisions" DROP COLUMN "critical";