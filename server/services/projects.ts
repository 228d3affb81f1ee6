import type { ProjectDto, ProjectMember, ProjectPatch } from "../../shared/schemas/projects.js";
import type { Db } from "../db/client.js";
import { writeAudit } from "../db/queries/audit.js";
import {
  findProjectById,
  listAllProjects,
  listProjectMembers,
  listProjectsOfMember,
  updateProjectTexts,
  type ProjectWithRole,
} from "../db/queries/projects.js";
import { AppError } from "../errors.js";
import { ANY_ROLE, assertRole } from "../middleware/auth.js";
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
