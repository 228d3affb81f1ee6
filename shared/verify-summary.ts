/**
 * Verifies a signed stability summary against a JWKS document. Browser-safe (jose, the canonicaliser and the
 * schema only): the server's POST /api/signatures/verify and the summary page in the browser run the same check.
 *
 * Valid means all of: the compact JWS verifies with EdDSA under the key its `kid` names in the JWKS; the `typ` is
 * a Stillspan summary; the payload is UTF-8 JSON in RFC 8785 canonical form; it matches the summary schema.
 */
import { compactVerify, createLocalJWKSet, decodeProtectedHeader, errors, type JSONWebKeySet } from "jose";
import { canonicalJson } from "./canonical-json";
import {
  SUMMARY_FORMAT,
  SUMMARY_JWS_ALG as SIGNING_ALG,
  SUMMARY_JWS_TYP,
  summaryPayloadSchema,
  type SummaryPayload,
} from "./schemas/summary";

export type SummaryVerification =
  | { valid: true; kid: string; summary: SummaryPayload }
  | { valid: false; kid: string | null; summary: null; reason: string };

function headerKid(jws: string): string | null {
  try {
    const kid = decodeProtectedHeader(jws).kid;
    return typeof kid === "string" ? kid : null;
  } catch {
    return null;
  }
}

function isCanonical(decoded: unknown, text: string): boolean {
  try {
    return canonicalJson(decoded) === text;
  } catch {
    return false; // e.g. a lone surrogate: not I-JSON, so not canonical either
  }
}

export async function verifySummary(jws: string, jwks: JSONWebKeySet): Promise<SummaryVerification> {
  const kid = headerKid(jws);
  const invalid = (reason: string): SummaryVerification => ({ valid: false, kid, summary: null, reason });
  if (kid === null) return invalid("not a compact JWS with a key id (kid) in its protected header");

  let payload: Uint8Array;
  let typ: unknown;
  try {
    const result = await compactVerify(jws, createLocalJWKSet(jwks), { algorithms: [SIGNING_ALG] });
    payload = result.payload;
    typ = result.protectedHeader.typ;
  } catch (err) {
    if (err instanceof errors.JWKSNoMatchingKey) return invalid(`signed with key ${kid}, which is not in the JWKS`);
    if (err instanceof errors.JWSSignatureVerificationFailed) {
      return invalid("the signature does not match the content");
    }
    if (err instanceof errors.JOSEAlgNotAllowed) return invalid(`algorithm not allowed (only ${SIGNING_ALG})`);
    return invalid(`malformed JWS: ${(err as Error).message}`);
  }
  if (typ !== SUMMARY_JWS_TYP) return invalid(`not a signed summary (typ ${String(typ)})`);

  let text: string;
  let decoded: unknown;
  try {
    text = new TextDecoder("utf-8", { fatal: true }).decode(payload);
    decoded = JSON.parse(text);
  } catch {
    return invalid("the payload is not UTF-8 JSON");
  }
  if (!isCanonical(decoded, text)) return invalid("the payload is not in RFC 8785 canonical form");
  const parsed = summaryPayloadSchema.safeParse(decoded);
  if (!parsed.success) {
    const first = parsed.error.issues[0];
    return invalid(`the payload is not a ${SUMMARY_FORMAT} document (${first.path.join(".")}: ${first.message})`);
  }
  return { valid: true, kid, summary: parsed.data };
}
