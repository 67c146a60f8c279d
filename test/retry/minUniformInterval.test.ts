import { describe, expect, test } from "vitest";
import { AttemptCursor, type PowerSegment, cauerToModal, fosterToModal, minUniformInterval } from "../../src/internal.js";
import { expectClose } from "../helpers/expectClose.js";
import { firstOnGrid, linspace, superposedPeak, uniformPulses, wholeTracePeak } from "./bruteForce.js";
import { chargeThenTrip, rectangularFault } from "./scenarios.js";

// One RC stage, N rectangular pulses every T from ambient: by the lumped-capacitance solution
// (Incropera et al., 7th ed. (2011), §5.1 and §5.3) and a geometric series, the n-th pulse ends at
// P·R·(1 − e^(−t_on/τ))·(1 − q^n)/(1 − q), q = e^(−T/τ), highest at n = N. The test solves
// P·R·(1 − a)·(1 + q + … + q^(N−1)) = ΔT_max for q by its own bisection (the sum rises with q).
function closedFormInterval(R: number, tau: number, P: number, onS: number, N: number, dT: number): number {
  const single = P * R * -Math.expm1(-onS / tau);
  const peak = (q: number): number => (single * (1 - q ** N)) / (1 - q);
  let lo = 0;
  let hi = Math.exp(-onS / tau); // T = t_on
  if (peak(hi) <= dT) return onS;
  for (let i = 0; i < 200; i++) {
    const mid = 0.5 * (lo + hi);
    if (peak(mid) <= dT) lo = mid;
    else hi = mid;
  }
  return -tau * Math.log(lo);
}

