/**
 * Plot styling from the theme tokens in src/index.css (emitted as custom properties), so plots share the
 * product's palette. Series colours: a calm qualitative set that keeps the warm signal colour for instability.
 */
const FALLBACK: Record<string, string> = {
  "--color-ink-900": "#12262b",
  "--color-ink-700": "#28474e",
  "--color-ink-600": "#3d5f66",
  "--color-ink-400": "#7f9a9e",
  "--color-ink-200": "#cfdcdd",
  "--color-ink-100": "#e4ecec",
  "--color-surface": "#fcfcfa",
  "--color-signal-600": "#b0461a",
  "--color-signal-700": "#8c3110",
  "--color-signal-50": "#fcf1ea",
  "--color-tide-600": "#14737b",
  "--color-tide-100": "#d5ecec",
  "--color-caution-100": "#f6ebc9",
};

export function token(name: string): string {
  if (typeof window === "undefined") return FALLBACK[name] ?? "#000";
  const value = getComputedStyle(document.documentElement).getPropertyValue(name).trim();
  return value || FALLBACK[name] || "#000";
}

/** One colour per mode / series, in order; distinguishable for common colour-vision deficiencies. */
export const SERIES_COLOURS = ["#14737b", "#6b4fa0", "#b8860b", "#3d6fb6", "#2f7550", "#8a5a44"] as const;

export function seriesColour(index: number): string {
  return SERIES_COLOURS[index % SERIES_COLOURS.length];
}

/** Axis styling: thin ink lines, light grid, the label with its unit. */
export function axis(title: string, extra: Record<string, unknown> = {}): Record<string, unknown> {
  return {
    title: { text: title, font: { size: 12, color: token("--color-ink-700") }, standoff: 6 },
    gridcolor: token("--color-ink-100"),
    linecolor: token("--color-ink-400"),
    zerolinecolor: token("--color-ink-200"),
    tickfont: { size: 11, color: token("--color-ink-600") },
    ticks: "outside",
    ticklen: 3,
    tickcolor: token("--color-ink-400"),
    automargin: true,
    ...extra,
  };
}

/** The base layout of every plot: transparent paper, the product's font, compact margins. */
export function baseLayout(extra: Record<string, unknown> = {}): Record<string, unknown> {
  return {
    paper_bgcolor: "rgba(0,0,0,0)",
    plot_bgcolor: token("--color-surface"),
    font: { family: '"Source Sans 3", "Segoe UI", system-ui, sans-serif', size: 12, color: token("--color-ink-900") },
    margin: { l: 52, r: 12, t: 10, b: 40 },
    hoverlabel: { font: { family: '"Source Sans 3", system-ui, sans-serif', size: 12 }, bgcolor: "#ffffff" },
    legend: { orientation: "h", x: 0, y: 1.02, yanchor: "bottom", font: { size: 11 } },
    hovermode: "closest",
    ...extra,
  };
}
