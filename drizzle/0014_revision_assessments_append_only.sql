-- A revision's assessments are what its screens, its review and its signed summary state: append-only like the
-- revision itself (0003) and the signatures that name them (0006). A new criteria version or a new result adds an
-- assessment; none is ever changed or deleted, whoever connects (the app's role owns no table, so it cannot drop
-- or disable these triggers).
CREATE FUNCTION "revision_assessments_refuse_change"() RETURNS trigger
LANGUAGE plpgsql AS $$
BEGIN
  RAISE EXCEPTION 'revision_assessments is append-only: % refused (an assessment is never changed or deleted; a new one is added)', TG_OP
    USING ERRCODE = 'integrity_constraint_violation';
END;
$$;--> statement-breakpoint
CREATE TRIGGER "revision_assessments_no_update_or_delete"
  BEFORE UPDATE OR DELETE ON "revision_assessments"
  FOR EACH ROW EXECUTE FUNCTION "revision_assessments_refuse_change"();--> statement-breakpoint
CREATE TRIGGER "revision_assessments_no_truncate"
  BEFORE TRUNCATE ON "revision_assessments"
  FOR EACH STATEMENT EXECUTE FUNCTION "revision_assessments_refuse_change"();