describe("minUniformInterval", () => {
  test.each([
    [2, 10, 50, 1, 5, 25, 90, 5],
    [0.5, 0.8, 400, 0.05, 12, 40, 155, 10],
    [1.2, 4, 100, 0.4, 30, 60, 125, 15],
  ])("one stage R=%d τ=%d P=%d t_on=%d N=%d against the closed form", (R, tau, P, onS, N, ambientC, limitC, marginK) => {
    const model = fosterToModal({ kind: "foster", stages: [{ rKPerW: R, tauS: tau }] });
    const answer = minUniformInterval([rectangularFault("one stage", model, P, onS, { ambientC, limitC, marginK })], N);
    // both sides bisect to ≤ 1e-9 relative: measured 5.3e-10 at worst over these cases (printed
    // when the tolerance was set); 2e-9 is twice the bracket
    expectClose(answer.minimumIntervalS!, closedFormInterval(R, tau, P, onS, N, limitC - marginK - ambientC), { rel: 2e-9 });
    expect(answer.bands).toHaveLength(1);
    expect(answer.bands[0]!.openEnded).toBe(true);
  });

  test.each([
    // spacing, timer step, expected answer: a pulse train that is safe back to back (P·R = 20 K,
    // under the 65 K allowed rise, so any interval is safe and the unconstrained answer is the
    // shortest the scan allows), held apart by a 50 ms relay dead time and rounded up to the timer
    ["end-to-start", 0, 0.05],
    ["end-to-start", 0.02, 0.06],
    ["start-to-start", 0, 0.15],
    ["start-to-start", 0.02, 0.16],
  ] as const)("a %s interval never undercuts the relay's dead time (timer step %s s)", (spacing, timerResolutionS, expected) => {
    const model = fosterToModal({ kind: "foster", stages: [{ rKPerW: 2, tauS: 10 }] });
    const corner = { ...rectangularFault("relay", model, 10, 0.1, { ambientC: 25, limitC: 100, marginK: 10 }), minWaitS: 0.05 };
    const answer = minUniformInterval([corner], 5, { spacing, timerResolutionS });
    // the scan starts at the dead time (plus the 0.1 s pulse start to start): exact to rounding
    expectClose(answer.minimumIntervalS!, expected, { rel: 1e-12 });
    expect(minUniformInterval([{ ...corner, minWaitS: 0 }], 5, { spacing }).minimumIntervalS).toBe(spacing === "end-to-start" ? 0 : 0.1);
  });

  test("a three-stage Cauer ladder agrees with brute-force superposition on a fine grid", () => {
    // Invented ladder; brute force: Zth superposition (no modal stepping) on 3000 intervals.
    const model = cauerToModal({ kind: "cauer", stages: [{ rKPerW: 0.2, cJPerK: 0.5 }, { rKPerW: 0.8, cJPerK: 4 }, { rKPerW: 1.5, cJPerK: 40 }] });
    const limits = { ambientC: 40, limitC: 150, marginK: 10 };
    const N = 8;
    const answer = minUniformInterval([rectangularFault("ladder", model, 300, 0.1, limits)], N);
    const grid = linspace(0.1, 6, 3000);
    const brute = firstOnGrid(grid, (T) => superposedPeak(model, uniformPulses(N, T, 0.1, 300), 2) <= 100);
    const step = grid[1]! - grid[0]!;
    // the solver's edge lies in the grid cell below the first safe grid point (plus rounding)
    expect(brute).not.toBeNull();
    expect(answer.minimumIntervalS!).toBeGreaterThan(brute! - step - 1e-9);
    expect(answer.minimumIntervalS!).toBeLessThanOrEqual(brute! + 1e-9);
  });

  test("restarts after a trip with a fast bleeder: two bands of safe waits, as brute force finds", () => {
    // Invented scenario (see chargeThenTrip): 400 V, 20 Ω, 1 mF, complete at 95 %, trip 20 ms
    // later, bleeder 50 ms; resistor on two Foster stages (τ 2 s and 60 s). Quick restarts find
    // the bus nearly full, medium ones find it empty with the part still hot, slow ones a cool part.
    const model = fosterToModal({ kind: "foster", stages: [{ rKPerW: 0.5, tauS: 2 }, { rKPerW: 3, tauS: 60 }] });
    const circuit = { sourceV: 400, resistanceOhm: 20, capacitanceF: 1e-3, fraction: 0.95, tripS: 0.02, bleedS: 0.05 };
    const limits = { ambientC: 40, limitC: 155, marginK: 10 };
    const N = 20;
    const corner = chargeThenTrip("trip", model, circuit, limits);
    const answer = minUniformInterval([corner], N, { spacing: "end-to-start" });
    expect(answer.bands).toHaveLength(2);
    expect(answer.minimumIntervalS).toBe(0);

    // Brute force: for each wait on a fine log grid, build the whole history's trace in absolute
    // time (voltages from the circuit formulas written out here again) and simulate it in one piece.
    const safeAt = (waitS: number): boolean => {
      const trace: PowerSegment[] = [];
      let t = 0;
      let v = 0;
      for (let k = 0; k < N; k++) {
        const dv = circuit.sourceV - v;
        const target = (1 - circuit.fraction) * circuit.sourceV;
        const chargeS = dv > target ? circuit.resistanceOhm * circuit.capacitanceF * Math.log(dv / target) : 0;
        if (chargeS > 0) trace.push({ startS: t, durationS: chargeS, terms: [{ a: (dv * dv) / circuit.resistanceOhm, b: 0, lambda: 2 / (circuit.resistanceOhm * circuit.capacitanceF) }] });
        t += chargeS + circuit.tripS + waitS;
        v = circuit.sourceV * Math.exp(-waitS / circuit.bleedS);
      }
      return wholeTracePeak(model, trace, 600) <= limits.limitC - limits.marginK - limits.ambientC;
    };
    const grid = [0, ...Array.from({ length: 1200 }, (_, i) => 1e-3 * 10 ** ((6 * i) / 1199))];
    const flips: number[] = [];
    let previous = safeAt(grid[0]!);
    expect(previous).toBe(true);
    for (let i = 1; i < grid.length; i++) {
      const now = safeAt(grid[i]!);
      if (now !== previous) flips.push(i);
      previous = now;
    }
    // two bands: safe → unsafe → safe, each edge inside the grid cell where brute force flips
    expect(flips).toHaveLength(2);
    const [first, second] = answer.bands;
    expect(first!.toS).toBeGreaterThanOrEqual(grid[flips[0]! - 1]!);
    expect(first!.toS).toBeLessThan(grid[flips[0]!]!);
    expect(second!.fromS).toBeGreaterThan(grid[flips[1]! - 1]!);
    expect(second!.fromS).toBeLessThanOrEqual(grid[flips[1]!]! * (1 + 1e-9));
    expect(second!.openEnded).toBe(true);
  });

  test("a corner whose first attempt alone is unsafe: no interval, found without scanning", () => {
    // the first attempt (cold part, initial voltage) is the same at every interval: 400 W for
    // 0.2 s into 0.5 K/W (τ = 2 s) and 3 K/W (τ = 60 s) rises 0.5·400·(1 − e^(−0.1)) + 3·400·(1 −
    // e^(−0.2/60)) ≈ 23 K, above the 20 K allowed (lumped capacitance per stage, as above)
    const model = fosterToModal({ kind: "foster", stages: [{ rKPerW: 0.5, tauS: 2 }, { rKPerW: 3, tauS: 60 }] });
    const cool = rectangularFault("cool", model, 50, 0.2, { ambientC: 25, limitC: 155, marginK: 10 });
    const hot = rectangularFault("hot", model, 400, 0.2, { ambientC: 25, limitC: 55, marginK: 10 });
    const before = AttemptCursor.trialCount;
    const answer = minUniformInterval([cool, hot], 5);
    const trials = AttemptCursor.trialCount - before;
    expect(answer.minimumIntervalS).toBeNull();
    expect(answer.bands).toEqual([]);
    expect(answer.evaluations).toBe(0);
    expect(answer.governing.corner).toBe("hot");
    // one first attempt per corner, then the 5-attempt burst per corner at the top of the scan
    // for the governing corner: 2 + 2·5; a scan would take 240 evaluations or more
    expect(trials).toBe(12);
  });
});
