import { describe, expect, test } from "vitest";
import { parse } from "yaml";
import { type SupervisionReport, defaultCircuitModels, planRetries, protectionFragment, supervisePrecharge } from "../../src/internal.js";
import { DANGER_STEP, PEAK_TOLERANCE_K, bundledText, loadAs, retryBlockOf, simulatedPeaks, withEvents, withValue, worst } from "../helpers/closedLoopFixtures.js";

// Closed loop for `supervise --checks`: the recommended checks, written as the profile
// fragment the command writes, are pasted under the bundled boat profile's `circuit:` key at the
// highest pack voltage (the corner that binds). The retry planner on that profile must find the
// retry-for-ever interval supervise promised; simulate, retrying for ever at that interval into
// the profile's short, stays within limit − margin, and 2 % sooner crosses it. Without the checks
// the planner finds supervise's interval for the timeout alone, more than ten times longer.

const BOAT = "electric-boat-72v-supervision.yaml";
const text = bundledText(BOAT);
let report: SupervisionReport | undefined;
const reportOf = (): SupervisionReport => (report ??= supervisePrecharge(loadAs(text, BOAT), defaultCircuitModels));

/** The boat profile with the written fragment pasted under circuit: and the pack at its highest voltage. */
function pasted(): string {
  const r = reportOf();
  const fragment = parse(protectionFragment(r.protection!.protection, "recommended checks")) as { protection: unknown };
  return withValue(withValue(text, ["circuit", "protection"], fragment.protection), ["circuit", "busVoltage"], r.shortBusVoltageV);
}

/** Retrying for ever (15 slowest time constants of the part) at a start-to-start interval into the profile's fault. */
function foreverAt(profileText: string, intervalS: number): number {
  const tau = Math.max(...loadAs(profileText, BOAT).parts[0]!.model.tauS);
  const count = Math.ceil((15 * tau) / intervalS);
  // a repeat with a start-to-start period (a retry block must allow the whole timeout per attempt)
  const events = [{ repeat: { count, period: intervalS, events: [{ fault: retryBlockOf(text)["fault"] }] } }, { wait: 60 }];
  return worst(simulatedPeaks(withEvents(profileText, events), BOAT)).headroomK;
}

describe("supervise --checks: the fragment pasted into the profile gives the promised retry interval", () => {
  test("the fragment holds the recommended early-abort and rise-too-fast checks, thresholds on the healthy side", () => {
    const r = reportOf();
    const checks = r.protection!.protection.busChecks!;
    expect(checks).toHaveLength(2);
    expect(checks[0]!.atS).toBe(r.recommendedAbort!.timeS);
    expect(checks[0]!.minV!).toBeLessThanOrEqual(r.recommendedAbort!.thresholdV);
    expect(checks[1]!.maxV!).toBeGreaterThanOrEqual(r.recommendedRise!.thresholdV);
  });

  test("the retry planner on the pasted profile finds supervise's interval; simulate holds there, 2 % sooner crosses", () => {
    const promised = reportOf().protection!.foreverWith.minimumIntervalS!;
    const without = reportOf().protection!.foreverWithout.minimumIntervalS!;
    expect(promised).toBeLessThan(without / 10);
    const profileText = pasted();
    const plan = planRetries(loadAs(profileText, BOAT), defaultCircuitModels);
    expect(plan.forever.minimumIntervalS).toBe(promised);
    expect(foreverAt(profileText, promised)).toBeGreaterThanOrEqual(-PEAK_TOLERANCE_K);
    expect(foreverAt(profileText, promised * (1 - DANGER_STEP))).toBeLessThan(-PEAK_TOLERANCE_K);
    // without the checks the planner on the same profile finds supervise's other number
    const bare = planRetries(loadAs(withValue(text, ["circuit", "busVoltage"], reportOf().shortBusVoltageV), BOAT), defaultCircuitModels);
    expect(bare.forever.minimumIntervalS).toBe(without);
  });

  test("each check reports the energy it lets through and its healthy margin", () => {
    const [abort, rise] = reportOf().protection!.checks;
    expect(abort!.kind).toBe("early-abort");
    // the weakest fault it catches takes no more than a hard short before the check fires (the
    // resistor's power (Vs − V)²·R/Rt² falls as the bus rises), and what it misses runs to the timeout
    expect(abort!.partialFault!.energyBeforeFiringJ).toBeLessThanOrEqual(abort!.shortEnergyJ!);
    expect(abort!.partialFault!.missedEnergyJ).toBeGreaterThan(abort!.shortEnergyJ!);
    expect(abort!.healthyMarginFraction).toBeGreaterThanOrEqual(0.2 - 1e-12);
    expect(rise!.healthyMarginV).toBeGreaterThan(0);
  });
});
