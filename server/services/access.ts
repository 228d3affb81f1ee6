/**
 * Who may touch alternatives, data sets, studies and revisions: analysts (and administrators) write,
 * reviewers read, viewers and non-members get 403. An object is looked up first (404 when it does not exist),
 * then the caller's role in its project is checked — the same order as for projects.
 */
import type { ProjectRole } from "../../shared/schemas/auth.js";
import type { DbOrTx } from "../db/client.js";
import { AppError } from "../errors.js";
import { assertRole } from "../middleware/auth.js";
import type { SessionUser } from "./auth.js";

export const READ_ROLES: readonly ProjectRole[] = ["analyst", "reviewer"];
export const WRITE_ROLES: readonly ProjectRole[] = ["analyst"];

export type Access = "read" | "write";

/** An id from the URL; anything but a positive integer is an object that does not exist. */
export function parseObjectId(raw: string | string[] | undefined, what: string): number {
  const text = Array.isArray(raw) ? raw[0] : raw;
  const id = /^\d{1,9}$/.test(text ?? "") ? Number(text) : NaN;
  if (!Number.isSafeInteger(id) || id <= 0) throw AppError.notFound(what);
  return id;
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
