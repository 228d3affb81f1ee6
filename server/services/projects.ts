import type { ProjectCreateInput, ProjectDto, ProjectMember, ProjectPatch } from "../../shared/schemas/projects.js";
import type { Db } from "../db/client.js";
import { writeAudit } from "../db/queries/audit.js";
import {
  countProjectContent,
  deleteProjectRow,
  findProjectById,
  insertProject,
  listAllProjects,
  listProjectMembers,
  listProjectsOfMember,
  lockProject,
  updateProjectTexts,
  type ProjectWithRole,
} from "../db/queries/projects.js";
import { AppError } from "../errors.js";
import { ANY_ROLE, assertRole } from "./access.js";
import type { SessionUser } from "./auth.js";

export function toProjectDto(p: ProjectWithRole): ProjectDto {
  return {
    id: String(p.id),
    name: p.name,
    description: p.description,
    siteNotes: p.siteNotes,
    role: p.role ?? null,
    createdAt: p.createdAt.toISOString(),
    updatedAt: p.updatedAt.toISOString(),
  };
}

/** The caller's projects; an administrator sees all of them. */
export async function listProjects(db: Db, user: SessionUser): Promise<ProjectDto[]> {
  const rows = user.isAdmin ? await listAllProjects(db, user.id) : await listProjectsOfMember(db, user.id);
  return rows.map(toProjectDto);
}

/** One project, for its members (any role) and administrators. */
export async function getProject(db: Db, user: SessionUser, projectId: number): Promise<ProjectDto> {
  await assertRole(db, user, projectId, ANY_ROLE);
  const row = await findProjectById(db, projectId, user.id);
  if (!row) throw AppError.notFound("Project");
  return toProjectDto(row);
}

/** Analysts (and administrators) edit the project's name, description and site notes; audited. */
export async function updateProject(
  db: Db,
  user: SessionUser,
  projectId: number,
  patch: ProjectPatch,
  ip?: string,
): Promise<ProjectDto> {
  await assertRole(db, user, projectId, ["analyst"]);
  return db.transaction(async (tx) => {
    const updated = await updateProjectTexts(tx, projectId, patch);
    if (!updated) throw AppError.notFound("Project");
    await writeAudit(tx, {
      actorId: user.id,
      action: "project.update",
      objectType: "project",
      objectId: projectId,
      ip,
      details: { fields: Object.keys(patch) },
    });
    const row = await findProjectById(tx, projectId, user.id);
    return toProjectDto(row!);
  });
}

export async function getProjectMembers(db: Db, user: SessionUser, projectId: number): Promise<ProjectMember[]> {
  await assertRole(db, user, projectId, ANY_ROLE);
  const rows = await listProjectMembers(db, projectId);
  return rows.map((m) => ({ ...m, userId: String(m.userId) }));
}

const FOREIGN_KEY_VIOLATION = "23503";
const count = (n: number, one: string, many = `${one}s`) => `${n} ${n === 1 ? one : many}`;
const pgCode = (err: unknown): string | undefined =>
  (err as { code?: string }).code ?? (err as { cause?: { code?: string } }).cause?.code;

/** Administrators only; the services repeat the route guard so no other caller can skip it. */
export function assertAdmin(user: SessionUser): void {
  if (!user.isAdmin) throw AppError.forbidden("Only an administrator can do this.");
}

/** An administrator creates a project (with no members yet); audited as `project.create`. */
export async function createProject(
  db: Db,
  user: SessionUser,
  input: ProjectCreateInput,
  ip?: string,
): Promise<ProjectDto> {
  assertAdmin(user);
  return db.transaction(async (tx) => {
    const project = await insertProject(tx, {
      name: input.name,
      description: input.description ?? "",
      siteNotes: input.siteNotes ?? "",
      createdBy: user.id,
    });
    await writeAudit(tx, {
      actorId: user.id,
      action: "project.create",
      objectType: "project",
      objectId: project.id,
      ip,
      details: { name: project.name },
    });
    return toProjectDto({ ...project, role: null });
  });
}

/**
 * An administrator deletes a project that holds no work yet. A project with deck alternatives (and so perhaps
 * studies, whose revisions are kept for good) is refused with 409 and the counts. Memberships, criteria and
 * pending invitations go with the project. Audited as `project.delete`.
 */
export async function deleteProject(db: Db, user: SessionUser, projectId: number, ip?: string): Promise<void> {
  assertAdmin(user);
  await db.transaction(async (tx) => {
    // The lock keeps an alternative from being added between the count and the delete.
    const project = await lockProject(tx, projectId);
    if (!project) throw AppError.notFound("Project");
    const content = await countProjectContent(tx, projectId);
    if (content.alternatives > 0) {
      throw AppError.conflict(
        `"${project.name}" holds ${count(content.alternatives, "deck alternative")}, ${count(content.studies, "study", "studies")} ` +
          `and ${count(content.datasets, "data set")}; a project with work in it cannot be deleted (study revisions are kept for good).`,
        content,
      );
    }
    try {
      await deleteProjectRow(tx, projectId);
    } catch (err) {
      // Anything else that keeps a restricting reference to the project (a later table) refuses the same way.
      if (pgCode(err) === FOREIGN_KEY_VIOLATION) {
        throw AppError.conflict(`"${project.name}" is still referred to by other records and cannot be deleted.`, content);
      }
      throw err;
    }
    await writeAudit(tx, {
      actorId: user.id,
      action: "project.delete",
      objectType: "project",
      objectId: projectId,
      ip,
      details: { name: project.name },
    });
  });
}
