import { gzipSync } from "node:zlib";
import { runSweep } from "../../shared/engine/run-sweep.js";
import type { SweepResult } from "../../shared/schemas/result.js";
import type { StudyDocument } from "../../shared/schemas/study.js";
import { decimateResult } from "../lib/decimate-result.js";
import { stepsCsvChunks } from "../lib/steps-table.js";

/** The full step table of a sweep, gzip-compressed CSV (`server/lib/steps-table.ts`). */
export interface StepsTable {
  readonly gzip: Uint8Array;
  /** Branch ids in column order. */
  readonly branchIds: readonly string[];
  /** Data rows (every solved step of every branch). */
  readonly rows: number;
}

/** A sweep as the server keeps and answers it: the bounded result and, when asked for, the full table. */
export interface ComputedSweep {
  readonly result: SweepResult;
  readonly table: StepsTable | null;
}

interface ComputeOptions {
  /** Most speeds the sweep may solve (`runSweep`'s `maxSolvedSteps`); none when absent. */
  readonly maxSolvedSteps?: number;
  /** Build the full step table too (stored revisions and downloads). */
  readonly table: boolean;
}

/**
 * Runs the sweep and shapes it for the server: the result thinned by `decimateResult` and, on request, every
 * solved step as gzip CSV. Heavy (the sweep, the CSV and its compression): runs in a sweep worker thread.
 */
export function computeSweep(study: StudyDocument, options: ComputeOptions): ComputedSweep {
  const full = runSweep(study, { maxSolvedSteps: options.maxSolvedSteps });
  let table: StepsTable | null = null;
  if (options.table) {
    const csv = Array.from(stepsCsvChunks(full, 5000)).join("");
    table = {
      gzip: gzipSync(Buffer.from(csv, "utf8")),
      branchIds: full.modes.map((m) => m.id),
      rows: full.modes.reduce((sum, m) => sum + m.steps.length, 0),
    };
  }
  return { result: decimateResult(full), table };
}

/**
 * How a service asks for a sweep (with or without its full step table); the route binds it to the app's pool,
 * the caller and the request's life (`server/lib/request-sweeps.ts`).
 */
export type RunSweep = (study: StudyDocument, options: { readonly table: boolean }) => Promise<ComputedSweep>;

/**
 * Runs sweeps on the calling thread, without limits: for the demo seed at start-up (small, known studies) and
 * tools, never for requests.
 */
export const runSweepInProcess: RunSweep = async (study, { table }) => computeSweep(study, { table });
