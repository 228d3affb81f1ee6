import { arrayContains, desc } from "drizzle-orm";
import type { ReceivedMail } from "../../mail/fake-smtp.js";
import type { DbOrTx } from "../client.js";
import { devMailMessages, type DevMailMessage } from "../schema/index.js";

export async function insertDevMail(db: DbOrTx, mail: ReceivedMail): Promise<void> {
  await db.insert(devMailMessages).values({
    fromAddress: mail.from,
    toAddresses: mail.to.map((address) => address.toLowerCase()),
    subject: mail.subject,
    text: mail.text,
    html: mail.html,
    sizeBytes: mail.sizeBytes,
    messageId: mail.messageId,
    receivedAt: mail.receivedAt,
  });
}

/** Newest first; `to` keeps the messages addressed to that recipient (envelope, exact address). */
export async function listDevMail(db: DbOrTx, params: { to?: string; limit: number }): Promise<DevMailMessage[]> {
  return db
    .select()
    .from(devMailMessages)
    .where(params.to ? arrayContains(devMailMessages.toAddresses, [params.to]) : undefined)
    .orderBy(desc(devMailMessages.id))
    .limit(params.limit);
}
