import { sql } from "drizzle-orm";
import { check, doublePrecision, index, integer, pgTable, serial, text, timestamp } from "drizzle-orm/pg-core";
import { bytea } from "./bytea.js";
import { projects } from "./projects.js";
import { users } from "./users.js";

/**
 * A deck alternative of a project: its geometry (B and D, which only pre-fill new studies — each study document
 * keeps the values it was computed with) and an optional cross-section image. The image lives in the row
 * (bytea, ≤ 5 MB) rather than on disk so that it is written in the same transaction as its audit event, is
 * covered by the database backup, and can never be orphaned or point at a missing file.
 */
export const alternatives = pgTable(
  "alternatives",
  {
    id: serial("id").primaryKey(),
    projectId: integer("project_id")
      .notNull()
      .references(() => projects.id, { onDelete: "restrict" }),
    name: text("name").notNull(),
    description: text("description").notNull().default(""),
    deckWidthM: doublePrecision("deck_width_m").notNull(),
    deckDepthM: doublePrecision("deck_depth_m").notNull(),
    imageBytes: bytea("image_bytes"),
    imageContentType: text("image_content_type"),
    imageSha256: text("image_sha256"),
    imageSizeBytes: integer("image_size_bytes"),
    imageUploadedAt: timestamp("image_uploaded_at", { withTimezone: true }),
    createdBy: integer("created_by").references(() => users.id, { onDelete: "set null" }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index("alternatives_project_idx").on(t.projectId),
    check("alternatives_geometry_positive", sql`${t.deckWidthM} > 0 and ${t.deckDepthM} > 0`),
    check(
      "alternatives_image_complete",
      sql`(${t.imageBytes} is null) = (${t.imageContentType} is null) and (${t.imageBytes} is null) = (${t.imageSha256} is null)`,
    ),
  ],
);

export type Alternative = typeof alternatives.$inferSelect;
export type NewAlternative = typeof alternatives.$inferInsert;
