import { useEffect, useRef, useState } from "react";
import type { SweepResult } from "@shared/schemas/result";
import type { StudyDocument } from "@shared/schemas/study";
import type { PreviewRequest, PreviewResponse } from "@/features/studies/utils/sweep-preview.worker";

export type PreviewState =
  | { status: "idle" }
  | { status: "computing"; previous: SweepResult | null }
  /** `elapsedMs` null: the inputs are those of a stored result, shown as is. */
  | { status: "done"; result: SweepResult; elapsedMs: number | null }
  | { status: "error"; message: string };

const DEBOUNCE_MS = 300;

function createWorker(): Worker {
  return new Worker(new URL("../utils/sweep-preview.worker.ts", import.meta.url), { type: "module" });
}

/**
 * The browser-side preview of a study's sweep: debounced, computed in a Web Worker by the shared engine. A
 * newer document replaces a computation still running (its worker is terminated, so a slow sweep never queues
 * behind itself). `study` must be a valid document, or null to pause (e.g. while the form has errors); `key`
 * identifies the document's content so unchanged renders do not restart the work.
 */
export function useSweepPreview(
  study: StudyDocument | null,
  key: string,
  known?: { key: string; result: SweepResult },
): PreviewState {
  const [state, setState] = useState<PreviewState>(() =>
    known && known.key === key ? { status: "done", result: known.result, elapsedMs: null } : { status: "idle" },
  );
  const workerRef = useRef<{ worker: Worker; busy: boolean } | null>(null);
  const lastResult = useRef<SweepResult | null>(null);
  const sequence = useRef(0);

  useEffect(() => {
    if (!study) return;
    const id = ++sequence.current;
    if (known && known.key === key) {
      lastResult.current = known.result;
      setState({ status: "done", result: known.result, elapsedMs: null });
      return;
    }
    const timer = window.setTimeout(() => {
      let slot = workerRef.current;
      if (slot?.busy) {
        slot.worker.terminate();
        slot = null;
      }
      if (!slot) {
        slot = { worker: createWorker(), busy: false };
        workerRef.current = slot;
      }
      const current = slot;
      current.busy = true;
      setState({ status: "computing", previous: lastResult.current });
      current.worker.onmessage = (event: MessageEvent<PreviewResponse>) => {
        current.busy = false;
        const data = event.data;
        if (data.id !== sequence.current) return;
        if (data.ok) {
          lastResult.current = data.result;
          setState({ status: "done", result: data.result, elapsedMs: data.elapsedMs });
        } else {
          setState({ status: "error", message: data.message });
        }
      };
      current.worker.onerror = (event) => {
        current.busy = false;
        event.preventDefault();
        if (id === sequence.current) setState({ status: "error", message: event.message || "The preview worker failed." });
      };
      current.worker.postMessage({ id, study } satisfies PreviewRequest);
    }, DEBOUNCE_MS);
    return () => window.clearTimeout(timer);
    // `key` stands for the document's content; `study` changes identity on every render.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [key]);

  useEffect(() => () => workerRef.current?.worker.terminate(), []);

  return state;
}
