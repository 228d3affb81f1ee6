/**
 * Who may do what in a project, for services and the route guards alike (`requireRole` in server/middleware/auth.ts
 * calls `assertRole`). Administrators pass every role check. Analysts (and administrators) write alternatives, data
 * sets, studies and revisions, reviewers read them, viewers and non-members get 403. An object is looked up first
 * (404 when it does not exist), then the caller's role in its project is checked — the same order as for projects.
 */
import type { ProjectRole } from "../../shared/schemas/auth.js";
import type { DbOrTx } from "../db/client.js";
import { findMembershipRole, projectExists } from "../db/queries/projects.js";
import { AppError } from "../errors.js";
import type { SessionUser } from "./auth.js";

export const READ_ROLES: readonly ProjectRole[] = ["analyst", "reviewer"];
export const WRITE_ROLES: readonly ProjectRole[] = ["analyst"];
/** Every project role: for what any member may do. */
export const ANY_ROLE: readonly ProjectRole[] = ["analyst", "reviewer", "viewer"];

export type Access = "read" | "write";

/**
 * The one parser of object ids from URLs and bodies (a decimal string or a number; the first value of a repeated
 * parameter). Anything but a positive integer is an object that does not exist: 404 "<what> not found.".
 */
export function parseObjectId(raw: unknown, what: string): number {
  const value: unknown = Array.isArray(raw) ? raw[0] : raw;
  const id =
    typeof value === "number" ? value : typeof value === "string" && /^\d{1,9}$/.test(value) ? Number(value) : NaN;
  if (!Number.isSafeInteger(id) || id <= 0) throw AppError.notFound(what);
  return id;
}

/** A project id (see `parseObjectId`). */
export const parseProjectId = (raw: unknown): number => parseObjectId(raw, "Project");

/**
 * The caller's role in the project when it is one of `roles`.
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

/** The object (404 when missing) once the caller's role in its project allows `access` (403 otherwise). */
export async function loadWithAccess<T extends { projectId: number }>(
  db: DbOrTx,
  user: SessionUser,
  what: string,
  find: () => Promise<T | undefined>,
  access: Access,
): Promise<T> {
  const row = await find();
  if (!row) throw AppError.notFound(what);
  await assertRole(db, user, row.projectId, access === "write" ? WRITE_ROLES : READ_ROLES);
  return row;
}

export const person = (id: number | null, name: string | null) =>
  id === null ? null : { id: String(id), name: name ?? "" };
