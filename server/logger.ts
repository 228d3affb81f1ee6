import pino from "pino";

/**
 * One process-wide logger. JSON lines in production; level from LOG_LEVEL (default "info", "silent" in tests
 * unless LOG_LEVEL says otherwise).
 */
export const logger = pino({
  level: process.env.LOG_LEVEL ?? (process.env.STILLSPAN_TEST === "1" ? "warn" : "info"),
  base: { app: "stillspan" },
});

export type Logger = typeof logger;
