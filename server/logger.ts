import pino from "pino";

/** Longest string property of a logged error (message, stack, SQL text) — a log line stays a few kB. */
const MAX_LOGGED_CHARS = 2000;
/** Error properties worth logging; anything else (Drizzle's `params`, body-parser's `body`) may hold user data in full. */
const LOGGED_ERROR_FIELDS = ["code", "status", "severity", "detail", "constraint", "table", "column", "routine", "query"] as const;

const clip = (text: string) =>
  text.length <= MAX_LOGGED_CHARS ? text : `${text.slice(0, MAX_LOGGED_CHARS)}… (${text.length} characters)`;

/**
 * The `err` serializer of every logger: type, message, stack and a few diagnostic fields, each clipped, and the
 * cause chain (three deep). Never the query parameters or the request body: a failed INSERT of a study with its
 * result once wrote 30 MB to the log for one request.
 */
export function serializeError(err: unknown, depth = 0): Record<string, unknown> {
  if (!(err instanceof Error)) return { message: clip(String(err)) };
  const out: Record<string, unknown> = { type: err.name, message: clip(err.message) };
  const fields = err as unknown as Record<string, unknown>;
  for (const key of LOGGED_ERROR_FIELDS) {
    const value = fields[key];
    if (typeof value === "string") out[key] = clip(value);
    else if (typeof value === "number" || typeof value === "boolean") out[key] = value;
  }
  // The stack's first line repeats the message (with Drizzle, the SQL parameters): keep only the frames.
  if (err.stack) out.stack = clip(err.stack.split("\n").filter((line) => /^\s+at /.test(line)).slice(0, 20).join("\n"));
  if (err.cause !== undefined && depth < 3) out.cause = serializeError(err.cause, depth + 1);
  return out;
}

/**
 * A logger with the project's settings: JSON lines, level from LOG_LEVEL (default "info"; "warn" in tests), and
 * the bounded error serializer. `destination` is for tests that measure what a request writes.
 */
export function createLogger(options: { level?: string; destination?: pino.DestinationStream } = {}) {
  const settings: pino.LoggerOptions = {
    level: options.level ?? process.env.LOG_LEVEL ?? (process.env.STILLSPAN_TEST === "1" ? "warn" : "info"),
    base: { app: "stillspan" },
    serializers: { err: (err: unknown) => serializeError(err) },
  };
  return options.destination ? pino(settings, options.destination) : pino(settings);
}

/** One process-wide logger. */
export const logger = createLogger();

export type Logger = typeof logger;
