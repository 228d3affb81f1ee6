import { index, integer, pgTable, serial, text, timestamp } from "drizzle-orm/pg-core";
import { projectRole } from "./projects.js";
import { projects } from "./projects.js";
import { users } from "./users.js";

/**
 * Invitations to a project. The e-mailed link carries a random 32-byte token; only its SHA-256 is stored, so a
 * database reader cannot use an open invitation. One use (acceptedAt), 72 hours (expiresAt).
 */
export const invitations = pgTable(
  "invitations",
  {
    id: serial("id").primaryKey(),
    projectId: integer("project_id")
      .notNull()
      .references(() => projects.id, { onDelete: "cascade" }),
    /** Lower-case. */
    email: text("email").notNull(),
    name: text("name"),
    role: projectRole("role").notNull(),
    tokenSha256: text("token_sha256").notNull().unique("invitations_token_key"),
    invitedBy: integer("invited_by").references(() => users.id, { onDelete: "set null" }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    expiresAt: timestamp("expires_at", { withTimezone: true }).notNull(),
    acceptedAt: timestamp("accepted_at", { withTimezone: true }),
    acceptedUserId: integer("accepted_user_id").references(() => users.id, { onDelete: "set null" }),
  },
  (t) => [index("invitations_project_idx").on(t.projectId)],
);

/** Password reset links: same rules as invitations (hashed token, one use, 72 hours). */
export const passwordResets = pgTable(
  "password_resets",
  {
    id: serial("id").primaryKey(),
    userId: integer("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    tokenSha256: text("token_sha256").notNull().unique("password_resets_token_key"),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    expiresAt: timestamp("expires_at", { withTimezone: true }).notNull(),
    usedAt: timestamp("used_at", { withTimezone: true }),
  },
  (t) => [index("password_resets_user_idx").on(t.userId)],
);

export type Invitation = typeof invitations.$inferSelect;
export type PasswordReset = typeof passwordResets.$inferSelect;
