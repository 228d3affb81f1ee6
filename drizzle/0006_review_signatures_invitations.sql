CREATE TYPE "public"."review_event_kind" AS ENUM('submitted', 'returned', 'signed', 'commented');--> statement-breakpoint
CREATE TYPE "public"."review_request_state" AS ENUM('in-review', 'returned', 'signed');--> statement-breakpoint
CREATE TABLE "review_comments" (
	"id" serial PRIMARY KEY NOT NULL,
	"revision_id" integer NOT NULL,
	"author_id" integer NOT NULL,
	"body" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "review_comments_body" CHECK (length(trim("review_comments"."body")) > 0)
);
--> statement-breakpoint
CREATE TABLE "review_events" (
	"id" bigserial PRIMARY KEY NOT NULL,
	"revision_id" integer NOT NULL,
	"kind" "review_event_kind" NOT NULL,
	"actor_id" integer,
	"reviewer_id" integer,
	"note" text DEFAULT '' NOT NULL,
	"at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "review_requests" (
	"id" serial PRIMARY KEY NOT NULL,
	"revision_id" integer NOT NULL,
	"state" "review_request_state" DEFAULT 'in-review' NOT NULL,
	"requested_by" integer NOT NULL,
	"reviewer_id" integer NOT NULL,
	"note" text DEFAULT '' NOT NULL,
	"submitted_at" timestamp with time zone DEFAULT now() NOT NULL,
	"decided_at" timestamp with time zone,
	"decided_by" integer,
	CONSTRAINT "review_requests_revision_key" UNIQUE("revision_id"),
	CONSTRAINT "review_requests_decided" CHECK (("review_requests"."state" = 'in-review') = ("review_requests"."decided_at" is null))
);
--> statement-breakpoint
CREATE TABLE "signatures" (
	"id" serial PRIMARY KEY NOT NULL,
	"revision_id" integer NOT NULL,
	"signer_id" integer NOT NULL,
	"jws" text NOT NULL,
	"kid" text NOT NULL,
	"payload" jsonb NOT NULL,
	"payload_sha256" text NOT NULL,
	"signed_at" timestamp with time zone NOT NULL,
	CONSTRAINT "signatures_revision_key" UNIQUE("revision_id"),
	CONSTRAINT "signatures_sha256_hex" CHECK ("signatures"."payload_sha256" ~ '^[0-9a-f]{64}$')
);
--> statement-breakpoint
CREATE TABLE "invitations" (
	"id" serial PRIMARY KEY NOT NULL,
	"project_id" integer NOT NULL,
	"email" text NOT NULL,
	"name" text,
	"role" "project_role" NOT NULL,
	"token_sha256" text NOT NULL,
	"invited_by" integer,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"expires_at" timestamp with time zone NOT NULL,
	"accepted_at" timestamp with time zone,
	"accepted_user_id" integer,
	CONSTRAINT "invitations_token_key" UNIQUE("token_sha256")
);
--> statement-breakpoint
CREATE TABLE "password_resets" (
	"id" serial PRIMARY KEY NOT NULL,
	"user_id" integer NOT NULL,
	"token_sha256" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"expires_at" timestamp with time zone NOT NULL,
	"used_at" timestamp with time zone,
	CONSTRAINT "password_resets_token_key" UNIQUE("token_sha256")
);
--> statement-breakpoint
ALTER TABLE "review_comments" ADD CONSTRAINT "review_comments_revision_id_study_revisions_id_fk" FOREIGN KEY ("revision_id") REFERENCES "public"."study_revisions"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "review_comments" ADD CONSTRAINT "review_comments_author_id_users_id_fk" FOREIGN KEY ("author_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "review_events" ADD CONSTRAINT "review_events_revision_id_study_revisions_id_fk" FOREIGN KEY ("revision_id") REFERENCES "public"."study_revisions"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "review_events" ADD CONSTRAINT "review_events_actor_id_users_id_fk" FOREIGN KEY ("actor_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "review_events" ADD CONSTRAINT "review_events_reviewer_id_users_id_fk" FOREIGN KEY ("reviewer_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "review_requests" ADD CONSTRAINT "review_requests_revision_id_study_revisions_id_fk" FOREIGN KEY ("revision_id") REFERENCES "public"."study_revisions"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "review_requests" ADD CONSTRAINT "review_requests_requested_by_users_id_fk" FOREIGN KEY ("requested_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "review_requests" ADD CONSTRAINT "review_requests_reviewer_id_users_id_fk" FOREIGN KEY ("reviewer_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "review_requests" ADD CONSTRAINT "review_requests_decided_by_users_id_fk" FOREIGN KEY ("decided_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "signatures" ADD CONSTRAINT "signatures_revision_id_study_revisions_id_fk" FOREIGN KEY ("revision_id") REFERENCES "public"."study_revisions"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "signatures" ADD CONSTRAINT "signatures_signer_id_users_id_fk" FOREIGN KEY ("signer_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "invitations" ADD CONSTRAINT "invitations_project_id_projects_id_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "invitations" ADD CONSTRAINT "invitations_invited_by_users_id_fk" FOREIGN KEY ("invited_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "invitations" ADD CONSTRAINT "invitations_accepted_user_id_users_id_fk" FOREIGN KEY ("accepted_user_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "password_resets" ADD CONSTRAINT "password_resets_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "review_comments_revision_idx" ON "review_comments" USING btree ("revision_id","id");--> statement-breakpoint
CREATE INDEX "review_events_revision_idx" ON "review_events" USING btree ("revision_id","id");--> statement-breakpoint
CREATE INDEX "review_requests_reviewer_state_idx" ON "review_requests" USING btree ("reviewer_id","state");--> statement-breakpoint
CREATE INDEX "invitations_project_idx" ON "invitations" USING btree ("project_id");--> statement-breakpoint
CREATE INDEX "password_resets_user_idx" ON "password_resets" USING btree ("user_id");--> statement-breakpoint
-- Signatures are append-only, like the revisions they sign: a signed summary is never changed or withdrawn in place.
CREATE FUNCTION "signatures_refuse_change"() RETURNS trigger
LANGUAGE plpgsql AS $$
BEGIN
  RAISE EXCEPTION 'signatures is append-only: % refused (a signed summary is never changed or deleted)', TG_OP
    USING ERRCODE = 'integrity_constraint_violation';
END;
$$;--> statement-breakpoint
CREATE TRIGGER "signatures_no_update_or_delete"
  BEFORE UPDATE OR DELETE ON "signatures"
  FOR EACH ROW EXECUTE FUNCTION "signatures_refuse_change"();--> statement-breakpoint
CREATE TRIGGER "signatures_no_truncate"
  BEFORE TRUNCATE ON "signatures"
  FOR EACH STATEMENT EXECUTE FUNCTION "signatures_refuse_change"();
