import type { DbOrTx } from "../client.js";
import { auditEvents } from "../schema/index.js";

export interface AuditEntry {
  actorId: number | null;
  /** Dotted verb, e.g. "auth.sign-in", "project.update". */
  action: string;
  objectType: string;
  objectId?: string | number | null;
  ip?: string | null;
  details?: Record<string, unknown>;
}

/** Records one write. Call it with the transaction of the write itself, so both commit or neither does. */
export async function writeAudit(tx: DbOrTx, entry: AuditEntry): Promise<void> {
  await tx.insert(auditEvents).values({
    actorId: entry.actorId,
    action: entry.action,
    objectType: entry.objectType,
    objectId: entry.objectId == null ? null : String(entry.objectId),
    ip: normaliseIp(entry.ip),
    details: entry.details ?? {},
  });
}

/** Express gives IPv4 clients as "::ffff:127.0.0.1"; store the plain form, and nothing that is not an address. */
function normaliseIp(ip: string | null | undefined): string | null {
  if (!ip) return null;
  const plain = ip.startsWith("::ffff:") ? ip.slice(7) : ip;
  return /^[0-9a-fA-F:.]+$/.test(plain) ? plain : null;
}
