import { diffJson } from "../../shared/diff-json.js";
import { ENGINE_VERSION } from "../../shared/engine/version.js";
import { clipValue } from "../../shared/message-bounds.js";
import type {
  RevisionDiffDto,
  RevisionDto,
  RevisionSummaryDto,
  StaleParentDetails,
} from "../../shared/schemas/revisions.js";
import { parseStudy, type StudyDocument } from "../../shared/schemas/study.js";
import { decodeUtf8Strict, describeUtf8Error } from "../../shared/utf8.js";
import type { DbOrTx } from "../db/client.js";
import { isUniqueViolation } from "../db/pg-errors.js";
import { writeAudit } from "../db/queries/audit.js";
import { insertRevisionTable } from "../db/queries/revision-tables.js";
import {
  findLatestRevision,
  findRevision,
  findRevisionSummary,
  insertRevision,
  listRevisions,
  type RevisionRow,
  type RevisionSummaryRow,
} from "../db/queries/revisions.js";
import { findStudy, lockStudy } from "../db/queries/studies.js";
import { AppError } from "../errors.js";
import { fileSlug } from "../lib/file-name.js";
import { canonicalSha256Hex } from "../lib/hash.js";
import { requireFile } from "../lib/uploads.js";
import { loadWithAccess, person } from "./access.js";
import { currentAssessment, currentAssessments, toAssessmentDto, type StoredAssessment } from "./assessments.js";
import type { SessionUser } from "./auth.js";
import type { ComputedSweep, RunSweep } from "./sweep-compute.js";
import { sweepFailure } from "./sweep-pool-errors.js";

/** A revision for a list, with its current assessment. */
export function toRevisionSummary(row: RevisionSummaryRow, assessment: StoredAssessment): RevisionSummaryDto {
  return {
    id: String(row.id),
    studyId: String(row.studyId),
    number: row.number,
    parentNumber: row.parentNumber,
    author: person(row.authorId, row.authorName),
    changeNote: row.changeNote,
    documentSha256: row.documentSha256,
    engineVersion: row.engineVersion,
    createdAt: row.createdAt.toISOString(),
    superseded: row.number < row.latestNumber,
    assessment: toAssessmentDto(assessment),
  };
}

/** Revision summaries with their current assessments (computed and stored first where there is none yet). */
export async function withAssessments(db: DbOrTx, rows: readonly RevisionSummaryRow[], actorId: number | null): Promise<RevisionSummaryDto[]> {
  const assessments = await currentAssessments(db, rows, actorId);
  return rows.map((row) => toRevisionSummary(row, assessments.get(row.id)!));
}

async function toRevisionDto(db: DbOrTx, row: RevisionRow, actorId: number | null): Promise<RevisionDto> {
  return {
    ...toRevisionSummary(row, await currentAssessment(db, row, actorId)),
    alternativeId: String(row.alternativeId),
    projectId: String(row.projectId),
    studyName: row.studyName,
    latestNumber: row.latestNumber,
    study: row.document,
    result: row.result,
  };
}

/** A study document from untrusted JSON, or 400 `invalid_study` listing each problem at its JSON path. */
export function parseStudyOrThrow(json: unknown, prefix = ""): StudyDocument {
  const parsed = parseStudy(json);
  if (parsed.ok) return parsed.study;
  const details = parsed.issues.map((i) => ({ path: i.path, message: i.message }));
  const shown = details.slice(0, 5).map((d) => `${d.path} ${d.message}`).join("; ");
  throw new AppError(
    400,
    "invalid_study",
    `${prefix}The study document is not valid (${details.length} problem${details.length === 1 ? "" : "s"}): ${shown}${details.length > 5 ? "; …" : ""}. Nothing was stored.`,
    { details },
  );
}

export interface SaveRevisionInput {
  parentRevision: number | null;
  changeNote: string;
  study: unknown;
}

/**
 * Validates the document, runs the sweep with the current engine and stores document, canonical hash, engine
 * version and result as the study's next revision, with its audit event, in one transaction.
 *
 * Concurrency: the sweep runs before the transaction (no lock is held while computing); inside, the study row
 * is locked `for update`, so a second save on the same parent waits, then finds the first one's revision and
 * is refused with 409 `stale_parent` carrying the newer revision and its own rejected document. The unique
 * (study_id, number) key backs this up; numbers stay gap-free because a refused save inserts nothing.
 */
