CREATE TABLE "study_revision_tables" (
	"revision_id" integer PRIMARY KEY NOT NULL,
	"branch_ids" jsonb NOT NULL,
	"row_count" integer NOT NULL,
	"csv_gzip" "bytea" NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "study_revision_tables" ADD CONSTRAINT "study_revision_tables_revision_id_study_revisions_id_fk" FOREIGN KEY ("revision_id") REFERENCES "public"."study_revisions"("id") ON DELETE no action ON UPDATE no action;