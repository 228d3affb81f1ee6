/**
 * Project membership, managed by administrators: add a user with a role, change the role, remove them.
 * Each change is audited on the project (`membership.set`, `membership.remove`) with the user and the roles.
 */
import type { MemberRoleInput, ProjectMember } from "../../shared/schemas/projects.js";
import type { Db } from "../db/client.js";
import { writeAudit } from "../db/queries/audit.js";
import { deleteMembership, findMember, upsertMembership } from "../db/queries/memberships.js";
import { lockProject } from "../db/queries/projects.js";
import { findUserById } from "../db/queries/users.js";
import { AppError } from "../errors.js";
import type { SessionUser } from "./auth.js";
import { assertAdmin } from "./projects.js";

/** Adds the user to the project or changes their role. `created` tells a new membership from a change. */
export async function setMember(
  db: Db,
  actor: SessionUser,
  params: { projectId: number; userId: number; input: MemberRoleInput; ip?: string },
): Promise<{ member: ProjectMember; created: boolean }> {
  assertAdmin(actor);
  const { projectId, userId, input, ip } = params;
  return db.transaction(async (tx) => {
    if (!(await lockProject(tx, projectId))) throw AppError.notFound("Project");
    if (!(await findUserById(tx, userId))) throw AppError.notFound("User");
    const { previousRole } = await upsertMembership(tx, { projectId, userId, role: input.role });
    if (previousRole !== input.role) {
      await writeAudit(tx, {
        actorId: actor.id,
        action: "membership.set",
        objectType: "project",
        objectId: projectId,
        ip,
        details: { userId: String(userId), role: input.role, previousRole: previousRole ?? null },
      });
    }
    const member = await findMember(tx, { projectId, userId });
    return { member: { ...member!, userId: String(member!.userId) }, created: previousRole === undefined };
  });
}

/** Removes the user from the project; 404 when they were not a member. */
export async function removeMember(
  db: Db,
  actor: SessionUser,
  params: { projectId: number; userId: number; ip?: string },
): Promise<void> {
  assertAdmin(actor);
  const { projectId, userId, ip } = params;
  await db.transaction(async (tx) => {
    if (!(await lockProject(tx, projectId))) throw AppError.notFound("Project");
    const previousRole = await deleteMembership(tx, { projectId, userId });
    if (previousRole === undefined) throw AppError.notFound("Membership");
    await writeAudit(tx, {
      actorId: actor.id,
      action: "membership.remove",
      objectType: "project",
      objectId: projectId,
      ip,
      details: { userId: String(userId), previousRole },
    });
  });
}
