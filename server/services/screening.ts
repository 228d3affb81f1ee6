import { screenStudy, type ScreeningResult } from "../../shared/criteria/screen-study.js";
import type { ScreeningRequest } from "../../shared/schemas/criteria.js";
import type { Db } from "../db/client.js";
import { findCurrentCriteria, hasRoleInAnyProject } from "../db/queries/criteria.js";
import { AppError } from "../errors.js";
import { assertRole, parseProjectId } from "./access.js";
import type { SessionUser } from "./auth.js";

const SCREENING_ROLES = ["analyst", "reviewer"] as const;

/**
 * Screens a study for vortex shedding, galloping and divergence (analysts, reviewers, administrators).
 * With `projectId` the caller must hold one of those roles there, and the project's current criteria apply
 * unless the request carries its own; without it, the caller must hold one of them in some project.
 */
export async function screen(db: Db, user: SessionUser, request: ScreeningRequest): Promise<ScreeningResult> {
  let criteria = request.criteria;
  if (request.projectId !== undefined) {
    const projectId = parseProjectId(request.projectId);
    await assertRole(db, user, projectId, SCREENING_ROLES);
    criteria ??= (await findCurrentCriteria(db, projectId))?.criteria;
  } else if (!user.isAdmin && !(await hasRoleInAnyProject(db, user.id, SCREENING_ROLES))) {
    throw AppError.forbidden("Screening needs the role analyst or reviewer on a project.");
  }
  try {
    return screenStudy(request.study, criteria, request.options);
  } catch (err) {
    if (err instanceof RangeError) throw AppError.badRequest(`The study cannot be screened: ${err.message}`);
    throw err;
  }
}
