import { describe, expect, test } from "vitest";
import { defaultCircuitModels, firstWaitCandidates, lockoutAfterBurst, profileRetrySetup } from "../../src/index.js";
import { expectClose } from "../helpers/expectClose.js";
import {
  DANGER_STEP,
  PEAK_TOLERANCE_K,
  type SimulatedPeak,
  attemptsWithWaits,
  bundledText,
  endToStartTrain,
  loadAs,
  planOf,
  retryBlockOf,
  simulateCorners,
  uniformRetry,
  withRetryKeys,
} from "./closedLoopFixtures.js";

// Closed loop for `heatledger retries`: every answer is written back into the bundled profile it
// came from (its parts, networks, limits and circuit; each retry plan corner's ambient, bus
// voltage and capacitance substituted in turn; the events replaced by what the answer says) and
// run through simulate. The planner's first attempt starts from an empty capacitor and a part at
// ambient, so the written-back events start the burst at t = 0 with nothing before it. Each
// answer must keep every corner at or below limit − margin (within PEAK_TOLERANCE_K, see there),
// and the answer moved 2 % toward danger must cross limit − margin in some corner. Where the move
// cannot cross because the answer sits on a bound of its own (no wait at all, the shortest
// interval an attempt allows, the smallest back-off factor), the test says so and asserts it.
// home-storage-400v.yaml is left out: its linear-MOSFET planner run takes minutes.

const HEAT_PUMP = "heat-pump-trip-retries.yaml";
const ROBOT = "warehouse-robot-48v.yaml";
const BOAT = "electric-boat-72v-supervision.yaml";

const faultOf = (text: string): unknown => retryBlockOf(text)["fault"];

/** Peak of the burst at a uniform interval, written back in the answer's spacing. */
function uniformBurstPeak(name: string, attempts: number, intervalS: number, spacing: string): SimulatedPeak {
  const text = bundledText(name);
  const events =
    spacing === "start-to-start" ? uniformRetry(faultOf(text), attempts, intervalS, 0) : attemptsWithWaits(faultOf(text), new Array<number>(attempts - 1).fill(intervalS));
  return simulateCorners(text, name, events);
}

/**
 * Enough attempts at one interval for the slowest thermal mode to settle: 15 slowest time
 * constants (what is left of the start is e^(−15) ≈ 3e-7 of it, far below the kelvins a 2 % move
 * changes), written in the answer's spacing.
 */
function foreverTrain(name: string, intervalS: number, spacing: string, attemptS: number, slowestTauS: number): SimulatedPeak {
  const text = bundledText(name);
  const period = spacing === "start-to-start" ? intervalS : intervalS + attemptS;
  const count = Math.ceil((15 * slowestTauS) / period);
  const events = spacing === "start-to-start" ? uniformRetry(faultOf(text), count, intervalS, 0) : endToStartTrain(faultOf(text), count, intervalS);
  return simulateCorners(text, name, events);
}

const slowestTau = (name: string): number => Math.max(...planOf(name).setup.scenarios.flatMap((s) => s.model.tauS));

