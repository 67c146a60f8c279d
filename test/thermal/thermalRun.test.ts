import { describe, expect, test } from "vitest";
import { type HistoryPoint, type PowerSegment, ThermalRun, fosterToModal, runThermalHistory, traceSteps } from "../../src/internal.js";

// ThermalRun is the push form of runThermalHistory: same steps in, same peaks, points and end
// state out (the pull form is a loop over push, so this pins that the two stay one computation),
// and with freshPoints: false the visitor sees one refilled point whose values match.
const model = fosterToModal({ kind: "foster", stages: [{ rKPerW: 0.3, tauS: 0.02 }, { rKPerW: 1, tauS: 2 }, { rKPerW: 2, tauS: 60 }] });
const trace: PowerSegment[] = Array.from({ length: 40 }, (_, k) => ({
  startS: k * 3,
  durationS: 0.4 + 0.01 * k,
  terms: k % 3 === 0 ? [{ a: 120, b: 0, lambda: 8 }] : k % 3 === 1 ? [{ a: 60, b: -50, lambda: 0 }] : [{ a: 40, b: 0, lambda: 0 }],
}));

function collect(fresh: boolean): { points: { timeS: number; riseK: number[]; kind: string }[]; summary: ReturnType<ThermalRun["summary"]> } {
  const points: { timeS: number; riseK: number[]; kind: string }[] = [];
  const onPoint = (p: HistoryPoint): void => {
    points.push({ timeS: p.timeS, riseK: [...p.riseK], kind: p.kind });
  };
  const run = new ThermalRun(model, { onPoint, freshPoints: fresh });
  for (const step of traceSteps([trace], 0, 130)) run.push(step);
  return { points, summary: run.summary() };
}

describe("ThermalRun", () => {
  test("pushing steps gives runThermalHistory's peaks, points and end state", () => {
    const points: { timeS: number; riseK: number[]; kind: string }[] = [];
    const pulled = runThermalHistory(model, traceSteps([trace], 0, 130), { onPoint: (p) => points.push({ timeS: p.timeS, riseK: [...p.riseK], kind: p.kind }) });
    const pushed = collect(true);
    expect(pushed.summary.peakRiseK).toEqual(pulled.peakRiseK);
    expect(pushed.summary.peakTimeS).toEqual(pulled.peakTimeS);
    expect([...pushed.summary.endState]).toEqual([...pulled.endState]);
    expect(pushed.summary.steps).toBe(pulled.steps);
    expect(pushed.points).toEqual(points);
    // the trace has interior peaks (decaying pulses from a warm state), so both kinds were visited
    expect(points.some((p) => p.kind === "peak")).toBe(true);
  });

  test("freshPoints: false hands one refilled point with the same values", () => {
    const seen = new Set<HistoryPoint>();
    const run = new ThermalRun(model, { onPoint: (p) => seen.add(p), freshPoints: false });
    for (const step of traceSteps([trace], 0, 130)) run.push(step);
    expect(seen.size).toBe(1);
    expect(collect(false).points).toEqual(collect(true).points);
  });
});
