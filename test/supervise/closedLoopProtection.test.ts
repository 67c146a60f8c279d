import { describe, expect, test } from "vitest";
import { parse } from "yaml";
import { type SupervisionReport, type TimelineEvent, defaultCircuitModels, healthyChargeI2t, planRetries, protectionFragment, simulateProfile, supervisePrecharge } from "../../src/internal.js";
import { DANGER_STEP, PEAK_TOLERANCE_K, bundledText, loadAs, retryBlockOf, simulatedPeaks, withEvents, withRetryKeys, withValue, worst } from "../helpers/closedLoopFixtures.js";

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
    // resistor's power (Vs − V)²·R/Rt² falls as the bus rises), and what it misses runs until the timeout or a recommended limit
    expect(abort!.partialFault!.energyBeforeFiringJ).toBeLessThanOrEqual(abort!.shortEnergyJ!);
    expect(abort!.partialFault!.missedEnergyJ).toBeGreaterThan(abort!.shortEnergyJ!);
    expect(abort!.healthyMarginFraction).toBeGreaterThanOrEqual(0.2 - 1e-12);
    expect(rise!.healthyMarginV).toBeGreaterThan(0);
  });
});

test("the smallest constant-current fault the early abort catches, against the RC closed form", () => {
  // An always-on load of I across the bus: by superposition the bus follows
  // V(t) = (Vs − I·Rt)·(1 − e^(−t/(Rt·C))) (driven RC circuit, Hayt, Kemmerly & Durbin, Engineering
  // Circuit Analysis, 8th ed. (2012), §8.8), so the check (V < Vthr at t) catches I above
  // (Vs − Vthr/(1 − e^(−t/(Rt·C))))/Rt, solved by hand.
  const abort = reportOf().protection!.checks[0]!;
  const rt = 47 + 0.08;
  const rise = 1 - Math.exp(-abort.timeS / (rt * 3.3e-3));
  const expectedA = (reportOf().shortBusVoltageV - abort.thresholdV / rise) / rt;
  expect(abort.currentFault!.currentA).toBeCloseTo(expectedA, 9);
  // a current the check misses runs until a limit ends it: more energy than the caught one gets
  expect(abort.currentFault!.missedEnergyJ).toBeGreaterThan(abort.currentFault!.energyBeforeFiringJ);
});

