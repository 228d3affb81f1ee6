/// <reference lib="webworker" />
/**
 * Runs the shared engine off the main thread for the workspace's live preview, so typing stays smooth while a
 * sweep (tens of milliseconds to seconds) computes. One message in, one out; the page terminates the worker
 * when a newer input arrives before the answer.
 */
import { runSweep } from "@shared/engine/run-sweep";
import type { SweepResult } from "@shared/schemas/result";
import type { StudyDocument } from "@shared/schemas/study";

export interface PreviewRequest {
  id: number;
  study: StudyDocument;
}

export type PreviewResponse =
  | { id: number; ok: true; result: SweepResult; elapsedMs: number }
  | { id: number; ok: false; message: string };

self.onmessage = (event: MessageEvent<PreviewRequest>) => {
  const { id, study } = event.data;
  const started = performance.now();
  let response: PreviewResponse;
  try {
    response = { id, ok: true, result: runSweep(study), elapsedMs: performance.now() - started };
  } catch (error) {
    response = { id, ok: false, message: error instanceof Error ? error.message : String(error) };
  }
  (self as unknown as DedicatedWorkerGlobalScope).postMessage(response);
};
