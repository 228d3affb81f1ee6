/**
 * Builds the signed stability summary (`stillspan.summary/2`) of one stored revision: its inputs, the revision's
 * current stored assessment (every figure, margin and warning — never recomputed here), what changed since the
 * study's previously signed revision, and who prepared, checked and approved it. One function, `summaryPayloadOfRevision`,
 * builds it for the signature (inside the signing transaction) and for a preview of what the reviewer will sign.
 */
import { diffJson } from "../../shared/diff-json.js";
import { SUMMARY_FORMAT, type SummaryChanges, type SummaryPayload } from "../../shared/schemas/summary.js";
import { fieldLabel } from "../../shared/study-field-label.js";
import type { DbOrTx } from "../db/client.js";
import { findAlternative } from "../db/queries/alternatives.js";
import { listDatasets } from "../db/queries/datasets.js";
import { findProjectById } from "../db/queries/projects.js";
import { findReviewRequest } from "../db/queries/review.js";
import { findRevision, type RevisionRow } from "../db/queries/revisions.js";
import { findPreviousSignature } from "../db/queries/signatures.js";
import { AppError } from "../errors.js";
import { currentAssessment } from "./assessments.js";
import { matchingDataset, summaryInputs } from "./summary-inputs.js";

/** Most changed fields a summary lists one by one (a re-measured derivative table changes hundreds). */
const MAX_CHANGES = 50;

interface SummaryInput {
  revision: RevisionRow;
  projectName: string;
  alternativeName: string;
  /** The reviewer who signs (the revision's assigned reviewer). */
  signer: { id: number; name: string; email: string };
  /** When the revision was submitted for checking (its review request). */
  submittedAt: Date;
  signedAt: Date;
  statement: string;
}

const dateText = (d: Date) => d.toISOString().slice(0, 10);

/** The field-level differences from the study's previously signed revision (the same diff as the revision diff). */
async function changesSincePreviousSignature(db: DbOrTx, revision: RevisionRow): Promise<SummaryChanges> {
  const previous = await findPreviousSignature(db, revision.studyId, revision.number);
  if (!previous) {
    return { since: null, items: [], omitted: 0, statement: "The first signed revision of this study: there is no earlier signed revision to compare with." };
  }
  const before = await findRevision(db, previous.revisionId);
  const all = before ? diffJson(before.document, revision.document) : [];
  const items = all.slice(0, MAX_CHANGES).map((c) => ({
    path: c.path,
    label: fieldLabel(c.path),
    kind: c.kind,
    ...(c.old !== undefined ? { old: c.old as never } : {}),
    ...(c.new !== undefined ? { new: c.new as never } : {}),
  }));
  const since = `since revision ${previous.revisionNumber} (signed ${dateText(previous.signedAt)})`;
  return {
    since: {
      summaryId: String(previous.id),
      revisionNumber: previous.revisionNumber,
      contentHash: before?.documentSha256 ?? revision.documentSha256,
      signedAt: previous.signedAt.toISOString(),
    },
    items,
    omitted: all.length - items.length,
    statement:
      all.length === 0
        ? `No input changed ${since}: the same study document.`
        : `${all.length} field${all.length === 1 ? "" : "s"} of the study document changed ${since}${all.length > items.length ? `; the first ${items.length} are listed` : ""}.`,
  };
}

/**
 * The summary payload of a revision, ready to be signed (validated by the signer against the schema), and the id of
 * the stored assessment it states (the signature row keeps it).
 */
async function buildSummaryPayload(db: DbOrTx, input: SummaryInput): Promise<{ payload: SummaryPayload; assessmentId: number }> {
  const { revision, signer } = input;
  const { document } = revision;
  const stored = await currentAssessment(db, revision, signer.id);
  const dataset = matchingDataset(await listDatasets(db, revision.alternativeId), document.aerodynamics);
  const payload: SummaryPayload = {
    format: SUMMARY_FORMAT,
    project: { id: String(revision.projectId), name: input.projectName },
    alternative: { id: String(revision.alternativeId), name: input.alternativeName },
    study: { id: String(revision.studyId), name: revision.studyName },
    revision: {
      id: String(revision.id),
      number: revision.number,
      contentHash: revision.documentSha256,
      createdAt: revision.createdAt.toISOString(),
      changeNote: revision.changeNote,
    },
    engineVersion: revision.engineVersion,
    inputs: summaryInputs(document, dataset),
    assessmentId: String(stored.id),
    assessment: stored.assessment,
    changes: await changesSincePreviousSignature(db, revision),
    signoff: {
      prepared: { name: revision.authorName ?? "a former user", role: "analyst", at: revision.createdAt.toISOString() },
      checked: { name: signer.name, role: "reviewer", submittedAt: input.submittedAt.toISOString(), at: input.signedAt.toISOString() },
      approved: { name: signer.name, at: input.signedAt.toISOString(), by: "signing this summary (Ed25519 signature)" },
    },
    signer: { name: signer.name, email: signer.email },
    signedAt: input.signedAt.toISOString(),
    statement: input.statement,
  };
  return { payload, assessmentId: stored.id };
}

/**
 * The summary payload a reviewer signs for a revision, with their statement: everything loaded from the database by
 * the revision's id. The signature builds it with this function inside its transaction; a preview built with it for
 * the same revision, signer and statement is the same payload but for the signing time. 404 when the revision is
 * gone; 409 when it was never submitted for review (a summary names when it was submitted for checking).
 */
export async function summaryPayloadOfRevision(
  db: DbOrTx,
  revisionId: number,
  signer: { id: number; name: string; email: string },
  options: { signedAt?: Date; statement: string },
): Promise<{ payload: SummaryPayload; assessmentId: number }> {
  const revision = await findRevision(db, revisionId);
  if (!revision) throw AppError.notFound("Revision");
  const [project, alternative, request] = [
    await findProjectById(db, revision.projectId, signer.id),
    await findAlternative(db, revision.alternativeId),
    await findReviewRequest(db, revisionId),
  ];
  if (!project || !alternative) throw AppError.notFound("Revision");
  if (!request) throw AppError.conflict(`Revision ${revision.number} has not been submitted for review: there is no summary to sign yet.`);
  return buildSummaryPayload(db, {
    revision,
    projectName: project.name,
    alternativeName: alternative.name,
    signer,
    submittedAt: request.submittedAt,
    signedAt: options.signedAt ?? new Date(),
    statement: options.statement,
  });
}
