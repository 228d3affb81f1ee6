-- The review history is append-only like the revisions it is about (and the signatures, 0006): the history
-- entries (submitted, returned, signed, commented, reassigned) and the comments are what a signed summary and its
-- audit trail rest on, so no UPDATE, DELETE or TRUNCATE may change them, whoever connects. The state of a review
-- (in review, returned, signed; its assigned reviewer) lives in review_requests, which does change.
-- The app's database role owns none of these tables, so it can neither drop nor disable these triggers.
CREATE FUNCTION "append_only_refuse_change"() RETURNS trigger
LANGUAGE plpgsql AS $$
BEGIN
  RAISE EXCEPTION '% is append-only: % refused (review history is never changed or deleted)', TG_TABLE_NAME, TG_OP
    USING ERRCODE = 'integrity_constraint_violation';
END;
$$;--> statement-breakpoint
CREATE TRIGGER "review_events_no_update_or_delete"
  BEFORE UPDATE OR DELETE ON "review_events"
  FOR EACH ROW EXECUTE FUNCTION "append_only_refuse_change"();--> statement-breakpoint
CREATE TRIGGER "review_events_no_truncate"
  BEFORE TRUNCATE ON "review_events"
  FOR EACH STATEMENT EXECUTE FUNCTION "append_only_refuse_change"();--> statement-breakpoint
CREATE TRIGGER "review_comments_no_update_or_delete"
  BEFORE UPDATE OR DELETE ON "review_comments"
  FOR EACH ROW EXECUTE FUNCTION "append_only_refuse_change"();--> statement-breakpoint
CREATE TRIGGER "review_comments_no_truncate"
  BEFORE TRUNCATE ON "review_comments"
  FOR EACH STATEMENT EXECUTE FUNCTION "append_only_refuse_change"();
