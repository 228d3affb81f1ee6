import { isUtf8 } from "node:buffer";
import type { IncomingMessage, ServerResponse } from "node:http";
import { decodeUtf8Strict, describeUtf8Error } from "../../shared/utf8.js";
import { AppError } from "../errors.js";

/** 400 `invalid_utf8` naming `what` (its `path` in the details: "(body)" or the field) and the first bad byte. */
function invalidUtf8(what: string, path: string, bytes: Uint8Array): AppError {
  const decoded = decodeUtf8Strict(bytes);
  const where = decoded.ok ? "" : `: ${describeUtf8Error(decoded)}`;
  const message = `is not valid UTF-8${where}`;
  return new AppError(400, "invalid_utf8", `${what} ${message}. Send text as UTF-8; nothing was stored.`, {
    details: [{ path, rule: "utf8", message, ...(decoded.ok ? {} : { line: decoded.line, offset: decoded.offset }) }],
  });
}

/**
 * `verify` hook of express.json: a body with bytes that are not UTF-8 is refused with 400, instead of being
 * decoded with U+FFFD in their place and stored (the study import already refused the same bytes in a file).
 */
export function refuseInvalidUtf8Body(_req: IncomingMessage, _res: ServerResponse, body: Buffer): void {
  if (!isUtf8(body)) throw invalidUtf8("The request body", "(body)", body);
}

/**
 * Multipart text fields arrive as Latin-1 (multer's `defCharset`), i.e. one character per byte, so their bytes
 * can be checked here and decoded strictly; a field that is not UTF-8 is refused with its name. Nested fields
 * (`a[b]`, built by multer from bracketed names) are walked too.
 */
export function decodeLatin1FieldsAsUtf8(fields: unknown, name = ""): unknown {
  if (typeof fields === "string") {
    const bytes = Buffer.from(fields, "latin1");
    if (!isUtf8(bytes)) throw invalidUtf8(`The field "${name}"`, name, bytes);
    return bytes.toString("utf8");
  }
  if (Array.isArray(fields)) return fields.map((v, i) => decodeLatin1FieldsAsUtf8(v, `${name}[${i}]`));
  if (typeof fields === "object" && fields !== null) {
    const out: Record<string, unknown> = Object.create(null);
    for (const [key, value] of Object.entries(fields)) out[key] = decodeLatin1FieldsAsUtf8(value, name ? `${name}[${key}]` : key);
    return out;
  }
  return fields;
}