export async function saveRevision(
  db: DbOrTx,
  sweeps: RunSweep,
  user: SessionUser,
  studyId: number,
  input: SaveRevisionInput,
  ip?: string,
  source: "api" | "import" | "rerun" | "create" | "seed" = "api",
): Promise<RevisionDto> {
  await loadWithAccess(db, user, "Study", () => findStudy(db, studyId), "write");
  const study = parseStudyOrThrow(input.study);
  const changeNote = input.changeNote.trim();
  if (input.parentRevision !== null && changeNote === "") {
    throw new AppError(400, "invalid_input", "changeNote: a change note is required from revision 2 on — say what changed and why.", {
      details: [{ path: "changeNote", rule: "required", message: "is required from revision 2 on" }],
    });
  }
  const { computed, sha256 } = await compute(sweeps, study);
  const id = await db
    .transaction(async (tx) => {
      const inserted = await appendRevision(tx, user, studyId, { ...input, changeNote, study }, computed, sha256);
      await writeAudit(tx, {
        actorId: user.id,
        action: "revision.create",
        objectType: "revision",
        objectId: inserted.id,
        ip,
        details: {
          studyId,
          number: inserted.number,
          parentNumber: input.parentRevision,
          documentSha256: sha256,
          engineVersion: computed.result.engine,
          assessmentId: inserted.assessmentId,
          source,
        },
      });
      return inserted.id;
    })
    .catch(async (err: unknown) => {
      // Backstop behind the row lock: the unique (study_id, number) key turns any race that got past it into
      // the same 409 as a stale parent, never a 500.
      if (!isUniqueViolation(err)) throw err;
      const latest = await findLatestRevision(db, studyId);
      throw latest ? staleParent(latest, { parentRevision: input.parentRevision, changeNote, study }) : err;
    });
  return toRevisionDto(db, (await findRevision(db, id))!, user.id);
}

/**
 * Runs the sweep (in the worker pool, for requests) with its full step table, before any transaction opens; pool
 * errors (429 `busy`, 422 `sweep_timeout`, …) pass through, engine errors become 422 (`sweepFailure`).
 */
async function compute(sweeps: RunSweep, study: StudyDocument) {
  let computed: ComputedSweep;
  try {
    computed = await sweeps(study, { table: true });
  } catch (err) {
    throw sweepFailure(err, " Nothing was stored.");
  }
  return { computed, sha256: canonicalSha256Hex(study) };
}

/** 409 `stale_parent`: names the newer revision and its author, and hands the rejected document back. */
function staleParent(
  latest: RevisionSummaryRow,
  rejected: { parentRevision: number | null; changeNote: string; study: StudyDocument },
): AppError {
  const details: StaleParentDetails = {
    latest: { id: String(latest.id), number: latest.number, author: person(latest.authorId, latest.authorName), createdAt: latest.createdAt.toISOString() },
    rejected: { parentRevision: rejected.parentRevision, changeNote: rejected.changeNote, study: rejected.study },
  };
  const base = rejected.parentRevision === null ? "a new study" : `revision ${rejected.parentRevision}`;
  return new AppError(
    409,
    "stale_parent",
    `Revision ${latest.number} by ${latest.authorName ?? "a former user"} was saved after ${base}, which your edit started from. ` +
      `Your document was not stored; it is returned so you can apply your changes on top of revision ${latest.number}.`,
    { details },
  );
}

/**
 * Inside the caller's transaction: lock the study, check the parent, insert the next number — its thinned result
 * in the revision row, its full step table (when computed) beside it.
 */
export async function appendRevision(
  tx: DbOrTx,
  user: { id: number },
  studyId: number,
  input: { parentRevision: number | null; changeNote: string; study: StudyDocument },
  computed: ComputedSweep,
  sha256: string,
): Promise<{ id: number; number: number; assessmentId: number }> {
  const { result, table } = computed;
  if (!(await lockStudy(tx, studyId))) throw AppError.notFound("Study");
  const latest = await findLatestRevision(tx, studyId);
  const latestNumber = latest?.number ?? null;
  if (input.parentRevision !== latestNumber) {
    if (latest && (input.parentRevision === null || input.parentRevision < latest.number)) throw staleParent(latest, input);
    throw new AppError(400, "invalid_input", `parentRevision: revision ${input.parentRevision} does not exist in this study (latest: ${latestNumber ?? "none"}).`, {
      details: [{ path: "parentRevision", rule: "not_found", message: `revision ${input.parentRevision} does not exist` }],
    });
  }
  const number = (latestNumber ?? 0) + 1;
  const id = await insertRevision(tx, {
    studyId,
    number,
    parentNumber: latestNumber,
    authorId: user.id,
    changeNote: input.changeNote,
    document: input.study,
    documentSha256: sha256,
    engineVersion: result.engine,
    result,
    flutterSpeedMps: result.flutter?.speed ?? null,
  });
  if (table) {
    await insertRevisionTable(tx, { revisionId: id, branchIds: [...table.branchIds], rowCount: table.rows, csvGzip: Buffer.from(table.gzip) });
  }
  // Assessed once, in the same transaction, against the project's current criteria (part of this write: the
  // caller's audit event names the assessment).
  const saved = (await findRevision(tx, id))!;
  const assessment = await currentAssessment(tx, { ...saved, document: input.study, result }, { id: user.id, audit: false });
  return { id, number, assessmentId: assessment.id };
}

