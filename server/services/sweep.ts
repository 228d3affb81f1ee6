import type { SweepResult } from "../../shared/schemas/result.js";
import type { StudyDocument } from "../../shared/schemas/study.js";
import type { Db } from "../db/client.js";
import { hasRoleInAnyProject } from "../db/queries/criteria.js";
import { AppError } from "../errors.js";
import { fileSlug } from "../lib/file-name.js";
import { bufferStream, type StepsTableSource } from "../lib/send-steps-table.js";
import type { SessionUser } from "./auth.js";
import { parseStudyOrThrow } from "./revisions.js";
import type { RunSweep } from "./sweep-compute.js";
import { sweepFailure } from "./sweep-pool-errors.js";

const SWEEP_ROLES = ["analyst", "reviewer"] as const;

/**
 * The study document of an ad-hoc sweep, for administrators and members holding the analyst or reviewer role in
 * some project (viewers get 403). An invalid document is a 400 whose details list each bad value's JSON path and
 * the rule it broke (`parseStudyOrThrow`, the same 400 as saving a revision; the same messages as the CLI).
 */
async function sweepableStudy(db: Db, user: SessionUser, body: unknown): Promise<StudyDocument> {
  if (!user.isAdmin && !(await hasRoleInAnyProject(db, user.id, SWEEP_ROLES))) {
    throw AppError.forbidden("Running a sweep needs the role analyst or reviewer on a project.");
  }
  return parseStudyOrThrow(body);
}

/**
 * Runs the stability sweep of a study document sent by the caller (nothing is stored). The sweep runs in the
 * worker pool (`sweep-pool.ts`); the answer is the thinned result (`sampling` says how many steps were solved
 * and shown). Pool errors pass through (429 `busy`, 422 `sweep_timeout`); past the limit on solved speeds it is a
 * 422 `sweep_too_large` naming `$.sweep.step`, another engine error a 422 `sweep_failed`.
 */
export async function sweepStudy(db: Db, sweeps: RunSweep, user: SessionUser, body: unknown): Promise<SweepResult> {
  const study = await sweepableStudy(db, user, body);
  try {
    return (await sweeps(study, { table: false })).result;
  } catch (err) {
    throw sweepFailure(err);
  }
}

/** The same sweep's full step table — every solved step of every branch — for a CSV or JSON download. */
export async function sweepStudyTable(db: Db, sweeps: RunSweep, user: SessionUser, body: unknown): Promise<StepsTableSource> {
  const study = await sweepableStudy(db, user, body);
  let computed;
  try {
    computed = await sweeps(study, { table: true });
  } catch (err) {
    throw sweepFailure(err);
  }
  const table = computed.table!;
  return {
    open: () => bufferStream(table.gzip),
    gzipped: true,
    branchIds: table.branchIds,
    engine: computed.result.engine,
    fileStem: `${fileSlug(study.name)}-steps`,
  };
}
