import { and, eq, gt, isNull, sql } from "drizzle-orm";
import type { DbOrTx } from "../client.js";
import { invitations, passwordResets, type Invitation, type PasswordReset } from "../schema/index.js";

export async function insertInvitation(
  db: DbOrTx,
  values: Pick<Invitation, "projectId" | "email" | "name" | "role" | "tokenSha256" | "invitedBy" | "expiresAt">,
): Promise<number> {
  const [row] = await db.insert(invitations).values(values).returning({ id: invitations.id });
  return row.id;
}

/** The invitation behind a token hash, whatever its state (so the caller can say why it no longer works). */
export async function findInvitationByHash(db: DbOrTx, tokenSha256: string): Promise<Invitation | undefined> {
  const [row] = await db.select().from(invitations).where(eq(invitations.tokenSha256, tokenSha256)).limit(1);
  return row;
}

/**
 * Marks the invitation used, only if it is still open and unexpired at `now`: of two concurrent accepts of the
 * same link exactly one gets the row back.
 */
export async function consumeInvitation(db: DbOrTx, id: number, userId: number, now: Date): Promise<boolean> {
  const rows = await db
    .update(invitations)
    .set({ acceptedAt: now, acceptedUserId: userId })
    .where(and(eq(invitations.id, id), isNull(invitations.acceptedAt), gt(invitations.expiresAt, now)))
    .returning({ id: invitations.id });
  return rows.length === 1;
}

export async function insertPasswordReset(
  db: DbOrTx,
  values: Pick<PasswordReset, "userId" | "tokenSha256" | "expiresAt">,
): Promise<void> {
  await db.insert(passwordResets).values(values);
}

export async function findPasswordResetByHash(db: DbOrTx, tokenSha256: string): Promise<PasswordReset | undefined> {
  const [row] = await db.select().from(passwordResets).where(eq(passwordResets.tokenSha256, tokenSha256)).limit(1);
  return row;
}

/** Marks the reset link used if still open; also closes the user's other open reset links. */
export async function consumePasswordReset(db: DbOrTx, reset: PasswordReset, now: Date): Promise<boolean> {
  const rows = await db
    .update(passwordResets)
    .set({ usedAt: now })
    .where(and(eq(passwordResets.id, reset.id), isNull(passwordResets.usedAt), gt(passwordResets.expiresAt, now)))
    .returning({ id: passwordResets.id });
  if (rows.length !== 1) return false;
  await db
    .update(passwordResets)
    .set({ usedAt: now })
    .where(and(eq(passwordResets.userId, reset.userId), isNull(passwordResets.usedAt)));
  return true;
}

/** Open reset links requested for the user in the last hour (a throttle against mail flooding). */
export async function countRecentPasswordResets(db: DbOrTx, userId: number, since: Date): Promise<number> {
  const [row] = await db
    .select({ n: sql<number>`count(*)::int` })
    .from(passwordResets)
    .where(and(eq(passwordResets.userId, userId), gt(passwordResets.createdAt, since)));
  return row.n;
}
