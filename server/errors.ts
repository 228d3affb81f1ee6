/**
 * The one error type the server throws on purpose. `status` is the HTTP status, `code` a stable machine-readable
 * word the client can switch on, `message` a sentence safe to show the user, `details` optional structured data
 * (for example the list of invalid fields).
 */
export class AppError extends Error {
  readonly status: number;
  readonly code: string;
  readonly details?: unknown;

  constructor(status: number, code: string, message: string, options?: { cause?: unknown; details?: unknown }) {
    super(message, options?.cause === undefined ? undefined : { cause: options.cause });
    this.name = "AppError";
    this.status = status;
    this.code = code;
    this.details = options?.details;
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
 * A problem the person starting a command can fix (a busy port, a missing setting): its message is one sentence
 * saying what to do, printed as it is — never with a stack trace.
 */
export class StartupError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "StartupError";
  }
}
