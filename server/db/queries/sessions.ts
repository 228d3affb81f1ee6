import { eq, lt } from "drizzle-orm";
import type { DbOrTx } from "../client.js";
import { revokedSessions } from "../schema/index.js";

/** Marks a session id as ended; pruning rows of sessions that have expired anyway. */
export async function revokeSession(db: DbOrTx, jti: string, userId: number, expiresAt: Date): Promise<void> {
  await db.delete(revokedSessions).where(lt(revokedSessions.expiresAt, new Date()));
  await db.insert(revokedSessions).values({ jti, userId, expiresAt }).onConflictDoNothing();
}

export async function isSessionRevoked(db: DbOrTx, jti: string): Promise<boolean> {
  const [row] = await db.select({ jti: revokedSessions.jti }).from(revokedSessions).where(eq(revokedSessions.jti, jti)).limit(1);
  return row !== undefined;
}
