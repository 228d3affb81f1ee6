/**
 * Verifies a signed stability summary against a JWKS document. Browser-safe (jose, the canonicaliser and the
 * schema only): the server's POST /api/signatures/verify and the summary page in the browser run the same check.
 *
 * Valid means all of: each of the three parts is canonical base64url; the compact JWS verifies with EdDSA under the
 * key its `kid` names in the JWKS; the `typ` is a Stillspan summary; the payload is UTF-8 JSON in RFC 8785
 * canonical form; it matches the summary schema of its format (the current one, or format 1 for summaries signed
 * before summaries carried their inputs and assessment).
 */
import { base64url, compactVerify, createLocalJWKSet, decodeProtectedHeader, errors, type JSONWebKeySet } from "jose";
import { canonicalJson } from "./canonical-json";
import {
  SUMMARY_FORMAT,
  SUMMARY_JWS_ALG as SIGNING_ALG,
  SUMMARY_JWS_TYP,
  signedSummaryPayloadSchema,
  type SignedSummaryPayload,
} from "./schemas/summary";
import { SUMMARY_FORMAT_V1 } from "./schemas/summary-v1";

export type SummaryVerification =
  | { valid: true; kid: string; summary: SignedSummaryPayload }
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

/**
 * True when `part` is the one canonical base64url spelling of its bytes (RFC 7515 §2, RFC 4648 §5 and §3.5): the
 * URL-safe alphabet, no padding, no impossible length, and the unused low bits of the last character zero.
 * Decoders ignore those bits, so without this check one signature has several spellings — and as many
 * verification codes, since the code hashes the JWS text.
 */
function isCanonicalBase64url(part: string): boolean {
  if (!/^[A-Za-z0-9_-]*$/.test(part) || part.length % 4 === 1) return false;
  try {
    return base64url.encode(base64url.decode(part)) === part;
  } catch {
    return false;
  }
}

export async function verifySummary(jws: string, jwks: JSONWebKeySet): Promise<SummaryVerification> {
  const kid = headerKid(jws);
  const invalid = (reason: string): SummaryVerification => ({ valid: false, kid, summary: null, reason });
  if (kid === null) return invalid("not a compact JWS with a key id (kid) in its protected header");
  const parts = jws.split(".");
  const names = ["protected header", "payload", "signature"];
  const spelt = parts.findIndex((part) => !isCanonicalBase64url(part));
  if (parts.length === 3 && spelt >= 0) return invalid(`the ${names[spelt]} is not in canonical base64url (it has been re-encoded)`);

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
  const parsed = signedSummaryPayloadSchema.safeParse(decoded);
  if (!parsed.success) {
    const first = parsed.error.issues[0];
    return invalid(
      `the payload is not a ${SUMMARY_FORMAT} (or ${SUMMARY_FORMAT_V1}) document (${first.path.join(".") || "format"}: ${first.message})`,
    );
  }
  return { valid: true, kid, summary: parsed.data };
}
