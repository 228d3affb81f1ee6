import { createAeroModel } from "@shared/engine/aero/create-aero-model";
import { DERIVATIVE_NAMES, type StudyAerodynamics } from "@shared/schemas/study";
import { axis, baseLayout, token } from "@/components/ui/plot-theme";
import type { PlotFigure } from "@/components/ui/plot";

const SAMPLES = 120;

/**
 * Small multiples of H1*..A4* against reduced velocity: the table's points, the interpolation the engine will
 * use (evaluated through the same model), dotted where it holds the table's end values, and the tested range
 * shaded. Theoretical models are drawn as curves over Ur 1–20.
 */
export function aeroFigure(aerodynamics: StudyAerodynamics): PlotFigure {
  const model = createAeroModel(aerodynamics);
  const range = model.reducedVelocityRange;
  const lo = range ? Math.max(0.2, range[0] * 0.6) : 1;
  const hi = range ? range[1] * 1.3 : 20;
  const ur = Array.from({ length: SAMPLES }, (_, i) => lo + ((hi - lo) * i) / (SAMPLES - 1));
  const values = ur.map((u) => model.derivatives((2 * Math.PI) / u));
  const line = token("--color-tide-600");
  const data: Record<string, unknown>[] = [];
  const shapes: Record<string, unknown>[] = [];
  const annotations: Record<string, unknown>[] = [];

  DERIVATIVE_NAMES.forEach((name, i) => {
    const axisSuffix = i === 0 ? "" : String(i + 1);
    const xaxis = `x${axisSuffix}`;
    const yaxis = `y${axisSuffix}`;
    const inside = (u: number) => !range || (u >= range[0] && u <= range[1]);
    const series = (keep: (u: number) => boolean, dash: string, showInHover: boolean) => ({
      type: "scatter",
      mode: "lines",
      x: ur.map((u) => (keep(u) ? u : null)),
      y: values.map((v, k) => (keep(ur[k]) ? v[name] : null)),
      xaxis,
      yaxis,
      line: { color: line, width: 1.6, dash },
      hoverinfo: showInHover ? "x+y" : "skip",
      showlegend: false,
      connectgaps: false,
    });
    data.push(series(inside, "solid", true));
    if (range) {
      data.push(series((u) => u <= range[0], "dot", false));
      data.push(series((u) => u >= range[1], "dot", false));
      if (aerodynamics.model === "tabulated") {
        const column = aerodynamics[name];
        data.push({
          type: "scatter",
          mode: "markers",
          x: aerodynamics.reducedVelocity,
          y: column ?? aerodynamics.reducedVelocity.map(() => 0),
          xaxis,
          yaxis,
          marker: { size: 5, color: token("--color-ink-900") },
          hovertemplate: `Ur %{x}<br>${name}* %{y}<extra>table</extra>`,
          showlegend: false,
        });
      }
      shapes.push({
        type: "rect",
        xref: xaxis,
        yref: `${yaxis} domain`,
        x0: range[0],
        x1: range[1],
        y0: 0,
        y1: 1,
        fillcolor: token("--color-tide-100"),
        opacity: 0.45,
        line: { width: 0 },
        layer: "below",
      });
    }
    shapes.push({
      type: "line",
      xref: `${xaxis} domain`,
      yref: yaxis,
      x0: 0,
      x1: 1,
      y0: 0,
      y1: 0,
      line: { color: token("--color-ink-400"), width: 1 },
      layer: "below",
    });
    annotations.push({
      text: `${name}*`,
      xref: `${xaxis} domain`,
      yref: `${yaxis} domain`,
      x: 0,
      y: 1,
      xanchor: "left",
      yanchor: "bottom",
      showarrow: false,
      font: { size: 12, color: token("--color-ink-900") },
    });
  });

  const layout: Record<string, unknown> = baseLayout({
    grid: { rows: 2, columns: 4, pattern: "independent", xgap: 0.14, ygap: 0.3 },
    margin: { l: 36, r: 8, t: 18, b: 30 },
    shapes,
    annotations,
    hovermode: "closest",
  });
  DERIVATIVE_NAMES.forEach((_, i) => {
    const suffix = i === 0 ? "" : String(i + 1);
    layout[`xaxis${suffix}`] = axis(i >= 4 ? "Ur" : "", { tickfont: { size: 10 }, nticks: 5 });
    layout[`yaxis${suffix}`] = axis("", { tickfont: { size: 10 }, nticks: 5, zeroline: false });
  });
  return { data, layout };
}