describe("supervise --checks: the firmware I²t limit and the maximum on-time", () => {
  const limit = (kind: "firmware-i2t" | "max-on-time") => reportOf().protection!.limits.find((l) => l.kind === kind)!;

  test("both are recommended for the boat, written into the fragment on the healthy side of every corner", () => {
    const r = reportOf();
    const i2t = limit("firmware-i2t");
    const onTime = limit("max-on-time");
    // (1 + 20 % margin) × the healthy value, rounded up to 4 digits
    expect(i2t.value).toBeGreaterThanOrEqual(1.2 * i2t.healthyValue);
    expect(i2t.value).toBeLessThan(1.2 * i2t.healthyValue * (1 + 1e-3));
    expect(onTime.healthyValue).toBe(r.window.lowerS);
    expect(onTime.value).toBeGreaterThanOrEqual(1.2 * r.window.lowerS);
    expect(onTime.value).toBeLessThan(r.configuredTimeoutS);
    const fragment = parse(protectionFragment(r.protection!.protection, "x")) as { protection: Record<string, unknown> };
    expect(fragment.protection["firmwareI2t"]).toBe(i2t.value);
    expect(fragment.protection["maxOnTime"]).toBe(onTime.value);
  });

  test("the I²t limit into a hard short fires at limit / I², with R·I²·t in the resistor (hand integral of a rectangular pulse)", () => {
    // A short holds the bus at 0 V: the path carries the constant I = Vs/(R + Rsrc) (Ohm's law,
    // Hayt, Kemmerly & Durbin, Engineering Circuit Analysis, 8th ed. (2012), §2.4); ∫i² dt = I²·t
    // reaches the limit at t = limit/I² (by hand), and the resistor takes I²·R·t = R·limit.
    const i2t = limit("firmware-i2t");
    const current = reportOf().shortBusVoltageV / (47 + 0.08);
    expect(i2t.shortFiringS).toBeCloseTo(i2t.value / current ** 2, 12);
    expect(i2t.shortEnergyJ).toBeCloseTo(47 * i2t.value, 9);
  });

  test("a healthy charge's I²t against the RC closed form (Vs²·C/(2·Rt))·(1 − (1 − k)²)", () => {
    // i = (Vs/Rt)·e^(−t/(Rt·C)) while an RC charges from 0 V (driven RC circuit, Hayt, Kemmerly &
    // Durbin, Engineering Circuit Analysis, 8th ed. (2012), §8.8); squared and integrated by hand to
    // the completion time t_k = Rt·C·ln(1/(1 − k)): (Vs/Rt)²·(Rt·C/2)·(1 − (1 − k)²).
    const profile = loadAs(text, BOAT);
    const corner = { name: "no load", capacitanceF: 3.3e-3, busVoltageV: 84, load: { kind: "none" as const }, completion: { fraction: 0.92 }, thresholdV: 0.92 * 84 };
    const bus = { corner, completionS: 0, outcome: "completed" as const, busStalled: false, reason: "", voltageAt: () => 0 };
    const rt = 47 + 0.08;
    const expected = (84 ** 2 * 3.3e-3 / (2 * rt)) * (1 - 0.08 ** 2);
    expect(healthyChargeI2t(defaultCircuitModels, profile.circuit!, bus, 0, 10)).toBeCloseTo(expected, 9);
  });

  test("the limits alone, pasted into the profile: the planner finds the promised interval; simulate holds there, 2 % sooner crosses", () => {
    const r = reportOf();
    const promised = r.protection!.foreverWithLimits!.minimumIntervalS!;
    // between the bus checks' interval and the bare timeout's
    expect(promised).toBeGreaterThan(r.protection!.foreverWith.minimumIntervalS!);
    expect(promised).toBeLessThan(r.protection!.foreverWithout.minimumIntervalS! / 5);
    const fragment = parse(protectionFragment({ i2t: [{ limitA2s: limit("firmware-i2t").value, kind: "firmware" }], maxOnTimeS: limit("max-on-time").value }, "limits")) as { protection: unknown };
    const profileText = withValue(withValue(text, ["circuit", "protection"], fragment.protection), ["circuit", "busVoltage"], r.shortBusVoltageV);
    expect(planRetries(loadAs(profileText, BOAT), defaultCircuitModels).forever.minimumIntervalS).toBe(promised);
    expect(foreverAt(profileText, promised)).toBeGreaterThanOrEqual(-PEAK_TOLERANCE_K);
    expect(foreverAt(profileText, promised * (1 - DANGER_STEP))).toBeLessThan(-PEAK_TOLERANCE_K);
  });

  test("with the full fragment every healthy corner still completes (no false trip)", () => {
    const r = reportOf();
    const protection = r.protection!.protection;
    const circuit = loadAs(text, BOAT).circuit!;
    for (const c of r.corners) {
      const at = { ...circuit, capacitanceF: c.capacitanceF, busVoltageV: c.busVoltageV };
      const run = defaultCircuitModels.charge(at, { kind: "resistive", resistanceOhm: 2200 }, { sourceVoltageV: c.busVoltageV, initialVoltageV: 0, completion: { fraction: c.thresholdV / c.busVoltageV, timeoutS: 10, protection } });
      const bare = defaultCircuitModels.charge(at, { kind: "none" }, { sourceVoltageV: c.busVoltageV, initialVoltageV: 0, completion: { fraction: c.thresholdV / c.busVoltageV, timeoutS: 10, protection } });
      expect([run.outcome, bare.outcome]).toEqual(["completed", "completed"]);
    }
  });
});

describe("a retry block shorter than the timeout, once protection ends each attempt early", () => {
  test("the pasted fragment lets a retry block run at supervise's interval; each attempt ends at the bus check", () => {
    const r = reportOf();
    const promised = r.protection!.foreverWith.minimumIntervalS!;
    expect(promised).toBeLessThan(r.configuredTimeoutS);
    const profile = loadAs(withRetryKeys(pasted(), { interval: promised, attempts: 5 }), BOAT);
    const attempts: TimelineEvent[] = [];
    simulateProfile(profile, { models: defaultCircuitModels, onEvent: (e) => void (e.kind === "shorted-output" && attempts.push(e)) });
    expect(attempts).toHaveLength(5);
    for (const a of attempts) {
      expect(a.outcome).toBe("tripped");
      expect(a.durationS).toBeCloseTo(r.recommendedAbort!.timeS, 9);
    }
  });

  test("an interval that cannot hold the attempt that ran and the relay's dead time is refused at its key", () => {
    // 50 ms until the check fires + 10 ms release + 20 ms operate (the default relay) = 80 ms
    const profile = loadAs(withRetryKeys(pasted(), { interval: 0.07 }), BOAT);
    expect(() => simulateProfile(profile, { models: defaultCircuitModels })).toThrow(
      /retry\.interval: expected an interval \(start to start\) at least as long as attempt 1 lasted plus the relay's and contactor's dead time \(0\.08 s: 0\.05 s, bus check at 0\.05 s: .*, and 0\.03 s\), found 0\.07 s/,
    );
  });
});
