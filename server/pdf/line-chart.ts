/**
 * A small vector line chart drawn with pdfkit primitives from the same figure data the browser's plots draw
 * (shared/figures/figure-data.ts): frame, grid, ticks with "nice" steps, an optional zero line, one polyline per
 * series clipped to the plot area (broken where a value is missing), vertical markers (critical speeds, each
 * labelled by what it is) and a legend. Vector lines keep the PDF small and sharp at any zoom.
 */
import type PDFDocument from "pdfkit";
import { extent } from "../../shared/extent.js";
import type { FigureMarker, FigureSeries, LineFigureData } from "../../shared/figures/figure-data.js";

type Doc = InstanceType<typeof PDFDocument>;

export interface LineChartSpec {
  x: number;
  y: number;
  width: number;
  height: number;
  title: string;
  figure: LineFigureData;
  seriesColor: (series: FigureSeries) => string;
  markerColor: (marker: FigureMarker) => string;
  fonts: { regular: string; bold: string };
}

const AXIS = "#28474e";
const GRID = "#dfe7e8";
const MUTED = "#51727a";

/** Tick step of 1, 2 or 5 × 10^n giving about `count` intervals over `span`. */
export function niceStep(span: number, count = 5): number {
  if (!(span > 0)) return 1;
  const raw = span / count;
  const power = 10 ** Math.floor(Math.log10(raw));
  const unit = raw / power;
  return (unit < 1.5 ? 1 : unit < 3 ? 2 : unit < 7 ? 5 : 10) * power;
}

/** Axis limits widened to whole ticks, and the ticks. */
export function niceAxis(min: number, max: number, count = 5): { min: number; max: number; ticks: number[] } {
  if (min === max) {
    const pad = Math.abs(min) > 0 ? Math.abs(min) * 0.1 : 1;
    [min, max] = [min - pad, max + pad];
  }
  const step = niceStep(max - min, count);
  const lo = Math.floor(min / step + 1e-9) * step;
  const hi = Math.ceil(max / step - 1e-9) * step;
  const ticks: number[] = [];
  for (let t = lo; t <= hi + step * 1e-6; t += step) ticks.push(Math.abs(t) < step * 1e-9 ? 0 : t);
  return { min: lo, max: hi, ticks };
}

function tickLabel(value: number, step: number): string {
  const decimals = Math.max(0, -Math.floor(Math.log10(step) + 1e-9));
  return value.toFixed(decimals);
}

