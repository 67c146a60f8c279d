import type { DutyProfile } from "../profile/DutyProfile.js";
import type { EventRecord } from "../profile/EventDigest.js";
import type { ProfileStressResult } from "../profile/ProfileStress.js";
import type { SimulationResult } from "../profile/simulateProfile.js";
import { logSpacedTimes, zth } from "../thermal/zth.js";
import type { ChartTrace } from "./ChartTrace.js";
import { REPORT_CHART_SIZE, type ReportChart, axisTimeUnit, quantitativeField } from "./ReportChart.js";

/** What the simulation charts draw from. */
export interface SimulationChartInput {
  readonly profile: DutyProfile;
  readonly result: SimulationResult;
  /** the events kept by the run's digest (all of them up to EVENT_DIGEST_DEFAULTS.keepAll) */
  readonly events: readonly EventRecord[];
  readonly trace: ChartTrace;
  /** with kept cycles, for the rainflow charts; undefined or without cycles: no rainflow charts */
  readonly stress?: ProfileStressResult;
}

/** How many events the per-event charts and the event marks draw at most, and how many rainflow classes. */
export const SIMULATION_CHART_LIMITS = { events: 5000, eventMarks: 400, rainflowClasses: 12, zthPoints: 80 } as const;

const q = quantitativeField;
const partColor = { field: "part", type: "nominal", title: "part" } as const;

/** The limit rules and the margin bands (limit − margin to limit) of every part, as a layer list. */
function limitLayers(profile: DutyProfile): Record<string, unknown>[] {
  const values = profile.parts.map((p) => ({ part: p.id, limitC: p.limitC, allowedC: p.limitC - p.marginK }));
  return [
    { data: { values }, mark: { type: "rect", color: "#f0a020", opacity: 0.15 }, encoding: { y: q("allowedC"), y2: { field: "limitC" } } },
    { data: { values }, mark: { type: "rule", color: "#c00000", strokeDash: [6, 3], strokeWidth: 1.5 }, encoding: { y: q("limitC"), description: { field: "part" } } },
  ];
}

/** The peak marker of every part at (time in `unit`, °C), with a description naming part and value. */
function peakLayer(points: { part: string; t: number; peakC: number; label: string }[]): Record<string, unknown> {
  return {
    data: { values: points },
    mark: { type: "point", shape: "triangle-up", filled: true, size: 90, color: "#000000" },
    encoding: { x: q("t"), y: q("peakC"), description: { field: "label" } },
  };
}

/**
 * The charts of a simulated history (simulate, replay): every part's temperature against time as
 * a band from the low to the high envelope with the high edge drawn, each part's limit (dashed
 * red) and margin band (shaded from limit − margin to the limit), the events marked at their
 * starts (grey rules) and each part's peak marked (black triangle, the simulation's own peak and
 * time); an inset of the event closest to a limit (its whole window up to twenty times the time
 * to its latest peak, every exact sample); energy and peak per event; the rainflow histogram and
 * the damage by cycle class when cycles were kept; the Zth(t) step response of every part's
 * network (log-log).
 * Source: the simulation's own numbers; Zth(t) = Σ gain·(1 − e^(−t/tau)) (zth, JEDEC JESD51-1).
 * Cost O(parts × (envelope bins + inset points + events + cycles)).
 */
