/// <reference types="vite/client" />

// plotly.js-dist-min ships no types. Plot components build their React wrapper with
// `createPlotlyComponent(Plotly)` from react-plotly.js/factory (the default entry fails with dist-min).
declare module "plotly.js-dist-min" {
  const Plotly: {
    /** Renders the drawn figure `graph` as an image in the browser and saves it as `<filename>.<format>`. */
    downloadImage(
      graph: HTMLElement,
      options: { format: "png" | "svg" | "jpeg" | "webp"; filename: string; width?: number; height?: number; scale?: number },
    ): Promise<string>;
  };
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
