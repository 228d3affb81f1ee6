import { Component, lazy, Suspense, type ReactNode } from "react";
import { Spinner } from "@/components/ui/spinner";
import { cn } from "@/lib/cn";

export interface PlotFigure {
  data: ReadonlyArray<Record<string, unknown>>;
  layout: Record<string, unknown>;
  showModeBar?: boolean;
}

interface PlotProps extends PlotFigure {
  /** Fixed height in px: the space is held while plotly loads, so nothing below jumps. */
  height: number;
  /** What the plot shows, for screen readers (the numbers are also in the tables beside each plot). */
  label: string;
  className?: string;
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

/** A plotly figure loaded on first use, in a box of fixed height with its own loading and error states. */
export function Plot({ height, label, className, ...figure }: PlotProps) {
  return (
    <div role="figure" aria-label={label} className={cn("relative w-full", className)} style={{ height }}>
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
  );
}
