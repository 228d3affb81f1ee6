/**
 * Access control. `requireAuth` turns the session cookie into `req.user` (401 otherwise); `requireAdmin` and
 * `requireRole` guard routes; `requireRole` applies `assertRole` (server/services/access.ts), the same rule the
 * services apply. Administrators pass every role check.
 * The client hides what a role cannot do; these guards are what actually enforces it.
 */
import type { Request, RequestHandler } from "express";
import type { ProjectRole } from "../../shared/schemas/auth.js";
import { appContext } from "../app-context.js";
import { AppError } from "../errors.js";
import { assertRole, parseProjectId } from "../services/access.js";
import { SESSION_COOKIE, userFromSession, type SessionUser } from "../services/auth.js";

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    interface Request {
      /** Set by requireAuth. */
      user?: SessionUser;
      /** Set by requireRole: the caller's role in the guarded project (null for an administrator who is not a member). */
      projectRole?: ProjectRole | null;
    }
  }
}

/** The signed-in user of a request that went through requireAuth. */
export function currentUser(req: Request): SessionUser {
  if (!req.user) throw AppError.unauthorized();
  return req.user;
}

/** Lets the request through with `req.user` set when its session cookie is valid; 401 otherwise. */
export const requireAuth: RequestHandler = async (req, _res, next) => {
  const { db, config } = appContext(req);
  const token: unknown = req.cookies?.[SESSION_COOKIE];
  const user = typeof token === "string" && token ? await userFromSession(db, config.sessionSecret, token) : undefined;
  if (!user) throw AppError.unauthorized("Your session is missing or has expired. Sign in again.");
  req.user = user;
  next();
};

export const requireAdmin: RequestHandler = (req, _res, next) => {
  if (!currentUser(req).isAdmin) throw AppError.forbidden("Only an administrator can do this.");
  next();
};

/**
 * Route guard: lets the request through when the signed-in user holds one of `roles` in the project named by
 * `projectIdFrom(req)` (or is an administrator), and records the role in `req.projectRole`. Use after requireAuth.
 */
export function requireRole(
  projectIdFrom: (req: Request) => string | number | undefined,
  roles: readonly ProjectRole[],
): RequestHandler {
  return async (req, _res, next) => {
    const projectId = parseProjectId(projectIdFrom(req));
    req.projectRole = await assertRole(appContext(req).db, currentUser(req), projectId, roles);
    next();
  };
}

/** The common case: the project id is the `:projectId` (or `:id`) URL parameter. */
export const fromParam =
  (name = "projectId") =>
  (req: Request): string | undefined => {
    const value = req.params[name];
    return Array.isArray(value) ? value[0] : value;
  };
