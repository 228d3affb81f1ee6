import Plotly from "plotly.js-dist-min";
import { useMemo } from "react";
import createPlotlyComponent from "react-plotly.js/factory";
import type { PlotFigure } from "@/components/ui/plot";

/**
 * The plotly.js wrapper, in a chunk of its own: only `plot.tsx` imports this file, through React.lazy, so the
 * ~1.5 MB plotting library loads the first time a screen draws a plot and never with the first page.
 */
const PlotlyComponent = createPlotlyComponent(Plotly);

/**
 * plotly's own toolbar stays off on every plot: it belongs to the library, not to this product, and it can offer
 * to send a chart's data to an outside charting service — a leak path for confidential design data. Nothing here
 * links to the library's site either. Downloading a figure is our own control (plot-download.tsx).
 */
const CONFIG = {
  displayModeBar: false,
  displaylogo: false,
  showLink: false,
  showSendToCloud: false,
  showEditInChartStudio: false,
  responsive: true,
  scrollZoom: false,
};
const STYLE = { width: "100%", height: "100%" };

export default function PlotImpl({ data, layout }: PlotFigure) {
  // react-plotly redraws when data, layout or config change identity: keep them stable between renders of the
  // parent (a keystroke elsewhere on the page must not redraw every plot).
  const fullLayout = useMemo(() => ({ autosize: true, ...layout }), [layout]);
  // No `useResizeHandler`: plotly's own `responsive` handler already follows the window. react-plotly's handler calls
  // Plots.resize on its element ref, which React clears at unmount before the effect that removes the handler runs —
  // a resize in between (a layout that moves a plot, e.g. across the two-column breakpoint) threw "DOM element
  // provided is null or undefined". plotly's handler skips a detached plot.
  return <PlotlyComponent data={data} layout={fullLayout} config={CONFIG} style={STYLE} />;
}
