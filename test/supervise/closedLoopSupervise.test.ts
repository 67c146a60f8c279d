import { describe, expect, test } from "vitest";
import { type SupervisionReport, defaultCircuitModels, supervisePrecharge } from "../../src/internal.js";
import { DANGER_STEP, PEAK_TOLERANCE_K, type SimulatedPeak, bundledText, loadAs, readPath, retryBlockOf, simulatedPeaks, withEvents, withValue, worst } from "../helpers/closedLoopFixtures.js";

// Closed loop for `heatledger supervise`: the upper ends of the pre-charge timeout window are
// written back into the bundled boat profile as its completion timeout, with the pre-charge
// running into a shorted output (the fault of the profile's retry block), and run through
// simulate at both ends of the supervision section's bus-voltage range (the window must hold for
// every pack voltage). At the answer the part stays at or below limit − margin (within
// PEAK_TOLERANCE_K, see closedLoopFixtures.ts); with the timeout 2 % longer it crosses.

const BOAT = "electric-boat-72v-supervision.yaml";
const text = bundledText(BOAT);
let report: SupervisionReport | undefined;
const reportOf = (): SupervisionReport => (report ??= supervisePrecharge(loadAs(text, BOAT), defaultCircuitModels));

/** The supervision section's bus-voltage range as written (each end is a corner of the short). */
const busEnds = readPath(text, ["supervision", "corners", "busVoltage"]) as string[];

/** Worst simulated peak over the bus-voltage ends, with the given timeout and events. */
function atTimeout(timeoutS: number, events: readonly unknown[]): SimulatedPeak {
  const withTimeout = withValue(text, ["circuit", "completion", "timeout"], timeoutS);
  return worst(busEnds.flatMap((v) => simulatedPeaks(withEvents(withValue(withTimeout, ["circuit", "busVoltage"], v), events), BOAT, `${v}`)));
}

const fault = retryBlockOf(text)["fault"];

describe("supervise: the timeout window's upper ends, written back as the completion timeout and simulated", () => {
  test("the bus-voltage range has two ends and the fault is a shorted output (what the window's upper end is about)", () => {
    expect(busEnds).toHaveLength(2);
    expect(fault).toEqual({ type: "shorted-output" });
  });

  test("from cold: one attempt into a short at the longest timeout holds; 2 % longer crosses limit − margin", () => {
    const cold = reportOf().window.cold;
    expect(cold.bounded).toBe(true);
    const once = [{ fault }, { wait: 60 }];
    expect(atTimeout(cold.longestS, once).headroomK).toBeGreaterThanOrEqual(-PEAK_TOLERANCE_K);
    expect(atTimeout(cold.longestS * (1 + DANGER_STEP), once).headroomK).toBeLessThan(-PEAK_TOLERANCE_K);
  });

  test("through the retry policy: burst + lockout repeated at the window's upper end holds; 2 % longer crosses, and it is the repetition that binds", () => {
    const window = reportOf().window;
    const under = window.underRetry!;
    expect(window.upperS).toBe(under.longestS);
    expect(under.binding).toBe("repeated bursts");
    const block = retryBlockOf(text);
    // the profile's own burst and lockout, repeated for 15 slowest time constants of the part
    // (e^(−15) ≈ 3e-7 of the start is left, far below what a 2 % longer timeout adds)
    const slowestTauS = Math.max(...loadAs(text, BOAT).parts[0]!.model.tauS);
    const cycleS = 10 + 180 + 1; // the burst's two 5 s intervals, the 3 min lockout and the last attempt (< 1 s)
    expect(block).toMatchObject({ attempts: 3, interval: "5 s", lockout: "3 min" });
    const repeated = [{ repeat: { count: Math.ceil((15 * slowestTauS) / cycleS), events: [{ retry: block }] } }, { wait: 60 }];
    expect(atTimeout(under.longestS, repeated).headroomK).toBeGreaterThanOrEqual(-PEAK_TOLERANCE_K);
    expect(atTimeout(under.longestS * (1 + DANGER_STEP), repeated).headroomK).toBeLessThan(-PEAK_TOLERANCE_K);
    // a single burst with the 2 % longer timeout still holds: the repeated bursts are what bind
    expect(atTimeout(under.longestS * (1 + DANGER_STEP), [{ retry: block }, { wait: 60 }]).headroomK).toBeGreaterThan(0);
  });
});
