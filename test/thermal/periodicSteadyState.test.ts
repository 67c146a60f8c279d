import fc from "fast-check";
import { describe, expect, test } from "vitest";
import {
  type FosterNetwork,
  InputError,
  type ModalModel,
  type PowerSegment,
  constantPowerSegment,
  fosterToModal,
  periodicSteadyState,
  runThermalHistory,
  traceSteps,
  zth,
} from "../../src/internal.js";
import { expectClose } from "../helpers/expectClose.js";

// Periodic rectangular pulse train on a Foster network: power P for tp, then 0, period T.
// Derivation (each branch i with R_i, tau_i is independent; write a = e^(−tp/tau), q = e^(−T/tau)):
//   the branch's rise at the end of pulse n is u_n; during pulse n+1 it starts from
//   u_n·e^(−(T−tp)/tau) and relaxes towards P·R for tp, so
//   u_{n+1} = u_n·e^(−(T−tp)/tau)·a + P·R·(1 − a) = q·u_n + P·R·(1 − a),   u_0 = 0.
//   By the geometric series, u_n = P·R·(1 − a)·(1 + q + ... + q^(n−1)) = P·R·(1 − a)·(1 − q^n)/(1 − q),
//   and as n → ∞, u_∞ = P·R·(1 − a)/(1 − q).
// The peak of pulse n is Σ_i u_n (every branch rises during the pulse, so the end of the pulse is the
// maximum). Source: lumped RC step response, Incropera et al., Fundamentals of Heat and Mass Transfer,
// 7th ed. (2011), §5.1 and §5.3; geometric series and first-order difference equations, Boyce & DiPrima,
// Elementary Differential Equations, 10th ed. (2012), §2.9.
function pulsePeak(network: FosterNetwork, P: number, tp: number, T: number, n: number): number {
  let sum = 0;
  for (const { rKPerW: R, tauS: tau } of network.stages) {
    const oneMinusA = -Math.expm1(-tp / tau);
    const geometric = n === Infinity ? 1 / -Math.expm1(-T / tau) : Math.expm1(-n * T / tau) / Math.expm1(-T / tau);
    sum += P * R * oneMinusA * geometric;
  }
  return sum;
}

const networks: [string, FosterNetwork][] = [
  ["single stage", { kind: "foster", stages: [{ rKPerW: 2, tauS: 0.5 }] }],
  [
    "four stages",
    { kind: "foster", stages: [{ rKPerW: 0.05, tauS: 1e-4 }, { rKPerW: 0.2, tauS: 3e-3 }, { rKPerW: 0.5, tauS: 0.08 }, { rKPerW: 1, tauS: 2 }] },
  ],
  ["wide taus", { kind: "foster", stages: [{ rKPerW: 0.01, tauS: 1e-6 }, { rKPerW: 0.3, tauS: 1 }, { rKPerW: 3, tauS: 1e5 }] }],
];

const cycle = (P: number, tp: number, T: number) => ({ periodS: T, traces: [[constantPowerSegment(0, tp, P)]] });

describe.each(networks)("rectangular periodic train, %s", (_, network) => {
  const model = fosterToModal(network);
  test.each([
    [50, 0.01, 0.1],
    [10, 0.2, 1],
    [200, 1e-4, 5],
  ])("P = %d W, tp = %d s, T = %d s: steady-state peak equals the geometric series", (P, tp, T) => {
    const result = periodicSteadyState(model, cycle(P, tp, T));
    // Closed form against the engine: both double precision, 1e-12 relative is rounding only.
    expectClose(result.peakRiseK[0]!, pulsePeak(network, P, tp, T, Infinity), { rel: 1e-12 });
    expectClose(result.peakTimeS[0]!, tp, { rel: 1e-12 });
    // Start-of-cycle state of the steady cycle is its own end state.
    for (let k = 0; k < result.startState.length; k++) expectClose(result.endState[k]!, result.startState[k]!, { rel: 1e-12, abs: 1e-300 });
  });

  test.each([1, 2, 7, 50])("pulse %d of a train started cold equals the partial sum", (n) => {
    const [P, tp, T] = [40, 0.02, 0.25];
    const result = periodicSteadyState(model, cycle(P, tp, T), { repetitions: n });
    // Closed form against the engine: 1e-12 relative is rounding only.
    expectClose(result.peakRiseK[0]!, pulsePeak(network, P, tp, T, n), { rel: 1e-12 });
  });
});

