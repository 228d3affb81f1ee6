import type { RequestHandler } from "express";
import multer from "multer";
import { AppError } from "../errors.js";

const MB = 1024 * 1024;

/**
 * Multipart upload of one file part `field` (kept in memory: files here are small and go straight into
 * PostgreSQL) plus a few short text fields. Multer's limit errors become 413/400 with a sentence naming the limit.
 */
export function uploadOne(field: string, maxBytes: number): RequestHandler {
  const handler = multer({
    storage: multer.memoryStorage(),
    limits: { fileSize: maxBytes, files: 1, fields: 8, fieldSize: 64 * 1024, parts: 10 },
  }).single(field);
  return (req, res, next) => {
    handler(req, res, (err: unknown) => {
      if (!err) return next();
      if (err instanceof multer.MulterError) {
        if (err.code === "LIMIT_FILE_SIZE") {
          const limit = maxBytes >= MB ? `${maxBytes / MB} MB` : `${Math.round(maxBytes / 1024)} kB`;
          return next(new AppError(413, "file_too_large", `The file is larger than the ${limit} limit. Nothing was stored.`));
        }
        if (err.code === "LIMIT_UNEXPECTED_FILE") {
          return next(AppError.badRequest(`Unexpected file part "${err.field}": send the file as the part "${field}".`));
        }
        return next(AppError.badRequest(`The upload was refused: ${err.message}.`));
      }
      next(err);
    });
  };
}

/** The uploaded file of a request that went through `uploadOne`, or a 400 saying how to send it. */
export function requireFile<F extends { buffer: Buffer }>(file: F | undefined, field: string): F {
  if (!file) {
    throw AppError.badRequest(`Send the file as multipart/form-data with the part "${field}".`);
  }
  return file;
}
