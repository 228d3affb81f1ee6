import { integer, jsonb, pgTable, timestamp } from "drizzle-orm/pg-core";
import { bytea } from "./bytea.js";
import { studyRevisions } from "./study-revisions.js";

/**
 * The full step table of a revision's sweep — every solved step of every branch, as gzip-compressed CSV
 * (server/lib/steps-table.ts) — kept apart from the revision row, whose `result` carries the thinned branches.
 * Read only for a download, in slices, so a large table never passes through one query. Append-only like the
 * revisions (migration 0009); the column is stored without PostgreSQL's own compression (already gzip), which
 * also lets a slice be read without reading the whole value.
 */
export const studyRevisionTables = pgTable("study_revision_tables", {
  revisionId: integer("revision_id")
    .primaryKey()
    .references(() => studyRevisions.id),
  /** Branch ids in the CSV's column order. */
  branchIds: jsonb("branch_ids").$type<string[]>().notNull(),
  /** Data rows of the CSV (every solved step of every branch). */
  rowCount: integer("row_count").notNull(),
  csvGzip: bytea("csv_gzip").notNull(),
  createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
});

export type NewStudyRevisionTable = typeof studyRevisionTables.$inferInsert;
