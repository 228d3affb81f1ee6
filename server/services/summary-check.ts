/**
 * The public check of a signed summary by its verification code: the code printed on a PDF finds the summary on
 * record, whose JWS is verified against the server's published keys (current and retired), with whether a later
 * revision of the study has been signed since. Anyone holding the paper copy holds the code; nothing else is needed.
 */
import type { SummaryCheckDto } from "../../shared/schemas/verification.js";
import type { Config } from "../config.js";
import type { DbOrTx } from "../db/client.js";
import { findSignature, findSignatureByCode } from "../db/queries/signatures.js";
import { AppError } from "../errors.js";
import { verificationCode } from "../signing/verification-code.js";
import { appLinks } from "./review-mail.js";
import { verifyStabilitySummary } from "./signing.js";

/** GET /api/signatures/by-code/:code — `hex12` is the code's 12 hex digits, lower case, without dashes. */
export async function checkSummaryByCode(db: DbOrTx, config: Pick<Config, "signing" | "publicUrl">, hex12: string): Promise<SummaryCheckDto> {
  const row = await findSignatureByCode(db, hex12);
  const printed = hex12.match(/.{4}/g)!.join("-");
  if (!row) {
    throw new AppError(404, "not_found", `No signed summary on record has the verification code ${printed}. Check the code as printed on the PDF.`);
  }
  const verified = await verifyStabilitySummary(config, row.jws);
  const current = row.currentSignatureId === row.id;
  const newest = current ? null : await findSignature(db, row.currentSignatureId);
  return {
    verificationCode: verificationCode(row.jws),
    valid: verified.valid,
    reason: verified.valid ? null : verified.reason,
    kid: verified.kid,
    jws: row.jws,
    payloadSha256: row.payloadSha256,
    payload: row.payload,
    current,
    supersededBy: newest ? { revisionNumber: newest.revisionNumber, signedAt: newest.signedAt.toISOString() } : null,
    newerUnsigned: row.newerUnsigned,
    jwksUrl: appLinks.jwks(config.publicUrl),
  };
}
