CREATE TYPE "public"."aero_dataset_kind" AS ENUM('flutter-derivatives', 'static-coefficients');--> statement-breakpoint
CREATE TABLE "alternatives" (
	"id" serial PRIMARY KEY NOT NULL,
	"project_id" integer NOT NULL,
	"name" text NOT NULL,
	"description" text DEFAULT '' NOT NULL,
	"deck_width_m" double precision NOT NULL,
	"deck_depth_m" double precision NOT NULL,
	"image_bytes" "bytea",
	"image_content_type" text,
	"image_sha256" text,
	"image_size_bytes" integer,
	"image_uploaded_at" timestamp with time zone,
	"created_by" integer,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "alternatives_geometry_positive" CHECK ("alternatives"."deck_width_m" > 0 and "alternatives"."deck_depth_m" > 0),
	CONSTRAINT "alternatives_image_complete" CHECK (("alternatives"."image_bytes" is null) = ("alternatives"."image_content_type" is null) and ("alternatives"."image_bytes" is null) = ("alternatives"."image_sha256" is null))
);
--> statement-breakpoint
CREATE TABLE "aero_datasets" (
	"id" serial PRIMARY KEY NOT NULL,
	"alternative_id" integer NOT NULL,
	"name" text NOT NULL,
	"kind" "aero_dataset_kind" NOT NULL,
	"mean_angle_deg" double precision DEFAULT 0 NOT NULL,
	"provenance" jsonb NOT NULL,
	"convention" jsonb,
	"drag_reference" text,
	"deck_width_m" double precision NOT NULL,
	"deck_depth_m" double precision NOT NULL,
	"delivered" jsonb NOT NULL,
	"converted" jsonb NOT NULL,
	"slopes" jsonb,
	"tested_min" double precision NOT NULL,
	"tested_max" double precision NOT NULL,
	"warnings" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"file_name" text NOT NULL,
	"file_bytes" "bytea" NOT NULL,
	"file_sha256" text NOT NULL,
	"file_size_bytes" integer NOT NULL,
	"created_by" integer,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "aero_datasets_kind_fields" CHECK (("aero_datasets"."kind" = 'flutter-derivatives' and "aero_datasets"."convention" is not null and "aero_datasets"."drag_reference" is null)
        or ("aero_datasets"."kind" = 'static-coefficients' and "aero_datasets"."convention" is null and "aero_datasets"."drag_reference" in ('B', 'D')))
);
--> statement-breakpoint
CREATE TABLE "studies" (
	"id" serial PRIMARY KEY NOT NULL,
	"alternative_id" integer NOT NULL,
	"name" text NOT NULL,
	"purpose" text DEFAULT '' NOT NULL,
	"created_by" integer,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "study_revisions" (
	"id" serial PRIMARY KEY NOT NULL,
	"study_id" integer NOT NULL,
	"number" integer NOT NULL,
	"parent_number" integer,
	"author_id" integer,
	"change_note" text DEFAULT '' NOT NULL,
	"document" jsonb NOT NULL,
	"document_sha256" text NOT NULL,
	"engine_version" text NOT NULL,
	"result" jsonb NOT NULL,
	"critical" jsonb NOT NULL,
	"flutter_speed_mps" double precision,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "study_revisions_study_number_key" UNIQUE("study_id","number"),
	CONSTRAINT "study_revisions_number_positive" CHECK ("study_revisions"."number" >= 1),
	CONSTRAINT "study_revisions_parent_before" CHECK (("study_revisions"."number" = 1 and "study_revisions"."parent_number" is null) or ("study_revisions"."number" > 1 and "study_revisions"."parent_number" = "study_revisions"."number" - 1)),
	CONSTRAINT "study_revisions_change_note" CHECK ("study_revisions"."number" = 1 or length(trim("study_revisions"."change_note")) > 0),
	CONSTRAINT "study_revisions_sha256_hex" CHECK ("study_revisions"."document_sha256" ~ '^[0-9a-f]{64}$')
);
--> statement-breakpoint
ALTER TABLE "alternatives" ADD CONSTRAINT "alternatives_project_id_projects_id_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "alternatives" ADD CONSTRAINT "alternatives_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "aero_datasets" ADD CONSTRAINT "aero_datasets_alternative_id_alternatives_id_fk" FOREIGN KEY ("alternative_id") REFERENCES "public"."alternatives"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "aero_datasets" ADD CONSTRAINT "aero_datasets_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "studies" ADD CONSTRAINT "studies_alternative_id_alternatives_id_fk" FOREIGN KEY ("alternative_id") REFERENCES "public"."alternatives"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "studies" ADD CONSTRAINT "studies_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "study_revisions" ADD CONSTRAINT "study_revisions_study_id_studies_id_fk" FOREIGN KEY ("study_id") REFERENCES "public"."studies"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "study_revisions" ADD CONSTRAINT "study_revisions_author_id_users_id_fk" FOREIGN KEY ("author_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "alternatives_project_idx" ON "alternatives" USING btree ("project_id");--> statement-breakpoint
CREATE INDEX "aero_datasets_alternative_idx" ON "aero_datasets" USING btree ("alternative_id");--> statement-breakpoint
CREATE INDEX "studies_alternative_idx" ON "studies" USING btree ("alternative_id");