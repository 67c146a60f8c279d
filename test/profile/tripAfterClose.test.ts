import { describe, expect, test } from "vitest";
import {
  defaultCircuitModels,
  loadProfile,
  parseEventLog,
  planRetries,
  replayEventLog,
  simulateProfile,
  sizeHeatCapacity,
  supervisePrecharge,
} from "../../src/internal.js";
import { expectClose } from "../helpers/expectClose.js";
import { tripDriveProfileText } from "./tripDriveProfile.js";

// A trip-after-close fault with `after: 0 s` trips the system at the moment the contactor closes:
// the bus is disconnected and drained like after any other trip. It must not be read as "no
// trip". The same invented profile with the trip 0 s, 1 ns and 1 ms after closing must give
// continuous answers in every command.
//
// Tolerances. The trip delay δ adds time with the contactor closed, when no current flows
// through the resistor; retries are start to start, so δ only shortens the drain before the next
// attempt (the active discharge, τ = 47 ohm × 1 mF = 47 ms, empties the bus long before the next
// attempt 1 s later). Temperatures therefore move by at most the fastest rate of change of the
// part's temperature times δ. For a Foster network under a power P ≤ P_max each stage obeys
// dθ_i/dt = (P·R_i − θ_i)/τ_i with 0 ≤ θ_i ≤ P_max·R_i, so |dT/dt| ≤ P_max·Σ R_i/τ_i (lumped
// capacitance per stage, Incropera et al., Fundamentals of Heat and Mass Transfer, 7th ed. (2011),
// §5.2). Here P_max = (400 V)²/20 ohm = 8 kW and Σ R_i/τ_i = 0.5/2 + 3/60 = 0.3 K/J: 2400 K/s,
// so 2.4e-6 K for 1 ns and 2.4 K for 1 ms. The defect this guards against moved the peak by tens
// of kelvin (the attempts after the first found the bus still charged and cost nothing).
const P_MAX_W = (400 * 400) / 20;
const RATE_K_PER_S = P_MAX_W * (0.5 / 2 + 3 / 60);
const DELAYS: readonly (readonly [string, number])[] = [
  ["0 s", 0],
  ["1 ns", 1e-9],
  ["1 ms", 1e-3],
];

function profileText(after: string): string {
  return tripDriveProfileText({ busVoltage: "400 V", capacitance: "1 mF", after, supervisedCapacitance: "[0.9 mF, 1.1 mF]", retryPlan: "{ attempts: 4, map: { attempts: 3, points: 3 } }" });
}
const load = (after: string) => loadProfile(profileText(after), "trip.yaml");
const models = defaultCircuitModels;

