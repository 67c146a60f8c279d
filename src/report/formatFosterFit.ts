import { wrapText } from "../text/cautions.js";
import type { FosterFit } from "../thermal/fitFosterNetwork.js";
import type { ZthPoint } from "../thermal/fitZthPoints.js";
import { fosterToModal } from "../thermal/fosterNetwork.js";
import { logSpacedTimes, zth } from "../thermal/zth.js";
import { formatDuration, formatNumber, formatTable } from "../text/formatTable.js";
import { lineChart } from "./lineChart.js";

/** Points of the fitted curve drawn in the chart (resampled to the width by lineChart). */
const CURVE_POINTS = 400;

/** A percentage with 2 significant digits: 0.0123 → "1.2 %". */
function percent(fraction: number): string {
  return `${formatNumber(fraction * 100, 2)} %`;
}

/**
 * The text report of a Foster fit: the stages (R, tau, C = tau/R), the fit errors, every stage
 * count tried with its criterion value, a chart of the points against the fitted Zth on a log time
 * axis, and the fit's warnings. Cautions are added by the caller (they close the whole report).
 * Cost O(points × stages + chart width).
 * @param fit the result of fitFosterNetwork
 * @param points the points that were fitted
 * @param width chart width in terminal columns
 * @example
 * const model = fosterToModal({ kind: "foster", stages: [{ rKPerW: 0.5, tauS: 0.01 }, { rKPerW: 1.5, tauS: 2 }] });
 * const points = logSpacedTimes(1e-4, 20, 40).map((timeS) => ({ timeS, zthKPerW: zth(model, timeS) }));
 * formatFosterFit(fitFosterNetwork(points), points, 100).split("\n")[0] // => "Foster network: 2 stages chosen by BIC among 1 to 4 tried; total Rth = 2.000 K/W"
 */
export function formatFosterFit(fit: FosterFit, points: readonly ZthPoint[], width: number): string {
  const stages = fit.network.stages;
  const total = stages.reduce((a, s) => a + s.rKPerW, 0);
  const first = points[0]!.timeS;
  const last = points[points.length - 1]!.timeS;
  const how =
    fit.chosenBy === "given"
      ? `${stages.length} stage${stages.length === 1 ? "" : "s"} as asked`
      : fit.candidates.length === 1
        ? `1 stage (the most ${fit.pointCount} points allow)`
        : `${stages.length} stage${stages.length === 1 ? "" : "s"} chosen by ${fit.criterion.toUpperCase()} among 1 to ${fit.candidates.length} tried`;
  const out: string[] = [
    wrapText(`Foster network: ${how}; total Rth = ${formatNumber(total)} K/W`, width),
    formatTable(
      [{ heading: "stage" }, { heading: "R [K/W]", align: "right" }, { heading: "tau", align: "right" }, { heading: "C = tau/R [J/K]", align: "right" }],
      stages.map((s, i) => [String(i + 1), formatNumber(s.rKPerW), formatDuration(s.tauS), formatNumber(s.tauS / s.rKPerW)]),
    ),
    wrapText(
      `Fit against ${fit.pointCount} points from ${formatDuration(first)} to ${formatDuration(last)}: ` +
        `max relative error ${percent(fit.errors.maxRelativeError)} (at ${formatDuration(fit.errors.worstTimeS)}), RMS ${percent(fit.errors.rmsRelativeError)}`,
      width,
    ),
  ];
  if (fit.candidates.length > 1) {
    const chosen = stages.length;
    out.push(
      "",
      `Stage counts tried (smaller ${fit.criterion.toUpperCase()} is better):`,
      formatTable(
        [{ heading: "stages", align: "right" }, { heading: fit.criterion.toUpperCase(), align: "right" }, { heading: "RMS error", align: "right" }, { heading: "max error", align: "right" }, { heading: "choice" }],
        fit.candidates.map((c) => [String(c.stageCount), formatNumber(c.criterionValue, 5), percent(c.rmsRelativeError), percent(c.maxRelativeError), c.stageCount === chosen ? "chosen" : c.resolved ? "" : "not resolved (time constants too close)"]),
      ),
    );
  }
  const model = fosterToModal(fit.network);
  out.push(
    lineChart(
      [
        { label: "Zth points (data)", points: points.map((p) => ({ x: p.timeS, y: p.zthKPerW })) },
        { label: "fitted Foster network", points: logSpacedTimes(first, last, CURVE_POINTS).map((t) => ({ x: t, y: zth(model, t) })) },
      ],
      { logX: true, yUnit: "K/W", width },
    ),
  );
  for (const warning of fit.warnings) out.push(wrapText(`Warning: ${warning}.`, Math.min(width, 100)));
  return `${out.join("\n")}\n`;
}
