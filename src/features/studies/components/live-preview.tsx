import { useMemo } from "react";
import { Plot } from "@/components/ui/plot";
import { Spinner } from "@/components/ui/spinner";
import type { PreviewState } from "@/features/studies/hooks/use-sweep-preview";
import { dampingFigure } from "@/features/studies/utils/result-figures";

/**
 * The damping curves computed in this browser as the inputs change — a guide while editing. The numbers that
 * count (stored, compared, signed) always come from the server's run.
 */
export function LivePreview({ state, blockedReason }: { state: PreviewState; blockedReason: string | null }) {
  const result = state.status === "done" ? state.result : state.status === "computing" ? state.previous : null;
  const figure = useMemo(() => {
    if (!result) return null;
    const f = dampingFigure([{ name: "Preview", result, assessment: null }]);
    // The legend names the branches (which curve is heave, which torsion); it sits above the plot area.
    return { ...f, layout: { ...f.layout, margin: { l: 44, r: 8, t: 24, b: 34 }, showlegend: true } };
  }, [result]);

  let line: React.ReactNode;
  if (blockedReason) line = <span className="text-caution-700">Paused: {blockedReason}</span>;
  else if (state.status === "error") line = <span className="text-signal-700">The preview failed: {state.message}</span>;
  else if (state.status === "computing" || state.status === "idle") line = <span className="inline-flex items-center gap-1.5"><Spinner size="sm" label={null} /> Computing…</span>;
  else {
    const flutter = state.result.flutter;
    line = (
      <>
        <span data-testid="preview-flutter" className="num font-semibold">
          {flutter ? `flutter ≈ ${flutter.speed.toFixed(2)} m/s at ${flutter.frequency.toFixed(3)} Hz` : "no flutter in the sweep"}
        </span>
        <span className="num ml-2 text-xs text-ink-600">
          {state.elapsedMs === null ? "the stored result; edits recompute it here" : `${Math.round(state.elapsedMs)} ms in this browser`}
        </span>
      </>
    );
  }

  return (
    <div className="space-y-1">
      <p className="min-h-6 text-sm" aria-live="polite">{line}</p>
      {figure ? (
        <Plot {...figure} height={190} label="Preview of the damping ratio against wind speed" />
      ) : (
        <div className="h-[190px] rounded-md bg-ink-50" aria-hidden="true" />
      )}
    </div>
  );
}
