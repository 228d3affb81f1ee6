import { useState, type RefObject } from "react";
import { Button } from "@/components/ui/button";

type ImageFormat = "png" | "svg";

/** The drawn plotly figure inside `container`: its graph element, which plotly renders and exports. */
function graphIn(container: HTMLElement | null): HTMLElement | null {
  return container?.querySelector<HTMLElement>(".js-plotly-plot") ?? null;
}

/**
 * Our own small control under a result plot: the figure as PNG (twice the screen resolution) or SVG, drawn in the
 * browser by plotly's image export — nothing is sent anywhere. plotly is already loaded once the figure is drawn.
 */
export function PlotDownload({ figure, fileName, what }: { figure: RefObject<HTMLElement | null>; fileName: string; what: string }) {
  const [busy, setBusy] = useState<ImageFormat | null>(null);
  const [failed, setFailed] = useState(false);
  const download = async (format: ImageFormat) => {
    const graph = graphIn(figure.current);
    if (!graph) return;
    setBusy(format);
    setFailed(false);
    try {
      const { default: Plotly } = await import("plotly.js-dist-min");
      await Plotly.downloadImage(graph, { format, filename: fileName, scale: format === "png" ? 2 : 1 });
    } catch {
      setFailed(true);
    } finally {
      setBusy(null);
    }
  };
  return (
    <div role="group" aria-label={`Download ${what}`} className="mt-1 flex items-center justify-end gap-1 text-xs text-ink-600">
      {failed ? <span role="alert">The image could not be made; the numbers are in the table.</span> : null}
      <span aria-hidden="true">Download</span>
      {(["png", "svg"] as const).map((format) => (
        <Button
          key={format}
          size="sm"
          variant="ghost"
          className="h-6 px-1.5 text-xs"
          isLoading={busy === format}
          aria-label={`Download ${what} as ${format.toUpperCase()}`}
          onClick={() => void download(format)}
        >
          {format.toUpperCase()}
        </Button>
      ))}
    </div>
  );
}
