import { describe, expect, test } from "vitest";
import { AttemptCursor, fosterToModal, minForeverInterval, retryForeverCheck, resolveScenario } from "../../src/internal.js";
import { expectClose } from "../helpers/expectClose.js";
import { superposedPeak, uniformPulses } from "./bruteForce.js";
import { rectangularFault } from "./scenarios.js";

// Closed form for one RC stage (R, τ) and rectangular attempts of power P and length t_on repeated
// every T (start to start). From the lumped-capacitance solution (Incropera et al., Fundamentals
// of Heat and Mass Transfer, 7th ed. (2011), §5.1, eq. 5.6, and §5.3 with heating), a pulse raises
// θ0 to θ0·a + P·R·(1 − a) with a = e^(−t_on/τ), and the gap then multiplies by e^(−(T − t_on)/τ).
// In the periodic steady state the start-of-cycle rise θs repeats:
//   θs = (θs·a + P·R·(1 − a))·e^(−(T − t_on)/τ)  ⇒  θs = P·R·(1 − a)·e^(−(T − t_on)/τ)/(1 − e^(−T/τ)),
// and the peak, at the pulse end, is θs·a + P·R·(1 − a) = P·R·(1 − a)/(1 − e^(−T/τ)).
// Retrying for ever is safe exactly when that is ≤ ΔT_max, so
//   T_min = −τ·ln(1 − P·R·(1 − e^(−t_on/τ))/ΔT_max).
// The periodic-pulse-train form itself is common practice in power-semiconductor thermal design;
// the derivation above rests only on the cited lumped-capacitance solution and a geometric series.
describe("minForeverInterval against the one-stage closed form", () => {
  test.each([
    // R [K/W], τ [s], P [W], t_on [s], ambient, limit, margin: invented cases spanning short and long pulses
    [2, 10, 50, 1, 25, 90, 5],
    [0.5, 0.8, 400, 0.05, 40, 155, 10],
    [8, 300, 20, 30, 25, 175, 0],
    [1.2, 4, 100, 0.4, 60, 125, 15],
  ])("R=%d τ=%d P=%d t_on=%d", (R, tau, P, onS, ambientC, limitC, marginK) => {
    const model = fosterToModal({ kind: "foster", stages: [{ rKPerW: R, tauS: tau }] });
    const corner = rectangularFault("one stage", model, P, onS, { ambientC, limitC, marginK });
    const dT = limitC - marginK - ambientC;
    const expected = -tau * Math.log(1 - (P * R * -Math.expm1(-onS / tau)) / dT);
    const answer = minForeverInterval([corner]);
    // The bisection stops when its bracket is below 1e-9 of the answer (PLAN_DEFAULTS.bisectionRelTol):
    // measured 3.7e-10 relative at worst over these cases (printed when the tolerance was set); 2e-9
    // is twice the bracket.
    expectClose(answer.minimumIntervalS!, expected, { rel: 2e-9 });
    expect(answer.proven).toBe(true);
    expect(answer.governing.corner).toBe("one stage");
    // at the minimum the steady peak sits on limit − margin (to the same relative accuracy of the
    // rise: measured 3.2e-10 at worst)
    expectClose(answer.governing.peakC - ambientC, dT, { rel: 2e-9 });
  });

  test("a two-stage network: the steady peak at the answer matches a long brute-force train", () => {
    // Two Foster stages (invented part); brute force: 400 pulses superposed from Zth, long enough
    // that the slow stage (τ = 20 s) is within e^(−400·T/20) of steady state.
    const model = fosterToModal({ kind: "foster", stages: [{ rKPerW: 0.4, tauS: 0.5 }, { rKPerW: 1.6, tauS: 20 }] });
    const corner = rectangularFault("two stages", model, 150, 0.2, { ambientC: 40, limitC: 150, marginK: 10 });
    const answer = minForeverInterval([corner]);
    const T = answer.minimumIntervalS!;
    const bruteRise = superposedPeak(model, uniformPulses(400, T, 0.2, 150), 4);
    // The peak is at a pulse end, which is sampled exactly; what the 400-pulse train lacks from the
    // steady state is the slow mode's remaining transient, at most 100 K·e^(−400·T/20 s), plus rounding.
    expect(bruteRise).toBeLessThanOrEqual(100 + 1e-9);
    expectClose(bruteRise, 100, { abs: 100 * Math.exp((-400 * T) / 20) + 1e-9 });
    // 0.5 % shorter and the brute-force train exceeds (the answer is the edge, not merely safe)
    expect(superposedPeak(model, uniformPulses(400, T * 0.995, 0.2, 150), 4)).toBeGreaterThan(100);
  });

  test("retryForeverCheck proves a safe interval in closed form and rejects a short one", () => {
    const model = fosterToModal({ kind: "foster", stages: [{ rKPerW: 2, tauS: 10 }] });
    const c = resolveScenario(rectangularFault("one", model, 50, 1, { ambientC: 25, limitC: 90, marginK: 5 }));
    const safe = retryForeverCheck(c, 3, "start-to-start");
    expect(safe.safe).toBe(true);
    expect(safe.method).toBe("closed-form");
    // steady peak P·R·(1 − e^(−0.1))/(1 − e^(−0.3)) + 25 °C (closed form above); rounding only
    expectClose(safe.steadyPeakC!, 25 + (100 * -Math.expm1(-0.1)) / -Math.expm1(-0.3), { rel: 1e-12 });
    expect(retryForeverCheck(c, 1.5, "start-to-start").safe).toBe(false);
    expect(retryForeverCheck(c, 0.5, "start-to-start").overlap).toBe(true);
  });
});

