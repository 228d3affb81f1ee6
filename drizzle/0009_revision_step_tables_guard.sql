-- A revision's full step table is part of what was computed for it: append-only like the revision itself.
CREATE FUNCTION "study_revision_tables_refuse_change"() RETURNS trigger
LANGUAGE plpgsql AS $$
BEGIN
  RAISE EXCEPTION 'study_revision_tables is append-only: % refused (a revision''s step table is never changed or deleted)', TG_OP
    USING ERRCODE = 'integrity_constraint_violation';
END;
$$;--> statement-breakpoint
CREATE TRIGGER "study_revision_tables_no_update_or_delete"
  BEFORE UPDATE OR DELETE ON "study_revision_tables"
  FOR EACH ROW EXECUTE FUNCTION "study_revision_tables_refuse_change"();--> statement-breakpoint
CREATE TRIGGER "study_revision_tables_no_truncate"
  BEFORE TRUNCATE ON "study_revision_tables"
  FOR EACH STATEMENT EXECUTE FUNCTION "study_revision_tables_refuse_change"();--> statement-breakpoint
-- The CSV is gzip already: store it out of line without PostgreSQL's compression, so a download can read it in
-- slices (substring) without fetching and decompressing the whole value.
ALTER TABLE "study_revision_tables" ALTER COLUMN "csv_gzip" SET STORAGE EXTERNAL;
