import { basisStatuses, nextConfirmations } from "../../shared/criteria/basis-confirmation.js";
import { evaluateCriteria } from "../../shared/criteria/evaluate-criteria.js";
import { DEFAULT_REQUIREMENTS } from "../../shared/criteria/default-requirements.js";
import type {
  ProjectCriteria,
  ProjectCriteriaDto,
  ProjectCriteriaVersionDto,
  PutCriteriaBody,
} from "../../shared/schemas/criteria.js";
import type { Db, DbOrTx } from "../db/client.js";
import { isUniqueViolation } from "../db/pg-errors.js";
import { writeAudit } from "../db/queries/audit.js";
import {
  findCurrentCriteria,
  insertCriteriaVersion,
  listCriteriaVersions,
  type CriteriaVersionRow,
} from "../db/queries/criteria.js";
import { AppError } from "../errors.js";
import { ANY_ROLE, assertRole } from "./access.js";
import type { SessionUser } from "./auth.js";

const savedBy = (row: CriteriaVersionRow) =>
  row.createdById === null ? null : { id: String(row.createdById), name: row.createdByName ?? "" };

/** v_m and the required speeds of saved criteria; a RangeError of the formulas becomes a 400 naming the input. */
export function evaluateOrReject(criteria: ProjectCriteria) {
  try {
    return evaluateCriteria(criteria);
  } catch (err) {
    if (err instanceof RangeError) throw AppError.badRequest(`The design wind cannot be evaluated: ${err.message}`);
    throw err;
  }
}

function toDto(projectId: number, row: CriteriaVersionRow | undefined): ProjectCriteriaDto {
  return {
    projectId: String(projectId),
    version: row?.version ?? null,
    criteria: row?.criteria ?? null,
    evaluated: row ? evaluateOrReject(row.criteria) : null,
    savedAt: row?.createdAt.toISOString() ?? null,
    savedBy: row ? savedBy(row) : null,
    bases: row ? basisStatuses(row.criteria, row.basisConfirmations) : null,
    defaults: DEFAULT_REQUIREMENTS,
  };
}

/** The project's current criteria with v_m at deck level and the required speeds; any member reads them. */
export async function getProjectCriteria(db: Db, user: SessionUser, projectId: number): Promise<ProjectCriteriaDto> {
  await assertRole(db, user, projectId, ANY_ROLE);
  return toDto(projectId, await findCurrentCriteria(db, projectId));
}

/** Every saved version, newest first; any member reads them. */
export async function getProjectCriteriaHistory(
  db: Db,
  user: SessionUser,
  projectId: number,
): Promise<ProjectCriteriaVersionDto[]> {
  await assertRole(db, user, projectId, ANY_ROLE);
  const rows = await listCriteriaVersions(db, projectId);
  return rows.map((row) => ({
    version: row.version,
    savedAt: row.createdAt.toISOString(),
    savedBy: savedBy(row),
    criteria: row.criteria,
    bases: basisStatuses(row.criteria, row.basisConfirmations),
  }));
}

/**
 * Who owns a project's criteria: its reviewers (the engineers who sign against them) and administrators — not the
 * analysts whose work is checked against them.
 */
export const CRITERIA_OWNER_ROLES = ["reviewer"] as const;

/**
 * Saves a new version of the project's criteria (reviewers and administrators), audited in the same transaction,
 * with the record of who confirmed or wrote each requirement's basis (shared/criteria/basis-confirmation.ts). 409
 * when `baseVersion` is given and another version was saved since, or when a concurrent save took the same
 * version number.
 */
export async function saveProjectCriteria(
  db: DbOrTx,
  user: SessionUser,
  projectId: number,
  body: PutCriteriaBody,
  ip?: string,
): Promise<ProjectCriteriaDto> {
  await assertRole(db, user, projectId, CRITERIA_OWNER_ROLES);
  const evaluated = evaluateOrReject(body.criteria);
  try {
    return await db.transaction(async (tx) => {
      const current = await findCurrentCriteria(tx, projectId);
      const currentVersion = current?.version ?? null;
      if (body.baseVersion !== undefined && body.baseVersion !== currentVersion) {
        throw AppError.conflict(
          `The criteria were changed since you opened them (your version ${body.baseVersion ?? "none"}, now ${currentVersion ?? "none"}). Reload and apply your edit again.`,
          { currentVersion },
        );
      }
      const version = (currentVersion ?? 0) + 1;
      const confirmBases = body.confirmBases ?? [];
      const basisConfirmations = nextConfirmations(
        current && { criteria: current.criteria, confirmations: current.basisConfirmations },
        body.criteria,
        confirmBases,
        { id: String(user.id), name: user.name },
        new Date().toISOString(),
        version,
      );
      await insertCriteriaVersion(tx, { projectId, version, criteria: body.criteria, basisConfirmations, createdBy: user.id });
      await writeAudit(tx, {
        actorId: user.id,
        action: "criteria.update",
        objectType: "project",
        objectId: projectId,
        ip,
        details: {
          version,
          confirmedBases: confirmBases,
          meanSpeedMps: evaluated.designWind.meanSpeedMps,
          requiredSpeedsMps: Object.fromEntries(
            Object.entries(evaluated.required).map(([phenomenon, r]) => [phenomenon, r.requiredSpeedMps]),
          ),
        },
      });
      return toDto(projectId, await findCurrentCriteria(tx, projectId));
    });
  } catch (err) {
    if (isUniqueViolation(err)) {
      throw AppError.conflict("Another version of the criteria was saved at the same moment. Reload and apply your edit again.");
    }
    throw err;
  }
}
