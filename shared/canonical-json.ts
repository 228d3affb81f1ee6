import canonicalize from "canonicalize";

/**
 * RFC 8785 JSON Canonicalization Scheme (JCS): the one byte form of a JSON value that content hashes and
 * signatures are computed over. Object members are sorted by UTF-16 code units, no whitespace is written, numbers
 * use the ECMAScript shortest round-trip form, strings are escaped minimally.
 *
 * Browser-safe (no Node imports): the client uses it to check a signed summary against its JWS payload.
 *
 * Notes: JSON has no NaN, Infinity, undefined or lone surrogates; those are refused here with a message naming the
 * JSON path, instead of being silently turned into `null` (which would make two different values hash alike).
 */
export class CanonicalJsonError extends Error {
  constructor(
    message: string,
    readonly path: string,
  ) {
    super(`${message} at ${path}`);
    this.name = "CanonicalJsonError";
  }
}

/** Walks the value once to reject what I-JSON (RFC 7493) forbids, with the JSON path of the first offender. */
function assertIJson(value: unknown, path: string, seen: Set<object>): void {
  if (value === undefined) throw new CanonicalJsonError("undefined is not a JSON value", path);
  if (typeof value === "number" && !Number.isFinite(value)) {
    throw new CanonicalJsonError(`${value} is not a JSON number`, path);
  }
  if (typeof value === "bigint" || typeof value === "function" || typeof value === "symbol") {
    throw new CanonicalJsonError(`a ${typeof value} is not a JSON value`, path);
  }
  if (value === null || typeof value !== "object") return;
  if (seen.has(value)) throw new CanonicalJsonError("circular reference", path);
  seen.add(value);
  if (Array.isArray(value)) {
    value.forEach((item, i) => assertIJson(item, `${path}[${i}]`, seen));
  } else if (typeof (value as { toJSON?: unknown }).toJSON !== "function") {
    for (const [key, item] of Object.entries(value)) {
      // An undefined member is omitted, as JSON.stringify does; that is a property of JS objects, not of JSON.
      if (item !== undefined) assertIJson(item, `${path}.${key}`, seen);
    }
  }
  seen.delete(value);
}

/** The RFC 8785 canonical JSON text of `value`. Throws CanonicalJsonError for values JSON cannot hold. */
export function canonicalJson(value: unknown): string {
  assertIJson(value, "$", new Set());
  let text: string | undefined;
  try {
    text = canonicalize(value);
  } catch (cause) {
    throw new CanonicalJsonError(cause instanceof Error ? cause.message : String(cause), "$");
  }
  if (text === undefined) throw new CanonicalJsonError("value has no JSON form", "$");
  return text;
}

/** The UTF-8 bytes of the canonical JSON text (what hashes and signatures cover). */
export function canonicalJsonBytes(value: unknown): Uint8Array {
  return new TextEncoder().encode(canonicalJson(value));
}
