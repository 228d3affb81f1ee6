import type { SweepResult } from "../../shared/schemas/result.js";
import type { Db } from "../db/client.js";
import { hasRoleInAnyProject } from "../db/queries/criteria.js";
import { AppError } from "../errors.js";
import type { SessionUser } from "./auth.js";
import { parseStudyOrThrow } from "./revisions.js";
import { runSweepInPool } from "./sweep-pool.js";

const SWEEP_ROLES = ["analyst", "reviewer"] as const;

/**
 * Runs the stability sweep of a study document sent by the caller (administrators, and members holding the
 * analyst or reviewer role in some project; viewers get 403). An invalid document is a 400 whose details list
 * each bad value's JSON path and the rule it broke (`parseStudyOrThrow`, the same 400 as saving a revision; the
 * same messages as the CLI). The sweep runs in the worker pool
 * (`sweep-pool.ts`): a sweep over the time limit is a 422 `sweep_timeout`, an engine error a 422 `sweep_failed`.
 */
export async function sweepStudy(db: Db, user: SessionUser, body: unknown): Promise<SweepResult> {
  if (!user.isAdmin && !(await hasRoleInAnyProject(db, user.id, SWEEP_ROLES))) {
    throw AppError.forbidden("Running a sweep needs the role analyst or reviewer on a project.");
  }
  const study = parseStudyOrThrow(body);
  try {
    return await runSweepInPool(study);
  } catch (err) {
    if (err instanceof AppError) throw err;
    const message = err instanceof Error ? err.message : String(err);
    throw new AppError(422, "sweep_failed", `The sweep could not be computed: ${message}.`, { cause: err });
  }
}
