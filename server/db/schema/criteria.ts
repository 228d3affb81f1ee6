import { integer, jsonb, pgTable, serial, timestamp, unique } from "drizzle-orm/pg-core";
import type { BasisConfirmations, ProjectCriteria } from "../../../shared/schemas/criteria.js";
import { projects } from "./projects.js";
import { users } from "./users.js";

/**
 * A project's design wind and acceptance criteria, versioned: every save appends version n+1 and the highest
 * version is the current one, so earlier versions stay readable (a signed summary can name the version it
 * used). Rows are never updated. Each save also writes a `criteria.update` audit event in the same
 * transaction. The unique (project, version) key turns two concurrent saves of the same version into one
 * success and one conflict instead of a lost update. `basisConfirmations` records, per phenomenon, which
 * reviewer or administrator confirmed or wrote the basis of that version's requirement, and when
 * (shared/criteria/basis-confirmation.ts); a summary is signed only when every basis has a record.
 */
export const projectCriteria = pgTable(
  "project_criteria",
  {
    id: serial("id").primaryKey(),
    projectId: integer("project_id")
      .notNull()
      .references(() => projects.id, { onDelete: "cascade" }),
    version: integer("version").notNull(),
    /** The validated `ProjectCriteria` document (shared/schemas/criteria.ts). */
    criteria: jsonb("criteria").$type<ProjectCriteria>().notNull(),
    basisConfirmations: jsonb("basis_confirmations").$type<BasisConfirmations>().notNull().default({}),
    createdBy: integer("created_by").references(() => users.id, { onDelete: "set null" }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [unique("project_criteria_project_version_key").on(t.projectId, t.version)],
);

export type ProjectCriteriaRow = typeof projectCriteria.$inferSelect;