export function simulationCharts(input: SimulationChartInput): ReportChart[] {
  const { profile, result, trace } = input;
  const charts: ReportChart[] = [];
  const unit = axisTimeUnit(result.endTimeS);
  const size = REPORT_CHART_SIZE;
  // 1. the whole history
  const band = profile.parts.flatMap((p, i) => {
    const lows = trace.lows(i);
    return trace.highs.points(i).map((h, k) => ({ part: p.id, t: h.x / unit.seconds, highC: h.y, lowC: lows[k]?.y ?? h.y }));
  });
  const marks = input.events.slice(0, SIMULATION_CHART_LIMITS.eventMarks).map((e) => ({ t: e.startS / unit.seconds, event: `#${e.index} ${e.label}` }));
  const peaks = result.parts.map((p) => ({ part: p.id, t: p.peakTimeS / unit.seconds, peakC: p.peakTemperatureC, label: `peak of ${p.id}: ${p.peakTemperatureC} °C at ${p.peakTimeS} s` }));
  charts.push({
    id: "temperature",
    title: "Temperature of every part",
    note:
      `Shaded: the range each part's temperature covers in each time slice (cooling included); line: its highest value. ` +
      `Dashed red: the limit; orange band: the design margin below it; grey rules: event starts` +
      `${input.events.length > SIMULATION_CHART_LIMITS.eventMarks ? ` (the first ${SIMULATION_CHART_LIMITS.eventMarks})` : ""}; triangles: each part's peak.`,
    spec: {
      ...size,
      layer: [
        ...(marks.length === 0 ? [] : [{ data: { values: marks }, mark: { type: "rule", color: "#999999", opacity: 0.35 }, encoding: { x: q("t"), description: { field: "event" } } }]),
        ...limitLayers(profile),
        { data: { values: band }, mark: { type: "area", opacity: 0.25 }, encoding: { x: q("t", `time [${unit.name}]`), y: q("lowC", "temperature [°C]", { scale: { zero: false } }), y2: { field: "highC" }, color: partColor } },
        { data: { values: band }, mark: { type: "line", strokeWidth: 1.2 }, encoding: { x: q("t"), y: q("highC"), color: partColor } },
        peakLayer(peaks),
      ],
    },
  });
  // 2. the worst event, zoomed
  const worst = trace.worst;
  if (worst !== undefined && worst.points.length > 0) {
    const latestPeakS = Math.max(...worst.peakTimeS) - worst.startS;
    const windowS = Math.max(20 * latestPeakS, 1e-3);
    const shown = worst.points.filter((p) => p.timeS - worst.startS <= windowS);
    const spanS = (shown[shown.length - 1]?.timeS ?? worst.startS) - worst.startS;
    const u = axisTimeUnit(spanS);
    const values = shown.flatMap((p) => profile.parts.map((part, i) => ({ part: part.id, t: (p.timeS - worst.startS) / u.seconds, temperatureC: p.temperatureC[i]! })));
    const eventPeaks = profile.parts.map((p, i) => ({
      part: p.id,
      t: (worst.peakTimeS[i]! - worst.startS) / u.seconds,
      peakC: worst.peakTemperatureC[i]!,
      label: `peak of ${p.id} in event ${worst.index}: ${worst.peakTemperatureC[i]!} °C`,
    }));
    charts.push({
      id: "worst-event",
      title: `Zoom on the event closest to a limit: #${worst.index} ${worst.label}`,
      note: `Every part's temperature from the event's start (exact samples between the steps)${worst.truncated ? "; the window was longer than the points kept" : ""}; dashed red: the limit; triangles: the event's peaks.`,
      spec: {
        ...size,
        layer: [
          ...limitLayers(profile),
          { data: { values }, mark: { type: "line", strokeWidth: 1.5 }, encoding: { x: q("t", `time since the event's start [${u.name}]`), y: q("temperatureC", "temperature [°C]", { scale: { zero: false } }), color: partColor } },
          peakLayer(eventPeaks),
        ],
      },
    });
  }
  // 3. per event
  const events = input.events.slice(0, SIMULATION_CHART_LIMITS.events);
  if (events.length > 0) {
    const rows = events.flatMap((e) => profile.parts.map((p, i) => ({ part: p.id, event: e.index, energyJ: e.energyJ[i]!, peakC: e.peakTemperatureC[i]!, label: e.label })));
    const cut = input.events.length > events.length ? ` (the first ${events.length} events)` : "";
    charts.push({
      id: "event-energy",
      title: "Energy per event",
      note: `Energy put into each part by each event [J]${cut}.`,
      spec: { ...size, data: { values: rows }, mark: { type: "point", filled: true, size: 40 }, encoding: { x: q("event", "event #"), y: q("energyJ", "energy [J]"), color: partColor, description: { field: "label" } } },
    });
    charts.push({
      id: "event-peak",
      title: "Peak temperature per event",
      note: `Highest temperature of each part in each event's window [°C]${cut}; dashed red: the limit, orange: the margin band.`,
      spec: {
        ...size,
        layer: [...limitLayers(profile), { data: { values: rows }, mark: { type: "point", filled: true, size: 40 }, encoding: { x: q("event", "event #"), y: q("peakC", "peak [°C]", { scale: { zero: false } }), color: partColor, description: { field: "label" } } }],
      },
    });
  }
  // 4. rainflow
  const classes = rainflowClasses(input.stress);
  if (classes.length > 0) {
    charts.push({
      id: "rainflow",
      title: "Rainflow cycles by range",
      note: `Counted temperature cycles per class of range (half cycles count 0.5), ${SIMULATION_CHART_LIMITS.rainflowClasses} classes from 0 to the largest range.`,
      spec: { ...size, data: { values: classes }, mark: { type: "rect", opacity: 0.6 }, encoding: { x: q("fromK", "cycle range [K]"), x2: { field: "toK" }, y: q("cycles", "cycles"), y2: { datum: 0 }, color: partColor } },
    });
    if (classes.some((c) => c.damageShare > 0))
      charts.push({
        id: "damage",
        title: "Damage by cycle class",
        note: "Share of each part's Miner damage carried by each class of cycle range [%].",
        spec: { ...size, data: { values: classes }, mark: { type: "rect", opacity: 0.6 }, encoding: { x: q("fromK", "cycle range [K]"), x2: { field: "toK" }, y: q("damagePercent", "share of the damage [%]"), y2: { datum: 0 }, color: partColor } },
      });
  }
  // 5. Zth
  charts.push(zthChart(profile));
  return charts;
}

