import { describe, expect, test } from "vitest";
import { circuitReadsTemperature, defaultCircuitModels, profileRetrySetup, segmentEnergy } from "../../src/internal.js";
import { bundledText, loadAs } from "../helpers/closedLoopFixtures.js";

// The retry planner remembers recent attempts by their start; a circuit whose values follow its
// part's temperature (circuitReadsTemperature: an NTC, a drifting MOSFET) must be remembered by the
// start temperature too, or a hot start would reuse a cold one's outcome.
describe("the attempt memo of a temperature-dependent circuit", () => {
  test("an NTC retried into a short: a hot start is not the cold start's outcome", () => {
    const name = "bench-supply-ntc-hot-restart.yaml";
    const text = bundledText(name).replace(/events:[\s\S]*$/, "events:\n  - retry: { label: restart, attempts: 3, interval: 5 s, lockout: 5 min, fault: { type: shorted-output } }\n");
    const profile = loadAs(text, name);
    expect(circuitReadsTemperature(profile.circuit)).toBe(true);
    const attempt = profileRetrySetup(profile, defaultCircuitModels).scenarios[0]!.attempt;
    const energy = (partTemperatureC: number) => attempt({ attemptIndex: 0, waitS: Infinity, capacitorVoltageV: 0, partTemperatureC }).trace.reduce((s, seg) => s + segmentEnergy(seg.terms, seg.durationS), 0);
    const cold = energy(35);
    const hot = energy(150);
    // ntc-beta, B 3000 K: R(150 °C) = 10 Ω·e^(3000·(1/423.15 − 1/298.15)) ≈ 0.51 Ω (IEC 60539-1, the B
    // value): into a short the power V²/R, and the energy over the same timeout, grows about twentyfold
    expect(hot / cold).toBeGreaterThan(10);
    expect(energy(35)).toBe(cold);
  });
});
