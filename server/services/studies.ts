import type { CreateStudy, PatchStudy, StudyDto } from "../../shared/schemas/studies.js";
import type { DbOrTx } from "../db/client.js";
import { writeAudit } from "../db/queries/audit.js";
import { latestRevisionsOf, type RevisionSummaryRow } from "../db/queries/revisions.js";
import { findStudy, insertStudy, listStudies, updateStudy, type StudyRow } from "../db/queries/studies.js";
import { loadWithAccess, person } from "./access.js";
import { loadAlternative } from "./alternatives.js";
import type { SessionUser } from "./auth.js";
import { currentAssessments } from "./assessments.js";
import { appendFirstRevision, parseStudyOrThrow, toRevisionSummary } from "./revisions.js";
import type { RunSweep } from "./sweep-compute.js";

function toStudyDto(row: StudyRow, latest: StudyDto["latestRevision"]): StudyDto {
  return {
    id: String(row.id),
    alternativeId: String(row.alternativeId),
    alternativeName: row.alternativeName,
    projectId: String(row.projectId),
    name: row.name,
    purpose: row.purpose,
    revisionCount: row.revisionCount,
    latestRevision: latest,
    createdAt: row.createdAt.toISOString(),
    createdBy: person(row.createdById, row.createdByName),
  };
}

/** The studies with their latest revisions, each with its current assessment. */
async function studyDtos(db: DbOrTx, rows: StudyRow[], actorId: number): Promise<StudyDto[]> {
  const latest = await latestRevisionsOf(db, rows.map((r) => r.id));
  const revisions: RevisionSummaryRow[] = [...latest.values()];
  const assessments = await currentAssessments(db, revisions, actorId);
  return rows.map((r) => {
    const revision = latest.get(r.id);
    return toStudyDto(r, revision ? toRevisionSummary(revision, assessments.get(revision.id)!) : null);
  });
}

export async function listAlternativeStudies(db: DbOrTx, user: SessionUser, alternativeId: number): Promise<StudyDto[]> {
  await loadAlternative(db, user, alternativeId, "read");
  return studyDtos(db, await listStudies(db, alternativeId), user.id);
}

export async function getStudy(db: DbOrTx, user: SessionUser, id: number): Promise<StudyDto> {
  return (await studyDtos(db, [await loadWithAccess(db, user, "Study", () => findStudy(db, id), "read")], user.id))[0];
}

/**
 * Creates a study; with a document, revision 1 is computed and stored in the same transaction, and recorded in
 * the one `study.create` audit event.
 */
export async function createStudy(
  db: DbOrTx,
  sweeps: RunSweep,
  user: SessionUser,
  alternativeId: number,
  input: Omit<CreateStudy, "study"> & { study?: unknown },
  ip?: string,
): Promise<StudyDto> {
  await loadAlternative(db, user, alternativeId, "write");
  const document = input.study === undefined ? undefined : parseStudyOrThrow(input.study);
  const id = await db.transaction(async (tx) => {
    const studyId = await insertStudy(tx, { alternativeId, name: input.name, purpose: input.purpose, createdBy: user.id });
    // One write, one audit event: revision 1 (when given) is recorded in the study's creation event.
    const first = document ? await appendFirstRevision(tx, sweeps, user, studyId, document) : null;
    await writeAudit(tx, {
      actorId: user.id,
      action: "study.create",
      objectType: "study",
      objectId: studyId,
      ip,
      details: {
        alternativeId,
        name: input.name,
        firstRevision: first && { id: first.id, number: 1, documentSha256: first.sha256, engineVersion: first.engineVersion, assessmentId: first.assessmentId },
      },
    });
    return studyId;
  });
  return (await studyDtos(db, [(await findStudy(db, id))!], user.id))[0];
}

export async function patchStudy(db: DbOrTx, user: SessionUser, id: number, patch: PatchStudy, ip?: string): Promise<StudyDto> {
  await loadWithAccess(db, user, "Study", () => findStudy(db, id), "write");
  await db.transaction(async (tx) => {
    await updateStudy(tx, id, patch);
    await writeAudit(tx, { actorId: user.id, action: "study.update", objectType: "study", objectId: id, ip, details: { ...patch } });
  });
  return (await studyDtos(db, [(await findStudy(db, id))!], user.id))[0];
}
