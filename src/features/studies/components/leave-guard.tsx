import { useEffect } from "react";
import { useBlocker } from "react-router-dom";
import { Button } from "@/components/ui/button";

/**
 * Keeps unsaved edits from being lost by accident: leaving the study for another screen asks first (in the
 * page), and closing or reloading the tab triggers the browser's own question.
 */
export function LeaveGuard({ when, what }: { when: boolean; what: string }) {
  const blocker = useBlocker(({ currentLocation, nextLocation }) => when && currentLocation.pathname !== nextLocation.pathname);

  useEffect(() => {
    if (!when) return;
    const onBeforeUnload = (event: BeforeUnloadEvent) => {
      event.preventDefault();
    };
    window.addEventListener("beforeunload", onBeforeUnload);
    return () => window.removeEventListener("beforeunload", onBeforeUnload);
  }, [when]);

  if (blocker.state !== "blocked") return null;
  return (
    <div className="fixed inset-0 z-40 flex items-start justify-center bg-ink-950/30 pt-24" role="presentation">
      <div
        role="alertdialog"
        aria-modal="true"
        aria-labelledby="leave-guard-title"
        aria-describedby="leave-guard-text"
        className="w-full max-w-md rounded-lg border border-ink-200 bg-surface p-4 shadow-panel"
        onKeyDown={(event) => event.key === "Escape" && blocker.reset()}
      >
        <h2 id="leave-guard-title" className="text-lg font-semibold">Leave without saving?</h2>
        <p id="leave-guard-text" className="mt-1 text-ink-800">{what} Save them as a revision first, or leave and lose them.</p>
        <div className="mt-4 flex justify-end gap-2">
          <Button autoFocus variant="secondary" onClick={() => blocker.reset()}>Stay and keep editing</Button>
          <Button variant="danger" onClick={() => blocker.proceed()}>Leave</Button>
        </div>
      </div>
    </div>
  );
}
