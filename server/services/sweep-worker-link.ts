import { createRequire } from "node:module";
import { pathToFileURL } from "node:url";
import { SweepStepLimitError } from "../../shared/engine/core/step-limit-error.js";
import type { ComputedSweep } from "./sweep-compute.js";
import type { SweepReply } from "./sweep-worker.js";

// The pool's side of the link to its worker threads (`sweep-worker.ts`): how a worker starts, and how its
// replies become values and errors of this thread.

/**
 * `--import tsx` in a worker's execArgv does not reach the worker's own entry module on Node 20 ("Unknown file
 * extension .ts"), so the worker starts from this small script that registers tsx's loader through its API and
 * then imports the TypeScript module.
 */
export const WORKER_BOOTSTRAP = `
import(${JSON.stringify(pathToFileURL(createRequire(import.meta.url).resolve("tsx/esm/api")).href.replace(/\.cjs$/, ".mjs"))})
  .then(({ register }) => { register(); return import(${JSON.stringify(new URL("./sweep-worker.ts", import.meta.url).href)}); });
`;

/** The table's bytes arrive as a plain Uint8Array; the server works with Buffers. */
export function withBuffer(computed: ComputedSweep): ComputedSweep {
  const table = computed.table;
  if (!table) return computed;
  return { ...computed, table: { ...table, gzip: Buffer.from(table.gzip.buffer, table.gzip.byteOffset, table.gzip.byteLength) } };
}

/** The engine's error as the worker reported it: a SweepStepLimitError keeps its class and limit, others their name. */
export function engineError(reply: Extract<SweepReply, { ok: false }>): Error {
  if (reply.stepLimit) return new SweepStepLimitError(reply.stepLimit.limit, reply.stepLimit.reachedAtMps);
  const err = reply.name === "RangeError" ? new RangeError(reply.message) : new Error(reply.message);
  if (reply.name !== "RangeError" && reply.name !== "Error") err.name = reply.name;
  return err;
}
