import type { SweepResult } from "../study/runSweep.js";
import { STUDY_ANSWERS } from "../study/studyDefaults.js";
import { DIMENSIONS } from "../units/dimensions.js";
import { formatNumber } from "../text/formatTable.js";
import { REPORT_CHART_SIZE, type ReportChart, quantitativeField as q } from "./ReportChart.js";
import { answerHeading } from "./formatSweep.js";

/** A parameter's axis title: its path and SI unit. */
function axisTitle(result: SweepResult, i: number): string {
  const p = result.axes[i]!.parameter;
  const unit = DIMENSIONS[p.dimension].si === "degC" ? "°C" : DIMENSIONS[p.dimension].si;
  return unit === "" ? p.path : `${p.path} [${unit}]`;
}

/**
 * The charts of a sweep for the HTML report, one per answer: a line chart over the one axis of a
 * 1-D sweep (a log axis where the values were spaced in ln p), or a heat map over the grid of a
 * 2-D sweep (first axis across, second up, the answer as colour, each cell labelled with its
 * value). Points without the answer (none, or refused by the profile) are left out of a line and
 * grey in a heat map. Source: the sweep's points (runSweep). Cost O(points × answers).
 */
export function sweepCharts(result: SweepResult): ReportChart[] {
  const log = (i: number): Record<string, unknown> => (result.axes[i]!.spacing === "log" ? { scale: { type: "log" } } : { scale: { zero: false } });
  return result.answers.map((answer): ReportChart => {
    const title = answerHeading(answer);
    const rows = result.points.map((p) => {
      const value = p.answers?.values[answer] ?? null;
      return { x: p.values[0]!, y: p.values[1] ?? null, value, label: value === null ? "none" : formatNumber(value) };
    });
    if (result.axes.length === 1) {
      return {
        id: `sweep-${answer}`,
        title: `${STUDY_ANSWERS[answer].words} against ${result.axes[0]!.parameter.path}`,
        note: `Line: ${title} at each point of the sweep${rows.some((r) => r.value === null) ? "; points without the answer are left out" : ""}.`,
        spec: {
          ...REPORT_CHART_SIZE,
          data: { values: rows.filter((r) => r.value !== null) },
          mark: { type: "line", point: true },
          encoding: { x: q("x", axisTitle(result, 0), log(0)), y: q("value", title, { scale: { zero: false } }), tooltip: { field: "label" } },
        },
      };
    }
    const rowsUp = new Set(result.axes[1]!.values).size;
    const cells = rows.map((r) => ({ ...r, xText: formatNumber(r.x), yText: formatNumber(r.y!) }));
    return {
      id: `sweep-${answer}`,
      title: `${STUDY_ANSWERS[answer].words} over ${result.axes[0]!.parameter.path} and ${result.axes[1]!.parameter.path}`,
      note: `Heat map: ${title} in each cell of the grid, its value written in it; grey: no answer there.`,
      spec: {
        width: REPORT_CHART_SIZE.width,
        height: Math.max(120, Math.min(REPORT_CHART_SIZE.width, 28 * rowsUp)),
        data: { values: cells },
        layer: [
          {
            mark: { type: "rect", stroke: "#ffffff", strokeWidth: 1 },
            encoding: {
              x: { field: "xText", type: "ordinal", sort: { field: "x", op: "min", order: "ascending" }, title: axisTitle(result, 0) },
              y: { field: "yText", type: "ordinal", sort: { field: "y", op: "min", order: "descending" }, title: axisTitle(result, 1) },
              color: { condition: { test: "datum.value === null", value: "#cccccc" }, field: "value", type: "quantitative", title },
            },
          },
          {
            mark: { type: "text", fontSize: 10 },
            encoding: { x: { field: "xText", type: "ordinal", sort: { field: "x", op: "min", order: "ascending" } }, y: { field: "yText", type: "ordinal", sort: { field: "y", op: "min", order: "descending" } }, text: { field: "label" } },
          },
        ],
      },
    };
  });
}
