/// <reference types="vite/client" />

// plotly.js-dist-min ships no types. Plot components build their React wrapper with
// `createPlotlyComponent(Plotly)` from react-plotly.js/factory (the default entry fails with dist-min).
declare module "plotly.js-dist-min" {
  const Plotly: object;
  export default Plotly;
}

declare module "react-plotly.js/factory" {
  import type { ComponentType, CSSProperties } from "react";

  export interface PlotProps {
    data: ReadonlyArray<Record<string, unknown>>;
    layout?: Record<string, unknown>;
    config?: Record<string, unknown>;
    frames?: ReadonlyArray<Record<string, unknown>>;
    style?: CSSProperties;
    className?: string;
    useResizeHandler?: boolean;
    revision?: number;
    onHover?: (event: unknown) => void;
    onUnhover?: (event: unknown) => void;
    onClick?: (event: unknown) => void;
    onRelayout?: (event: unknown) => void;
    onInitialized?: (figure: unknown, graphDiv: HTMLElement) => void;
    onUpdate?: (figure: unknown, graphDiv: HTMLElement) => void;
  }

  export default function createPlotlyComponent(plotly: object): ComponentType<PlotProps>;
}
