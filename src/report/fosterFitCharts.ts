import type { FosterFit } from "../thermal/fitFosterNetwork.js";
import type { ZthPoint } from "../thermal/fitZthPoints.js";
import { fosterToModal } from "../thermal/fosterNetwork.js";
import { logSpacedTimes, zth } from "../thermal/zth.js";
import { REPORT_CHART_SIZE, type ReportChart, quantitativeField as q } from "./ReportChart.js";

/** Points of the fitted curve in the report's Zth chart. */
const FIT_CURVE_POINTS = 200;

/**
 * The charts of `network fit --report`: (1) the Zth(t) points and the fitted Foster network's
 * curve, log-log; (2) the fit residual at every point, e_i = (Zfit(t_i) − Z_i)/Z_i in percent,
 * against time on a log axis, with the zero line and the ±(largest error) band, so a systematic
 * bend (a missing stage) shows as a wave and a misread point as a lone spike. The residuals are
 * the ones `fitRelativeErrors` summarises (max and RMS).
 * Source: the fit (fitFosterNetwork); relative residuals as in fitRelativeErrors.
 * Cost O(points × stages + FIT_CURVE_POINTS × stages).
 */
export function fosterFitCharts(fit: FosterFit, points: readonly ZthPoint[]): ReportChart[] {
  const model = fosterToModal(fit.network);
  const first = points[0]!.timeS;
  const last = points[points.length - 1]!.timeS;
  const curve = logSpacedTimes(first, last, FIT_CURVE_POINTS).map((t) => ({ series: "fitted Foster network", timeS: t, zthKPerW: zth(model, t) }));
  const data = points.map((p) => ({ series: "Zth points (data)", timeS: p.timeS, zthKPerW: p.zthKPerW }));
  const residuals = points.map((p) => ({ timeS: p.timeS, errorPercent: ((zth(model, p.timeS) - p.zthKPerW) / p.zthKPerW) * 100 }));
  const bandPercent = fit.errors.maxRelativeError * 100;
  const series = { field: "series", type: "nominal", title: "", scale: { domain: ["Zth points (data)", "fitted Foster network"], range: ["#1f5fa8", "#c05000"] } };
  const logTime = q("timeS", "time [s]", { scale: { type: "log" } });
  return [
    {
      id: "fit-zth",
      title: "Zth(t): the points and the fitted Foster network",
      note: `Points: the data; line: the fitted network (${fit.network.stages.length} stages), log-log. They should lie on each other over the whole range.`,
      spec: {
        ...REPORT_CHART_SIZE,
        layer: [
          { data: { values: curve }, mark: { type: "line", strokeWidth: 1.5 }, encoding: { x: logTime, y: q("zthKPerW", "Zth [K/W]", { scale: { type: "log" } }), color: series } },
          { data: { values: data }, mark: { type: "point", filled: true, size: 40 }, encoding: { x: logTime, y: q("zthKPerW", "Zth [K/W]", { scale: { type: "log" } }), color: series } },
        ],
      },
    },
    {
      id: "fit-residuals",
      title: "Fit residuals: (fitted − data)/data at every point",
      note: `Relative error of the fitted network at each point [%]; grey lines: ±${Number(bandPercent.toPrecision(2))} %, the largest. A wave across decades suggests a missing stage; a lone spike, a misread point.`,
      spec: {
        ...REPORT_CHART_SIZE,
        height: Math.round(REPORT_CHART_SIZE.height * 0.7),
        layer: [
          { data: { values: [{ y: 0 }] }, mark: { type: "rule", color: "#000000" }, encoding: { y: q("y") } },
          { data: { values: [{ y: bandPercent }, { y: -bandPercent }] }, mark: { type: "rule", color: "#999999", strokeDash: [4, 3] }, encoding: { y: q("y") } },
          {
            data: { values: residuals },
            mark: { type: "line", point: { filled: true, size: 40 }, strokeWidth: 1, color: "#1f5fa8" },
            encoding: { x: logTime, y: q("errorPercent", "relative error [%]") },
          },
        ],
      },
    },
  ];
}
