import { readlinkSync } from "node:fs";
import { parentPort } from "node:worker_threads";
import { SweepStepLimitError } from "../../shared/engine/core/step-limit-error.js";
import type { StudyDocument } from "../../shared/schemas/study.js";
import { computeSweep, type ComputedSweep } from "./sweep-compute.js";

/** One job of the sweep pool (`sweep-pool.ts`): a validated study document and how to compute it. */
export interface SweepJob {
  readonly id: number;
  readonly study: StudyDocument;
  readonly maxSolvedSteps: number;
  readonly table: boolean;
}

export type SweepReply =
  | { readonly id: number; readonly ok: true; readonly computed: ComputedSweep }
  | {
      readonly id: number;
      readonly ok: false;
      readonly name: string;
      readonly message: string;
      /** For a SweepStepLimitError: the limit and the last speed solved. */
      readonly stepLimit?: { readonly limit: number; readonly reachedAtMps: number };
    };

/** What the worker says once it is loaded: `tid` is its Linux thread id (for its CPU time), null elsewhere. */
export interface SweepWorkerReady {
  readonly ready: true;
  readonly tid: number | null;
}

function threadId(): number | null {
  try {
    const tid = Number(readlinkSync("/proc/thread-self").split("/").pop());
    return Number.isInteger(tid) && tid > 0 ? tid : null;
  } catch {
    return null;
  }
}

/** The table's bytes as an ArrayBuffer of their own, so they move to the pool's thread without a copy there. */
function transferable(computed: ComputedSweep): ArrayBuffer[] {
  const bytes = computed.table?.gzip;
  if (!bytes) return [];
  if (bytes.byteOffset === 0 && bytes.byteLength === bytes.buffer.byteLength && bytes.buffer instanceof ArrayBuffer) return [bytes.buffer];
  const own = new Uint8Array(bytes);
  (computed.table as { gzip: Uint8Array }).gzip = own;
  return [own.buffer];
}

// Runs in a worker thread: each message is one sweep; the answer is the computed sweep or the engine's error.
parentPort?.on("message", (job: SweepJob) => {
  let reply: SweepReply;
  let transfer: ArrayBuffer[] = [];
  try {
    const computed = computeSweep(job.study, { maxSolvedSteps: job.maxSolvedSteps, table: job.table });
    transfer = transferable(computed);
    reply = { id: job.id, ok: true, computed };
  } catch (err) {
    reply = {
      id: job.id,
      ok: false,
      name: err instanceof Error ? err.name : "Error",
      message: err instanceof Error ? err.message : String(err),
      stepLimit: err instanceof SweepStepLimitError ? { limit: err.limit, reachedAtMps: err.reachedAtMps } : undefined,
    };
  }
  parentPort!.postMessage(reply, transfer);
});

// Tells the pool that the module (and the TypeScript loader) works in this thread, and which thread it is.
parentPort?.postMessage({ ready: true, tid: threadId() } satisfies SweepWorkerReady);
