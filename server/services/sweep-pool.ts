import { createRequire } from "node:module";
import { pathToFileURL } from "node:url";
import { Worker } from "node:worker_threads";
import { runSweep, type SweepOptions } from "../../shared/engine/run-sweep.js";
import type { SweepResult } from "../../shared/schemas/result.js";
import type { StudyDocument } from "../../shared/schemas/study.js";
import { AppError } from "../errors.js";
import type { SweepJob, SweepReply } from "./sweep-worker.js";

/**
 * Runs stability sweeps off the request thread, in a small pool of worker threads (`sweep-worker.ts`, loaded
 * through tsx like the rest of the server), so one heavy sweep never blocks other users' requests.
 *
 * - Pool size: `STILLSPAN_SWEEP_WORKERS` (default 2, for the 2-core host; at least 1). Workers start on first use
 *   and hold the process open only while they work.
 * - Time limit per sweep: `STILLSPAN_SWEEP_TIMEOUT_MS` (default 20 000 ms), counted from the moment a worker takes
 *   the job. On expiry the worker is terminated (and replaced on the next job) and the caller gets a 422
 *   `sweep_timeout` naming the limit.
 * - Fallback: if a worker cannot start (the tsx loader unusable in worker threads), the sweep runs in-process
 *   (blocking, without the time limit) and a one-line notice goes to stderr.
 * The result is exactly `runSweep`'s (structured clone of plain numbers, strings and arrays).
 */

const DEFAULT_TIMEOUT_MS = 20_000;
const DEFAULT_WORKERS = 2;

function envInt(name: string, fallback: number, min: number): number {
  const raw = process.env[name];
  if (raw === undefined || raw.trim() === "") return fallback;
  const value = Number(raw);
  return Number.isInteger(value) && value >= min ? value : fallback;
}

/** The time limit per sweep, read at each call so tests and operators can change it. */
export function sweepTimeoutMs(): number {
  return envInt("STILLSPAN_SWEEP_TIMEOUT_MS", DEFAULT_TIMEOUT_MS, 1);
}

interface Pending {
  readonly job: SweepJob;
  readonly resolve: (result: SweepResult) => void;
  readonly reject: (err: unknown) => void;
}

interface Slot {
  worker: Worker;
  busy: Pending | null;
  timer: NodeJS.Timeout | null;
  online: boolean;
}

/**
 * `--import tsx` in a worker's execArgv does not reach the worker's own entry module on Node 20 ("Unknown file
 * extension .ts"), so the worker starts from this small script that registers tsx's loader through its API and
 * then imports the TypeScript module.
 */
const WORKER_BOOTSTRAP = `
import(${JSON.stringify(pathToFileURL(createRequire(import.meta.url).resolve("tsx/esm/api")).href.replace(/\.cjs$/, ".mjs"))})
  .then(({ register }) => { register(); return import(${JSON.stringify(new URL("./sweep-worker.ts", import.meta.url).href)}); });
`;

const slots: Slot[] = [];
const queue: Pending[] = [];
let nextId = 1;
let workersUnusable = false;

function spawn(): Slot {
  const worker = new Worker(WORKER_BOOTSTRAP, { eval: true });
  const slot: Slot = { worker, busy: null, timer: null, online: false };
  worker.unref();
  worker.on("message", (reply: SweepReply | { readonly ready: true }) => {
    if ("ready" in reply) {
      slot.online = true;
      return;
    }
    const job = slot.busy;
    if (!job || job.job.id !== reply.id) return;
    finish(slot);
    if (reply.ok) job.resolve(reply.result);
    else job.reject(engineError(reply.name, reply.message));
    pump();
  });
  worker.on("error", (err) => fail(slot, err));
  worker.on("exit", (code) => fail(slot, new Error(`the sweep worker stopped (exit code ${code})`)));
  return slot;
}

function engineError(name: string, message: string): Error {
  const err = name === "RangeError" ? new RangeError(message) : new Error(message);
  if (name !== "RangeError" && name !== "Error") err.name = name;
  return err;
}

function finish(slot: Slot): void {
  if (slot.timer) clearTimeout(slot.timer);
  slot.timer = null;
  slot.busy = null;
  slot.worker.unref();
}

/** A worker died (crash, failed start or termination): drop it; its job fails or, if it never started, runs in-process. */
function fail(slot: Slot, err: unknown): void {
  const index = slots.indexOf(slot);
  if (index < 0) return;
  slots.splice(index, 1);
  const job = slot.busy;
  const neverStarted = !slot.online;
  finish(slot);
  if (neverStarted) {
    workersUnusable = true;
    process.stderr.write(`stillspan: sweep worker threads unavailable (${String(err)}); sweeps run in-process.\n`);
  }
  if (job) {
    if (neverStarted) runInProcess(job);
    else job.reject(err);
  }
  pump();
}

function runInProcess(p: Pending): void {
  try {
    p.resolve(runSweep(p.job.study, p.job.options));
  } catch (err) {
    p.reject(err);
  }
}

function pump(): void {
  while (queue.length > 0) {
    if (workersUnusable) {
      runInProcess(queue.shift()!);
      continue;
    }
    let slot = slots.find((s) => s.busy === null);
    if (!slot) {
      if (slots.length >= envInt("STILLSPAN_SWEEP_WORKERS", DEFAULT_WORKERS, 1)) return;
      slot = spawn();
      slots.push(slot);
    }
    const p = queue.shift()!;
    const limit = sweepTimeoutMs();
    slot.busy = p;
    slot.worker.ref();
    const s = slot;
    s.timer = setTimeout(() => {
      slots.splice(slots.indexOf(s), 1);
      finish(s);
      void s.worker.terminate();
      p.reject(
        new AppError(
          422,
          "sweep_timeout",
          `The sweep did not finish within the time limit of ${formatSeconds(limit)} per sweep and was stopped; ` +
            "nothing was stored. Use a coarser step or a shorter speed range (or fewer modes).",
        ),
      );
      pump();
    }, limit);
    slot.worker.postMessage(p.job);
  }
}

function formatSeconds(ms: number): string {
  return ms >= 1000 ? `${Number((ms / 1000).toPrecision(3))} s` : `${ms} ms`;
}

/**
 * Runs `runSweep(study, options)` in the worker pool.
 * @param study a study document that passed `studyDocumentSchema`
 * @returns the same result as `runSweep`; rejects with the engine's error (RangeError etc.) or a 422 AppError
 *   `sweep_timeout` when the time limit is exceeded
 */
export function runSweepInPool(study: StudyDocument, options?: SweepOptions): Promise<SweepResult> {
  return new Promise<SweepResult>((resolve, reject) => {
    queue.push({ job: { id: nextId++, study, options }, resolve, reject });
    pump();
  });
}

/** Terminates every worker (tests, shutdown); queued jobs stay queued and start new workers when pumped. */
export async function closeSweepPool(): Promise<void> {
  const all = slots.splice(0, slots.length);
  for (const s of all) {
    const job = s.busy;
    finish(s);
    job?.reject(new Error("the sweep pool was closed"));
  }
  await Promise.all(all.map((s) => s.worker.terminate()));
}
