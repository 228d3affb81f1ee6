/**
 * Invitations and password resets: one-time links carrying 32 random bytes (base64url). Only the SHA-256 of a
 * token is stored; a link works once (consumed atomically) and expires after 72 hours. Unknown tokens are 400,
 * used or expired ones 410 with a sentence saying which.
 */
import { randomBytes } from "node:crypto";
import type { z } from "zod";
import type {
  acceptInvitationSchema,
  createInvitationSchema,
  InvitationDto,
} from "../../shared/schemas/invitations.js";
import type { AppContext } from "../app-context.js";
import { writeAudit } from "../db/queries/audit.js";
import {
  consumeInvitation,
  consumePasswordReset,
  countRecentPasswordResets,
  findInvitationByHash,
  findPasswordResetByHash,
  insertInvitation,
  insertPasswordReset,
} from "../db/queries/one-time-tokens.js";
import { upsertMembership } from "../db/queries/memberships.js";
import { findProjectById } from "../db/queries/projects.js";
import { findUserByEmail, insertUser, setPassword } from "../db/queries/users.js";
import { AppError } from "../errors.js";
import { sha256Hex } from "../lib/hash.js";
import { invitationMail, ONE_TIME_LINK_TTL_HOURS } from "../mail/templates/invitation.js";
import { passwordResetMail } from "../mail/templates/password-reset.js";
import type { SessionUser } from "./auth.js";
import { deliverMail } from "./mail.js";
import { hashPassword } from "./passwords.js";
import { appLinks } from "./review-mail.js";

const TTL_MS = ONE_TIME_LINK_TTL_HOURS * 3600 * 1000;
/** At most this many reset links per account per hour (the response stays the same beyond it). */
const RESETS_PER_HOUR = 5;

export function newOneTimeToken(): { token: string; sha256: string } {
  const token = randomBytes(32).toString("base64url");
  return { token, sha256: sha256Hex(token) };
}

const linkGone = (what: string, why: "used" | "expired") =>
  new AppError(
    410,
    why === "used" ? "link_used" : "link_expired",
    why === "used"
      ? `This ${what} link has already been used. Links work once${what === "invitation" ? ": sign in with the password you chose, or ask an administrator for a new invitation." : ": ask for a new one."}`
      : `This ${what} link has expired (links are valid for ${ONE_TIME_LINK_TTL_HOURS} hours). ${what === "invitation" ? "Ask an administrator for a new invitation." : "Ask for a new one."}`,
  );

const unknownLink = (what: string) =>
  new AppError(400, "invalid_link", `This ${what} link is not valid. Check that the whole address was copied from the e-mail.`);

/** POST /api/projects/:id/invitations (administrators): stores the hashed token, e-mails the link. */
export async function inviteToProject(
  ctx: AppContext,
  admin: SessionUser,
  projectId: number,
  input: z.infer<typeof createInvitationSchema>,
  ip?: string,
): Promise<InvitationDto> {
  const { db } = ctx;
  const project = await findProjectById(db, projectId, admin.id);
  if (!project) throw AppError.notFound("Project");
  const { token, sha256 } = newOneTimeToken();
  const expiresAt = new Date(Date.now() + TTL_MS);
  const email = input.email.toLowerCase();
  const id = await db.transaction(async (tx) => {
    const invitationId = await insertInvitation(tx, {
      projectId,
      email,
      name: input.name ?? null,
      role: input.role,
      tokenSha256: sha256,
      invitedBy: admin.id,
      expiresAt,
    });
    await writeAudit(tx, {
      actorId: admin.id,
      action: "invitation.create",
      objectType: "invitation",
      objectId: invitationId,
      ip,
      details: { projectId, email, role: input.role },
    });
    return invitationId;
  });
  const mail = invitationMail({
    recipientName: input.name ?? null,
    inviterName: admin.name,
    projectName: project.name,
    role: input.role,
    link: appLinks.acceptInvitation(ctx.config.publicUrl, token),
    expiresAt,
  });
  const sent = await deliverMail(ctx, { to: email, ...mail });
  if (!sent) {
    throw new AppError(502, "mail_failed", "The invitation was stored but the e-mail could not be sent. Check the mail settings and invite again.");
  }
  return { id: String(id), projectId: String(projectId), email, name: input.name ?? null, role: input.role, expiresAt: expiresAt.toISOString() };
}

