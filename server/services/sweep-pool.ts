import { Worker } from "node:worker_threads";
import type { StudyDocument } from "../../shared/schemas/study.js";
import { threadCpuMs } from "../lib/thread-cpu.js";
import { computeSweep, type ComputedSweep } from "./sweep-compute.js";
import { busyError, cancelledError, closedError, timeoutError } from "./sweep-pool-errors.js";
import type { SweepJob, SweepReply, SweepWorkerReady } from "./sweep-worker.js";
import { engineError, WORKER_BOOTSTRAP, withBuffer } from "./sweep-worker-link.js";

/** The pool's settings (server/config.ts, `STILLSPAN_SWEEP_*`). */
export interface SweepPoolSettings {
  /** Worker threads (sweeps computed at once). */
  readonly workers: number;
  /** Computing time one sweep may use, ms: the worker thread's CPU time from the moment it starts the sweep. */
  readonly computeLimitMs: number;
  /** Sweeps that may wait for a worker, over all users. */
  readonly queueLimit: number;
  /** Sweeps one user may have waiting or running. */
  readonly queuePerUser: number;
  /** Longest a sweep may wait for a worker, ms (also refused up front when the estimated wait is longer). */
  readonly maxWaitMs: number;
  /** Most speeds one sweep may solve (grid and local refinement). */
  readonly maxSolvedSteps: number;
}

/** Who asks, until when the answer is wanted, and whether the full step table is needed. */
interface SweepRequest {
  /** The user the sweep counts against (per-user limit). */
  readonly owner: string;
  /** Aborted when the request is closed: a waiting sweep leaves the queue, a running one is stopped. */
  readonly signal?: AbortSignal;
  readonly table: boolean;
}

interface Job {
  readonly id: number;
  readonly study: StudyDocument;
  readonly request: SweepRequest;
  readonly settle: (outcome: { computed: ComputedSweep } | { error: unknown }) => void;
  waitTimer: NodeJS.Timeout | null;
  slot: Slot | null;
}

interface Slot {
  readonly worker: Worker;
  online: boolean;
  tid: number | null;
  job: Job | null;
  startedAt: number;
  cpuAtStartMs: number | null;
  monitor: NodeJS.Timeout | null;
}

/** Weight of the newest sweep in the running average of sweep durations (wait estimates, Retry-After). */
const AVERAGE_WEIGHT = 0.3;
/** Without CPU times (no /proc), or as a backstop with them: wall time from the start, as a multiple of the limit. */
const WALL_BACKSTOP_FACTOR = 4;

/**
 * Runs stability sweeps off the request thread, in a small pool of worker threads (`sweep-worker.ts`), so one
 * heavy sweep never blocks other users' requests. Created with the app (`createApp`) and closed on shutdown.
 *
 * - Admission: a user may have `queuePerUser` sweeps waiting or running; at most `queueLimit` sweeps wait in
 *   all; a sweep whose estimated wait (running average of recent durations) exceeds `maxWaitMs`, or that has
 *   waited that long, is refused — each a 429 `busy` with a Retry-After.
 * - Compute limit: counted from the moment a worker starts the sweep, in the worker thread's CPU time (Linux
 *   /proc; wall time elsewhere, and as a backstop at 4 × the limit) — so it does not depend on what else runs
 *   or waits. Over it the worker is terminated (a fresh one replaces it) and the caller gets 422 `sweep_timeout`.
 * - Cancellation: when the request's signal aborts, a waiting sweep leaves the queue and a running one's
 *   worker is terminated.
 * - Workers start on first use and hold the process open only while they work. If a worker cannot start (the
 *   tsx loader unusable in worker threads), sweeps run in-process (blocking) and one notice goes to stderr.
 */
export class SweepPool {
  private readonly slots: Slot[] = [];
  private readonly queue: Job[] = [];
  private readonly active = new Set<Job>();
  private nextId = 1;
  private averageMs: number | null = null;
  private workersUnusable = false;
  private closed = false;