export function drawLineChart(doc: Doc, spec: LineChartSpec): void {
  const { x, y, width, height, fonts, figure } = spec;
  const plot = { left: x + 46, top: y + 18, right: x + width - 8, bottom: y + height - 46 };
  const all = figure.series.flatMap((s) => s.points);
  const xs = [...all.map((p) => p[0]), ...figure.markers.map((m) => m.x)];
  const ys = all.flatMap((p) => (p[1] === null ? [] : [p[1]]));
  const xRange = extent(xs);
  const yData = extent(ys);
  const xAxis = niceAxis(xs.length ? xRange.min : 0, xs.length ? xRange.max : 1, 6);
  const yAxis = figure.yRange
    ? niceAxis(figure.yRange[0], figure.yRange[1], 5)
    : niceAxis(ys.length ? yData.min : 0, ys.length ? yData.max : 1, 5);
  const px = (v: number) => plot.left + ((v - xAxis.min) / (xAxis.max - xAxis.min)) * (plot.right - plot.left);
  const py = (v: number) => plot.bottom - ((v - yAxis.min) / (yAxis.max - yAxis.min)) * (plot.bottom - plot.top);

  doc.save();
  doc.font(fonts.bold).fontSize(9).fillColor(AXIS).text(spec.title, x, y, { width, lineBreak: false });

  // Grid and ticks
  doc.lineWidth(0.4).strokeColor(GRID);
  for (const t of xAxis.ticks) doc.moveTo(px(t), plot.top).lineTo(px(t), plot.bottom).stroke();
  for (const t of yAxis.ticks) doc.moveTo(plot.left, py(t)).lineTo(plot.right, py(t)).stroke();
  doc.font(fonts.regular).fontSize(7).fillColor(MUTED);
  const xStep = xAxis.ticks[1] - xAxis.ticks[0];
  const yStep = yAxis.ticks[1] - yAxis.ticks[0];
  for (const t of xAxis.ticks) {
    doc.text(tickLabel(t, xStep), px(t) - 20, plot.bottom + 4, { width: 40, align: "center", lineBreak: false });
  }
  for (const t of yAxis.ticks) {
    doc.text(tickLabel(t, yStep), plot.left - 44, py(t) - 3.5, { width: 40, align: "right", lineBreak: false });
  }
  doc.lineWidth(0.6).strokeColor(AXIS);
  for (const t of xAxis.ticks) doc.moveTo(px(t), plot.bottom).lineTo(px(t), plot.bottom + 3).stroke();
  for (const t of yAxis.ticks) doc.moveTo(plot.left - 3, py(t)).lineTo(plot.left, py(t)).stroke();
  doc.rect(plot.left, plot.top, plot.right - plot.left, plot.bottom - plot.top).stroke();

  // Axis titles
  doc.fontSize(8).fillColor(AXIS);
  const centred = { align: "center", lineBreak: false } as const;
  doc.text(figure.xLabel, plot.left, plot.bottom + 14, { ...centred, width: plot.right - plot.left });
  doc.save();
  doc.rotate(-90, { origin: [x + 6, (plot.top + plot.bottom) / 2] });
  doc.text(figure.yLabel, x + 6 - 80, (plot.top + plot.bottom) / 2 - 4, { ...centred, width: 160 });
  doc.restore();

  // Data, clipped to the plot
  doc.save();
  doc.rect(plot.left, plot.top, plot.right - plot.left, plot.bottom - plot.top).clip();
  if (figure.zeroLine && yAxis.min < 0 && yAxis.max > 0) {
    doc.lineWidth(0.8).strokeColor(AXIS).moveTo(plot.left, py(0)).lineTo(plot.right, py(0)).stroke();
  }
  for (const s of figure.series) {
    doc.lineWidth(1.1).strokeColor(spec.seriesColor(s)).lineJoin("round");
    let drawing = false;
    let segment = 0;
    for (const [vx, vy] of s.points) {
      if (vy === null) {
        if (drawing && segment > 1) doc.stroke();
        drawing = false;
        continue;
      }
      if (!drawing) {
        doc.moveTo(px(vx), py(vy));
        drawing = true;
        segment = 1;
      } else {
        doc.lineTo(px(vx), py(vy));
        segment++;
      }
    }
    if (drawing && segment > 1) doc.stroke();
  }
  for (const m of figure.markers) {
    doc.lineWidth(0.9).strokeColor(spec.markerColor(m)).dash(3, { space: 2 });
    doc.moveTo(px(m.x), plot.top).lineTo(px(m.x), plot.bottom).stroke();
    doc.undash();
  }
  doc.restore();
  figure.markers.forEach((m, i) => {
    const right = px(m.x) > (plot.left + plot.right) / 2;
    doc.font(fonts.bold).fontSize(7);
    // one label row per marker, so labels of close critical speeds never overlap; a light box keeps them legible
    const labelWidth = doc.widthOfString(m.label);
    const labelX = right ? px(m.x) - 4 - labelWidth : px(m.x) + 4;
    doc.rect(labelX - 1.5, plot.top + 2 + 9 * i, labelWidth + 3, 9).fillOpacity(0.85).fill("#ffffff").fillOpacity(1);
    doc.fillColor(spec.markerColor(m));
    doc.text(m.label, right ? px(m.x) - 164 : px(m.x) + 4, plot.top + 3 + 9 * i, {
      width: 160,
      align: right ? "right" : "left",
      lineBreak: false,
    });
  });

  // Legend under the axis title
  let lx = plot.left;
  doc.font(fonts.regular).fontSize(7);
  for (const s of figure.series) {
    doc.lineWidth(1.4).strokeColor(spec.seriesColor(s)).moveTo(lx, plot.bottom + 33).lineTo(lx + 14, plot.bottom + 33).stroke();
    doc.fillColor(AXIS).text(s.name, lx + 17, plot.bottom + 29.5, { lineBreak: false });
    lx += 17 + doc.widthOfString(s.name) + 12;
  }
  doc.restore();
}
