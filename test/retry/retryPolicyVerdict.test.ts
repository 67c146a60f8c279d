import { describe, expect, test } from "vitest";
import { backoffBurst, fosterToModal, retryPolicyVerdict, uniformBurst } from "../../src/internal.js";
import { expectClose } from "../helpers/expectClose.js";
import { rectangularFault } from "./scenarios.js";

// One RC stage (lumped capacitance, Incropera et al., 7th ed. (2011), §5.1 and §5.3). A burst of N
// pulses every T, then a lockout L, repeated for ever: with S_k = S·(1 − q^k)/(1 − q),
// S = P·R·(1 − e^(−t_on/τ)), q = e^(−T/τ) and the cycle length Pc = (N − 1)·T + t_on + L, the rise
// at a cycle's start repeats as θs = S_N·e^(−L/τ)/(1 − e^(−Pc/τ)) (geometric series over cycles),
// and the cycle's peak is max over k of θs·e^(−((k − 1)·T + t_on)/τ) + S_k; the first burst from
// cold peaks at S_N. Limit 90 °C, margin 5 K, ambient 25 °C: a rise up to 60 K passes, up to 65 K
// warns (inside the margin), above 65 K fails (verdict rule of src/stress/Verdict.ts).
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

  const burstPeak = (N: number, T: number): number => {
    const q = Math.exp(-T / tau);
    return (P * R * -Math.expm1(-onS / tau) * (1 - q ** N)) / (1 - q);
  };
  const word = (riseK: number): string => (riseK <= 60 ? "pass" : riseK <= 65 ? "warn" : "fail");

  // Every case is at least 0.9 K from a boundary (rises in K: burst, cycle): 36.0, 38.6; 50.5,
  // 50.5; 25.7, 45.9; 24.8, 62.9 (the cycle warns); 53.5, 71.7 (the cycle fails); 61.0, 69.6 (the
  // burst warns, the cycle fails).
  test.each([
    [5, 1.5, 20, "pass"],
    [8, 1.3, 60, "pass"],
    [3, 1.1, 5, "pass"],
    [3, 1.5, 1, "warn"],
    [8, 1.1, 5, "fail"],
    [10, 1.1, 10, "fail"],
  ])("N=%d T=%d L=%d: the repeated cycle's peak matches the closed form; verdict %s", (N, T, L, expected) => {
    const verdict = retryPolicyVerdict([corner], uniformBurst(N, T, "start-to-start"), L);
    // closed forms on both sides; 1e-9 relative is rounding of the geometric sums (a cycle that
    // goes above limit − margin on its way in stops before its steady state is computed)
    const steadyC = verdict.cycleVerdicts[0]!.steadyPeakC;
    if (verdict.cyclesSafe || steadyC !== null) expectClose(steadyC! - 25, cyclePeak(N, T, L), { rel: 1e-9 });
    expect(verdict.burstVerdict).toBe(word(burstPeak(N, T)));
    expect(verdict.cyclesVerdict).toBe(word(cyclePeak(N, T, L)));
    expect(verdict.verdict).toBe(expected);
    expect(verdict.burstSafe).toBe(verdict.burstVerdict === "pass");
    expect(verdict.cyclesSafe).toBe(verdict.cyclesVerdict === "pass");
  });

  test("a cycle inside the margin says so, a cycle past the limit says that", () => {
    expect(retryPolicyVerdict([corner], uniformBurst(3, 1.5, "start-to-start"), 1).reasons).toEqual([
      `corner "one stage": repeating burst + 1 s lockout while the fault persists reaches ${(25 + cyclePeak(3, 1.5, 1)).toFixed(1)} °C, above limit − margin 85.0 °C, not above the limit 90.0 °C`,
    ]);
    const fail = retryPolicyVerdict([corner], uniformBurst(8, 1.1, "start-to-start"), 5);
    expect(fail.reasons[0]).toMatch(/above limit − margin 85\.0 °C; it passes the limit 90\.0 °C$/);
    // a bisection that reads only safe / unsafe skips the check against the limit
    expect(retryPolicyVerdict([corner], uniformBurst(3, 1.5, "start-to-start"), 1, { verdictWords: false }).cyclesSafe).toBe(false);
  });

  test("an unsafe policy names the corner and the attempt", () => {
    const verdict = retryPolicyVerdict([corner], backoffBurst(12, 1.05, 1, 1.05), 5);
    expect(verdict.verdict).toBe("fail");
    expect(verdict.burstSafe).toBe(false);
    expect(verdict.reasons[0]).toMatch(/^corner "one stage": attempt \d+ of the burst reaches [\d.]+ °C, above limit − margin 85\.0 °C, not above the limit 90\.0 °C$/);
    expect(verdict.reasons[1]).toMatch(/^corner "one stage": attempt \d+ of the burst reaches [\d.]+ °C; it passes the limit 90\.0 °C$/);
  });
});
