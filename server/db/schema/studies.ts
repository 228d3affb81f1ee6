import { index, integer, pgTable, serial, text, timestamp } from "drizzle-orm/pg-core";
import { alternatives } from "./alternatives.js";
import { users } from "./users.js";

/**
 * A stability study of a deck alternative: a name and a purpose. Its content is the chain of immutable
 * revisions in `study_revisions`; the row here is also what a revision save locks (`select … for update`) so
 * that concurrent saves on the same study are serialised.
 */
export const studies = pgTable(
  "studies",
  {
    id: serial("id").primaryKey(),
    alternativeId: integer("alternative_id")
      .notNull()
      .references(() => alternatives.id, { onDelete: "restrict" }),
    name: text("name").notNull(),
    purpose: text("purpose").notNull().default(""),
    createdBy: integer("created_by").references(() => users.id, { onDelete: "set null" }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("studies_alternative_idx").on(t.alternativeId)],
);

export type Study = typeof studies.$inferSelect;
export type NewStudy = typeof studies.$inferInsert;