describe("periodicSteadyState against running every cycle", () => {
  test("N repetitions equal a straight run of N cycles (random cycles)", () => {
    const model: ModalModel = fosterToModal(networks[1]![1]);
    fc.assert(
      fc.property(
        fc.double({ min: 1e-3, max: 2, noNaN: true }),
        // relative widths from 1 % up and powers of 0 or 1 mW..100 W: physical cycles (subnormal widths
        // would only test the rounding of numbers near 1e-315)
        fc.array(fc.tuple(fc.double({ min: 0.01, max: 1, noNaN: true }), fc.oneof(fc.constant(0), fc.double({ min: 1e-3, max: 100, noNaN: true }))), { minLength: 1, maxLength: 4 }),
        fc.integer({ min: 1, max: 30 }),
        (T, pieces, n) => {
          // a cycle of consecutive constant-power pieces with random relative lengths
          const total = pieces.reduce((a, [w]) => a + w, 0) || 1;
          const segs: PowerSegment[] = [];
          let t = 0;
          for (const [w, p] of pieces) {
            const d = (w / total) * T * 0.999;
            segs.push(constantPowerSegment(t, d, p));
            t += d;
          }
          const periodic = periodicSteadyState(model, { periodS: T, traces: [segs] }, { repetitions: n });
          const all = segs.flatMap((s) => Array.from({ length: n }, (_, k) => constantPowerSegment(s.startS + k * T, s.durationS, s.terms[0]?.a ?? 0)));
          all.sort((a, b) => a.startS - b.startS);
          const run = runThermalHistory(model, traceSteps([all], 0, n * T));
          // Same exact arithmetic in a different order (geometric sum vs n cycles of updates):
          // 1e-9 relative of the peak covers accumulated rounding over up to 120 steps.
          const scale = Math.max(run.peakRiseK[0]!, 1e-12);
          expectClose(periodic.peakRiseK[0]!, run.peakRiseK[0]!, { abs: 1e-9 * scale });
          expectClose(periodic.endState[0]!, run.endState[0]!, { abs: 1e-9 * Math.max(...run.endState, 1e-12) });
        },
      ),
      { numRuns: 60 },
    );
  });
});

describe("four-term duty-cycle approximation", () => {
  // The classic approximation of the steady periodic peak per watt for a rectangular train,
  //   Z ≈ D·Rth + (1 − D)·Zth(T + tp) − Zth(T) + Zth(tp),   D = tp/T,
  // replaces all but the last two pulses by their average power. It is common practice in the
  // power-semiconductor application-note literature (recalled from memory, no document to cite).
  // It is an approximation: here it must never be below the exact steady peak (conservative) and
  // must differ from it somewhere (so the exact path is doing real work).
  const model = fosterToModal(networks[1]![1]);
  const Rth = 1.75;
  const cases: [number, number][] = [
    [1e-4, 1e-3],
    [1e-3, 0.01],
    [0.01, 0.02],
    [0.01, 0.1],
    [0.1, 0.5],
    [0.5, 1],
    [1, 10],
    [0.001, 5],
  ];
  const differences: number[] = [];
  test.each(cases)("tp = %d s, T = %d s: the approximation is conservative", (tp, T) => {
    const D = tp / T;
    const approx = D * Rth + (1 - D) * zth(model, T + tp) - zth(model, T) + zth(model, tp);
    const exact = periodicSteadyState(model, cycle(1, tp, T)).peakRiseK[0]!;
    // conservative up to rounding (1e-12 K/W)
    expect(approx).toBeGreaterThanOrEqual(exact - 1e-12);
    differences.push((approx - exact) / exact);
  });
  test("and it is not the exact answer", () => {
    expect(Math.max(...differences)).toBeGreaterThan(1e-3);
  });
});

describe("periodicSteadyState input checks", () => {
  const model = fosterToModal(networks[0]![1]);
  test.each([
    [{ periodS: 0, traces: [[]] }, {}, "cycle.periodS: expected a finite period > 0 s, found 0"],
    [cycle(1, 0.1, 1), { repetitions: 2.5 }, "cycle.repetitions: expected a whole number of repetitions ≥ 1, or Infinity, found 2.5"],
    [cycle(1, 2, 1), {}, "cycle.traces[0][0]: expected a segment inside the cycle [0, 1] s, found 0 s to 2 s"],
    [{ periodS: 1, traces: [] }, {}, "cycle.traces: expected one trace per heat source (1), found 0"],
  ])("bad cycles are InputErrors (%#)", (c, options, message) => {
    expect(() => periodicSteadyState(model, c, options)).toThrow(InputError);
    expect(() => periodicSteadyState(model, c, options)).toThrow(message);
  });
});
