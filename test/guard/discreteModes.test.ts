import fc from "fast-check";
import { describe, expect, test } from "vitest";
import { discreteModes } from "../../src/internal.js";
import type { ModalModel } from "../../src/internal.js";

// The discretisation against the continuous solution at the sample instants, computed here in
// closed form without project code. One Foster stage (gain R, time constant tau) under power held
// at P_i over tick i has, by superposition of the held steps (Oppenheim & Willsky, Signals and
// Systems, 2nd ed. (1997), §2.2), the rise at t_k = k·Ts
//   z(t_k) = Σ_i R·P_i·(e^(−(t_k − t_(i+1))/tau) − e^(−(t_k − t_i)/tau)),
// each term the heated RC stage from rest (Incropera, DeWitt, Bergman & Lavine, Fundamentals of
// Heat and Mass Transfer, 7th ed. (2011), §5.3). The zero-order-hold recursion
// z ← a·z + zohGain·E (Franklin, Powell & Workman, Digital Control of Dynamic Systems, 3rd ed.
// (1998), §4.3.3, section from memory) must give the same numbers within rounding. Energy put into
// a tick as short bursts at arbitrary instants θ has the closed form z(t_k) = Σ R·E/tau·e^(−(t_k − θ)/tau),
// which the guard's gain must never fall below.

const stage = (gains: number[], tauS: number[]): ModalModel => ({ tauS, sources: ["element"], observed: ["element"], gainKPerW: [[gains]] });

describe("zero-order hold at the tick", () => {
  test("decay and gains of a hand-worked stage: R = 2 K/W, tau = 0.5 s, Ts = 10 ms", () => {
    const d = discreteModes(stage([2], [0.5]), 0, 0.01);
    // a = e^(−0.02) = 0.98019867330675527 (exponential series, Abramowitz & Stegun, Handbook of Mathematical Functions (1964), 4.2.1)
    expect(d.decay[0]).toBeCloseTo(0.98019867330675527, 15);
    // ZOH gain per joule: R·(1 − a)/Ts = 2·0.019801326693244735/0.01 = 3.960265338648947 K/J
    expect(d.zohGainKPerJ[0]![0]).toBeCloseTo(3.960265338648947, 12);
    // guard gain per joule: R/tau = 4 K/J (all of the tick's energy at its end)
    expect(d.boundGainKPerJ[0]![0]).toBe(4);
  });

  test("piecewise-constant power: the ZOH recursion equals the continuous closed form at every tick (random histories)", () => {
    fc.assert(
      fc.property(
        fc.array(fc.double({ min: 0.01, max: 100, noNaN: true }), { minLength: 1, maxLength: 3 }),
        fc.array(fc.double({ min: 1e-3, max: 1e3, noNaN: true }), { minLength: 3, maxLength: 3 }),
        fc.double({ min: 1e-4, max: 1, noNaN: true }),
        fc.array(fc.double({ min: 0, max: 500, noNaN: true }), { minLength: 1, maxLength: 60 }),
        (gains, taus, tickS, powers) => {
          const tauS = taus.slice(0, gains.length);
          const d = discreteModes(stage(gains, tauS), 0, tickS);
          const z = tauS.map(() => 0);
          let scale = 0;
          powers.forEach((p, k) => {
            z.forEach((v, m) => (z[m] = d.decay[m]! * v + d.zohGainKPerJ[0]![m]! * p * tickS));
            const t = (k + 1) * tickS;
            let continuous = 0;
            gains.forEach((R, m) => {
              for (let i = 0; i <= k; i++) continuous += R * powers[i]! * (Math.exp(-(t - (i + 1) * tickS) / tauS[m]!) - Math.exp(-(t - i * tickS) / tauS[m]!));
            });
            scale = Math.max(scale, ...powers.slice(0, k + 1).map((q) => q * gains.reduce((a, b) => a + b, 0)));
            const recursion = z.reduce((a, b) => a + b, 0);
            // rounding only: a few ulps of the largest term per tick summed
            expect(Math.abs(recursion - continuous)).toBeLessThanOrEqual(1e-12 * (scale + 1) * (k + 1));
          });
        },
      ),
      { numRuns: 200, seed: 1901 },
    );
  });

  test("energy landing anywhere inside a tick: the guard's gain never falls below the closed form, the ZOH gain may", () => {
    let zohBelow = 0;
    fc.assert(
      fc.property(
        fc.double({ min: 0.1, max: 10, noNaN: true }),
        fc.double({ min: 1e-3, max: 10, noNaN: true }),
        fc.double({ min: 1e-4, max: 0.1, noNaN: true }),
        fc.array(fc.tuple(fc.double({ min: 0, max: 5, noNaN: true }), fc.double({ min: 0, max: 1, noNaN: true })), { minLength: 1, maxLength: 40 }),
        (R, tau, tickS, bursts) => {
          const d = discreteModes(stage([R], [tau]), 0, tickS);
          let guard = 0;
          let zoh = 0;
          bursts.forEach(([E], k) => {
            guard = d.decay[0]! * guard + d.boundGainKPerJ[0]![0]! * E;
            zoh = d.decay[0]! * zoh + d.zohGainKPerJ[0]![0]! * E;
            const t = (k + 1) * tickS;
            let exact = 0;
            for (let i = 0; i <= k; i++) exact += ((R * bursts[i]![0]) / tau) * Math.exp(-(t - (i + bursts[i]![1]) * tickS) / tau);
            expect(guard).toBeGreaterThanOrEqual(exact * (1 - 1e-12));
            if (zoh < exact * (1 - 1e-9)) zohBelow++;
          });
        },
      ),
      { numRuns: 200, seed: 1902 },
    );
    // the ZOH figure alone is not a bound when the energy comes late in the tick
    expect(zohBelow).toBeGreaterThan(0);
  });

  test("a negative gain (a node away from the source) takes the early-landing bound", () => {
    const d = discreteModes(stage([-0.5], [2]), 0, 0.1);
    // g·a/tau: −0.5·e^(−0.05)/2, the least negative tick-end change per joule
    expect(d.boundGainKPerJ[0]![0]).toBeCloseTo((-0.5 * Math.exp(-0.05)) / 2, 15);
  });

  test("a tick that is not finite and > 0 is refused, naming --tick", () => {
    expect(() => discreteModes(stage([1], [1]), 0, 0)).toThrow(/--tick/);
    expect(() => discreteModes(stage([1], [1]), 0, Number.POSITIVE_INFINITY)).toThrow(/--tick/);
  });
});
