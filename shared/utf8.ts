/**
 * Strict UTF-8 decoding for everything a client sends as text (JSON bodies, multipart fields, CSV and study
 * files): invalid bytes are refused with their position, never replaced by U+FFFD and stored.
 */

export type Utf8Result = { ok: true; text: string } | { ok: false; offset: number; line: number; byte: number };

/** Line number (1-based) of byte `offset` in `bytes`. */
export function lineOfByte(bytes: Uint8Array, offset: number): number {
  let line = 1;
  for (let i = 0; i < offset && i < bytes.length; i++) if (bytes[i] === 0x0a) line++;
  return line;
}

/** Offset of the first byte that is not part of a valid UTF-8 sequence (the input is known to be invalid). */
function firstInvalidUtf8(bytes: Uint8Array): number {
  const decoder = new TextDecoder("utf-8", { fatal: true });
  let lo = 0;
  let hi = bytes.length;
  // Binary search on the longest valid prefix; a cut inside a multi-byte sequence is tolerated by `stream`.
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    try {
      decoder.decode(bytes.subarray(0, mid), { stream: true });
      decoder.decode();
      lo = mid;
    } catch {
      hi = mid;
    }
  }
  return lo;
}

/** Decodes `bytes` as UTF-8 (a leading BOM is dropped); on invalid bytes, the offset, line and value of the first one. */
export function decodeUtf8Strict(bytes: Uint8Array): Utf8Result {
  try {
    return { ok: true, text: new TextDecoder("utf-8", { fatal: true }).decode(bytes) };
  } catch {
    const offset = firstInvalidUtf8(bytes);
    return { ok: false, offset, line: lineOfByte(bytes, offset), byte: bytes[offset] ?? 0 };
  }
}

/** "byte 0x96 at line 3" — where a decoding failed, for messages. */
export function describeUtf8Error(error: { line: number; byte: number }): string {
  return `byte 0x${error.byte.toString(16).padStart(2, "0")} at line ${error.line}`;
}
