import type { DutyProfile } from "../profile/DutyProfile.js";
import type { SizingReport } from "../size/sizeProfile.js";
import { REPORT_CHART_SIZE, type ReportChart, quantitativeField as q } from "./ReportChart.js";
import { zthChart } from "./simulationCharts.js";

/**
 * The charts of `size`: every sized part's peak as it is now and at the size found (the peak of
 * the inversion's scale), against its target (limit − margin, orange) and its limit (red); then
 * the Zth(t) of the profile's parts as they are.
 * Source: the sizing answers (sizeProfile).
 * Cost O(parts).
 */
export function sizingCharts(profile: DutyProfile, report: SizingReport): ReportChart[] {
  const peaks = report.parts.flatMap((p) => [
    { part: p.partId, size: "as it is", peakC: p.presentPeakC },
    ...(p.inversion.status === "none" ? [] : [{ part: p.partId, size: `sized (×${Number(p.inversion.scale.toPrecision(3))})`, peakC: p.inversion.peakTemperatureC }]),
  ]);
  const levels = report.parts.map((p) => ({ part: p.partId, targetC: p.targetC, limitC: p.limitC }));
  return [
    {
      id: "sized-peaks",
      title: "Peak of every part as it is and at the size found",
      note: "Points: the part's peak over the whole profile; orange tick: its target (limit − margin); red tick: its limit.",
      spec: {
        width: REPORT_CHART_SIZE.width,
        height: Math.max(100, 40 * report.parts.length),
        layer: [
          { data: { values: levels }, mark: { type: "tick", color: "#f0a020", thickness: 3 }, encoding: { y: { field: "part", type: "nominal" }, x: q("targetC") } },
          { data: { values: levels }, mark: { type: "tick", color: "#c00000", thickness: 3 }, encoding: { y: { field: "part", type: "nominal" }, x: q("limitC") } },
          {
            data: { values: peaks },
            mark: { type: "point", filled: true, size: 90 },
            encoding: { y: { field: "part", type: "nominal", title: "part" }, x: q("peakC", "peak [°C]", { scale: { zero: false } }), color: { field: "size", type: "nominal", title: "size" }, shape: { field: "size", type: "nominal" } },
          },
        ],
      },
    },
    zthChart(profile),
  ];
}
