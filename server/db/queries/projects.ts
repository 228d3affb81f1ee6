import { and, asc, countDistinct, eq, isNotNull } from "drizzle-orm";
import type { DbOrTx } from "../client.js";
import {
  aeroDatasets,
  alternatives,
  memberships,
  projects,
  studies,
  users,
  type NewProject,
  type Project,
  type ProjectRole,
} from "../schema/index.js";

export type ProjectWithRole = Project & { role: ProjectRole | null };

const projectWithRoleColumns = {
  id: projects.id,
  name: projects.name,
  description: projects.description,
  siteNotes: projects.siteNotes,
  createdBy: projects.createdBy,
  createdAt: projects.createdAt,
  updatedAt: projects.updatedAt,
  role: memberships.role,
};

/** Projects joined to the user's own membership row (left join: the role is null where they are not a member). */
function selectWithRole(db: DbOrTx, userId: number) {
  return db
    .select(projectWithRoleColumns)
    .from(projects)
    .leftJoin(memberships, and(eq(memberships.projectId, projects.id), eq(memberships.userId, userId)));
}

/** Projects the user is a member of, with their role, by name. */
export async function listProjectsOfMember(db: DbOrTx, userId: number): Promise<ProjectWithRole[]> {
  return selectWithRole(db, userId).where(isNotNull(memberships.id)).orderBy(asc(projects.name), asc(projects.id));
}

/** Every project, with the user's role where they are a member (administrators). */
export async function listAllProjects(db: DbOrTx, userId: number): Promise<ProjectWithRole[]> {
  return selectWithRole(db, userId).orderBy(asc(projects.name), asc(projects.id));
}

export async function findProjectById(db: DbOrTx, projectId: number, userId: number): Promise<ProjectWithRole | undefined> {
  const [row] = await selectWithRole(db, userId).where(eq(projects.id, projectId)).limit(1);
  return row;
}

export async function projectExists(db: DbOrTx, projectId: number): Promise<boolean> {
  const [row] = await db.select({ id: projects.id }).from(projects).where(eq(projects.id, projectId)).limit(1);
  return row !== undefined;
}

export async function findMembershipRole(db: DbOrTx, userId: number, projectId: number): Promise<ProjectRole | undefined> {
  const [row] = await db
    .select({ role: memberships.role })
    .from(memberships)
    .where(and(eq(memberships.userId, userId), eq(memberships.projectId, projectId)))
    .limit(1);
  return row?.role;
}

export async function updateProjectTexts(
  db: DbOrTx,
  projectId: number,
  patch: Partial<Pick<Project, "name" | "description" | "siteNotes">>,
): Promise<Project | undefined> {
  const [row] = await db
    .update(projects)
    .set({ ...patch, updatedAt: new Date() })
    .where(eq(projects.id, projectId))
    .returning();
  return row;
}

export async function listProjectMembers(db: DbOrTx, projectId: number) {
  return db
    .select({ userId: users.id, name: users.name, email: users.email, role: memberships.role })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(eq(memberships.projectId, projectId))
    .orderBy(asc(memberships.role), asc(users.name));
}

export async function insertProject(db: DbOrTx, project: NewProject): Promise<Project> {
  const [row] = await db.insert(projects).values(project).returning();
  return row;
}

/** Locks the project row until the transaction ends (so no alternative can be added while it is deleted). */
export async function lockProject(db: DbOrTx, projectId: number): Promise<Project | undefined> {
  const [row] = await db.select().from(projects).where(eq(projects.id, projectId)).for("update").limit(1);
  return row;
}

/** How many alternatives, studies and data sets hang on the project. */
export async function countProjectContent(
  db: DbOrTx,
  projectId: number,
): Promise<{ alternatives: number; studies: number; datasets: number }> {
  const [row] = await db
    .select({
      alternatives: countDistinct(alternatives.id),
      studies: countDistinct(studies.id),
      datasets: countDistinct(aeroDatasets.id),
    })
    .from(alternatives)
    .leftJoin(studies, eq(studies.alternativeId, alternatives.id))
    .leftJoin(aeroDatasets, eq(aeroDatasets.alternativeId, alternatives.id))
    .where(eq(alternatives.projectId, projectId));
  return row ?? { alternatives: 0, studies: 0, datasets: 0 };
}

/** Deletes the project row; memberships, criteria and invitations go with it (cascade). */
export async function deleteProjectRow(db: DbOrTx, projectId: number): Promise<boolean> {
  const rows = await db.delete(projects).where(eq(projects.id, projectId)).returning({ id: projects.id });
  return rows.length > 0;
}
