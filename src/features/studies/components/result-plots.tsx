import { useMemo } from "react";
import { Card } from "@/components/ui/card";
import { Plot } from "@/components/ui/plot";
import { samplingNote } from "@/lib/sampling-note";
import { dampingFigure, frequencyFigure, polePathFigure, type PlotRun } from "@/features/studies/utils/result-figures";

/** The pole paths and the frequency and damping curves of one result (or several overlaid). */
export function ResultPlots({ runs, dimmed = false }: { runs: readonly PlotRun[]; dimmed?: boolean }) {
  const figures = useMemo(
    () => ({ poles: polePathFigure(runs), frequency: frequencyFigure(runs), damping: dampingFigure(runs) }),
    [runs],
  );
  const what = runs.length > 1 ? runs.map((r) => r.name).join(", ") : "the sweep";
  const notes = runs.flatMap((r) => {
    const note = samplingNote(r.result.sampling);
    return note ? [runs.length > 1 ? `${r.name}: ${note}` : note] : [];
  });
  return (
    <div className={dimmed ? "opacity-60 transition-opacity" : "transition-opacity"}>
      <div className="grid gap-4">
        <Card title="Pole paths" subtitle="Re λ against Im λ; markers grow with wind speed; right of the heavy axis a pole grows">
          <Plot {...figures.poles} height={330} label={`Pole paths in the complex plane for ${what}`} downloadName="pole-paths" />
        </Card>
        <div className="grid gap-4 xl:grid-cols-2">
          <Card title="Damping ratio" subtitle="ζ against U; below zero the motion grows">
            <Plot {...figures.damping} height={250} label={`Damping ratio against wind speed for ${what}`} downloadName="damping-ratio" />
          </Card>
          <Card title="Frequency" subtitle="f against U">
            <Plot {...figures.frequency} height={250} label={`Frequency against wind speed for ${what}`} downloadName="frequency" />
          </Card>
        </div>
        {notes.map((note) => (
          <p key={note} className="text-sm text-ink-600">{note}</p>
        ))}
      </div>
    </div>
  );
}
