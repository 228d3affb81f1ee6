import type { SweepResult } from "../../shared/schemas/result.js";
import { parseStudy } from "../../shared/schemas/study.js";
import type { Db } from "../db/client.js";
import { hasRoleInAnyProject } from "../db/queries/criteria.js";
import { AppError } from "../errors.js";
import type { SessionUser } from "./auth.js";
import { runSweepInPool } from "./sweep-pool.js";

const SWEEP_ROLES = ["analyst", "reviewer"] as const;

/**
 * Runs the stability sweep of a study document sent by the caller (administrators, and members holding the
 * analyst or reviewer role in some project; viewers get 403). An invalid document is a 400 whose details list
 * each bad value's JSON path and the rule it broke — the same messages as the CLI. The sweep runs in the worker pool
 * (`sweep-pool.ts`): a sweep over the time limit is a 422 `sweep_timeout`, an engine error a 422 `sweep_failed`.
 */
export async function sweepStudy(db: Db, user: SessionUser, body: unknown): Promise<SweepResult> {
  if (!user.isAdmin && !(await hasRoleInAnyProject(db, user.id, SWEEP_ROLES))) {
    throw AppError.forbidden("Running a sweep needs the role analyst or reviewer on a project.");
  }
  const parsed = parseStudy(body);
  if (!parsed.ok) {
    const summary = parsed.issues.map((i) => `${i.path}: ${i.message}`).join("; ");
    throw new AppError(400, "invalid_study", `The study is not valid — ${summary}`, { details: parsed.issues });
  }
  try {
    return await runSweepInPool(parsed.study);
  } catch (err) {
    if (err instanceof AppError) throw err;
    const message = err instanceof Error ? err.message : String(err);
    throw new AppError(422, "sweep_failed", `The sweep could not be computed: ${message}.`, { cause: err });
  }
}
