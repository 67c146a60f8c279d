import type { DutyProfile } from "../profile/DutyProfile.js";
import type { RetryPlanReport } from "../retry/planRetries.js";
import { formatDuration } from "../text/formatTable.js";
import { REPORT_CHART_SIZE, type ReportChart, quantitativeField as q } from "./ReportChart.js";
import { zthChart } from "./simulationCharts.js";

/** Colours of the lockout map's verdicts (legend order). */
const STATUS_SCALE = { domain: ["pass", "warn", "fail", "impossible"], range: ["#4caf50", "#ffb300", "#d32f2f", "#bdbdbd"] } as const;

/**
 * The charts of `retries`: the lockout map as a heat map (attempts × interval, each cell coloured
 * by its verdict, with a legend; the worst corner's peak in the cell's description), the fastest
 * safe schedule (each attempt's own peak against its start, per corner, with the limit and
 * limit − margin of the map's corners) and the Zth(t) of the profile's parts.
 * Source: the planner's own numbers (planRetries).
 * Cost O(cells + scheduled attempts × corners).
 */
export function retryCharts(profile: DutyProfile, report: RetryPlanReport): ReportChart[] {
  const map = report.map;
  const cells = map.cells.flatMap((row) =>
    row.map((c) => ({
      attempts: c.attempts,
      interval: formatDuration(c.intervalS),
      intervalS: c.intervalS,
      status: c.status,
      peakC: c.peakC,
      label: `${c.attempts} attempts every ${formatDuration(c.intervalS)}: ${c.status}${c.peakC === null ? "" : `, peak ${c.peakC.toFixed(1)} °C (${c.corner})`}`,
    })),
  );
  const intervalOrder = [...new Set(map.intervalsS)].sort((a, b) => a - b).map(formatDuration);
  const charts: ReportChart[] = [
    {
      id: "lockout-map",
      title: "Lockout map: verdict of every burst",
      note: `Each cell: a burst of that many attempts at that interval (${map.spacing}), judged at the corner with the least headroom; grey: the attempts would overlap.`,
      spec: {
        width: REPORT_CHART_SIZE.width,
        height: Math.max(120, 22 * map.attempts.length),
        data: { values: cells },
        mark: { type: "rect", stroke: "#ffffff", strokeWidth: 1 },
        encoding: {
          x: { field: "interval", type: "ordinal", sort: intervalOrder, title: "interval" },
          y: { field: "attempts", type: "ordinal", sort: "descending", title: "attempts in the burst" },
          color: { field: "status", type: "nominal", scale: STATUS_SCALE, title: "verdict" },
          description: { field: "label" },
        },
      },
    },
  ];
  const schedule = report.fastest.perCorner.flatMap((c) =>
    c.attempts.map((a, k) => ({ corner: c.corner, attempt: k + 1, startS: a.startS, peakC: a.peakC, label: `${c.corner}, attempt ${k + 1}: own peak ${a.peakC.toFixed(1)} °C` })),
  );
  if (schedule.length > 0) {
    const levels = [...new Map(map.cells.flat().map((c) => [`${c.limitC}/${c.allowedC}`, { limitC: c.limitC, allowedC: c.allowedC }])).values()];
    charts.push({
      id: "fastest-schedule",
      title: "Fastest safe schedule",
      note: "Each attempt's own peak at its start time on the fastest safe schedule, per corner; dashed red: the limit; orange band: the design margin below it.",
      spec: {
        ...REPORT_CHART_SIZE,
        layer: [
          { data: { values: levels }, mark: { type: "rect", color: "#f0a020", opacity: 0.15 }, encoding: { y: q("allowedC"), y2: { field: "limitC" } } },
          { data: { values: levels }, mark: { type: "rule", color: "#c00000", strokeDash: [6, 3] }, encoding: { y: q("limitC") } },
          {
            data: { values: schedule },
            mark: { type: "line", point: { filled: true, size: 50 } },
            encoding: { x: q("startS", "attempt start [s]"), y: q("peakC", "own peak [°C]", { scale: { zero: false } }), color: { field: "corner", type: "nominal", title: "corner" }, description: { field: "label" } },
          },
        ],
      },
    });
  }
  charts.push(zthChart(profile));
  return charts;
}
