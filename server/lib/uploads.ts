import type { RequestHandler } from "express";
import multer from "multer";
import { quoteValue } from "../../shared/message-bounds.js";
import { textProblem } from "../../shared/schemas/input-rules.js";
import { AppError } from "../errors.js";
import { decodeLatin1FieldsAsUtf8 } from "./strict-utf8.js";

const MB = 1024 * 1024;

/**
 * Multipart upload of one file part `field` (kept in memory: files here are small and go straight into
 * PostgreSQL) plus a few short text fields. Multer's limit errors become 413/400 with a sentence naming the limit.
 * Text fields are read as Latin-1 (byte for byte) and then decoded as strict UTF-8, so bytes that are not UTF-8
 * are refused (400 `invalid_utf8`) instead of being replaced by U+FFFD and stored.
 */
export function uploadOne(field: string, maxBytes: number): RequestHandler {
  const handler = multer({
    storage: multer.memoryStorage(),
    limits: { fileSize: maxBytes, files: 1, fields: 8, fieldSize: 64 * 1024, parts: 10 },
    defCharset: "latin1",
  } as multer.Options).single(field);
  return (req, res, next) => {
    handler(req, res, (err: unknown) => {
      if (!err) {
        try {
          req.body = decodeLatin1FieldsAsUtf8(req.body ?? {});
        } catch (decodeError) {
          return next(decodeError);
        }
        return next();
      }
      if (err instanceof multer.MulterError) {
        if (err.code === "LIMIT_FILE_SIZE") {
          const limit = maxBytes >= MB ? `${maxBytes / MB} MB` : `${Math.round(maxBytes / 1024)} kB`;
          return next(new AppError(413, "file_too_large", `The file is larger than the ${limit} limit. Nothing was stored.`));
        }
        if (err.code === "LIMIT_UNEXPECTED_FILE") {
          return next(AppError.badRequest(`Unexpected file part ${quoteValue(err.field ?? "")}: send the file as the part "${field}".`));
        }
        return next(AppError.badRequest(`The upload was refused: ${err.message}.`));
      }
      // Anything else the multipart parser throws is about the body it was sent ("Malformed part header",
      // "Unexpected end of form"): the client's fault, not a server error.
      const message = err instanceof Error ? err.message : String(err);
      next(new AppError(400, "malformed_multipart", `The multipart body could not be read: ${quoteValue(message)}. Nothing was stored.`));
    });
  };
}

/**
 * The uploaded file of a request that went through `uploadOne`, or a 400 saying how to send it. The file name is
 * stored and shown, so it follows the text rule of every other text field (no NUL, no unpaired surrogate).
 */
export function requireFile<F extends { buffer: Buffer; originalname?: string }>(file: F | undefined, field: string): F {
  if (!file) {
    throw AppError.badRequest(`Send the file as multipart/form-data with the part "${field}".`);
  }
  const problem = textProblem(file.originalname ?? "");
  if (problem) {
    throw AppError.badRequest(`The file name of the part "${field}" ${problem}.`, [{ path: `${field}.filename`, rule: "custom", message: problem }]);
  }
  return file;
}
