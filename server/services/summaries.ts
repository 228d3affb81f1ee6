/**
 * Signing a revision's stability summary, and reading signed summaries. A summary is "current" while no later
 * revision of the same study has been signed; it also tells when later revisions exist that are not signed.
 * Viewers (owner's representatives) read the summaries of their projects and nothing else.
 */
import type { SweepResult } from "../../shared/schemas/result.js";
import type { SignReviewInput, SummaryDto, SummaryListItemDto } from "../../shared/schemas/review.js";
import type { SignedSummaryPayload } from "../../shared/schemas/summary.js";
import type { AppContext } from "../app-context.js";
import type { Config } from "../config.js";
import type { DbOrTx } from "../db/client.js";
import { isUniqueViolation } from "../db/pg-errors.js";
import { writeAudit } from "../db/queries/audit.js";
import { findCurrentCriteria } from "../db/queries/criteria.js";
import { listProjectsOfMember } from "../db/queries/projects.js";
import { decideReviewRequest, findReviewRequest, insertReviewEvent } from "../db/queries/review.js";
import { findRevision, type RevisionRow } from "../db/queries/revisions.js";
import { findSignature, findSignatureByJws, insertSignature, listSignatures, type SignatureRow } from "../db/queries/signatures.js";
import { findUserById } from "../db/queries/users.js";
import { AppError } from "../errors.js";
import { canonicalSha256Hex } from "../lib/hash.js";
import { renderSummaryPdf } from "../pdf/summary-pdf.js";
import { verificationCode } from "../signing/verification-code.js";
import { ANY_ROLE, assertRole } from "./access.js";
import type { SessionUser } from "./auth.js";
import { assertAssignedReviewer, assertReviewer, revisionFor } from "./review.js";
import { assertBasesConfirmed, assertSameAsPreview } from "./review-sign-checks.js";
import { appLinks, notifySigned } from "./review-mail.js";
import { signStabilitySummary } from "./signing.js";
import { summaryPayloadOfRevision } from "./summary-payload.js";

export interface RecordSignatureInput {
  revision: Pick<RevisionRow, "id" | "projectId">;
  /** The revision's review request (in review), set to signed. */
  request: { id: number };
  signer: { id: number; name: string; email: string };
  signedAt: Date;
  statement: string;
  /** The `previewSha256` of the summary preview the signer read; a different summary is refused (409). */
  previewSha256?: string;
  ip?: string;
}

/**
 * Inside the caller's transaction: refuses criteria whose basis no reviewer confirmed (409 `criteria_unconfirmed`),
 * builds the summary of the stored revision (its current assessment, which the signature row names; refused with
 * 409 `preview_outdated` when it is not the preview the signer read), signs it, stores the signature (JWS, key id,
 * payload, payload hash, assessment), marks the review signed, and records the history and audit events. Used by the
 * sign route and by the demo seed. Returns the summary id.
 */
export async function recordSignature(tx: DbOrTx, config: Pick<Config, "signing">, input: RecordSignatureInput): Promise<number> {
  const { revision, signer, signedAt } = input;
  const criteria = await findCurrentCriteria(tx, revision.projectId);
  if (!criteria) throw AppError.conflict("The project has no design wind and criteria yet: a summary states its margins against them.");
  assertBasesConfirmed(criteria);
  const { payload, assessmentId } = await summaryPayloadOfRevision(tx, revision.id, signer, { signedAt, statement: input.statement });
  if (input.previewSha256 !== undefined) assertSameAsPreview(payload, input.previewSha256);
  const signed = await signStabilitySummary(config, payload);
  const payloadSha256 = canonicalSha256Hex(signed.summary);
  const id = await insertSignature(tx, {
    revisionId: revision.id,
    signerId: signer.id,
    jws: signed.jws,
    kid: signed.kid,
    payload: signed.summary,
    payloadSha256,
    signedAt,
    assessmentId,
  });
  await decideReviewRequest(tx, input.request.id, "signed", signer.id, signedAt);
  await insertReviewEvent(tx, { revisionId: revision.id, kind: "signed", actorId: signer.id, note: input.statement, at: signedAt });
  await writeAudit(tx, {
    actorId: signer.id,
    action: "review.sign",
    objectType: "revision",
    objectId: revision.id,
    ip: input.ip,
    details: { summaryId: id, kid: signed.kid, assessmentId, criteriaVersion: payload.assessment.computedFrom.criteriaVersion, payloadSha256 },
  });
  return id;
}

