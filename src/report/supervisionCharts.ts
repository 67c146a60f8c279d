import type { DutyProfile } from "../profile/DutyProfile.js";
import type { SupervisionReport } from "../supervise/supervisePrecharge.js";
import { REPORT_CHART_SIZE, type ReportChart, quantitativeField as q } from "./ReportChart.js";
import { zthChart } from "./simulationCharts.js";

/**
 * The charts of `supervise`: the healthy charge time of every corner against the timeout window
 * (shaded green from the slowest healthy charge to the longest timeout the part survives into a
 * short, when such a window exists) and the profile's own timeout (dashed); then the Zth(t) of
 * the profile's parts.
 * Source: the supervision answers (supervisePrecharge).
 * Cost O(corners).
 */
export function supervisionCharts(profile: DutyProfile, report: SupervisionReport): ReportChart[] {
  const corners = report.corners.map((c) => ({ corner: c.name, completionS: c.completionS, label: `${c.name}: ${c.outcome} after ${c.completionS} s` }));
  const window = report.window;
  const finite = Number.isFinite(window.lowerS) && Number.isFinite(window.upperS);
  return [
    {
      id: "timeout-window",
      title: "Healthy charge time of every corner and the timeout window",
      note: `Bars: time each healthy corner takes to charge; green band: the timeouts that let every healthy unit finish and the part survive a short${window.exists ? "" : " (empty here: no such timeout)"}; dashed: the profile's timeout.`,
      spec: {
        width: REPORT_CHART_SIZE.width,
        height: Math.max(100, 28 * corners.length),
        layer: [
          ...(window.exists && finite ? [{ data: { values: [{ lowerS: window.lowerS, upperS: window.upperS }] }, mark: { type: "rect", color: "#4caf50", opacity: 0.2 }, encoding: { x: q("lowerS"), x2: { field: "upperS" } } }] : []),
          { data: { values: corners }, mark: { type: "bar", color: "#4477aa" }, encoding: { y: { field: "corner", type: "nominal", title: "corner", axis: { labelLimit: 360 } }, x: q("completionS", "time [s]"), description: { field: "label" } } },
          { data: { values: [{ timeoutS: report.configuredTimeoutS }] }, mark: { type: "rule", color: "#c00000", strokeDash: [6, 3], strokeWidth: 2 }, encoding: { x: q("timeoutS") } },
        ],
      },
    },
    zthChart(profile),
  ];
}
