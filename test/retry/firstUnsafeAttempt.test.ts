import { describe, expect, test } from "vitest";
import {
  AttemptCursor,
  type ResolvedScenario,
  type RetryScenario,
  type RetrySpacing,
  firstUnsafeAttempt,
  fosterToModal,
  graphToModal,
  resolveScenario,
} from "../../src/internal.js";
import { expectClose } from "../helpers/expectClose.js";
import { chargeThenTrip, rectangularFault } from "./scenarios.js";

/**
 * The plain scan the search replaces: every attempt integrated one after the other up to the
 * first unsafe one (how maxAttempts counted before). Returns the index (null: none up to last),
 * that attempt's peak and the highest safe peak before it.
 */
function plainScan(c: ResolvedScenario, intervalS: number, spacing: RetrySpacing, last: number): { index: number | null; peakC: number | null; worstC: number } {
  const cursor = new AttemptCursor(c);
  let worstC = -Infinity;
  for (let k = 0; k <= last; k++) {
    const trial = cursor.tryAt(k === 0 ? 0 : (spacing === "start-to-start" ? cursor.lastStartS : cursor.endS) + intervalS)!;
    cursor.keep(trial);
    if (!trial.safe) return { index: k, peakC: trial.record.peakC, worstC };
    worstC = Math.max(worstC, trial.record.peakC);
  }
  return { index: null, peakC: null, worstC };
}

/** Attempts integrated by f. */
function trialsOf<T>(f: () => T): { value: T; trials: number } {
  const before = AttemptCursor.trialCount;
  const value = f();
  return { value, trials: AttemptCursor.trialCount - before };
}

// Invented parts and faults. Three Foster stages with a slow heatsink (400 s) so that a train of
// attempts heats up over hundreds of attempts.
const foster3 = fosterToModal({ kind: "foster", stages: [{ rKPerW: 0.3, tauS: 0.05 }, { rKPerW: 1.0, tauS: 2 }, { rKPerW: 2.0, tauS: 400 }] });
// (A) identical attempts: a fault that takes 100 W for 0.2 s whatever the bus does
const rect = resolveScenario(rectangularFault("rectangular", foster3, 100, 0.2, { ambientC: 25, limitC: 125, marginK: 10 }));
// (B) the first attempt charges from 0 V, later ones from what the bleeder left: not identical
const trip = resolveScenario(
  chargeThenTrip("charge then trip", foster3, { sourceV: 400, resistanceOhm: 470, capacitanceF: 2e-4, fraction: 0.9, tripS: 0.5, bleedS: 0.5 }, { ambientC: 25, limitC: 80, marginK: 5 }),
);
// the same with a slow bleeder: a quick retry finds the bus still above the completion level and
// dissipates nothing, so the settled attempts are lighter than the first and the peaks sink
const tripCharged = resolveScenario(
  chargeThenTrip("bus still charged", foster3, { sourceV: 400, resistanceOhm: 470, capacitanceF: 2e-4, fraction: 0.9, tripS: 0.5, bleedS: 3 }, { ambientC: 25, limitC: 80, marginK: 5 }),
);
// (A) with two sources on a shared heatsink, observed at the resistor (the die heats it through the sink)
const sink = graphToModal({
  kind: "graph",
  nodes: [
    { id: "die", cJPerK: 0.05 },
    { id: "res", cJPerK: 0.5 },
    { id: "sink", cJPerK: 40 },
  ],
  links: [
    { from: "die", to: "sink", rKPerW: 0.8 },
    { from: "res", to: "sink", rKPerW: 3 },
    { from: "sink", to: "ambient", rKPerW: 1.5 },
  ],
  sources: ["die", "res"],
  observed: ["res", "die"],
});
const twoSources: RetryScenario = {
  name: "two sources",
  model: sink,
  source: "res",
  observe: "res",
  ambientC: 25,
  limitC: 110,
  marginK: 10,
  initialVoltageV: 0,
  attempt: () => ({
    trace: [{ startS: 0, durationS: 0.3, terms: [{ a: 30, b: 0, lambda: 0 }] }],
    durationS: 0.3,
    endVoltageV: 0,
    otherTraces: { die: [{ startS: 0, durationS: 0.3, terms: [{ a: 80, b: 0, lambda: 0 }] }] },
  }),
  discharge: (v) => v,
};
const shared = resolveScenario(twoSources);