describe("a trip at 0 s after the contactor closes is a trip", () => {
  const sims = DELAYS.map(([after]) => simulateProfile(load(after), { models }));

  test.each(DELAYS)("simulate, after %s: every attempt charges from an empty bus", (_after, delayS) => {
    const sim = sims[DELAYS.findIndex(([, d]) => d === delayS)]!;
    // each attempt puts ½·C·Vs² = ½ × 1 mF × (400 V)² = 80 J into the resistor when it charges
    // from 0 V to Vs (exactly: to 95 % and then the rest with the contactor closed is not the
    // resistor's; the model's 79.8 J), so six attempts put 6 × that in; without the drain
    // between attempts the last five would put nothing in.
    const first = sim.parts[0]!.energyJ / 6;
    expectClose(first, 79.8, { rel: 1e-3 });
  });

  test.each(DELAYS.slice(1))("simulate: peak after %s is within P_max·ΣR/τ·δ of the peak after 0 s", (_after, delayS) => {
    const peak0 = sims[0]!.parts[0]!.peakTemperatureC;
    const peak = sims[DELAYS.findIndex(([, d]) => d === delayS)]!.parts[0]!.peakTemperatureC;
    expectClose(peak, peak0, { abs: RATE_K_PER_S * delayS });
    expect(sims[0]!.parts[0]!.verdict).toBe(sims[DELAYS.findIndex(([, d]) => d === delayS)]!.parts[0]!.verdict);
  });

  test.each(DELAYS)("simulate and retries agree on the burst from cold, after %s", (after) => {
    // the same attempts through two paths: the profile's expansion and the retry planner's
    // cursor (both exact modal integration of the same circuit model), so they agree to rounding
    const sim = simulateProfile(load(after), { models });
    const plan = planRetries(load(after), models);
    expectClose(plan.policy.burst.peakC, sim.parts[0]!.peakTemperatureC, { abs: 1e-6 });
    expect(plan.policy.burstSafe).toBe(sim.parts[0]!.verdict !== "fail" && sim.parts[0]!.peakTemperatureC <= 180);
  });

  test("retries: the answers are continuous in the trip delay", () => {
    const plans = DELAYS.map(([after]) => planRetries(load(after), models));
    const [p0, ...rest] = plans;
    rest.forEach((p, i) => {
      const delayS = DELAYS[i + 1]![1];
      expect(p.policy.verdict).toBe(p0!.policy.verdict);
      expectClose(p.policy.burst.peakC, p0!.policy.burst.peakC, { abs: RATE_K_PER_S * delayS });
      expectClose(p.lockout.burst.peakC, p0!.lockout.burst.peakC, { abs: RATE_K_PER_S * delayS });
      p.fastest.schedule.forEach((row, k) => expectClose(row.governing.peakC, p0!.fastest.schedule[k]!.governing.peakC, { abs: RATE_K_PER_S * delayS }));
    });
  });

  test("size: the capacity scale is continuous in the trip delay", () => {
    const scales = DELAYS.map(([after]) => sizeHeatCapacity(load(after), 0, { models }).inversion.scale);
    // the scale is bisected to SIZE_DEFAULTS' relative width of 1e-3; a delay that moves the peak
    // by far less than the 0.01 K target tolerance leaves the bisection on the same steps
    expectClose(scales[1]!, scales[0]!, { rel: 1e-3 });
    expectClose(scales[2]!, scales[0]!, { rel: 1e-3 });
  });

  test("supervise: the window and the retry-storm counts do not depend on the trip delay", () => {
    // supervise plans for attempts into a short, which never complete, so a trip after closing
    // never happens there: the answers must be the same numbers
    const reports = DELAYS.map(([after]) => supervisePrecharge(load(after), models));
    for (const r of reports.slice(1)) {
      expect(r.window.lowerS).toBe(reports[0]!.window.lowerS);
      expect(r.window.upperS).toBe(reports[0]!.window.upperS);
      expect(r.storm.backToBack.attempts).toBe(reports[0]!.storm.backToBack.attempts);
      expect(r.verdict).toBe(reports[0]!.verdict);
    }
  });

  test.each(DELAYS)("replay: a log of the burst with each trip line %s after the charge completes gives simulate's peak", (after, delayS) => {
    // the log states the profile's burst line by line: a power-up at each attempt's start and a
    // trip δ after its charge completes, then the lockout. Both runs are the same exact modal
    // integration of the same attempts (the replay passes through log times printed and read
    // back as doubles), so they agree to rounding.
    const attempts: { startS: number; durationS: number }[] = [];
    const sim = simulateProfile(load(after), { models, onEvent: (e) => e.kind === "trip-after-close" && attempts.push({ startS: e.startS, durationS: e.durationS }) });
    expect(attempts.length).toBe(6);
    const rows = ["time,event"];
    for (const a of attempts) rows.push(`${a.startS},power-up`, `${a.startS + a.durationS},trip`);
    const last = attempts[attempts.length - 1]!;
    rows.push(`${last.startS + last.durationS},lockout`, `${last.startS + last.durationS + 120},note`);
    // the trip is δ after the charge: the logged trip time minus the attempt's start is charge + δ
    expectClose(attempts[1]!.durationS - delayS, attempts[0]!.durationS - delayS, { rel: 1e-9 });
    const replay = replayEventLog(load(after), parseEventLog(rows.join("\n"), "unit.csv"), { models });
    expectClose(replay.simulation.parts[0]!.peakTemperatureC, sim.parts[0]!.peakTemperatureC, { abs: 1e-9 });
    expect(replay.simulation.parts[0]!.verdict).toBe(sim.parts[0]!.verdict);
  });
});
