import { describe, expect, test } from "vitest";
import {
  ATTEMPT_TIMING_DEFAULTS,
  AttemptCursor,
  backoffWaits,
  defaultCircuitModels,
  loadProfile,
  planRetries,
  resolveCorners,
  retryForeverCheck,
  runBurst,
  supervisePrecharge,
  uniformBurst,
} from "../../src/internal.js";
import { tripDriveProfileText } from "./tripDriveProfile.js";

// Retry intervals a relay can do. An invented 420 V drive trips 20 ms after each completed
// pre-charge and its active discharge empties the link in about 50 ms (τ = 47 ohm × 1.1 mF), so
// with no relay and no timer the planner would have attempts follow each other at once: a quick
// restart finds the bus still charged and costs the resistor little. A real relay must open
// (release time) and close again (operate time) between attempts, and the firmware times waits in
// whole steps of its timer.
function profileText(relay: string, timer: string): string {
  return tripDriveProfileText({
    busVoltage: "420 V",
    capacitance: "1.1 mF",
    after: "20 ms",
    supervisedCapacitance: "[1 mF, 1.2 mF]",
    retryPlan: "{ spacing: end-to-start, attempts: 12, interval: 300 ms, map: { attempts: 3, points: 3 } }",
    relay,
    timer,
  });
}
const load = (relay: string, timer: string) => loadProfile(profileText(relay, timer), "drive.yaml");
const models = defaultCircuitModels;

/** Every wait, interval and lockout the retry plan proposes (the first attempt has no wait). */
function proposals(plan: ReturnType<typeof planRetries>): number[] {
  return [
    ...plan.uniformInterval.bands.map((b) => b.fromS),
    ...plan.forever.bands.map((b) => b.fromS),
    ...plan.fastest.schedule.slice(1).map((s) => s.waitS!),
    ...(plan.backoff?.rule == null ? [] : backoffWaits(plan.backoff.rule.firstWaitS, plan.backoff.rule.growthFactor, plan.backoff.attempts - 1, plan.setup.timing.timerResolutionS)),
    ...plan.lockout.bands.map((b) => b.fromS),
  ];
}

/** True when x is a whole number of steps: x/step within 1e-9 of an integer (decimal steps are not exact in binary). */
const onGrid = (x: number, step: number): boolean => Math.abs(x / step - Math.round(x / step)) < 1e-9;

