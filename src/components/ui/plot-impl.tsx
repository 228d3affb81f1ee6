import Plotly from "plotly.js-dist-min";
import { useMemo } from "react";
import createPlotlyComponent from "react-plotly.js/factory";
import type { PlotFigure } from "@/components/ui/plot";

/**
 * The plotly.js wrapper, in a chunk of its own: only `plot.tsx` imports this file, through React.lazy, so the
 * ~1.5 MB plotting library loads the first time a screen draws a plot and never with the first page.
 */
const PlotlyComponent = createPlotlyComponent(Plotly);

const BASE_CONFIG = {
  displaylogo: false,
  responsive: true,
  scrollZoom: false,
  modeBarButtonsToRemove: ["select2d", "lasso2d", "toggleSpikelines"],
  toImageButtonOptions: { format: "png", scale: 2 },
};
const CONFIG_WITH_MODE_BAR = { ...BASE_CONFIG, displayModeBar: "hover" };
const CONFIG_WITHOUT_MODE_BAR = { ...BASE_CONFIG, displayModeBar: false };
const STYLE = { width: "100%", height: "100%" };

export default function PlotImpl({ data, layout, showModeBar }: PlotFigure) {
  // react-plotly redraws when data, layout or config change identity: keep them stable between renders of the
  // parent (a keystroke elsewhere on the page must not redraw every plot).
  const fullLayout = useMemo(() => ({ autosize: true, ...layout }), [layout]);
  return (
    <PlotlyComponent
      data={data}
      layout={fullLayout}
      config={showModeBar ? CONFIG_WITH_MODE_BAR : CONFIG_WITHOUT_MODE_BAR}
      useResizeHandler
      style={STYLE}
    />
  );
}