/**
 * POST /api/revisions/:id/sign — the reviewer's statement, the summary built from the stored revision, signed
 * (compact JWS over RFC 8785 canonical JSON) and stored with its key id and payload hash, in one transaction
 * with the review state, the history and the audit event. 409 when already signed, when a criterion's basis is
 * unconfirmed (`criteria_unconfirmed`), or when the summary is not the preview the reviewer read
 * (`preview_outdated`).
 */
export async function signRevision(
  ctx: AppContext,
  user: SessionUser,
  revisionId: number,
  { statement, previewSha256 }: SignReviewInput,
  ip?: string,
): Promise<{ summaryId: string }> {
  const { db, config } = ctx;
  const revision = await revisionFor(db, user, revisionId, ["reviewer"]);
  await assertReviewer(db, user, revision, "sign a revision");
  const full = await findRevision(db, revisionId);
  const [criteria, signer] = await Promise.all([findCurrentCriteria(db, revision.projectId), findUserById(db, user.id)]);
  if (!full || !signer) throw AppError.notFound("Revision");
  if (!criteria) {
    throw AppError.conflict(
      "The project has no design wind and criteria yet: the summary states the required speeds and margins, so a reviewer or administrator must save the criteria first.",
    );
  }
  const signedAt = new Date();
  let summaryId: number;
  try {
    summaryId = await db.transaction(async (tx) => {
      const request = await findReviewRequest(tx, revisionId, true);
      if (request?.state === "signed") throw AppError.conflict(`Revision ${revision.number} is already signed.`);
      if (!request || request.state !== "in-review") {
        throw AppError.conflict(
          `Revision ${revision.number} is ${request ? request.state : "a draft"}: only a revision in review can be signed.`,
        );
      }
      assertAssignedReviewer(request, user, revision, "sign it");
      return recordSignature(tx, config, {
        revision: full,
        request,
        signer,
        signedAt,
        statement,
        previewSha256,
        ip,
      });
    });
  } catch (err) {
    if (isUniqueViolation(err)) throw AppError.conflict(`Revision ${revision.number} is already signed.`);
    throw err;
  }
  const row = await findSignature(db, summaryId);
  if (row) void notifySigned(ctx, row);
  return { summaryId: String(summaryId) };
}

/** The checks of a signed summary with their status, in its order: format 2 from its assessment, format 1 as signed. */
function checksOf(payload: SignedSummaryPayload): { phenomenon: string; status: string }[] {
  if (payload.format === "stillspan.summary/1") return payload.margins;
  const a = payload.assessment;
  const margins = a.margins ? Object.entries(a.margins).map(([phenomenon, m]) => ({ phenomenon, status: m.status as string })) : [];
  return [...margins, { phenomenon: "vortexOnset", status: a.vortexShedding.status }];
}

function outcome(payload: SignedSummaryPayload): SummaryListItemDto["outcome"] {
  const statuses = checksOf(payload).map((m) => m.status);
  if (statuses.includes("fail")) return "fail";
  if (statuses.includes("undetermined")) return "undetermined";
  if (statuses.includes("investigate")) return "investigate";
  return "pass";
}

function flutterSpeedOf(payload: SignedSummaryPayload): number | null {
  if (payload.format === "stillspan.summary/1") return payload.flutter?.speedMps ?? null;
  return payload.assessment.flutter.found ? payload.assessment.flutter.speedMps : null;
}

/** GET /api/summaries — signed summaries of the caller's projects (every project for administrators). */
export async function listSummaries(db: DbOrTx, user: SessionUser): Promise<SummaryListItemDto[]> {
  const projectIds = user.isAdmin ? null : (await listProjectsOfMember(db, user.id)).map((p) => p.id);
  const rows = await listSignatures(db, projectIds);
  return rows.map((r) => ({
    id: String(r.id),
    projectId: String(r.projectId),
    projectName: r.projectName,
    alternativeName: r.alternativeName,
    studyId: String(r.studyId),
    studyName: r.studyName,
    revisionNumber: r.revisionNumber,
    signer: { id: String(r.signerId), name: r.signerName },
    signedAt: r.signedAt.toISOString(),
    flutterSpeedMps: flutterSpeedOf(r.payload),
    outcome: outcome(r.payload),
    attention: checksOf(r.payload).flatMap((m) =>
      m.status === "fail" || m.status === "undetermined" || m.status === "investigate" || m.status === "not-evaluated"
        ? [{ phenomenon: m.phenomenon, status: m.status as "fail" | "undetermined" | "investigate" | "not-evaluated" }]
        : [],
    ),
    current: r.currentSignatureId === r.id,
    newerUnsigned: r.newerUnsigned,
  }));
}

