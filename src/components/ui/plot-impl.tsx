import Plotly from "plotly.js-dist-min";
import createPlotlyComponent from "react-plotly.js/factory";
import type { PlotFigure } from "@/components/ui/plot";

/**
 * The plotly.js wrapper, in a chunk of its own: only `plot.tsx` imports this file, through React.lazy, so the
 * ~1.5 MB plotting library loads the first time a screen draws a plot and never with the first page.
 */
const PlotlyComponent = createPlotlyComponent(Plotly);

const CONFIG = {
  displaylogo: false,
  responsive: true,
  scrollZoom: false,
  modeBarButtonsToRemove: ["select2d", "lasso2d", "toggleSpikelines"],
  toImageButtonOptions: { format: "png", scale: 2 },
};

export default function PlotImpl({ data, layout, showModeBar }: PlotFigure) {
  return (
    <PlotlyComponent
      data={data}
      layout={{ autosize: true, ...layout }}
      config={{ ...CONFIG, displayModeBar: showModeBar ? "hover" : false }}
      useResizeHandler
      style={{ width: "100%", height: "100%" }}
    />
  );
}
