/**
 * The short verification code of a signed summary, computed with Web Crypto so the browser shows the same code as
 * the PDF: the first 12 hex digits of SHA-256 over the compact JWS text, in groups of four ("3f9a-07c2-b1e4").
 * It identifies a signed summary by eye; it is not a signature and proves nothing on its own.
 */
export async function verificationCodeOf(jws: string): Promise<string> {
  const digest = new Uint8Array(await globalThis.crypto.subtle.digest("SHA-256", new TextEncoder().encode(jws)));
  const hex = Array.from(digest.slice(0, 6), (b) => b.toString(16).padStart(2, "0")).join("");
  return `${hex.slice(0, 4)}-${hex.slice(4, 8)}-${hex.slice(8, 12)}`;
}
