/** A multipart/form-data body built byte by byte, for what FormData cannot send (bytes that are not UTF-8, a NUL in a file name). */
import type { ApiResponse } from "./http.js";

export interface RawPart {
  name: string;
  /** Raw bytes of the Content-Disposition filename parameter (written as is, between quotes). */
  filename?: Uint8Array | string;
  /** The RFC 5987 form `filename*=<value>` instead (e.g. "UTF-8''a%00b.csv"). */
  filenameStar?: string;
  type?: string;
  bytes: Uint8Array | string;
}

const bytesOf = (value: Uint8Array | string) => (typeof value === "string" ? Buffer.from(value, "utf8") : Buffer.from(value));

export async function postRawMultipart<T = any>(
  url: string,
  parts: RawPart[],
  options: { cookie?: string; method?: string } = {},
): Promise<ApiResponse<T>> {
  const boundary = `----stillspan-test-${Date.now().toString(36)}`;
  const chunks: Buffer[] = [];
  for (const part of parts) {
    chunks.push(Buffer.from(`--${boundary}\r\nContent-Disposition: form-data; name="${part.name}"`));
    if (part.filename !== undefined) chunks.push(Buffer.from('; filename="'), bytesOf(part.filename), Buffer.from('"'));
    if (part.filenameStar !== undefined) chunks.push(Buffer.from(`; filename*=${part.filenameStar}`));
    chunks.push(Buffer.from(`\r\n${part.type ? `Content-Type: ${part.type}\r\n` : ""}\r\n`), bytesOf(part.bytes), Buffer.from("\r\n"));
  }
  chunks.push(Buffer.from(`--${boundary}--\r\n`));
  const headers: Record<string, string> = { Accept: "application/json", "Content-Type": `multipart/form-data; boundary=${boundary}` };
  if (options.cookie) headers.Cookie = options.cookie;
  const res = await fetch(url, { method: options.method ?? "POST", headers, body: Buffer.concat(chunks) });
  const text = await res.text();
  const body = (res.headers.get("content-type") ?? "").includes("application/json") && text ? JSON.parse(text) : text;
  return { status: res.status, headers: res.headers, body: body as T };
}
