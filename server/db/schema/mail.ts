import { bigserial, index, integer, pgTable, text, timestamp } from "drizzle-orm/pg-core";

/**
 * Messages received by the local fake SMTP server (development and tests only: nothing is written here when real
 * SMTP settings are configured). Admins read them at GET /api/dev/mailbox.
 */
export const devMailMessages = pgTable(
  "dev_mail_messages",
  {
    id: bigserial("id", { mode: "number" }).primaryKey(),
    /** Envelope sender. */
    fromAddress: text("from_address").notNull(),
    /** Envelope recipients, Bcc included. */
    toAddresses: text("to_addresses").array().notNull(),
    subject: text("subject").notNull(),
    text: text("text").notNull(),
    html: text("html"),
    sizeBytes: integer("size_bytes").notNull(),
    messageId: text("message_id"),
    receivedAt: timestamp("received_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("dev_mail_messages_received_at_idx").on(t.receivedAt)],
);

export type DevMailMessage = typeof devMailMessages.$inferSelect;
export type NewDevMailMessage = typeof devMailMessages.$inferInsert;
