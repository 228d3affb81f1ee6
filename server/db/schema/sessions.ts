import { index, integer, pgTable, text, timestamp } from "drizzle-orm/pg-core";
import { users } from "./users.js";

/**
 * Sessions ended by sign-out before their expiry. A session token stays cryptographically valid until it expires;
 * its id (jti) listed here makes the server refuse it anyway. Rows past `expiresAt` are useless and get pruned.
 */
export const revokedSessions = pgTable(
  "revoked_sessions",
  {
    jti: text("jti").primaryKey(),
    userId: integer("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    expiresAt: timestamp("expires_at", { withTimezone: true }).notNull(),
    revokedAt: timestamp("revoked_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("revoked_sessions_expires_idx").on(t.expiresAt)],
);