/** Computes and appends revision 1 of a study created in the same transaction (study creation with a document). */
export async function appendFirstRevision(tx: DbOrTx, sweeps: RunSweep, user: { id: number }, studyId: number, study: StudyDocument) {
  const { computed, sha256 } = await compute(sweeps, study);
  const inserted = await appendRevision(tx, user, studyId, { parentRevision: null, changeNote: "", study }, computed, sha256);
  return { ...inserted, sha256, engineVersion: computed.result.engine };
}

export async function listStudyRevisions(db: DbOrTx, user: SessionUser, studyId: number): Promise<RevisionSummaryDto[]> {
  await loadWithAccess(db, user, "Study", () => findStudy(db, studyId), "read");
  return withAssessments(db, await listRevisions(db, studyId), user.id);
}

export async function getRevision(db: DbOrTx, user: SessionUser, id: number): Promise<RevisionDto> {
  return toRevisionDto(db, await loadWithAccess(db, user, "Revision", () => findRevision(db, id), "read"), user.id);
}

/** Field-by-field differences of two revisions' documents (each readable by the caller). */
export async function diffRevisions(db: DbOrTx, user: SessionUser, a: number, b: number): Promise<RevisionDiffDto> {
  const from = await loadWithAccess(db, user, "Revision", () => findRevisionSummary(db, a), "read");
  const to = await loadWithAccess(db, user, "Revision", () => findRevisionSummary(db, b), "read");
  const [fromDto, toDto] = await withAssessments(db, [from, to], user.id);
  return {
    from: fromDto,
    to: toDto,
    identical: from.documentSha256 === to.documentSha256,
    changes: diffJson(from.document, to.document),
  };
}

/**
 * Re-runs a stored revision's document with the current engine as the study's next revision, on top of
 * `parentRevision` — the newest revision the caller saw: like every write that creates a revision, a stale base
 * is refused with 409 `stale_parent`, so a re-run never silently drops a save made in between. The stored result
 * is never touched; the new revision's change note names the engine (and the source revision when it is not the
 * newest).
 */
export async function rerunRevision(
  db: DbOrTx,
  sweeps: RunSweep,
  user: SessionUser,
  id: number,
  parentRevision: number,
  ip?: string,
): Promise<RevisionDto> {
  const source = await loadWithAccess(db, user, "Revision", () => findRevision(db, id), "write");
  const note = `re-run with engine ${ENGINE_VERSION}` + (source.number < parentRevision ? ` (document of revision ${source.number})` : "");
  return saveRevision(db, sweeps, user, source.studyId, { parentRevision, changeNote: note, study: source.document }, ip, "rerun");
}

/** The document of a revision as a file: pretty JSON, and the canonical hash it was stored with. */
export async function exportRevision(db: DbOrTx, user: SessionUser, id: number) {
  const row = await loadWithAccess(db, user, "Revision", () => findRevision(db, id), "read");
  return {
    fileName: `${fileSlug(row.studyName)}-r${row.number}.study.json`,
    text: `${JSON.stringify(row.document, null, 2)}\n`,
    sha256: row.documentSha256,
  };
}

/** A study file uploaded as the study's next revision; access is checked before the file is read. */
export async function importRevision(
  db: DbOrTx,
  sweeps: RunSweep,
  user: SessionUser,
  studyId: number,
  fields: { parentRevision: number | null; changeNote: string },
  upload: { buffer: Buffer; originalname: string } | undefined,
  ip?: string,
): Promise<RevisionDto> {
  await loadWithAccess(db, user, "Study", () => findStudy(db, studyId), "write");
  const file = requireFile(upload, "file");
  const study = readStudyFile(file.buffer, file.originalname);
  return saveRevision(db, sweeps, user, studyId, { ...fields, study }, ip, "import");
}

/** Reads an uploaded study file (UTF-8 JSON) — 400 `invalid_file` with line and column when it is not JSON. */
export function readStudyFile(bytes: Uint8Array, fileName: string): unknown {
  const decoded = decodeUtf8Strict(bytes);
  if (!decoded.ok) {
    const where = describeUtf8Error(decoded);
    throw new AppError(400, "invalid_file", `${clipValue(fileName)}: the file is not UTF-8 text (${where}). Nothing was stored.`, {
      details: [{ row: decoded.line, message: `not UTF-8: ${where}` }],
    });
  }
  const text = decoded.text;
  try {
    return JSON.parse(text);
  } catch (err) {
    const message = err instanceof Error ? err.message : String(err);
    const position = /position (\d+)/.exec(message);
    let where = "";
    const details: { row?: number; column?: string; message: string }[] = [{ message }];
    if (position) {
      const before = text.slice(0, Number(position[1]));
      const line = before.split("\n").length;
      const column = Number(position[1]) - before.lastIndexOf("\n");
      where = ` at line ${line}, column ${column}`;
      details[0] = { row: line, column: String(column), message };
    }
    throw new AppError(400, "invalid_file", `${clipValue(fileName)}: not valid JSON${where} (${message}). Nothing was stored.`, { details });
  }
}
