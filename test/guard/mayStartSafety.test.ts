import fc from "fast-check";
import { describe, expect, test } from "vitest";
import { FixedPointEstimator, FloatEstimator, type GuardEstimator, buildThermalGuard, defaultCircuitModels, fixedPointGuard, floatGuard, runGuardBurst, simulateProfile } from "../../src/internal.js";
import { atCorner, bundledText, cornersOf, loadAs, PEAK_TOLERANCE_K, withEvents } from "../helpers/closedLoopFixtures.js";
import { faultAsWritten, guardOf, scheduleEvents, setupOf } from "./guardFixtures.js";

// The may-start rule against simulate. The estimators used here are the exported C sources'
// twins (exportedC.test.ts: bit for bit the same answers under gcc). Random fault
// sequences (fast-check, fixed seed, bounded runs): a corner, a number of attempts, and for each
// attempt a delay after the guard first allows it (a firmware busy elsewhere, a driver that
// starts late); the attempts the guard admits are written back into the profile and simulated:
// no corner may go above limit − margin. Then the guard against the retry planner's fastest safe
// schedule on the same tick: never earlier than it (it is the fastest), and later by at most the
// stated slack.

const PROFILES = ["warehouse-robot-48v.yaml", "heat-pump-trip-retries.yaml", "electric-boat-72v-supervision.yaml", "irrigation-pump-decade.yaml"];

describe.each(["fixed", "float"] as const)("random fault sequences, %s point: no attempt the guard admits crosses limit − margin in simulate", (numeric) => {
  test.each(PROFILES)("%s", (name) => {
    const text = bundledText(name);
    const setup = setupOf(name);
    const guard = buildThermalGuard(setup, setup.timing.timerResolutionS);
    const estimator = (): GuardEstimator => (numeric === "fixed" ? new FixedPointEstimator(fixedPointGuard(guard)) : new FloatEstimator(floatGuard(guard)));
    const corners = cornersOf(text);
    const fault = faultAsWritten(text);
    fc.assert(
      fc.property(
        fc.integer({ min: 0, max: corners.length - 1 }),
        fc.integer({ min: 2, max: 7 }),
        fc.array(fc.oneof(fc.constant(0), fc.integer({ min: 1, max: 40 }), fc.integer({ min: 40, max: 3000 })), { minLength: 7, maxLength: 7 }),
        (corner, attempts, delays) => {
          const burst = runGuardBurst(guard, setup, corner, estimator(), attempts, { extraWaitTicks: (k) => delays[k - 1] ?? 0 });
          expect(burst.attempts.length).toBe(attempts);
          // the exact own peak of every admitted attempt (AttemptCursor) is within limit − margin
          for (const a of burst.attempts) expect(a.headroomK).toBeGreaterThanOrEqual(0);
          const events = scheduleEvents(fault, burst.attempts.map((a) => ({ startS: a.startTick * guard.tickS, durationS: a.durationS })), burst.burstEndS + 60);
          const profile = loadAs(withEvents(atCorner(text, corners[corner]!), events), name);
          const result = simulateProfile(profile, { models: defaultCircuitModels });
          result.parts.forEach((part, p) => expect(part.peakTemperatureC).toBeLessThanOrEqual(part.limitC - profile.parts[p]!.marginK + PEAK_TOLERANCE_K));
        },
      ),
      { numRuns: 12, seed: 1903 },
    );
  });
});

/**
 * The stated slack: how much later than the fastest safe schedule the guard may allow an attempt
 * [s], and how much longer its burst may be. Measured (fixed point, Q15.16, 1 ms tick): robot at
 * most 68 ms later, burst 1.5 % longer; boat 47 ms, 1.7 %; heat pump 1 ms, 0.2 %; irrigation
 * 0 ms. The guard sums decayed states span by span instead of following the exact peak, and books
 * each tick's energy at the tick's end.
 */
const SLACK_S = 0.1;
const BURST_SLACK = 1.03;

describe("against the fastest safe schedule of the retry planner", () => {
  test.each(PROFILES)("%s: the guard is never earlier than the fastest schedule, and later by at most the stated slack", (name) => {
    for (const numeric of ["fixed", "float"] as const) {
      const report = guardOf(name, numeric);
      for (const c of report.conservatism) {
        expect(c.guardStartsS).toHaveLength(report.attempts);
        expect(c.fastestStartsS).toHaveLength(report.attempts);
        for (const late of c.laterByS) {
          // both on the 1 ms tick; a hair of floating-point below 0 is the same tick
          expect(late, `${name} ${numeric} ${c.corner}`).toBeGreaterThanOrEqual(-1e-9);
          expect(late, `${name} ${numeric} ${c.corner}`).toBeLessThanOrEqual(SLACK_S);
        }
        expect(c.burstRatio!).toBeLessThanOrEqual(BURST_SLACK);
      }
    }
  });
});