describe("answer 1, shortest uniform interval: written back as a burst, simulated", () => {
  // Band edges and what binds each: "thermal" edges are where some corner's peak reaches
  // limit − margin, so 2 % toward danger (shorter at a lower edge, longer at an upper one) crosses.
  // The heat pump's first band starts at 0 s (end to start): no interval is shorter, and a quick
  // retry finds the bus still charged and costs the resistor little.
  test.each([
    { name: ROBOT, lower: ["thermal"], upper: [] as string[] },
    { name: BOAT, lower: ["thermal"], upper: [] as string[] },
    { name: HEAT_PUMP, lower: ["zero interval", "thermal"], upper: ["thermal"] },
  ])("$name: every band edge holds, and 2 % beyond each thermal edge crosses limit − margin", ({ name, lower, upper }) => {
    const answer = planOf(name).uniformInterval;
    const n = answer.attempts;
    expect(answer.bands.map((b) => (b.fromS === 0 ? "zero interval" : "thermal"))).toEqual(lower);
    expect(answer.bands.filter((b) => !b.openEnded)).toHaveLength(upper.length);
    expect(answer.minimumIntervalS).toBe(answer.bands[0]!.fromS);
    for (const band of answer.bands) {
      const at = uniformBurstPeak(name, n, band.fromS, answer.spacing);
      expect(at.headroomK, `${name} at ${band.fromS} s`).toBeGreaterThanOrEqual(-PEAK_TOLERANCE_K);
      if (band.fromS === 0) {
        // the binding reason is the bound itself: 0 s × 0.98 is the same schedule; the attempts
        // stay inside the margin with room to spare
        expect(answer.spacing).toBe("end-to-start");
        expect(at.headroomK).toBeGreaterThan(1);
      } else {
        const closer = uniformBurstPeak(name, n, band.fromS * (1 - DANGER_STEP), answer.spacing);
        expect(closer.headroomK, `${name} at 0.98 × ${band.fromS} s`).toBeLessThan(-PEAK_TOLERANCE_K);
      }
      if (!band.openEnded) {
        const end = uniformBurstPeak(name, n, band.toS, answer.spacing);
        expect(end.headroomK, `${name} at ${band.toS} s`).toBeGreaterThanOrEqual(-PEAK_TOLERANCE_K);
        const beyond = uniformBurstPeak(name, n, band.toS * (1 + DANGER_STEP), answer.spacing);
        expect(beyond.headroomK, `${name} at 1.02 × ${band.toS} s`).toBeLessThan(-PEAK_TOLERANCE_K);
      }
    }
  });
});

describe("answer 3, shortest interval for retrying for ever: a long train written back, simulated", () => {
  test.each([
    { name: ROBOT, lower: ["thermal"] },
    { name: BOAT, lower: ["thermal"] },
    { name: HEAT_PUMP, lower: ["zero interval", "thermal"] },
  ])("$name: every band edge holds over 15 slowest time constants, and 2 % beyond each thermal edge crosses", ({ name, lower }) => {
    const answer = planOf(name).forever;
    expect(answer.proven).toBe(true);
    expect(answer.bands.map((b) => (b.fromS === 0 ? "zero interval" : "thermal"))).toEqual(lower);
    // the attempt's own length (timeout, or charge plus trip delay) is what an end-to-start train
    // adds to each period; the longest over corners is used to size the train
    const attemptS = Math.max(...planOf(name).fastest.perCorner.map((c) => c.attempts[0]!.durationS));
    const tau = slowestTau(name);
    for (const band of answer.bands) {
      const at = foreverTrain(name, band.fromS, answer.spacing, attemptS, tau);
      expect(at.headroomK, `${name} at ${band.fromS} s`).toBeGreaterThanOrEqual(-PEAK_TOLERANCE_K);
      if (band.fromS === 0) expect(at.headroomK).toBeGreaterThan(1); // bound: no interval is shorter
      else expect(foreverTrain(name, band.fromS * (1 - DANGER_STEP), answer.spacing, attemptS, tau).headroomK).toBeLessThan(-PEAK_TOLERANCE_K);
      if (!band.openEnded) {
        expect(foreverTrain(name, band.toS, answer.spacing, attemptS, tau).headroomK).toBeGreaterThanOrEqual(-PEAK_TOLERANCE_K);
        expect(foreverTrain(name, band.toS * (1 + DANGER_STEP), answer.spacing, attemptS, tau).headroomK).toBeLessThan(-PEAK_TOLERANCE_K);
      }
    }
  });
});

