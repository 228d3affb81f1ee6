-- Study revisions are append-only: a stored revision is what a signed summary points at, so no UPDATE,
-- DELETE or TRUNCATE may change it, whoever connects. Review state and comments live in their own tables.
CREATE FUNCTION "study_revisions_refuse_change"() RETURNS trigger
LANGUAGE plpgsql AS $$
BEGIN
  RAISE EXCEPTION 'study_revisions is append-only: % refused (revisions are never changed or deleted)', TG_OP
    USING ERRCODE = 'integrity_constraint_violation';
END;
$$;--> statement-breakpoint
CREATE TRIGGER "study_revisions_no_update_or_delete"
  BEFORE UPDATE OR DELETE ON "study_revisions"
  FOR EACH ROW EXECUTE FUNCTION "study_revisions_refuse_change"();--> statement-breakpoint
CREATE TRIGGER "study_revisions_no_truncate"
  BEFORE TRUNCATE ON "study_revisions"
  FOR EACH STATEMENT EXECUTE FUNCTION "study_revisions_refuse_change"();
