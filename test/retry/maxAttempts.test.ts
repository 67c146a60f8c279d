import { describe, expect, test } from "vitest";
import { AttemptCursor, InputError, fosterToModal, maxAttempts } from "../../src/internal.js";
import { superposedPeak, uniformPulses } from "./bruteForce.js";
import { rectangularFault } from "./scenarios.js";

// One RC stage: the n-th of a train of pulses every T ends at S·(1 − q^n)/(1 − q), S = P·R·(1 − e^(−t_on/τ)),
// q = e^(−T/τ) (lumped capacitance, Incropera et al., 7th ed. (2011), §5.1 and §5.3, summed as a
// geometric series). The largest safe n is therefore floor(ln(1 − ΔT·(1 − q)/S)/ln q).
describe("maxAttempts", () => {
  const R = 2;
  const tau = 10;
  const P = 50;
  const onS = 1;
  const limits = { ambientC: 25, limitC: 90, marginK: 5 };
  const model = fosterToModal({ kind: "foster", stages: [{ rKPerW: R, tauS: tau }] });
  const corner = rectangularFault("one stage", model, P, onS, limits);

  test.each([1.05, 1.2, 1.5, 1.7])("one stage at T = %d s matches the closed-form count", (T) => {
    const S = P * R * -Math.expm1(-onS / tau);
    const q = Math.exp(-T / tau);
    const expected = Math.floor(Math.log(1 - (60 * (1 - q)) / S) / Math.log(q));
    const answer = maxAttempts([corner], T);
    // an exact integer: the closed form's peaks are not within 1e-9 K of the limit at these T
    expect(answer.attempts).toBe(expected);
    expect(answer.unlimited).toBe(false);
    expect(answer.governing.corner).toBe("one stage");
  });

  test("at an interval above the retry-forever minimum the count is unlimited", () => {
    // T_min = −τ·ln(1 − S/ΔT) = 1.727 s for these values (closed form in minForeverInterval.test.ts)
    const answer = maxAttempts([corner], 1.8);
    expect(answer.unlimited).toBe(true);
    expect(answer.attempts).toBeNull();
  });

  test("two corners: the hotter corner governs, and the count agrees with brute force", () => {
    const model2 = fosterToModal({ kind: "foster", stages: [{ rKPerW: 0.4, tauS: 0.5 }, { rKPerW: 1.6, tauS: 20 }] });
    const cool = rectangularFault("cool", model2, 150, 0.2, { ambientC: 25, limitC: 150, marginK: 10 });
    const hot = rectangularFault("hot", model2, 150, 0.2, { ambientC: 60, limitC: 150, marginK: 10 });
    const answer = maxAttempts([cool, hot], 0.5);
    expect(answer.governing.corner).toBe("hot");
    const n = answer.attempts!;
    // brute force (Zth superposition): n attempts stay within 80 K of rise, n + 1 do not
    expect(superposedPeak(model2, uniformPulses(n, 0.5, 0.2, 150), 2)).toBeLessThanOrEqual(80);
    expect(superposedPeak(model2, uniformPulses(n + 1, 0.5, 0.2, 150), 2)).toBeGreaterThan(80);
  });

  test("an attempt longer than the interval is bad input naming the interval", () => {
    expect(() => maxAttempts([corner], 0.5)).toThrow(InputError);
    expect(() => maxAttempts([corner], 0.5)).toThrow('intervalS: expected a start-to-start interval at least as long as an attempt (1 s in corner "one stage"), found 0.5 s');
  });

  test.each([
    ["unsafe corner first", true],
    ["unsafe corner last", false],
  ])("a corner whose first attempt alone is unsafe decides at once (%s)", (_name, hotFirst) => {
    // the hot corner's first attempt rises 2·500·(1 − e^(−0.1)) ≈ 95 K (one stage, as above),
    // above its 60 K; the cool one would count thousands of safe attempts at this interval
    const hot = rectangularFault("hot", model, 500, onS, limits);
    const cool = rectangularFault("cool", model, P, onS, { ...limits, limitC: 150 });
    const before = AttemptCursor.trialCount;
    const answer = maxAttempts(hotFirst ? [hot, cool] : [cool, hot], 1.05);
    const trials = AttemptCursor.trialCount - before;
    expect(answer.attempts).toBe(0);
    expect(answer.governing.corner).toBe("hot");
    expect(answer.firstUnsafePeakC).toBeGreaterThan(limits.limitC - limits.marginK);
    // a few attempts per corner (the cool corner's retry-for-ever check settles and closes in a
    // few when it comes first); the plain scan took the cool corner to its first unsafe attempt
    expect(trials).toBeLessThanOrEqual(12);
  });

  test("a long train is counted from a few attempts: the closed-form count over thousands of attempts", () => {
    // one stage as above with τ = 2000 s and T = 5 s: the count is in the thousands, and the
    // closed form gives it exactly (no peak lies within 1e-9 K of the limit)
    const slow = fosterToModal({ kind: "foster", stages: [{ rKPerW: 1, tauS: 2000 }] });
    const corner = rectangularFault("slow sink", slow, 130, 1, { ambientC: 25, limitC: 55, marginK: 5 });
    const S = 130 * -Math.expm1(-1 / 2000);
    const q = Math.exp(-5 / 2000);
    const expected = Math.floor(Math.log(1 - (25 * (1 - q)) / S) / Math.log(q));
    const before = AttemptCursor.trialCount;
    const answer = maxAttempts([corner], 5);
    expect(answer.attempts).toBe(expected);
    expect(expected).toBeGreaterThan(1000);
    expect(AttemptCursor.trialCount - before).toBeLessThanOrEqual(60);
  });
});