describe("answer 4, fastest safe schedule and its back-off rule: written back attempt by attempt, simulated", () => {
  const waitsOf = (name: string): number[] => planOf(name).fastest.schedule.slice(1).map((s) => s.waitS!);

  test.each([ROBOT, BOAT, HEAT_PUMP])("%s: the schedule holds, simulate's peak is the planner's highest own peak", (name) => {
    const plan = planOf(name);
    expect(plan.fastest.schedule).toHaveLength(plan.setup.attempts);
    const sim = simulateCorners(bundledText(name), name, attemptsWithWaits(faultOf(bundledText(name)), waitsOf(name)));
    expect(sim.headroomK).toBeGreaterThanOrEqual(-PEAK_TOLERANCE_K);
    const plannerPeak = Math.max(...plan.fastest.perCorner.flatMap((c) => c.attempts.map((a) => a.peakC)));
    // same exact modal sums by two code paths: rounding only (see PEAK_TOLERANCE_K)
    expectClose(sim.peakC, plannerPeak, { abs: PEAK_TOLERANCE_K });
  });

  // Which waits are thermal edges: an attempt whose own peak reaches limit − margin was placed at
  // the earliest safe moment, so starting it 2 % sooner crosses. An attempt that may follow the
  // previous one at once (wait 0 s) is bound by that: it cannot start earlier, and its own peak
  // stays below limit − margin (the robot's and boat's first attempts have not yet heated the
  // housing; every heat-pump restart finds the bus still charged and costs the resistor nothing).
  test.each([
    { name: ROBOT, zeroWaits: [2, 3], thermal: [4, 5, 6, 7, 8] },
    { name: BOAT, zeroWaits: [2], thermal: [3] },
    { name: HEAT_PUMP, zeroWaits: [2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12], thermal: [] as number[] },
  ])("$name: each wait 2 % shorter crosses limit − margin, or the wait is 0 s", ({ name, zeroWaits, thermal }) => {
    const schedule = planOf(name).fastest.schedule;
    const fault = faultOf(bundledText(name));
    expect(schedule.filter((s) => s.waitS === 0).map((s) => s.attempt)).toEqual(zeroWaits);
    expect(schedule.filter((s) => s.waitS !== null && s.waitS > 0).map((s) => s.attempt)).toEqual(thermal);
    for (const s of schedule) {
      if (s.waitS === 0) expect(s.governing.headroomK, `attempt ${s.attempt}`).toBeGreaterThan(1);
      if (s.waitS === null || s.waitS === 0) continue;
      expect(s.governing.headroomK).toBeLessThan(PEAK_TOLERANCE_K);
      const waits = waitsOf(name).map((w, i) => (i === s.attempt - 2 ? w * (1 - DANGER_STEP) : w));
      const sim = simulateCorners(bundledText(name), name, attemptsWithWaits(fault, waits));
      expect(sim.headroomK, `attempt ${s.attempt} 2 % sooner`).toBeLessThan(-PEAK_TOLERANCE_K);
    }
  });

  const ruleWaits = (firstWaitS: number, growth: number, attempts: number): number[] => Array.from({ length: attempts - 1 }, (_, k) => firstWaitS * growth ** k);

  test("robot: the back-off rule holds, and its waits 2 % shorter cross limit − margin (its growth factor is a thermal edge)", () => {
    const plan = planOf(ROBOT);
    const rule = plan.backoff!.rule!;
    const text = bundledText(ROBOT);
    const at = simulateCorners(text, ROBOT, attemptsWithWaits(faultOf(text), ruleWaits(rule.firstWaitS, rule.growthFactor, plan.setup.attempts)));
    expect(at.headroomK).toBeGreaterThanOrEqual(-PEAK_TOLERANCE_K);
    expect(rule.growthFactor).toBeGreaterThan(1);
    const shorter = ruleWaits(rule.firstWaitS, rule.growthFactor, plan.setup.attempts).map((w) => w * (1 - DANGER_STEP));
    expect(simulateCorners(text, ROBOT, attemptsWithWaits(faultOf(text), shorter)).headroomK).toBeLessThan(-PEAK_TOLERANCE_K);
    // the growth factor alone 2 % smaller crosses too
    const slower = ruleWaits(rule.firstWaitS, rule.growthFactor * (1 - DANGER_STEP), plan.setup.attempts);
    expect(simulateCorners(text, ROBOT, attemptsWithWaits(faultOf(text), slower)).headroomK).toBeLessThan(-PEAK_TOLERANCE_K);
  });

  test("boat: the back-off rule holds; it is bound by its smallest growth factor (1) and a first wait taken from the fastest schedule, not by the limit", () => {
    const plan = planOf(BOAT);
    const rule = plan.backoff!.rule!;
    const text = bundledText(BOAT);
    const waits = ruleWaits(rule.firstWaitS, rule.growthFactor, plan.setup.attempts);
    const at = simulateCorners(text, BOAT, attemptsWithWaits(faultOf(text), waits));
    expect(at.headroomK).toBeGreaterThan(1);
    // why 2 % shorter does not cross: a growth factor below 1 is no back-off, and the rule's first
    // wait is one of the fastest schedule's waits (the planner offers rules built on those)
    expect(rule.growthFactor).toBe(1);
    expect(firstWaitCandidates(plan.fastest)).toContain(rule.firstWaitS);
    expect(simulateCorners(text, BOAT, attemptsWithWaits(faultOf(text), waits.map((w) => w * (1 - DANGER_STEP)))).headroomK).toBeGreaterThan(0);
  });

  test("heat pump: every restart may follow the previous one at once, so there is no back-off rule to check", () => {
    const plan = planOf(HEAT_PUMP);
    expect(plan.fastest.schedule.every((s) => s.waitS === null || s.waitS === 0)).toBe(true);
    expect(plan.backoff).toBeNull();
  });
});

