/**
 * Sign-in and sessions. A session is a JWT (HS256, signed with the server's session secret) naming the user and
 * carrying a random session id (jti); it lives 12 h in an httpOnly cookie. Every request re-reads the user, so a
 * deleted user loses access at once, checks the session id against those ended by sign-out, and refuses sessions
 * issued before the user's `sessionsValidAfter` (moved forward when the password changes).
 */
import { randomUUID } from "node:crypto";
import { errors as joseErrors, jwtVerify, SignJWT } from "jose";
import type { Me, SignInInput } from "../../shared/schemas/auth.js";
import type { Db, DbOrTx } from "../db/client.js";
import { writeAudit } from "../db/queries/audit.js";
import { isSessionRevoked, revokeSession } from "../db/queries/sessions.js";
import { findUserByEmail, findUserById, listMembershipsOfUser } from "../db/queries/users.js";
import type { User } from "../db/schema/index.js";
import { AppError } from "../errors.js";
import { DUMMY_HASH, verifyPassword } from "./passwords.js";

export const SESSION_COOKIE = "stillspan_session";
export const SESSION_TTL_SECONDS = 12 * 60 * 60;
const ISSUER = "stillspan";
const AUDIENCE = "stillspan-session";

/** The signed-in user as routes and services see it. */
export interface SessionUser {
  id: number;
  email: string;
  name: string;
  isAdmin: boolean;
}

/** Same answer for an unknown e-mail and a wrong password, so the response does not reveal who has an account. */
const invalidCredentials = () => new AppError(401, "invalid_credentials", "E-mail or password is incorrect.");

/**
 * A signed session token for the user. `iat` keeps milliseconds (a NumericDate may be fractional, RFC 7519 §2),
 * so a session started just after a password change is told apart from one started just before it.
 */
export async function createSessionToken(secret: Uint8Array, userId: number, now = new Date()): Promise<string> {
  const issuedAt = now.getTime() / 1000;
  return new SignJWT({})
    .setProtectedHeader({ alg: "HS256", typ: "JWT" })
    .setSubject(String(userId))
    .setJti(randomUUID())
    .setIssuer(ISSUER)
    .setAudience(AUDIENCE)
    .setIssuedAt(issuedAt)
    .setExpirationTime(Math.floor(issuedAt) + SESSION_TTL_SECONDS)
    .sign(secret);
}

export interface SessionClaims {
  userId: number;
  /** Session id. */
  jti: string;
  issuedAt: Date;
  expiresAt: Date;
}

/** The claims of a valid, unexpired session token; undefined for anything else (tampered, expired, malformed). */
export async function readSessionToken(secret: Uint8Array, token: string): Promise<SessionClaims | undefined> {
  try {
    const { payload } = await jwtVerify(token, secret, {
      algorithms: ["HS256"],
      issuer: ISSUER,
      audience: AUDIENCE,
      requiredClaims: ["sub", "jti", "iat", "exp"],
    });
    const userId = Number(payload.sub);
    if (!Number.isSafeInteger(userId) || userId <= 0 || typeof payload.jti !== "string") return undefined;
    return { userId, jti: payload.jti, issuedAt: new Date(payload.iat! * 1000), expiresAt: new Date(payload.exp! * 1000) };
  } catch (err) {
    if (err instanceof joseErrors.JOSEError) return undefined;
    throw err;
  }
}

export function toSessionUser(user: User): SessionUser {
  return { id: user.id, email: user.email, name: user.name, isAdmin: user.isAdmin };
}

/** Checks the credentials; on success records the sign-in and returns the user. */
export async function signIn(db: DbOrTx, input: SignInInput, ip: string | undefined): Promise<SessionUser> {
  const user = await findUserByEmail(db, input.email);
  // Compare against a dummy hash for unknown e-mails so both failures take the same time.
  const ok = await verifyPassword(input.password, user?.passwordHash ?? DUMMY_HASH);
  if (!user || !ok) throw invalidCredentials();
  await writeAudit(db, { actorId: user.id, action: "auth.sign-in", objectType: "user", objectId: user.id, ip });
  return toSessionUser(user);
}

/**
 * The user behind a session token, or undefined when the token is invalid or revoked, the user is gone, or the
 * session was started before the user's password last changed.
 */
export async function userFromSession(db: Db, secret: Uint8Array, token: string): Promise<SessionUser | undefined> {
  const claims = await readSessionToken(secret, token);
  if (!claims) return undefined;
  // Two pooled connections, not a transaction: the lookups may run side by side.
  const [user, revoked] = await Promise.all([findUserById(db, claims.userId), isSessionRevoked(db, claims.jti)]);
  if (!user || revoked) return undefined;
  if (user.sessionsValidAfter && claims.issuedAt.getTime() < user.sessionsValidAfter.getTime()) return undefined;
  return toSessionUser(user);
}

/** Ends a session before its expiry (sign-out) and records it; a no-op for an invalid token. */
export async function endSession(db: DbOrTx, secret: Uint8Array, token: string, ip: string | undefined): Promise<void> {
  const claims = await readSessionToken(secret, token);
  if (!claims) return;
  await db.transaction(async (tx) => {
    await revokeSession(tx, claims.jti, claims.userId, claims.expiresAt);
    await writeAudit(tx, { actorId: claims.userId, action: "auth.sign-out", objectType: "user", objectId: claims.userId, ip });
  });
}

/** Body of GET /api/auth/me. */
export async function describeMe(db: DbOrTx, user: SessionUser): Promise<Me> {
  const memberships = await listMembershipsOfUser(db, user.id);
  return {
    id: String(user.id),
    email: user.email,
    name: user.name,
    isAdmin: user.isAdmin,
    memberships: memberships.map((m) => ({ projectId: String(m.projectId), role: m.role })),
  };
}
