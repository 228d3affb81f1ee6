import { Component, lazy, Suspense, useRef, type ReactNode } from "react";
import { PlotDownload } from "@/components/ui/plot-download";
import { Spinner } from "@/components/ui/spinner";
import { cn } from "@/lib/cn";

export interface PlotFigure {
  data: ReadonlyArray<Record<string, unknown>>;
  layout: Record<string, unknown>;
}

interface PlotProps extends PlotFigure {
  /** Fixed height in px: the space is held while plotly loads, so nothing below jumps. */
  height: number;
  /** What the plot shows, for screen readers (the numbers are also in the tables beside each plot). */
  label: string;
  className?: string;
  /** Offers the figure as PNG and SVG under this file name (without extension); result plots set it. */
  downloadName?: string;
}

const PlotImpl = lazy(() => import("@/components/ui/plot-impl"));

class PlotErrorBoundary extends Component<{ children: ReactNode }, { failed: boolean }> {
  override state = { failed: false };
  static getDerivedStateFromError() {
    return { failed: true };
  }
  override render() {
    if (this.state.failed) {
      return (
        <p className="flex h-full items-center justify-center text-sm text-ink-600">
          The plot could not be drawn. Reload the page to try again; the numbers are in the table.
        </p>
      );
    }
    return this.props.children;
  }
}

/**
 * A plotly figure loaded on first use, in a box of fixed height with its own loading and error states. The box
 * clips: while plotly re-lays a figure out after a resize, the figure never widens the page.
 */
export function Plot({ height, label, className, downloadName, ...figure }: PlotProps) {
  const box = useRef<HTMLDivElement>(null);
  return (
    <div className={cn("w-full", className)}>
      <div ref={box} role="figure" aria-label={label} className="relative w-full overflow-hidden" style={{ height }}>
        <PlotErrorBoundary>
          <Suspense
            fallback={
              <div className="flex h-full items-center justify-center gap-2 text-sm text-ink-600">
                <Spinner size="sm" label={null} /> Loading the plot…
              </div>
            }
          >
            <PlotImpl {...figure} />
          </Suspense>
        </PlotErrorBoundary>
      </div>
      {downloadName ? <PlotDownload figure={box} fileName={downloadName} what={label.charAt(0).toLowerCase() + label.slice(1)} /> : null}
    </div>
  );
}
