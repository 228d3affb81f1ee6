/**
 * Account administration: the list of accounts with their memberships, renaming, and the administrator flag.
 * An administrator cannot take away their own flag (409), so the product always keeps at least one.
 */
import type { AdminUser, UserPatch } from "../../shared/schemas/users.js";
import type { Db } from "../db/client.js";
import { writeAudit } from "../db/queries/audit.js";
import { listAllUsers, listMembershipsWithProject, lockUser, updateUserFields } from "../db/queries/users.js";
import type { User } from "../db/schema/index.js";
import { AppError } from "../errors.js";
import type { SessionUser } from "./auth.js";
import { assertAdmin } from "./projects.js";

function toAdminUser(user: User, memberships: AdminUser["memberships"]): AdminUser {
  return {
    id: String(user.id),
    email: user.email,
    name: user.name,
    isAdmin: user.isAdmin,
    createdAt: user.createdAt.toISOString(),
    memberships,
  };
}

export async function listUsers(db: Db, actor: SessionUser): Promise<AdminUser[]> {
  assertAdmin(actor);
  const [users, memberships] = await Promise.all([listAllUsers(db), listMembershipsWithProject(db)]);
  const byUser = new Map<number, AdminUser["memberships"]>();
  for (const m of memberships) {
    const list = byUser.get(m.userId) ?? [];
    list.push({ projectId: String(m.projectId), projectName: m.projectName, role: m.role });
    byUser.set(m.userId, list);
  }
  return users.map((u) => toAdminUser(u, byUser.get(u.id) ?? []));
}

/** Renames an account or sets its administrator flag; audited as `user.update` with the changed fields. */
export async function updateUser(
  db: Db,
  actor: SessionUser,
  params: { userId: number; patch: UserPatch; ip?: string },
): Promise<AdminUser> {
  assertAdmin(actor);
  const { userId, patch, ip } = params;
  if (userId === actor.id && patch.isAdmin === false) {
    throw AppError.conflict(
      "You cannot remove your own administrator flag. Ask another administrator to do it, so one always remains.",
    );
  }
  return db.transaction(async (tx) => {
    const before = await lockUser(tx, userId);
    if (!before) throw AppError.notFound("User");
    const changes: Record<string, { from: unknown; to: unknown }> = {};
    if (patch.name !== undefined && patch.name !== before.name) changes.name = { from: before.name, to: patch.name };
    if (patch.isAdmin !== undefined && patch.isAdmin !== before.isAdmin) {
      changes.isAdmin = { from: before.isAdmin, to: patch.isAdmin };
    }
    const after = Object.keys(changes).length ? await updateUserFields(tx, userId, patch) : before;
    if (Object.keys(changes).length) {
      await writeAudit(tx, { actorId: actor.id, action: "user.update", objectType: "user", objectId: userId, ip, details: changes });
    }
    const memberships = await listMembershipsWithProject(tx, userId);
    return toAdminUser(
      after!,
      memberships.map((m) => ({ projectId: String(m.projectId), projectName: m.projectName, role: m.role })),
    );
  });
}
