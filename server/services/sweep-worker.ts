import { parentPort } from "node:worker_threads";
import { runSweep, type SweepOptions } from "../../shared/engine/run-sweep.js";
import type { StudyDocument } from "../../shared/schemas/study.js";

/** One job of the sweep pool (`sweep-pool.ts`): a validated study document and optional sweep overrides. */
export interface SweepJob {
  readonly id: number;
  readonly study: StudyDocument;
  readonly options?: SweepOptions;
}

export type SweepReply =
  | { readonly id: number; readonly ok: true; readonly result: ReturnType<typeof runSweep> }
  | { readonly id: number; readonly ok: false; readonly name: string; readonly message: string };

// Runs in a worker thread: each message is one sweep; the answer is the result or the engine's error message.
parentPort?.on("message", (job: SweepJob) => {
  let reply: SweepReply;
  try {
    reply = { id: job.id, ok: true, result: runSweep(job.study, job.options) };
  } catch (err) {
    reply = {
      id: job.id,
      ok: false,
      name: err instanceof Error ? err.name : "Error",
      message: err instanceof Error ? err.message : String(err),
    };
  }
  parentPort!.postMessage(reply);
});

// Tells the pool that the module (and the TypeScript loader) works in this thread.
parentPort?.postMessage({ ready: true });
