import type { ErrorRequestHandler, Request, RequestHandler } from "express";
import { ZodError } from "zod";
import { clipValue } from "../../shared/message-bounds.js";
import { AppError, zodIssues } from "../errors.js";
import type { Logger } from "../logger.js";

/** Body of every error response: `{ error: { code, message, details? } }`. */
export interface ErrorBody {
  error: { code: string; message: string; details?: unknown };
}

/** Where a request went, for the log: method and path, never the query string (it may carry user data). */
const requestPath = (req: Request) => clipValue(req.originalUrl.split("?")[0], 300);

export const apiNotFound: RequestHandler = (req, _res, next) => {
  next(new AppError(404, "not_found", `No API route ${req.method} ${req.baseUrl}${req.path}.`));
};

/** The single error middleware: maps known errors to JSON, logs the rest, never sends a stack trace. */
export function errorHandler(logger: Logger): ErrorRequestHandler {
  return (err, req, res, next) => {
    if (res.headersSent) return next(err);
    const send = (status: number, error: ErrorBody["error"]) => res.status(status).json({ error } satisfies ErrorBody);

    if (err instanceof AppError) {
      if (err.status >= 500) logger.error({ err, method: req.method, path: requestPath(req) }, clipValue(err.message, 300));
      if (err.retryAfterS !== undefined) res.setHeader("Retry-After", String(err.retryAfterS));
      return send(err.status, { code: err.code, message: err.message, details: err.details });
    }
    if (err instanceof ZodError) {
      const details = zodIssues(err);
      const summary = details.map((d) => `${d.path}: ${d.message}`).join("; ");
      return send(400, { code: "invalid_input", message: `Invalid input — ${summary}`, details });
    }
    // body-parser errors carry `type` and `status`.
    const type = (err as { type?: string }).type;
    if (type === "entity.parse.failed") {
      return send(400, { code: "malformed_json", message: "The request body is not valid JSON." });
    }
    if (type === "entity.too.large") {
      return send(413, { code: "body_too_large", message: "The request body is larger than the 1 MB limit." });
    }
    const status = (err as { status?: number }).status;
    if (typeof status === "number" && status >= 400 && status < 500) {
      return send(status, { code: "bad_request", message: clipValue((err as Error).message || "Bad request.", 300) });
    }
    logger.error({ err, method: req.method, path: requestPath(req) }, "unhandled error");
    return send(500, { code: "internal", message: "Something went wrong on the server. The error was logged." });
  };
}
