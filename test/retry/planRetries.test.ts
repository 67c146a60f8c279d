import { describe, expect, test } from "vitest";
import { AttemptCursor } from "../../src/internal.js";
import { planOf } from "../helpers/closedLoopFixtures.js";

// The bundled home-storage profile is the case where the planners used to scan their whole space:
// its MOSFET's first attempt into the fault is above limit − margin on its own, while the source
// resistor beside it stays safe at every interval and its start voltage never settles (the
// converter switching on and off with the bus). Every answer is decided by that first attempt.
describe("planRetries on a profile whose first attempt is unsafe", () => {
  test("every answer is found from a bounded number of attempts, and says the first attempt decides", () => {
    const before = AttemptCursor.trialCount;
    const plan = planOf("home-storage-400v.yaml");
    const trials = AttemptCursor.trialCount - before;
    // 148 °C against 150 °C with a 20 K margin: inside the margin, so "warn" (the one verdict rule)
    expect(plan.policy.verdict).toBe("warn");
    expect(plan.policy.burst.corner).toBe("nominal / precharge-mosfet");
    expect(plan.uniformInterval.minimumIntervalS).toBeNull();
    expect(plan.uniformInterval.evaluations).toBe(0);
    expect(plan.maxAttempts?.attempts).toBe(0);
    expect(plan.forever.minimumIntervalS).toBeNull();
    expect(plan.forever.evaluations).toBe(0);
    expect(plan.fastest.schedule).toHaveLength(0);
    expect(plan.lockout.burstSafe).toBe(false);
    expect(plan.lockout.evaluations).toBe(0);
    // Counted, not timed: the lockout map's 40 columns of 2 corners take at most 10 attempts
    // each (800), the rest a few dozen. Counting attempts to the cap alone took 10,000 per
    // corner before, and each scan 240 evaluations or more.
    expect(trials).toBeLessThanOrEqual(1000);
  });
});