describe("firstUnsafeAttempt", () => {
  // The closed form and the plain scan add the same heat in a different order: the start state
  // differs by rounding (about 1e-15 of it per attempt, over up to 10,000 attempts), so own peaks
  // agree to 1e-9 K, far below anything reported; the indices are equal because no own peak of
  // these cases lies within 1e-9 K of limit − margin.
  test.each([
    ["identical attempts, heating up over hundreds of attempts", rect, 1.0, "start-to-start"],
    ["identical attempts, safe for ever", rect, 1.5, "start-to-start"],
    ["attempts that differ until the bus settles, unsafe late", trip, 1.5, "end-to-start"],
    ["attempts that differ until the bus settles, unsafe later", trip, 2, "end-to-start"],
    ["attempts that differ until the bus settles, safe for ever", trip, 1, "end-to-start"],
    ["settled attempts lighter than the first, peaks sinking", tripCharged, 0.3, "end-to-start"],
    ["two sources on a shared heatsink, unsafe late", shared, 1, "start-to-start"],
    ["two sources on a shared heatsink, safe for ever", shared, 4, "start-to-start"],
  ] as const)("%s: the same attempt as a plain scan, from a few attempts integrated", (_name, corner, intervalS, spacing) => {
    const last = 9999;
    const { value: found, trials } = trialsOf(() => firstUnsafeAttempt(corner, intervalS, spacing, last));
    const scan = plainScan(corner, intervalS, spacing, last);
    expect(found.index).toBe(scan.index);
    expect(found.overlap).toBe(false);
    expect(found.method).toBe("closed-form");
    if (scan.peakC !== null) expectClose(found.peakC!, scan.peakC, { abs: 1e-9 });
    expectClose(found.worstSafePeakC, scan.worstC, { abs: 1e-9 });
    // settling takes a few attempts, then exponential search and bisection over 10,000 attempts
    // take at most 2·log2(10,000) ≈ 27 more; a plain scan integrates (index + 1) or 10,000
    expect(trials).toBeLessThanOrEqual(40);
  });

  test("a part whose attempt depends on its temperature is scanned attempt by attempt, with the same answer", () => {
    // the attempt's power grows with the part's temperature at its start (0.2 %/K): never the settled attempt
    const hot = resolveScenario({
      ...rectangularFault("temperature-dependent", foster3, 100, 0.2, { ambientC: 25, limitC: 125, marginK: 10 }),
      attempt: ({ partTemperatureC }) => ({ trace: [{ startS: 0, durationS: 0.2, terms: [{ a: 100 * (1 + 0.002 * (partTemperatureC - 25)), b: 0, lambda: 0 }] }], durationS: 0.2, endVoltageV: 0 }),
    });
    const found = firstUnsafeAttempt(hot, 1.2, "start-to-start", 9999);
    const scan = plainScan(hot, 1.2, "start-to-start", 9999);
    expect(found.method).toBe("simulated");
    expect(found.index).toBe(scan.index);
    expect(found.peakC).toBe(scan.peakC);
  });

  test("one RC stage: the first unsafe attempt of a long train is the closed-form count", () => {
    // One stage: attempt n (from 0) of a train of pulses every T peaks at S·(1 − q^(n+1))/(1 − q),
    // S = P·R·(1 − e^(−t_on/τ)), q = e^(−T/τ) (lumped capacitance, Incropera et al., 7th ed.
    // (2011), §5.1 and §5.3, summed as a geometric series): the first unsafe index is
    // floor(ln(1 − ΔT·(1 − q)/S)/ln q). With τ = 2000 s and T = 5 s it is about 1300.
    const R = 1;
    const tau = 2000;
    const P = 130;
    const onS = 1;
    const T = 5;
    const one = resolveScenario(rectangularFault("one stage", fosterToModal({ kind: "foster", stages: [{ rKPerW: R, tauS: tau }] }), P, onS, { ambientC: 25, limitC: 55, marginK: 5 }));
    const S = P * R * -Math.expm1(-onS / tau);
    const q = Math.exp(-T / tau);
    const expected = Math.floor(Math.log(1 - (25 * (1 - q)) / S) / Math.log(q));
    expect(expected).toBeGreaterThan(1000);
    const { value: found, trials } = trialsOf(() => firstUnsafeAttempt(one, T, "start-to-start", 9999));
    // an exact integer: no peak of this train lies within 1e-9 K of the limit
    expect(found.index).toBe(expected);
    expect(trials).toBeLessThanOrEqual(40);
  });

  test("the first attempt alone unsafe costs one attempt", () => {
    const { value: found, trials } = trialsOf(() => firstUnsafeAttempt(resolveScenario(rectangularFault("hot", foster3, 400, 0.2, { ambientC: 25, limitC: 125, marginK: 10 })), 1, "start-to-start", 9999));
    expect(found.index).toBe(0);
    expect(trials).toBe(1);
  });

  test("a start-to-start interval shorter than an attempt is reported as an overlap", () => {
    expect(firstUnsafeAttempt(rect, 0.1, "start-to-start", 0).overlap).toBe(true);
    expect(firstUnsafeAttempt(rect, 0.1, "start-to-start", 5).overlap).toBe(true);
  });
});
