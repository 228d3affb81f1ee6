import { SweepStepLimitError } from "../../shared/engine/core/step-limit-error.js";
import { AppError } from "../errors.js";
import type { SweepPoolSettings } from "./sweep-pool.js";

/** How long, in words: "20 s", "5 ms". */
function formatDuration(ms: number): string {
  return ms >= 1000 ? `${Number((ms / 1000).toPrecision(3))} s` : `${Math.round(ms)} ms`;
}

/**
 * 429 `busy`: the caller's own sweeps are at the per-user limit, the queue is full, the estimated wait is too long,
 * or the sweep waited too long. Nothing was computed; `retryAfterS` goes out as Retry-After.
 */
export function busyError(
  why: "user" | "queue" | "estimate" | "waited",
  settings: SweepPoolSettings,
  retryAfterS: number,
  estimateMs = 0,
): AppError {
  const reason = {
    user: `you already have ${settings.queuePerUser} sweep${settings.queuePerUser === 1 ? "" : "s"} waiting or running (the limit per user)`,
    queue: `${settings.queueLimit} sweep${settings.queueLimit === 1 ? " is" : "s are"} already waiting for a free worker (the limit)`,
    estimate: `the wait for a free worker would be about ${formatDuration(estimateMs)}, longer than the limit of ${formatDuration(settings.maxWaitMs)}`,
    waited: `no worker became free within the limit of ${formatDuration(settings.maxWaitMs)} of waiting`,
  }[why];
  return new AppError(429, "busy", `The server is busy: ${reason}. Nothing was computed or stored; try again in about ${retryAfterS} s.`, {
    details: { reason: why, retryAfterS },
    retryAfterS,
  });
}

/** 422 `sweep_timeout`: the sweep used its computing time (counted from its start in a worker) and was stopped. */
export function timeoutError(limitMs: number): AppError {
  return new AppError(
    422,
    "sweep_timeout",
    `The sweep did not finish within the time limit of ${formatDuration(limitMs)} of computing per sweep (counted from its start) ` +
      "and was stopped; nothing was stored. Use a coarser step or a shorter speed range (or fewer modes).",
  );
}

/** The request was closed before its sweep finished: the sweep was dropped (the status is never seen by a client). */
export function cancelledError(): AppError {
  return new AppError(499, "cancelled", "The request was closed before its sweep finished; the sweep was stopped and nothing was stored.");
}

/** 503 `shutting_down`: the pool is closed. */
export function closedError(): AppError {
  return new AppError(503, "shutting_down", "The server is shutting down; the sweep was not finished. Try again in a moment.", {
    retryAfterS: 5,
  });
}

/**
 * The answer for a sweep that did not produce a result: pool errors pass through; a `SweepStepLimitError` is a
 * 422 `sweep_too_large` naming the limit and `$.sweep.step`; any other engine error a 422 `sweep_failed`.
 * @param suffix appended to the message (e.g. " Nothing was stored.")
 */
export function sweepFailure(err: unknown, suffix = ""): AppError {
  if (err instanceof AppError) return err;
  if (err instanceof SweepStepLimitError) {
    const limit = err.limit.toLocaleString("en-GB");
    return new AppError(
      422,
      "sweep_too_large",
      `The sweep needs more than ${limit} solved speeds, the server's limit per sweep (grid and local refinement together; ` +
        `it was stopped at ${Number(err.reachedAtMps.toFixed(3))} m/s). Use a coarser step ($.sweep.step) or a shorter speed range; ` +
        `the command-line sweep (npm run sweep) has no such limit.${suffix}`,
      {
        cause: err,
        details: [{ path: "$.sweep.step", rule: "max_solved_steps", message: `needs more than ${limit} solved speeds (the limit per sweep)`, limit: err.limit }],
      },
    );
  }
  const message = err instanceof Error ? err.message : String(err);
  return new AppError(422, "sweep_failed", `The sweep could not be computed: ${message}.${suffix}`, { cause: err });
}
