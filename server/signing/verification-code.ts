import { sha256Hex } from "../lib/hash.js";

/**
 * A short code that identifies one signed summary by eye: the first 12 hex digits of SHA-256 over the compact
 * JWS text, in groups of four ("3f9a-07c2-b1e4"). Printed on the PDF and shown on the summary page so a reader can
 * match a paper copy to the verified record; it is not a signature and proves nothing on its own.
 */
export function verificationCode(jws: string): string {
  return sha256Hex(jws).slice(0, 12).match(/.{4}/g)!.join("-");
}
