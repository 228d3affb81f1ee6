import { and, eq } from "drizzle-orm";
import type { DbOrTx } from "../client.js";
import { memberships, users, type ProjectRole } from "../schema/index.js";

/**
 * Adds the user to the project with `role`, or changes their role. Returns the role they had before
 * (undefined when they were not a member). The row is locked first so two admins changing it at once serialise.
 */
export async function upsertMembership(
  db: DbOrTx,
  params: { projectId: number; userId: number; role: ProjectRole },
): Promise<{ previousRole: ProjectRole | undefined }> {
  const [existing] = await db
    .select({ id: memberships.id, role: memberships.role })
    .from(memberships)
    .where(and(eq(memberships.projectId, params.projectId), eq(memberships.userId, params.userId)))
    .for("update")
    .limit(1);
  if (existing) {
    if (existing.role !== params.role) {
      await db.update(memberships).set({ role: params.role }).where(eq(memberships.id, existing.id));
    }
    return { previousRole: existing.role };
  }
  await db
    .insert(memberships)
    .values(params)
    .onConflictDoUpdate({ target: [memberships.userId, memberships.projectId], set: { role: params.role } });
  return { previousRole: undefined };
}

/** Removes the membership; returns the role it had, or undefined when there was none. */
export async function deleteMembership(
  db: DbOrTx,
  params: { projectId: number; userId: number },
): Promise<ProjectRole | undefined> {
  const [row] = await db
    .delete(memberships)
    .where(and(eq(memberships.projectId, params.projectId), eq(memberships.userId, params.userId)))
    .returning({ role: memberships.role });
  return row?.role;
}

/** One member of a project with their account's name and e-mail. */
export async function findMember(db: DbOrTx, params: { projectId: number; userId: number }) {
  const [row] = await db
    .select({ userId: users.id, name: users.name, email: users.email, role: memberships.role })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(and(eq(memberships.projectId, params.projectId), eq(memberships.userId, params.userId)))
    .limit(1);
  return row;
}
