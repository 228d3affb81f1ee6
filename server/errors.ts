import type { ZodError } from "zod";
import { capList, clipValue } from "../shared/message-bounds.js";

/**
 * The one error type the server throws on purpose. `status` is the HTTP status, `code` a stable machine-readable
 * word the client can switch on, `message` a sentence safe to show the user, `details` optional structured data
 * (for example the list of invalid fields).
 */
export class AppError extends Error {
  readonly status: number;
  readonly code: string;
  readonly details?: unknown;
  /** Seconds after which a retry may succeed, sent as the Retry-After header (429, 503). */
  readonly retryAfterS?: number;

  constructor(
    status: number,
    code: string,
    message: string,
    options?: { cause?: unknown; details?: unknown; retryAfterS?: number },
  ) {
    super(message, options?.cause === undefined ? undefined : { cause: options.cause });
    this.name = "AppError";
    this.status = status;
    this.code = code;
    this.details = options?.details;
    this.retryAfterS = options?.retryAfterS;
  }

  static badRequest(message: string, details?: unknown): AppError {
    return new AppError(400, "bad_request", message, { details });
  }
  static unauthorized(message = "Sign in to continue."): AppError {
    return new AppError(401, "unauthorized", message);
  }
  static forbidden(message = "Your role on this project does not allow this."): AppError {
    return new AppError(403, "forbidden", message);
  }
  static notFound(what = "Resource"): AppError {
    return new AppError(404, "not_found", `${what} not found.`);
  }
  static conflict(message: string, details?: unknown): AppError {
    return new AppError(409, "conflict", message, { details });
  }
}

/**
 * One line per invalid field: its path, the rule it broke and the message (the `details` of a 400) — at most 50
 * lines, each path and message clipped, so an answer never repeats a huge input (zod quotes unknown keys).
 */
export function zodIssues(err: ZodError): { path: string; rule: string; message: string }[] {
  const issues = err.issues.map((i) => ({
    path: i.path.length ? clipValue(i.path.join("."), 200) : "(body)",
    rule: i.code,
    message: clipValue(i.message, 300),
  }));
  return capList(issues, (count) => ({ path: "(body)", rule: "more", message: `… and ${count} more problems` }));
}

/**
 * A problem the person starting a command can fix (a busy port, a missing setting): its message is one sentence
 * saying what to do, printed as it is — never with a stack trace.
 */
export class StartupError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "StartupError";
  }
}