describe("answer 5, lockout after a burst: burst, lockout, the same burst again, simulated", () => {
  /** The profile's own retry block twice, the first with the given lockout, then a cooling tail. */
  const twoBursts = (text: string, lockoutS: number): unknown[] => {
    const block = retryBlockOf(text);
    return [{ retry: { ...block, lockout: lockoutS } }, { retry: { ...block, lockout: 60 } }];
  };

  test.each([ROBOT, BOAT, HEAT_PUMP])("%s (bundled): no lockout is needed; the same burst again at once holds (0 s is the bound: no lockout is shorter)", (name) => {
    const lockout = planOf(name).lockout;
    expect(lockout.burstSafe).toBe(true);
    expect(lockout.minimumLockoutS).toBe(0);
    const sim = simulateCorners(bundledText(name), name, twoBursts(bundledText(name), 0));
    expect(sim.headroomK).toBeGreaterThanOrEqual(-PEAK_TOLERANCE_K);
    expect(lockout.governing.headroomK).toBeGreaterThan(1);
  });

  // The bundled bursts need no lockout, so the crossing is shown on the same profiles with a
  // denser burst (keys of the retry block changed, everything else as bundled).
  test.each([
    { name: ROBOT, retry: { interval: 1.2, backoff: 1, maxInterval: 1.2 } },
    { name: BOAT, retry: { interval: 1.5 } },
    { name: HEAT_PUMP, retry: { interval: 0.6 } },
  ])("$name with a burst of $retry: the lockout holds, 2 % shorter crosses limit − margin", ({ name, retry }) => {
    const text = withRetryKeys(bundledText(name), retry);
    const setup = profileRetrySetup(loadAs(text, name), defaultCircuitModels);
    const answer = lockoutAfterBurst(setup.scenarios, setup.policy);
    expect(answer.burstSafe).toBe(true);
    const l = answer.minimumLockoutS!;
    expect(l).toBeGreaterThan(1);
    expect(simulateCorners(text, name, twoBursts(text, l)).headroomK).toBeGreaterThanOrEqual(-PEAK_TOLERANCE_K);
    expect(simulateCorners(text, name, twoBursts(text, l * (1 - DANGER_STEP))).headroomK).toBeLessThan(-PEAK_TOLERANCE_K);
  });
});
