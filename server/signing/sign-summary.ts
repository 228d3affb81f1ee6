/**
 * Signs a stability summary: a compact JWS (RFC 7515, alg EdDSA with Ed25519) whose payload is the RFC 8785
 * canonical JSON of the validated summary, with the key id in the protected header. The payload is the canonical
 * bytes themselves, so anyone can re-canonicalise the decoded summary and get the signed bytes back.
 */
import { CompactSign } from "jose";
import { canonicalJsonBytes } from "../../shared/canonical-json.js";
import {
  SUMMARY_JWS_ALG,
  SUMMARY_JWS_TYP,
  summaryPayloadSchema,
  type SummaryPayload,
} from "../../shared/schemas/summary.js";
import type { KeyStore } from "./key-store.js";

export { SUMMARY_JWS_TYP };

export interface SignedSummary {
  jws: string;
  kid: string;
  /** The summary exactly as signed (validated; strings trimmed by the schema). */
  summary: SummaryPayload;
}

export async function signSummary(store: KeyStore, summary: SummaryPayload): Promise<SignedSummary> {
  const validated = summaryPayloadSchema.parse(summary);
  const key = await store.signingKey();
  const jws = await new CompactSign(canonicalJsonBytes(validated))
    .setProtectedHeader({ alg: SUMMARY_JWS_ALG, kid: key.kid, typ: SUMMARY_JWS_TYP })
    .sign(key.privateKey);
  return { jws, kid: key.kid, summary: validated };
}
