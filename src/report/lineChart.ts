import asciichart from "asciichart";
import { formatDuration, formatNumber } from "../text/formatTable.js";

/** One curve of a chart: points (x ascending) and a label for the legend. */
export interface ChartSeries {
  readonly label: string;
  readonly points: readonly { readonly x: number; readonly y: number }[];
}

/** Options of {@link lineChart}; every field has a default. */
export interface LineChartOptions {
  /** total width in terminal columns (default 80) */
  readonly width?: number;
  /** plot height in rows (default 12) */
  readonly height?: number;
  /** horizontal reference lines, e.g. a temperature limit */
  readonly lines?: readonly { readonly label: string; readonly y: number }[];
  /** x axis: "time" formats ticks as durations (default), "plain" as numbers */
  readonly xKind?: "time" | "plain";
  /** logarithmic x axis (x > 0), for Zth curves */
  readonly logX?: boolean;
  /** unit of y, shown in the legend ("°C") */
  readonly yUnit?: string;
}

/** Default chart size, declared once. */
export const CHART_DEFAULTS = { width: 80, height: 12 } as const;

/**
 * A terminal line chart (asciichart) of one or more series against x, resampled to the width so
 * the chart fits the terminal. Resampling keeps the maximum of each column, so short peaks are
 * never lost; empty columns repeat the last value. Reference lines (limits) are drawn as flat
 * series. Below the plot: x ticks (start, middle, end) and a legend.
 * Cost O(points + width × series).
 * @example
 * const points = [{ x: 0, y: 0 }, { x: 1, y: 5 }, { x: 2, y: 3 }];
 * lineChart([{ label: "rise [K]", points }], { width: 30, height: 5 }).split("\n").length // => 9
 */
export function lineChart(series: readonly ChartSeries[], options: LineChartOptions = {}): string {
  const width = Math.max(20, options.width ?? CHART_DEFAULTS.width);
  const height = options.height ?? CHART_DEFAULTS.height;
  const all = series.flatMap((s) => s.points).filter((p) => Number.isFinite(p.x) && Number.isFinite(p.y) && (!options.logX || p.x > 0));
  if (all.length === 0) return "(no data to plot)\n";
  const map = (x: number): number => (options.logX ? Math.log10(x) : x);
  const xMin = Math.min(...all.map((p) => map(p.x)));
  const xMax = Math.max(...all.map((p) => map(p.x)));
  const labelWidth = 12;
  const columns = Math.max(10, width - labelWidth);
  const span = xMax - xMin || 1;
  const resample = (points: readonly { x: number; y: number }[]): number[] => {
    const out = new Array<number>(columns).fill(Number.NaN);
    for (const p of points) {
      if (!Number.isFinite(p.y) || (options.logX && !(p.x > 0))) continue;
      const c = Math.min(columns - 1, Math.max(0, Math.floor(((map(p.x) - xMin) / span) * columns)));
      if (Number.isNaN(out[c]!) || p.y > out[c]!) out[c] = p.y;
    }
    let last = out.find((v) => !Number.isNaN(v)) ?? 0;
    return out.map((v) => (Number.isNaN(v) ? last : (last = v)));
  };
  const rows = series.map((s) => resample(s.points));
  for (const line of options.lines ?? []) rows.push(new Array<number>(columns).fill(line.y));
  const plot = asciichart.plot(rows, { height, format: (v: number) => formatNumber(v, 4).padStart(labelWidth - 2) });
  const tick = (v: number): string => {
    const x = options.logX ? 10 ** v : v;
    return options.xKind === "plain" ? formatNumber(x, 3) : formatDuration(x);
  };
  const left = tick(xMin);
  const middle = tick(xMin + span / 2);
  const right = tick(xMax);
  const axisWidth = labelWidth + columns;
  const axis = " ".repeat(labelWidth) + left + " ".repeat(Math.max(1, Math.floor(columns / 2) - left.length - Math.floor(middle.length / 2))) + middle;
  const axisLine = axis + " ".repeat(Math.max(1, axisWidth - axis.length - right.length)) + right;
  const unit = options.yUnit === undefined ? "" : ` [${options.yUnit}]`;
  const legend = [
    ...series.map((s, i) => `${i === 0 ? "curve" : `curve ${i + 1}`}: ${s.label}${unit}`),
    ...(options.lines ?? []).map((l) => `flat line: ${l.label} = ${formatNumber(l.y, 4)}${options.yUnit === undefined ? "" : ` ${options.yUnit}`}`),
  ];
  // the log-axis note goes under the axis, so the axis line stays within the width
  if (options.logX) legend.unshift("time axis: logarithmic");
  return `${plot}\n${axisLine}\n${legend.map((l) => `  ${l}`).join("\n")}\n`;
}
