import { index, integer, pgEnum, pgTable, serial, text, timestamp, unique } from "drizzle-orm/pg-core";
import { PROJECT_ROLES as ROLES } from "../../../shared/schemas/auth.js";
import { users } from "./users.js";

/** A crossing (or any deck design job): the unit of access control. */
export const projects = pgTable("projects", {
  id: serial("id").primaryKey(),
  name: text("name").notNull(),
  description: text("description").notNull().default(""),
  siteNotes: text("site_notes").notNull().default(""),
  createdBy: integer("created_by").references(() => users.id, { onDelete: "set null" }),
  createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
});

/** Project roles: analyst (runs sweeps, edits studies), reviewer (compares, returns or signs), viewer (reads). */
export const projectRole = pgEnum("project_role", ROLES);
export const PROJECT_ROLES = projectRole.enumValues;
export type ProjectRole = (typeof PROJECT_ROLES)[number];

export const memberships = pgTable(
  "memberships",
  {
    id: serial("id").primaryKey(),
    userId: integer("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    projectId: integer("project_id")
      .notNull()
      .references(() => projects.id, { onDelete: "cascade" }),
    role: projectRole("role").notNull(),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [unique("memberships_user_project_key").on(t.userId, t.projectId), index("memberships_project_idx").on(t.projectId)],
);

export type Project = typeof projects.$inferSelect;
export type NewProject = typeof projects.$inferInsert;
export type Membership = typeof memberships.$inferSelect;
