/**
 * One chart of the HTML report: a Vega-Lite specification (plain JSON, rendered to SVG in Node by
 * renderChartSvg) with the title and note the page prints above it. The chart builders
 * (simulationCharts, retryCharts, supervisionCharts, sizingCharts) return these; tests read the
 * data in `spec` to check that what is drawn is what the simulation reported.
 * Source: the Vega-Lite 6 specification format (the vega-lite package's own documentation).
 */
export interface ReportChart {
  /** a stable name, also the SVG's id on the page ("temperature", "worst-event", ...) */
  readonly id: string;
  readonly title: string;
  /** one or two sentences under the title: what is drawn and how to read it */
  readonly note: string;
  /** the Vega-Lite specification (data inline) */
  readonly spec: Readonly<Record<string, unknown>>;
}

/** A time unit for an axis: its name and its length [s]. */
export interface AxisTimeUnit {
  readonly name: "ms" | "s" | "min" | "h" | "d";
  readonly seconds: number;
}

/**
 * The unit that shows a time span with readable numbers on an axis: ms below 2 s, s below
 * 2 min, min below 2 h, h below 2 d, else d (common practice).
 */
export function axisTimeUnit(spanS: number): AxisTimeUnit {
  if (spanS < 2) return { name: "ms", seconds: 1e-3 };
  if (spanS < 120) return { name: "s", seconds: 1 };
  if (spanS < 7200) return { name: "min", seconds: 60 };
  if (spanS < 2 * 86400) return { name: "h", seconds: 3600 };
  return { name: "d", seconds: 86400 };
}

/** Chart size [px] shared by every report chart. */
export const REPORT_CHART_SIZE = { width: 760, height: 260 } as const;

/** A Vega-Lite quantitative field encoding: `{ field, type: "quantitative", title?, ...extra }`. */
export function quantitativeField(field: string, title?: string, extra: Readonly<Record<string, unknown>> = {}): Record<string, unknown> {
  return { field, type: "quantitative", ...(title === undefined ? {} : { title }), ...extra };
}