  constructor(
    readonly settings: SweepPoolSettings,
    private readonly bootstrap: string = WORKER_BOOTSTRAP,
  ) {}

  /**
   * Computes a sweep in the pool.
   * @param study a study document that passed `studyDocumentSchema`
   * @returns the bounded result and (with `request.table`) the full step table; rejects with an AppError (429
   *   `busy`, 422 `sweep_timeout`, 499 `cancelled`, 503 `shutting_down`) or the engine's error — a
   *   `SweepStepLimitError` past `maxSolvedSteps`
   */
  run(study: StudyDocument, request: SweepRequest): Promise<ComputedSweep> {
    if (this.closed) return Promise.reject(closedError());
    if (request.signal?.aborted) return Promise.reject(cancelledError());
    const mine = [...this.active].filter((j) => j.request.owner === request.owner).length;
    if (mine >= this.settings.queuePerUser) return Promise.reject(busyError("user", this.settings, this.retryAfterS()));
    const idle = this.slots.filter((s) => s.job === null).length + (this.settings.workers - this.slots.length);
    if (this.queue.length >= idle) {
      const waiting = this.queue.length - idle;
      if (waiting >= this.settings.queueLimit) return Promise.reject(busyError("queue", this.settings, this.retryAfterS()));
      const estimate = this.averageMs === null ? 0 : this.averageMs * Math.ceil((waiting + 1) / this.settings.workers);
      if (estimate > this.settings.maxWaitMs) {
        return Promise.reject(busyError("estimate", this.settings, this.retryAfterS(), estimate));
      }
    }
    return new Promise<ComputedSweep>((resolve, reject) => {
      const onAbort = () => this.cancel(job);
      const job: Job = {
        id: this.nextId++,
        study,
        request,
        waitTimer: null,
        slot: null,
        settle: (outcome) => {
          if (!this.active.delete(job)) return;
          if (job.waitTimer) clearTimeout(job.waitTimer);
          request.signal?.removeEventListener("abort", onAbort);
          if ("computed" in outcome) resolve(outcome.computed);
          else reject(outcome.error);
        },
      };
      this.active.add(job);
      request.signal?.addEventListener("abort", onAbort, { once: true });
      job.waitTimer = setTimeout(() => {
        const index = this.queue.indexOf(job);
        if (index >= 0) this.queue.splice(index, 1);
        job.settle({ error: busyError("waited", this.settings, this.retryAfterS()) });
      }, this.settings.maxWaitMs);
      this.queue.push(job);
      this.pump();
    });
  }

  /** Sweeps waiting and running (for logs and tests). */
  stats(): { workers: number; running: number; waiting: number } {
    return { workers: this.slots.length, running: this.slots.filter((s) => s.job).length, waiting: this.queue.length };
  }

  /** Refuses new sweeps, fails waiting and running ones with 503 `shutting_down`, and ends every worker. */
  async close(): Promise<void> {
    this.closed = true;
    for (const job of this.queue.splice(0)) job.settle({ error: closedError() });
    const all = this.slots.splice(0);
    for (const slot of all) this.release(slot)?.settle({ error: closedError() });
    await Promise.all(all.map((s) => s.worker.terminate()));
  }

  private retryAfterS(): number {
    return Math.min(300, Math.max(1, Math.ceil((this.averageMs ?? 5000) / 1000)));
  }

  private cancel(job: Job): void {
    const queued = this.queue.indexOf(job);
    if (queued >= 0) this.queue.splice(queued, 1);
    if (job.slot) this.stop(job.slot, cancelledError());
    else job.settle({ error: cancelledError() });
  }

  private pump(): void {
    while (this.queue.length > 0 && !this.closed) {
      if (this.workersUnusable) {
        this.runInProcess(this.queue.shift()!);
        continue;
      }
      const slot = this.slots.find((s) => s.online && s.job === null);
      if (!slot) {
        const booting = this.slots.filter((s) => !s.online).length;
        for (let b = booting; b < this.queue.length && this.slots.length < this.settings.workers; b++) this.spawn();
        return;
      }
      this.start(slot, this.queue.shift()!);
    }
  }