/**
 * POST /api/invitations/accept: creates the account (or sets the password of an existing one — the link proves
 * the mailbox — and ends its earlier sessions) and the membership, in one transaction with the token's consumption and the audit event.
 */
export async function acceptInvitation(
  ctx: AppContext,
  input: z.infer<typeof acceptInvitationSchema>,
  ip?: string,
): Promise<{ email: string; projectId: string }> {
  const { db } = ctx;
  const invitation = await findInvitationByHash(db, sha256Hex(input.token));
  if (!invitation) throw unknownLink("invitation");
  if (invitation.acceptedAt) throw linkGone("invitation", "used");
  if (invitation.expiresAt.getTime() <= Date.now()) throw linkGone("invitation", "expired");
  const passwordHash = await hashPassword(input.password);
  await db.transaction(async (tx) => {
    let user = await findUserByEmail(tx, invitation.email);
    if (user) {
      await setPassword(tx, user.id, passwordHash);
    } else {
      user = await insertUser(tx, { email: invitation.email, name: input.name, passwordHash });
    }
    if (!(await consumeInvitation(tx, invitation.id, user.id, new Date()))) {
      throw linkGone("invitation", "used"); // a concurrent accept won; the transaction rolls back
    }
    await upsertMembership(tx, { projectId: invitation.projectId, userId: user.id, role: invitation.role });
    await writeAudit(tx, {
      actorId: user.id,
      action: "invitation.accept",
      objectType: "invitation",
      objectId: invitation.id,
      ip,
      details: { projectId: invitation.projectId, role: invitation.role },
    });
  });
  return { email: invitation.email, projectId: String(invitation.projectId) };
}

/**
 * POST /api/auth/password-reset: e-mails a reset link when the account exists. The caller learns nothing either
 * way: the answer is the same, and it is given before anything depends on the account — the request path does
 * exactly the same work for every address (schedule, return), and the lookup, the token and the mail follow
 * after the answer has gone. A failure there is logged; the caller could not act on it anyway.
 */
export function requestPasswordReset(ctx: AppContext, email: string, ip?: string): void {
  setImmediate(() => {
    sendPasswordResetLink(ctx, email, ip).catch((err: unknown) => ctx.logger.error({ err }, "password reset request failed"));
  });
}

/** The work behind a password-reset request, after the answer: a link for an existing account (throttled per hour). */
async function sendPasswordResetLink(ctx: AppContext, email: string, ip?: string): Promise<void> {
  const { db } = ctx;
  const user = await findUserByEmail(db, email);
  if (!user) return;
  if ((await countRecentPasswordResets(db, user.id, new Date(Date.now() - 3600_000))) >= RESETS_PER_HOUR) {
    ctx.logger.warn({ userId: user.id }, "password reset throttled");
    return;
  }
  const { token, sha256 } = newOneTimeToken();
  const expiresAt = new Date(Date.now() + TTL_MS);
  await db.transaction(async (tx) => {
    await insertPasswordReset(tx, { userId: user.id, tokenSha256: sha256, expiresAt });
    await writeAudit(tx, { actorId: user.id, action: "auth.password-reset.request", objectType: "user", objectId: user.id, ip });
  });
  const mail = passwordResetMail({ recipientName: user.name, link: appLinks.resetPassword(ctx.config.publicUrl, token), expiresAt });
  await deliverMail(ctx, { to: user.email, ...mail });
}

/**
 * POST /api/auth/password-reset/confirm: sets the new password, closes every open reset link of the account and
 * ends every session started before.
 */
export async function confirmPasswordReset(ctx: AppContext, token: string, password: string, ip?: string): Promise<void> {
  const { db } = ctx;
  const reset = await findPasswordResetByHash(db, sha256Hex(token));
  if (!reset) throw unknownLink("password reset");
  if (reset.usedAt) throw linkGone("password reset", "used");
  if (reset.expiresAt.getTime() <= Date.now()) throw linkGone("password reset", "expired");
  const passwordHash = await hashPassword(password);
  await db.transaction(async (tx) => {
    if (!(await consumePasswordReset(tx, reset, new Date()))) throw linkGone("password reset", "used");
    await setPassword(tx, reset.userId, passwordHash);
    await writeAudit(tx, { actorId: reset.userId, action: "auth.password-reset", objectType: "user", objectId: reset.userId, ip });
  });
}
