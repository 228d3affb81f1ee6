import { sql } from "drizzle-orm";
import { check, doublePrecision, integer, jsonb, pgTable, serial, text, timestamp, unique } from "drizzle-orm/pg-core";
import type { SweepResult } from "../../../shared/schemas/result.js";
import type { StudyDocument } from "../../../shared/schemas/study.js";
import { studies } from "./studies.js";
import { users } from "./users.js";

/**
 * Every saved state of a study: numbered 1, 2, … per study without gaps, with the full document, its SHA-256
 * over RFC 8785 canonical JSON, the engine version and the stored result. Append-only: a trigger (migration
 * 0003) raises on UPDATE, DELETE and TRUNCATE, so a signed summary that names a revision always names exactly
 * what was computed. Review state and comments live in their own tables; what a reader is told about the result
 * (critical speeds with their basis, margins, warnings) in its assessments (revision_assessments). Users and studies that have
 * revisions cannot be deleted (no ON DELETE action: it would have to update or delete revisions).
 */
export const studyRevisions = pgTable(
  "study_revisions",
  {
    id: serial("id").primaryKey(),
    studyId: integer("study_id")
      .notNull()
      .references(() => studies.id),
    number: integer("number").notNull(),
    parentNumber: integer("parent_number"),
    authorId: integer("author_id").references(() => users.id),
    changeNote: text("change_note").notNull().default(""),
    document: jsonb("document").$type<StudyDocument>().notNull(),
    documentSha256: text("document_sha256").notNull(),
    engineVersion: text("engine_version").notNull(),
    result: jsonb("result").$type<SweepResult>().notNull(),
    flutterSpeedMps: doublePrecision("flutter_speed_mps"),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    unique("study_revisions_study_number_key").on(t.studyId, t.number),
    check("study_revisions_number_positive", sql`${t.number} >= 1`),
    check(
      "study_revisions_parent_before",
      sql`(${t.number} = 1 and ${t.parentNumber} is null) or (${t.number} > 1 and ${t.parentNumber} = ${t.number} - 1)`,
    ),
    check("study_revisions_change_note", sql`${t.number} = 1 or length(trim(${t.changeNote})) > 0`),
    check("study_revisions_sha256_hex", sql`${t.documentSha256} ~ '^[0-9a-f]{64}$'`),
  ],
);

export type StudyRevision = typeof studyRevisions.$inferSelect;
export type NewStudyRevision = typeof studyRevisions.$inferInsert;