/** One rainflow class of one part: range [fromK, toK), cycles and damage share. */
export interface RainflowClass {
  readonly part: string;
  readonly fromK: number;
  readonly toK: number;
  readonly cycles: number;
  /** the class's damage over the part's kept damage (0 without a lifetime model) */
  readonly damageShare: number;
  readonly damagePercent: number;
}

/**
 * The kept rainflow cycles of every part, counted in SIMULATION_CHART_LIMITS.rainflowClasses equal
 * classes of range from 0 to the largest range over every part (a cycle at the largest range falls
 * in the last class). Classes without cycles are left out.
 */
export function rainflowClasses(stress: ProfileStressResult | undefined): RainflowClass[] {
  if (stress === undefined) return [];
  const n = SIMULATION_CHART_LIMITS.rainflowClasses;
  const largest = Math.max(0, ...stress.parts.flatMap((p) => p.report.cycles.map((c) => c.rangeK)));
  if (!(largest > 0)) return [];
  const width = largest / n;
  const out: RainflowClass[] = [];
  for (const part of stress.parts) {
    const cycles = new Array<number>(n).fill(0);
    const damage = new Array<number>(n).fill(0);
    const total = part.report.cycleDamage.reduce((a, b) => a + b, 0);
    part.report.cycles.forEach((c, k) => {
      const j = Math.min(n - 1, Math.floor(c.rangeK / width));
      cycles[j] = cycles[j]! + c.count;
      damage[j] = damage[j]! + (part.report.cycleDamage[k] ?? 0);
    });
    for (let j = 0; j < n; j++) {
      if (cycles[j] === 0) continue;
      const share = total > 0 ? damage[j]! / total : 0;
      out.push({ part: part.id, fromK: j * width, toK: (j + 1) * width, cycles: cycles[j]!, damageShare: share, damagePercent: 100 * share });
    }
  }
  return out;
}

/**
 * The Zth(t) step response of every part's own network (its source to its observed node),
 * log-log, from a hundredth of the fastest time constant to ten times the slowest.
 * Source: zth (JEDEC JESD51-1 definition of Zth).
 */
export function zthChart(profile: DutyProfile): ReportChart {
  const values = profile.parts.flatMap((p) => {
    const taus = p.model.tauS;
    const times = logSpacedTimes(Math.min(...taus) / 100, Math.max(...taus) * 10, SIMULATION_CHART_LIMITS.zthPoints);
    return times.map((t) => ({ part: p.id, timeS: t, zthKPerW: zth(p.model, t, p.observedIndex, p.sourceIndex) }));
  });
  return {
    id: "zth",
    title: "Zth(t) of every part's network",
    note: "Rise per watt of a power step applied at t = 0 [K/W], log-log; it levels off at the network's steady-state resistance.",
    spec: {
      ...REPORT_CHART_SIZE,
      data: { values: values.filter((v) => v.zthKPerW > 0) },
      mark: { type: "line", strokeWidth: 1.5 },
      encoding: { x: q("timeS", "time since the power step [s]", { scale: { type: "log" } }), y: q("zthKPerW", "Zth [K/W]", { scale: { type: "log" } }), color: partColor },
    },
  };
}
