import fc from "fast-check";
import { describe, expect, test } from "vitest";
import { backoffRule, fastestSchedule, firstWaitCandidates, fosterToModal } from "../../src/internal.js";
import { type Pulse, superposedPeak } from "./bruteForce.js";
import { rectangularFault } from "./scenarios.js";

// Checks use Zth superposition of the whole schedule (no planner code): a sum of step responses.
describe("fastestSchedule", () => {
  const model = fosterToModal({ kind: "foster", stages: [{ rKPerW: 0.5, tauS: 2 }, { rKPerW: 3, tauS: 60 }] });
  const limits = { ambientC: 40, limitC: 155, marginK: 10 };
  const allowedRise = 105;
  const P = 200;
  const onS = 0.2;
  const corner = rectangularFault("short", model, P, onS, limits);
  const answer = fastestSchedule([corner], 40);
  const pulses: Pulse[] = answer.schedule.map((s) => ({ startS: s.startS, onS, powerW: P }));

  test("no attempt's peak exceeds limit − margin", () => {
    expect(answer.schedule).toHaveLength(40);
    // the bisection keeps the safe side, so the only excess allowed is rounding of the sums
    expect(superposedPeak(model, pulses, 4)).toBeLessThanOrEqual(allowedRise + 1e-9);
  });

  test("moving any attempt 1 % of its wait earlier makes it exceed", () => {
    let moved = 0;
    answer.schedule.forEach((s, k) => {
      if (s.waitS === null || s.waitS === 0) return; // back to back already: it cannot start earlier
      const earlier = pulses.slice(0, k + 1).map((p, i) => (i === k ? { ...p, startS: p.startS - 0.01 * s.waitS! } : p));
      expect(superposedPeak(model, earlier, 4)).toBeGreaterThan(allowedRise);
      moved++;
    });
    expect(moved).toBeGreaterThan(10);
  });

  test("the waits grow and the implied back-off ratio is their geometric mean", () => {
    const waits = answer.schedule.map((s) => s.waitS).filter((w): w is number => w !== null && w > 0);
    expect(answer.impliedBackoffRatio!).toBeCloseTo((waits[waits.length - 1]! / waits[0]!) ** (1 / (waits.length - 1)), 12);
    expect(answer.impliedBackoffRatio!).toBeGreaterThan(1);
  });

  test("the firmware rule (first wait, growth factor) is safe when re-simulated by superposition", () => {
    const rule = backoffRule([corner], 40, firstWaitCandidates(answer));
    expect(rule.rule).not.toBeNull();
    const { firstWaitS, growthFactor } = rule.rule!;
    const rulePulses: Pulse[] = [];
    let t = 0;
    for (let k = 0; k < 40; k++) {
      rulePulses.push({ startS: t, onS, powerW: P });
      t += onS + firstWaitS * growthFactor ** k;
    }
    expect(superposedPeak(model, rulePulses, 4)).toBeLessThanOrEqual(allowedRise + 1e-9);
    // and it cannot be faster than the fastest schedule
    expect(rule.burstEndS!).toBeGreaterThanOrEqual(answer.burstEndS - 1e-9);
  });

  test("property: for random one- and two-stage parts the schedule stays under the limit", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.1, max: 3, noNaN: true }),
        fc.double({ min: 0.05, max: 5, noNaN: true }),
        fc.double({ min: 0.5, max: 5, noNaN: true }),
        fc.double({ min: 10, max: 200, noNaN: true }),
        fc.double({ min: 0.01, max: 0.5, noNaN: true }),
        (r1, tau1, r2, power, on) => {
          const m = fosterToModal({ kind: "foster", stages: [{ rKPerW: r1, tauS: tau1 }, { rKPerW: r2, tauS: 30 * tau1 }] });
          const c = rectangularFault("random", m, power, on, { ambientC: 25, limitC: 150, marginK: 10 });
          const a = fastestSchedule([c], 12);
          const ps = a.schedule.map((s) => ({ startS: s.startS, onS: on, powerW: power }));
          return superposedPeak(m, ps, 4) <= 115 + 1e-9;
        },
      ),
      { numRuns: 25, seed: 6 },
    );
  });
});
