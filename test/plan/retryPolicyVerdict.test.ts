import { describe, expect, test } from "vitest";
import { backoffBurst, fosterToModal, retryPolicyVerdict, uniformBurst } from "../../src/index.js";
import { expectClose } from "../helpers/expectClose.js";
import { rectangularFault } from "./scenarios.js";

// One RC stage (lumped capacitance, Incropera et al., 7th ed. (2011), §5.1 and §5.3). A burst of N
// pulses every T, then a lockout L, repeated for ever: with S_k = S·(1 − q^k)/(1 − q),
// S = P·R·(1 − e^(−t_on/τ)), q = e^(−T/τ) and the cycle length Pc = (N − 1)·T + t_on + L, the rise
// at a cycle's start repeats as θs = S_N·e^(−L/τ)/(1 − e^(−Pc/τ)) (geometric series over cycles),
// and the cycle's peak is max over k of θs·e^(−((k − 1)·T + t_on)/τ) + S_k.
describe("retryPolicyVerdict", () => {
  const R = 2;
  const tau = 10;
  const P = 50;
  const onS = 1;
  const model = fosterToModal({ kind: "foster", stages: [{ rKPerW: R, tauS: tau }] });
  const corner = rectangularFault("one stage", model, P, onS, { ambientC: 25, limitC: 90, marginK: 5 });
  const cyclePeak = (N: number, T: number, L: number): number => {
    const S = P * R * -Math.expm1(-onS / tau);
    const q = Math.exp(-T / tau);
    const Sk = (k: number): number => (S * (1 - q ** k)) / (1 - q);
    const thetaS = (Sk(N) * Math.exp(-L / tau)) / -Math.expm1(-((N - 1) * T + onS + L) / tau);
    let peak = 0;
    for (let k = 1; k <= N; k++) peak = Math.max(peak, thetaS * Math.exp(-((k - 1) * T + onS) / tau) + Sk(k));
    return peak;
  };

  test.each([
    [5, 1.5, 20],
    [8, 1.3, 60],
    [3, 1.1, 5],
  ])("N=%d T=%d L=%d: the repeated cycle's peak matches the closed form", (N, T, L) => {
    const verdict = retryPolicyVerdict([corner], uniformBurst(N, T, "start-to-start"), L);
    // closed forms on both sides; 1e-9 relative is rounding of the geometric sums
    expectClose(verdict.cycleVerdicts[0]!.steadyPeakC! - 25, cyclePeak(N, T, L), { rel: 1e-9 });
    expect(verdict.verdict).toBe(cyclePeak(N, T, L) <= 60 && verdict.burstSafe ? "safe" : "unsafe");
  });

  test("an unsafe policy names the corner and the attempt", () => {
    const verdict = retryPolicyVerdict([corner], backoffBurst(12, 1.05, 1, 1.05), 5);
    expect(verdict.verdict).toBe("unsafe");
    expect(verdict.burstSafe).toBe(false);
    expect(verdict.reasons[0]).toMatch(/^corner "one stage": attempt \d+ of the burst reaches [\d.]+ °C, above limit − margin 85\.0 °C$/);
  });
});
