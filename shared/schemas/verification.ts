/**
 * Contract of the public verification of a signed summary by its code (GET /api/signatures/by-code/:code, no
 * sign-in): the code printed on a PDF leads to the summary on record, checked against the published keys.
 */
import { z } from "zod";
import type { SignedSummaryPayload } from "./summary";

/** A verification code as printed ("3f9a-07c2-b1e4"); spaces and case are forgiven, dashes optional. */
export const verificationCodeSchema = z
  .string()
  .trim()
  .transform((v) => v.toLowerCase().replace(/[\s-]/g, ""))
  .pipe(z.string().regex(/^[0-9a-f]{12}$/, "must be the 12 hex digits of the verification code, e.g. 3f9a-07c2-b1e4"));

/** GET /api/signatures/by-code/:code. */
export interface SummaryCheckDto {
  /** The code in its printed form. */
  verificationCode: string;
  /** The JWS on record verifies under the server's published keys, and its payload is a summary document. */
  valid: boolean;
  /** Why not, when not valid. */
  reason: string | null;
  kid: string | null;
  /** The compact JWS, so anyone can check it with their own tools against `jwksUrl`. */
  jws: string;
  /** SHA-256 of the payload's canonical JSON. */
  payloadSha256: string;
  /** The payload exactly as signed. */
  payload: SignedSummaryPayload;
  /** No later revision of the study has been signed. */
  current: boolean;
  /** The study's newest signed revision, when this summary is superseded. */
  supersededBy: { revisionNumber: number; signedAt: string } | null;
  /** Later revisions of the study exist that are not signed. */
  newerUnsigned: boolean;
  jwksUrl: string;
}
