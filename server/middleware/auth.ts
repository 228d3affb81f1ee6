/**
 * Access control. `requireAuth` turns the session cookie into `req.user` (401 otherwise); `requireAdmin` and
 * `requireRole` guard routes; `assertRole` is the same rule for services. Administrators pass every role check.
 * The client hides what a role cannot do; these guards are what actually enforces it.
 */
import type { Request, RequestHandler } from "express";
import type { ProjectRole } from "../../shared/schemas/auth.js";
import { appContext } from "../app-context.js";
import type { DbOrTx } from "../db/client.js";
import { findMembershipRole, projectExists } from "../db/queries/projects.js";
import { AppError } from "../errors.js";
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

/** Parses a project id from the URL; anything but a positive integer is a project that does not exist. */
export function parseProjectId(raw: string | number | undefined): number {
  const id = typeof raw === "number" ? raw : /^\d{1,9}$/.test(raw ?? "") ? Number(raw) : NaN;
  if (!Number.isSafeInteger(id) || id <= 0) throw AppError.notFound("Project");
  return id;
}

/**
 * Service-level guard: the caller's role in the project when it is one of `roles`.
 * 404 when the project does not exist, 403 when the caller is not a member or has another role.
 * Administrators pass; their role is null unless they are also members.
 */
export async function assertRole(
  db: DbOrTx,
  user: SessionUser,
  projectId: number,
  roles: readonly ProjectRole[],
): Promise<ProjectRole | null> {
  const role = await findMembershipRole(db, user.id, projectId);
  if (role === undefined && !(await projectExists(db, projectId))) throw AppError.notFound("Project");
  if (user.isAdmin) return role ?? null;
  if (role === undefined) throw AppError.forbidden("You are not a member of this project.");
  if (!roles.includes(role)) {
    throw AppError.forbidden(`This needs the role ${roles.join(" or ")} on this project; yours is ${role}.`);
  }
  return role;
}

/** Every project role: for routes any member may use. */
export const ANY_ROLE: readonly ProjectRole[] = ["analyst", "reviewer", "viewer"];

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
