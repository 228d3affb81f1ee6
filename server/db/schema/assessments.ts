import { index, integer, jsonb, pgTable, serial, text, timestamp, unique } from "drizzle-orm/pg-core";
import type { Assessment, AssessmentSource } from "../../../shared/schemas/assessment.js";
import { studyRevisions } from "./study-revisions.js";

/**
 * The assessments of study revisions (shared/assessment): what every screen, the review queue and the signed
 * summary tell a reader, computed once and kept. Keyed by what each was computed from — the revision, the version
 * of the project's criteria (null: none saved), the stored results it used and the assessor's version — so a new
 * criteria version or a new result adds a row and never changes one; the newest for the current key is what the
 * screens show, and a signature names the one it signed. Append-only (trigger in the migration after this table's);
 * who asked for it first is in its audit event.
 */
export const revisionAssessments = pgTable(
  "revision_assessments",
  {
    id: serial("id").primaryKey(),
    revisionId: integer("revision_id")
      .notNull()
      .references(() => studyRevisions.id),
    criteriaVersion: integer("criteria_version"),
    /** The results it used, canonical text ("sweep@1.1.0"), for the unique key. */
    resultsKey: text("results_key").notNull(),
    assessor: text("assessor").notNull(),
    source: jsonb("source").$type<AssessmentSource>().notNull(),
    assessment: jsonb("assessment").$type<Assessment>().notNull(),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    unique("revision_assessments_key").on(t.revisionId, t.criteriaVersion, t.resultsKey, t.assessor).nullsNotDistinct(),
    index("revision_assessments_revision_idx").on(t.revisionId, t.id),
  ],
);

export type RevisionAssessmentRow = typeof revisionAssessments.$inferSelect;
