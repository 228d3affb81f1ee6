/**
 * What must hold before a stability summary is signed, besides the review state: every criterion's basis stands
 * confirmed by a criteria owner, and the summary is the one the reviewer read on the preview.
 */
import { basisStatuses, unconfirmedBases, unconfirmedBasesMessage } from "../../shared/criteria/basis-confirmation.js";
import type { SummaryPayload } from "../../shared/schemas/summary.js";
import type { CriteriaVersionRow } from "../db/queries/criteria.js";
import { AppError } from "../errors.js";
import { canonicalSha256Hex } from "../lib/hash.js";

/** The criteria whose basis nobody confirmed or wrote, in the version `criteria`. */
export function unconfirmedBasesOf(criteria: Pick<CriteriaVersionRow, "criteria" | "basisConfirmations">) {
  return unconfirmedBases(basisStatuses(criteria.criteria, criteria.basisConfirmations));
}

/** 409 `criteria_unconfirmed`, naming each criterion whose basis is still a default text or unconfirmed. */
export function assertBasesConfirmed(criteria: Pick<CriteriaVersionRow, "version" | "criteria" | "basisConfirmations">): void {
  const unconfirmed = unconfirmedBasesOf(criteria);
  if (unconfirmed.length === 0) return;
  throw new AppError(409, "criteria_unconfirmed", unconfirmedBasesMessage(unconfirmed, criteria.version), {
    details: { criteriaVersion: criteria.version, unconfirmed },
  });
}

/**
 * The hash a sign request carries: SHA-256 over the RFC 8785 canonical JSON of the summary payload without what is
 * set at the moment of signing — `signedAt`, `statement`, and the times of checking and approval in the sign-off
 * block (both the signing time). Equal hashes: the reviewer signs exactly what the preview showed them.
 */
export function previewSha256(payload: SummaryPayload): string {
  const { signedAt: _signedAt, statement: _statement, signoff, ...content } = payload;
  const { at: _checkedAt, ...checked } = signoff.checked;
  const { at: _approvedAt, ...approved } = signoff.approved;
  return canonicalSha256Hex({ ...content, signoff: { ...signoff, checked, approved } });
}

/** 409 `preview_outdated` when the summary about to be signed is not the one previewed. */
export function assertSameAsPreview(payload: SummaryPayload, expected: string): void {
  const actual = previewSha256(payload);
  if (actual === expected) return;
  throw new AppError(
    409,
    "preview_outdated",
    "The summary differs from the preview you read (the revision's criteria, data set or review changed since): nothing " +
      "was signed. Read the preview again, then sign it.",
    { details: { previewSha256: expected, currentSha256: actual } },
  );
}
