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
 * Characters of a chart: the first curve is asciichart's line, each further curve its own
 * marker, each reference line its own dash, so curves can be told apart without colour.
 */
export const CHART_MARKS = { curves: ["─", "*", "+", "x", "o", "#", "@", "%"], lines: ["┄", "╌", "┈", "="] } as const;

/** The mark of curve i (the last marker repeats past the list). */
const curveMark = (i: number): string => CHART_MARKS.curves[Math.min(i, CHART_MARKS.curves.length - 1)]!;
const lineMark = (i: number): string => CHART_MARKS.lines[Math.min(i, CHART_MARKS.lines.length - 1)]!;

/**
 * A terminal line chart (asciichart) of one or more series against x, resampled to the width so
 * the chart fits the terminal; with no reference line the rows run from the lowest value to the
 * highest. Resampling keeps the maximum of each column, so short peaks are
 * never lost; empty columns repeat the last value. Below the plot: x ticks (start, middle, end)
 * and a legend giving each curve's and line's character.
 * The first reference line (a limit) is drawn at its true value: the rows are a whole number of
 * steps of (range of the data and lines)/(height − 1) from it, so it falls exactly on a row, whose
 * axis label is its value; further lines are drawn on the nearest row (the legend says so, unless
 * they too fall on a row). Curves after the first are drawn with their own marker (`CHART_MARKS`).
 * Cost O(points + width × (series + lines)).
 * @example
 * const points = [{ x: 0, y: 0 }, { x: 1, y: 5 }, { x: 2, y: 3 }];
 * lineChart([{ label: "rise [K]", points }], { width: 30, height: 5 }).split("\n").length // => 9
 */
export function lineChart(series: readonly ChartSeries[], options: LineChartOptions = {}): string {
  const width = Math.max(20, options.width ?? CHART_DEFAULTS.width);
  const height = Math.max(2, options.height ?? CHART_DEFAULTS.height);
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
  const lines = (options.lines ?? []).filter((l) => Number.isFinite(l.y));
  const rows = series.map((s) => resample(s.points));
  // The grid: values are shifted so the first line sits at 0; the lowest row is a whole number of
  // steps below it, so 0 (the line) and every row boundary are exact multiples of the step.
  // With no line, the rows run from the lowest value to the highest, both on a row.
  const values = [...rows.flat(), ...lines.map((l) => l.y)];
  const low = Math.min(...values);
  const high = Math.max(...values);
  const origin = lines[0]?.y ?? low;
  const spread = high > low ? high - low : Math.max(Math.abs(high), 1);
  const step = lines.length > 0 ? spread / (height - 1) : spread / height;
  const bottom = lines.length > 0 ? Math.floor((low - origin) / step) : 0;
  const grid = { min: bottom * step, max: (bottom + height) * step };
  const plotted = rows.length > 0 ? rows : [new Array<number>(columns).fill(origin)];
  const base = asciichart
    .plot([plotted[0]!.map((v) => v - origin)], { height, min: grid.min, max: grid.max, format: (v: number) => formatNumber(v + origin, 4).padStart(labelWidth - 2) })
    .split("\n");
  // row (from the top) of a value, as asciichart places it
  const ratio = height / (grid.max - grid.min);
  const rowOf = (v: number): number => height - (Math.round((v - origin) * ratio) - Math.round(grid.min * ratio));
  // the axis: asciichart marks its zero row with ┼ (here the shifted origin, mirrored); only the
  // first curve's start is marked here
  const start = rowOf(plotted[0]![0]!);
  const cells = base.map((line, r) => {
    const axis = Math.max(line.indexOf("┤"), line.indexOf("┼"));
    return { head: `${line.slice(0, axis)}${r === start && rows.length > 0 ? "┼" : "┤"}`, body: Array.from(line.slice(axis + 1).padEnd(columns)) };
  });
  lines.forEach((line, i) => {
    const r = rowOf(line.y);
    const row = cells[r];
    if (row !== undefined) row.body = row.body.map((c) => (c === " " ? lineMark(i) : c));
  });
  rows.slice(1).forEach((values, k) => {
    values.forEach((v, x) => {
      const r = rowOf(v);
      const previous = x === 0 ? r : rowOf(values[x - 1]!);
      for (let y = Math.min(r, previous); y <= Math.max(r, previous); y++) {
        const row = cells[y];
        if (row !== undefined && x < row.body.length) row.body[x] = curveMark(k + 1);
      }
    });
  });
  const plot = cells.map((c) => (c.head + c.body.join("")).trimEnd()).join("\n");
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
  const onRow = (y: number): boolean => {
    const k = (y - origin) / step;
    return Math.abs(k - Math.round(k)) < 1e-9 * Math.max(1, Math.abs(k));
  };
  const legend = [
    ...series.map((s, i) => `${i === 0 ? "curve" : `curve ${i + 1}`} (${curveMark(i)}): ${s.label}${unit}`),
    ...lines.map(
      (l, i) =>
        `line (${lineMark(i)}): ${l.label} = ${formatNumber(l.y, 4)}${options.yUnit === undefined ? "" : ` ${options.yUnit}`}${i === 0 || onRow(l.y) ? "" : ", on the nearest row"}`,
    ),
  ];
  // the log-axis note goes under the axis, so the axis line stays within the width
  if (options.logX) legend.unshift("time axis: logarithmic");
  return `${plot}\n${axisLine}\n${legend.map((l) => `  ${l}`).join("\n")}\n`;
}
