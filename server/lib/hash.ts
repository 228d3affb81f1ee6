import { createHash } from "node:crypto";
import { canonicalJsonBytes } from "../../shared/canonical-json.js";

/** Lower-case hex SHA-256 of a string (UTF-8) or of bytes. */
export function sha256Hex(data: string | Uint8Array): string {
  return createHash("sha256").update(data).digest("hex");
}

/** SHA-256 over the RFC 8785 canonical JSON bytes of `value`: the content hash of a study document or summary. */
export function canonicalSha256Hex(value: unknown): string {
  return sha256Hex(canonicalJsonBytes(value));
}
