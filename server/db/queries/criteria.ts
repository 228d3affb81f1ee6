import { and, desc, eq, inArray } from "drizzle-orm";
import type { BasisConfirmations, ProjectCriteria } from "../../../shared/schemas/criteria.js";
import type { ProjectRole } from "../../../shared/schemas/auth.js";
import type { DbOrTx } from "../client.js";
import { memberships, projectCriteria, users } from "../schema/index.js";

export interface CriteriaVersionRow {
  version: number;
  criteria: ProjectCriteria;
  basisConfirmations: BasisConfirmations;
  createdAt: Date;
  createdById: number | null;
  createdByName: string | null;
}

const versionColumns = {
  version: projectCriteria.version,
  criteria: projectCriteria.criteria,
  basisConfirmations: projectCriteria.basisConfirmations,
  createdAt: projectCriteria.createdAt,
  createdById: projectCriteria.createdBy,
  createdByName: users.name,
};

/** The project's current (highest) criteria version, or undefined when none was saved. */
export async function findCurrentCriteria(db: DbOrTx, projectId: number): Promise<CriteriaVersionRow | undefined> {
  const [row] = await db
    .select(versionColumns)
    .from(projectCriteria)
    .leftJoin(users, eq(users.id, projectCriteria.createdBy))
    .where(eq(projectCriteria.projectId, projectId))
    .orderBy(desc(projectCriteria.version))
    .limit(1);
  return row;
}

/** Every saved version of the project's criteria, newest first. */
export async function listCriteriaVersions(db: DbOrTx, projectId: number): Promise<CriteriaVersionRow[]> {
  return db
    .select(versionColumns)
    .from(projectCriteria)
    .leftJoin(users, eq(users.id, projectCriteria.createdBy))
    .where(eq(projectCriteria.projectId, projectId))
    .orderBy(desc(projectCriteria.version));
}

/** Appends a version; the unique (project, version) key rejects a concurrent save of the same version. */
export async function insertCriteriaVersion(
  db: DbOrTx,
  params: { projectId: number; version: number; criteria: ProjectCriteria; basisConfirmations: BasisConfirmations; createdBy: number | null },
): Promise<void> {
  await db.insert(projectCriteria).values(params);
}

/** True when the user holds one of `roles` in at least one project. */
export async function hasRoleInAnyProject(db: DbOrTx, userId: number, roles: readonly ProjectRole[]): Promise<boolean> {
  const [row] = await db
    .select({ id: memberships.id })
    .from(memberships)
    .where(and(eq(memberships.userId, userId), inArray(memberships.role, [...roles])))
    .limit(1);
  return row !== undefined;
}
