import { describe, expect, test } from "vitest";
import { type TimelineEvent, defaultCircuitModels, loadProfile, planRetries, profileRetrySetup, simulateProfile, supervisePrecharge } from "../../src/internal.js";
import { shortedBusProfile } from "../helpers/shortedBusProfile.js";

// The main contactor's operate and release times in every planner: the next attempt may start
// only once the contactor is open again (max(relay release, contactor release) + relay operate of
// dead time), and a charge that completes and then trips lasts the contactor's operate time
// longer (the trip delay counts from its contacts closing). The sums are by hand (common practice).

const load = (text: string) => loadProfile(text, "p.yaml", () => "");

/** The shorted-bus profile (48 V, 48 ohm, 1 mF: τ = 48 ms) with a contactor and these circuit extras. */
const withContactor = (contactor: string, events: string, sections = "") =>
  shortedBusProfile(events, sections).replace(
    "  discharge: { kind: bleeder, resistance: 10 kohm }",
    `  discharge: { kind: bleeder, resistance: 10 kohm }\n  contactor: { makingCurrent: 100 A, loopResistance: 20 mohm${contactor} }`,
  );

const tripRetry = (interval: string) => `  - retry:
      attempts: 3
      interval: ${interval}
      fault: { type: trip-after-close, after: 100 ms }
      lockout: 1 min`;

describe("the contactor's operate and release times", () => {
  test("its release time, longer than the relay's, sets the dead time between attempts in retries and supervise", () => {
    // default relay: release 10 ms, operate 20 ms; contactor release 50 ms: max(10, 50) + 20 = 70 ms
    const profile = load(withContactor(", release: 50 ms", tripRetry("2 s")));
    expect(profile.timing!.contactorReleaseS).toBe(0.05);
    const setup = profileRetrySetup(profile, defaultCircuitModels);
    expect(setup.shortestWaitS).toBeCloseTo(0.07, 12);
    for (const s of setup.scenarios) expect(s.minWaitS).toBeCloseTo(0.07, 12);
    // without the contactor's times the relay alone: 10 + 20 = 30 ms
    expect(profileRetrySetup(load(withContactor("", tripRetry("2 s"))), defaultCircuitModels).shortestWaitS).toBeCloseTo(0.03, 12);
  });

  test("a completed charge that trips lasts completion + contactor operate + trip delay, in simulate and in retries", () => {
    // completion at 95 %: t = R·C·ln(1/0.05) = 0.048 s × ln 20 (driven RC circuit, Hayt, Kemmerly &
    // Durbin, Engineering Circuit Analysis, 8th ed. (2012), §8.8); + 30 ms operate + 100 ms
    const expectedS = 0.048 * Math.log(20) + 0.03 + 0.1;
    const profile = load(withContactor(", operate: 30 ms", tripRetry("2 s")));
    const attempts: TimelineEvent[] = [];
    simulateProfile(profile, { models: defaultCircuitModels, onEvent: (e) => void (e.kind === "trip-after-close" && attempts.push(e)) });
    expect(attempts).toHaveLength(3);
    // the first from an empty bus (the later ones start from what the bleeder left)
    expect(attempts[0]!.durationS).toBeCloseTo(expectedS, 9);
    const scenario = profileRetrySetup(profile, defaultCircuitModels).scenarios[0]!;
    expect(scenario.attempt({ attemptIndex: 0, waitS: Infinity, capacitorVoltageV: 0, partTemperatureC: 25 }).durationS).toBeCloseTo(expectedS, 9);
  });

  test("a retry interval must hold the operate time too; the refusal names the interval's line", () => {
    // 0.5 s timeout + 30 ms operate + 100 ms trip delay + 30 ms relay = 0.66 s
    expect(() => load(withContactor(", operate: 30 ms", tripRetry("0.65 s")))).toThrow(
      "p.yaml:19: events[0].retry.interval: expected an interval (start to start) at least as long as an attempt can last plus the relay's release and operate times (0.66 s: the completion timeout, the contactor's operate time, the trip delay and 0.03 s for the relay), found 0.65 s",
    );
    expect(() => load(withContactor(", operate: 30 ms", tripRetry("0.66 s")))).not.toThrow();
  });

  test("planRetries and supervise answer with the contactor's dead time", () => {
    const text = withContactor(", release: 200 ms", tripRetry("2 s"));
    const plan = planRetries(load(text), defaultCircuitModels);
    // no proposed wait, end to start, is shorter than max(10, 200) + 20 ms
    expect(plan.setup.shortestWaitS).toBeCloseTo(0.22, 12);
    const supervision = `supervision:
  corners: { capacitance: [0.9 mF, 1.1 mF], busVoltage: [46 V, 48 V] }
`;
    const report = supervisePrecharge(load(text + supervision), defaultCircuitModels);
    expect(report.storm.backToBackWaitS).toBeCloseTo(0.22, 12);
  });
});