  private spawn(): void {
    const worker = new Worker(this.bootstrap, { eval: true });
    const slot: Slot = { worker, online: false, tid: null, job: null, startedAt: 0, cpuAtStartMs: null, monitor: null };
    this.slots.push(slot);
    worker.unref();
    worker.on("message", (message: SweepReply | SweepWorkerReady) => {
      if ("ready" in message) {
        slot.online = true;
        slot.tid = message.tid;
        this.pump();
      } else if (slot.job?.id === message.id) {
        this.finished(slot, message);
      }
    });
    worker.on("error", (err) => this.lost(slot, err));
    worker.on("exit", (code) => this.lost(slot, new Error(`the sweep worker stopped (exit code ${code})`)));
  }

  private start(slot: Slot, job: Job): void {
    if (job.waitTimer) clearTimeout(job.waitTimer);
    job.waitTimer = null;
    job.slot = slot;
    slot.job = job;
    slot.startedAt = performance.now();
    slot.cpuAtStartMs = threadCpuMs(slot.tid);
    slot.worker.ref();
    const limit = this.settings.computeLimitMs;
    slot.monitor = setInterval(() => {
      const wallMs = performance.now() - slot.startedAt;
      const cpuMs = threadCpuMs(slot.tid);
      const usedMs = cpuMs !== null && slot.cpuAtStartMs !== null ? cpuMs - slot.cpuAtStartMs : wallMs;
      if (usedMs >= limit || wallMs >= WALL_BACKSTOP_FACTOR * limit) this.stop(slot, timeoutError(limit));
    }, Math.min(100, Math.max(5, Math.floor(limit / 4))));
    const message: SweepJob = { id: job.id, study: job.study, maxSolvedSteps: this.settings.maxSolvedSteps, table: job.request.table };
    slot.worker.postMessage(message);
  }

  private finished(slot: Slot, reply: SweepReply): void {
    const elapsed = performance.now() - slot.startedAt;
    this.averageMs = this.averageMs === null ? elapsed : (1 - AVERAGE_WEIGHT) * this.averageMs + AVERAGE_WEIGHT * elapsed;
    const job = this.release(slot)!;
    if (reply.ok) job.settle({ computed: withBuffer(reply.computed) });
    else job.settle({ error: engineError(reply) });
    this.pump();
  }

  /** Ends a running sweep: its worker is terminated and dropped (a new one starts for the next sweep). */
  private stop(slot: Slot, error: unknown): void {
    const index = this.slots.indexOf(slot);
    if (index >= 0) this.slots.splice(index, 1);
    this.release(slot)?.settle({ error });
    void slot.worker.terminate();
    this.pump();
  }

  /** A worker died (crash, failed start or termination): its sweep fails; one that never started means no workers. */
  private lost(slot: Slot, err: unknown): void {
    const index = this.slots.indexOf(slot);
    if (index < 0) return;
    this.slots.splice(index, 1);
    if (!slot.online && !this.closed) {
      this.workersUnusable = true;
      process.stderr.write(`stillspan: sweep worker threads unavailable (${String(err)}); sweeps run in-process.\n`);
    }
    this.release(slot)?.settle({ error: err });
    this.pump();
  }

  private release(slot: Slot): Job | null {
    if (slot.monitor) clearInterval(slot.monitor);
    slot.monitor = null;
    const job = slot.job;
    slot.job = null;
    if (job) job.slot = null;
    slot.worker.unref();
    return job;
  }

  private runInProcess(job: Job): void {
    try {
      job.settle({ computed: computeSweep(job.study, { maxSolvedSteps: this.settings.maxSolvedSteps, table: job.request.table }) });
    } catch (err) {
      job.settle({ error: err });
    }
  }
}