async function readableSignature(db: DbOrTx, user: SessionUser, id: number): Promise<SignatureRow> {
  const row = await findSignature(db, id);
  if (!row) throw AppError.notFound("Signed summary");
  await assertRole(db, user, row.projectId, ANY_ROLE);
  return row;
}

async function currentOf(db: DbOrTx, row: SignatureRow): Promise<SummaryDto["currentSummary"]> {
  if (row.currentSignatureId === row.id) return null;
  const current = await findSignature(db, row.currentSignatureId);
  return current ? { id: String(current.id), revisionNumber: current.revisionNumber, signedAt: current.signedAt.toISOString() } : null;
}

/** The pole paths of a stored result, as the summary's plots draw them. */
export function summaryBranches(result: SweepResult | undefined): SummaryDto["branches"] {
  return (result?.modes ?? []).map((m) => ({
    id: m.id,
    steps: m.steps.map((s) => ({ speed: s.speed, frequency: s.frequency, damping: s.damping, re: s.re, im: s.im })),
  }));
}

/**
 * GET /api/summaries/:id — the payload as signed, its JWS, whether it is still current, and the absolute addresses
 * of the public verification page and the keys.
 */
export async function getSummary(db: DbOrTx, config: Pick<Config, "publicUrl">, user: SessionUser, id: number): Promise<SummaryDto> {
  const row = await readableSignature(db, user, id);
  const revision = await findRevision(db, row.revisionId);
  return {
    id: String(row.id),
    revisionId: String(row.revisionId),
    studyId: String(row.studyId),
    projectId: String(row.projectId),
    payload: row.payload,
    jws: row.jws,
    kid: row.kid,
    payloadSha256: row.payloadSha256,
    verificationCode: verificationCode(row.jws),
    current: row.currentSignatureId === row.id,
    currentSummary: await currentOf(db, row),
    newerUnsigned: row.newerUnsigned,
    newestRevisionNumber: row.newestRevisionNumber,
    branches: summaryBranches(revision?.result),
    branchSampling: revision?.result.sampling ?? null,
    jwksUrl: appLinks.jwks(config.publicUrl),
    verificationUrl: appLinks.verify(config.publicUrl, verificationCode(row.jws)),
  };
}

/** GET /api/summaries/:id/pdf — the PDF copy with its verification code, the page that checks it, and the JWS in an appendix. */
export async function getSummaryPdf(
  db: DbOrTx,
  config: Pick<Config, "publicUrl">,
  user: SessionUser,
  id: number,
): Promise<{ pdf: Buffer; fileName: string }> {
  const row = await readableSignature(db, user, id);
  const revision = await findRevision(db, row.revisionId);
  const current = await currentOf(db, row);
  const pdf = await renderSummaryPdf({
    summary: row.payload,
    jws: row.jws,
    branches: revision?.result.modes ?? [],
    supersededBy: current ? { revisionNumber: current.revisionNumber } : null,
    verificationUrl: appLinks.verify(config.publicUrl, verificationCode(row.jws)),
    jwksUrl: appLinks.jwks(config.publicUrl),
  });
  const safe = `${row.studyName}-rev${row.revisionNumber}`.replace(/[^A-Za-z0-9._-]+/g, "-").replace(/^-+|-+$/g, "").slice(0, 80);
  return { pdf, fileName: `stability-summary-${safe || row.id}.pdf` };
}

/**
 * For POST /api/signatures/verify: whether a JWS is one of ours and still current. null when this server holds
 * no summary with exactly this JWS (it may still verify: it is then simply not on record here).
 */
export async function summaryCurrency(db: DbOrTx, jws: string): Promise<{ summaryId: string; current: boolean; newerUnsigned: boolean } | null> {
  const row = await findSignatureByJws(db, jws);
  return row ? { summaryId: String(row.id), current: row.currentSignatureId === row.id, newerUnsigned: row.newerUnsigned } : null;
}