describe("retry timing: relay switching times and the firmware timer", () => {
  test("the profile keys resolve, each default from ATTEMPT_TIMING_DEFAULTS", () => {
    expect(load("", "").timing).toEqual(ATTEMPT_TIMING_DEFAULTS);
    expect(load("{ operate: 17 ms }", "").timing).toEqual({ operateS: 0.017, releaseS: ATTEMPT_TIMING_DEFAULTS.releaseS, timerResolutionS: ATTEMPT_TIMING_DEFAULTS.timerResolutionS });
    expect(load("{ operate: 17 ms, release: 8 ms }", "10 ms").timing).toEqual({ operateS: 0.017, releaseS: 0.008, timerResolutionS: 0.01 });
  });

  test("with no relay and no timer the unconstrained answer is 0 s (the case the relay rules out)", () => {
    const plan = planRetries(load("{ operate: 0 s, release: 0 s }", "0 s"), models);
    expect(plan.uniformInterval.minimumIntervalS).toBe(0);
    expect(plan.fastest.schedule.slice(1).every((s) => s.waitS === 0)).toBe(true);
    expect(plan.lockout.minimumLockoutS).toBe(0);
  });

  test("the default relay: nothing proposed is shorter than operate + release, in retries and supervise", () => {
    const minWaitS = ATTEMPT_TIMING_DEFAULTS.operateS + ATTEMPT_TIMING_DEFAULTS.releaseS;
    const plan = planRetries(load("", ""), models);
    const all = proposals(plan);
    expect(all.length).toBeGreaterThan(10);
    for (const x of all) expect(x).toBeGreaterThanOrEqual(minWaitS * (1 - 1e-12));
    // the quick band that a relay can reach still exists: its lower end is the relay's dead time
    expect(plan.uniformInterval.minimumIntervalS).toBeCloseTo(minWaitS, 12);
    const supervise = supervisePrecharge(load("", ""), models);
    expect(supervise.storm.backToBackWaitS).toBeGreaterThanOrEqual(minWaitS * (1 - 1e-12));
  });

  test.each([
    ["10 ms", 0.01],
    ["100 ms", 0.1],
  ])("a %s timer: every proposal is a whole number of steps, at least operate + release, and re-checked safe", (timer, stepS) => {
    // operate 17 ms + release 8 ms = 25 ms: not a whole number of 10 ms steps, so the shortest
    // wait proposed is 30 ms (or 100 ms on the coarser timer)
    const plan = planRetries(load("{ operate: 17 ms, release: 8 ms }", timer), models);
    expect(plan.setup.shortestWaitS).toBe(stepS === 0.01 ? 0.03 : 0.1);
    for (const x of proposals(plan)) {
      expect(onGrid(x, stepS)).toBe(true);
      expect(x).toBeGreaterThanOrEqual(0.025);
    }
    const corners = resolveCorners(plan.setup.scenarios);
    // 1. the uniform interval: the burst of 12 at that wait, simulated again, is safe everywhere
    const u = plan.uniformInterval.minimumIntervalS!;
    for (const c of corners) {
      const run = runBurst(new AttemptCursor(c), uniformBurst(12, u, "end-to-start"), 0);
      expect([run.overlapAt, run.firstUnsafe]).toEqual([null, null]);
    }
    // 3. retrying for ever at the rounded interval
    for (const c of corners) expect(retryForeverCheck(c, plan.forever.minimumIntervalS!, "end-to-start").safe).toBe(true);
    // 4. the fastest schedule as firmware runs it (each corner waits from its own attempt's end),
    // and the peaks the report gives are those of the rounded schedule
    plan.setup.scenarios.forEach((_, i) => {
      const cursor = new AttemptCursor(corners[i]!);
      plan.fastest.schedule.forEach((row, k) => {
        const trial = cursor.tryAt(k === 0 ? 0 : cursor.endS + row.waitS!)!;
        expect(trial.safe).toBe(true);
        expect(trial.record.peakC).toBeLessThanOrEqual(row.governing.peakC + 1e-9);
        cursor.keep(trial);
      });
    });
    // 4. the back-off rule with every wait rounded up
    const rule = plan.backoff!.rule!;
    const gaps = backoffWaits(rule.firstWaitS, rule.growthFactor, 11, stepS);
    for (const c of corners) expect(runBurst(new AttemptCursor(c), { gapsS: gaps, spacing: "end-to-start" }, 0).firstUnsafe).toBeNull();
    // 5. the lockout: the profile's burst, the rounded lockout, the same burst again
    const lockoutS = plan.lockout.minimumLockoutS!;
    for (const c of corners) {
      const cursor = new AttemptCursor(c);
      runBurst(cursor, plan.setup.policy, 0);
      const second = runBurst(cursor, plan.setup.policy, plan.lockout.burstEndS + lockoutS);
      expect([second.overlapAt, second.firstUnsafe]).toEqual([null, null]);
    }
  });

  test("a profile's lockout shorter than the relay allows cannot be the policy: it fails, with the reason", () => {
    const profile = loadProfile(profileText("", "").replace("lockout: 2 min", "lockout: 10 ms"), "drive.yaml");
    const plan = planRetries(profile, models);
    expect(plan.policy.verdict).toBe("fail");
    expect(plan.policy.cyclesVerdict).toBe("fail");
    expect(plan.policy.reasons).toContain('corner "nominal": a 0.01 s lockout is shorter than the relay\'s release and operate times (0.03 s): the next burst cannot start that soon');
  });

  test("a band too narrow for the timer is not proposed: rounding up into the gap between bands is caught by the re-check", () => {
    // on a 10 ms timer the quick band starts at 30 ms; on a 100 ms timer a naive round-up would
    // propose 100 ms, which lies between the bands (the bus is empty by then, the part still hot)
    const fine = planRetries(load("{ operate: 17 ms, release: 8 ms }", "10 ms"), models);
    const coarse = planRetries(load("{ operate: 17 ms, release: 8 ms }", "100 ms"), models);
    expect(fine.uniformInterval.minimumIntervalS).toBe(0.03);
    expect(coarse.uniformInterval.minimumIntervalS!).toBeGreaterThan(0.1);
    const unsafeAt100ms = resolveCorners(coarse.setup.scenarios).some((c) => runBurst(new AttemptCursor(c), uniformBurst(12, 0.1, "end-to-start"), 0).firstUnsafe !== null);
    expect(unsafeAt100ms).toBe(true);
  });
});