describe("attempts that heat two sources of one network", () => {
  test("a shared heatsink: the second source's heat counts, in the history and in the steady state", async () => {
    const { graphToModal, superposedRiseGraph } = await import("./sharedSink.js");
    // Two parts on one heatsink (invented values); part A is limited, part B dissipates beside it.
    const model = graphToModal({
      kind: "graph",
      nodes: [
        { id: "a", cJPerK: 2 },
        { id: "b", cJPerK: 2 },
        { id: "sink", cJPerK: 60 },
      ],
      links: [
        { from: "a", to: "sink", rKPerW: 0.5 },
        { from: "b", to: "sink", rKPerW: 0.5 },
        { from: "sink", to: "ambient", rKPerW: 1 },
      ],
      sources: ["a", "b"],
      observed: ["a"],
    });
    const corner = {
      name: "shared",
      model,
      source: "a",
      observe: "a",
      ambientC: 25,
      limitC: 125,
      marginK: 0,
      initialVoltageV: 0,
      attempt: () => ({ trace: [{ startS: 0, durationS: 1, terms: [{ a: 40, b: 0, lambda: 0 }] }], durationS: 1, endVoltageV: 0, otherTraces: { b: [{ startS: 0, durationS: 1, terms: [{ a: 60, b: 0, lambda: 0 }] }] } }),
      discharge: (v: number) => v,
    };
    const answer = minForeverInterval([corner]);
    const T = answer.minimumIntervalS!;
    // brute force: Zth superposition of both sources' pulse trains over 600 periods; what it lacks
    // from the steady peak (100 K at part A) is the slowest mode's remaining transient, at most
    // 100 K·e^(−600·T/τ_slowest), plus rounding
    const slowest = Math.max(...model.tauS);
    const rise = superposedRiseGraph(model, 600, T, 1, [40, 60]);
    expect(rise).toBeLessThanOrEqual(100 + 1e-6);
    expectClose(rise, 100, { abs: 100 * Math.exp((-600 * T) / slowest) + 1e-6 });
  });
});

describe("minForeverInterval when the first attempt decides", () => {
  test("a corner whose first attempt alone is unsafe: no interval, found without scanning", () => {
    // 400 W for 0.2 s into 0.5 K/W (τ = 2 s) and 3 K/W (τ = 60 s) rises about 23 K on the first
    // attempt (lumped capacitance per stage, as above), above the 20 K the hot corner allows
    const model = fosterToModal({ kind: "foster", stages: [{ rKPerW: 0.5, tauS: 2 }, { rKPerW: 3, tauS: 60 }] });
    const cool = rectangularFault("cool", model, 50, 0.2, { ambientC: 25, limitC: 155, marginK: 10 });
    const hot = rectangularFault("hot", model, 400, 0.2, { ambientC: 25, limitC: 55, marginK: 10 });
    const before = AttemptCursor.trialCount;
    const answer = minForeverInterval([cool, hot]);
    const trials = AttemptCursor.trialCount - before;
    expect(answer.minimumIntervalS).toBeNull();
    expect(answer.bands).toEqual([]);
    expect(answer.evaluations).toBe(0);
    expect(answer.governing.corner).toBe("hot");
    // the first attempts, then each corner's verdict at the top of the scan (the cool corner
    // proves itself in a handful of attempts, the hot one fails at its first); a scan would check
    // every corner at 240 intervals or more
    expect(trials).toBeLessThanOrEqual(20);
  });
});
