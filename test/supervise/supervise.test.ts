import { describe, expect, test } from "vitest";
import {
  AttemptCursor,
  SUPERVISE_DEFAULTS,
  chargeSeriesResistor,
  createModalState,
  healthyCorners,
  longestShortFromState,
  longestShortUnderPolicy,
  profileRetryPolicy,
  resolveScenario,
  shortedScenario,
  supervisePrecharge,
} from "../../src/internal.js";
import { expectClose } from "../helpers/expectClose.js";
import { MODELS, ONE_STAGE_BASE, type OneStageSettings, oneStageProfile } from "./superviseFixtures.js";

// One Foster stage (R_th, τ) heated by a series resistor into a shorted output: the bus is held at
// 0 V, so the resistor dissipates the constant P = Vs²/R (no source resistance) for the whole
// timeout. Lumped capacitance (Incropera et al., Fundamentals of Heat and Mass Transfer, 7th ed.
// (2011), §5.1 and §5.3): dθ/dt = (P·R_th − θ)/τ, so from θ0
//   θ(t) = P·R_th + (θ0 − P·R_th)·e^(−t/τ),
// which rises monotonically; setting θ(t_max) = ΔT_max (limit − margin − ambient) gives
//   t_max = −τ·ln((P·R_th − ΔT_max)/(P·R_th − θ0)),
// and from cold (θ0 = 0) t_max = −τ·ln(1 − ΔT_max/(P·R_th)); when P·R_th ≤ ΔT_max the rise never
// reaches the limit (unbounded). The bisection stops when its bracket is below 1e-9 of the
// answer (SUPERVISE_DEFAULTS.bisectionRelTol), so the answers below are within about 1e-9 of the
// closed forms: measured 5.9e-10 relative at worst over these cases (2.6e-10 from cold), by
// printing each relative error when the tolerances were set. 2e-9 is twice the bracket.
const BASE: OneStageSettings = { ...ONE_STAGE_BASE, startVoltageV: 5 };
const P = (50 * 50) / 10; // 250 W at the highest bus voltage
const PR = P * 2; // 500 K
const DT = 150 - 0 - 25; // 125 K

describe("longestShortFromState: one Foster stage closed forms", () => {
  const profile = oneStageProfile(BASE);
  const part = profile.parts[0]!;
  const build = (t: number) => shortedScenario(profile, part, 50, t, MODELS);

  test("from cold: t_max = −τ·ln(1 − ΔT_max/(P·R_th))", () => {
    const answer = longestShortFromState(build);
    expect(answer.bounded).toBe(true);
    expectClose(answer.longestS, -10 * Math.log(1 - DT / PR), { rel: 2e-9 });
    expect(answer.startTemperatureC).toBe(25);
  });

  test.each([[0], [20], [50], [100], [124]])("from θ0 = %d K: t_max = −τ·ln((P·R_th − ΔT_max)/(P·R_th − θ0))", (theta0) => {
    // a one-stage state is the mode's power y with rise R_th·y, so θ0 is y = θ0/R_th
    const state = createModalState(part.model);
    state[0] = theta0 / 2;
    const answer = longestShortFromState(build, state);
    expectClose(answer.longestS, -10 * Math.log((PR - DT) / (PR - theta0)), { rel: 2e-9 });
    expectClose(answer.startTemperatureC, 25 + theta0, { abs: 1e-9 });
  });

  test("a start above the limit leaves no timeout at all", () => {
    const state = createModalState(part.model);
    state[0] = 130 / 2;
    expect(longestShortFromState(build, state).longestS).toBe(0);
  });

  test("unbounded when P·R_th ≤ ΔT_max (the steady rise stays within the limit)", () => {
    // 10 V into 10 Ω: P = 10 W, P·R_th = 20 K < 125 K
    const answer = longestShortFromState((t) => shortedScenario(profile, part, 10, t, MODELS));
    expect(answer.bounded).toBe(false);
    expect(answer.longestS).toBe(Infinity);
  });
});

describe("longestShortUnderPolicy: the retry burst, through the retry planner", () => {
  // a 10 min lockout is 60 τ: what a burst leaves has decayed by e^(−60) before the next burst, so
  // the first burst binds and the closed forms below apply to it
  const retry = `  - retry: { attempts: 3, interval: 5 s, fault: { type: shorted-output }, lockout: 10 min }\n`;
  const profile = oneStageProfile({ ...BASE, retry });
  const part = profile.parts[0]!;
  const build = (t: number) => shortedScenario(profile, part, 50, t, MODELS);
  const policy = profileRetryPolicy(profile.events)!;

  test("the policy is read from the profile's retry block", () => {
    expect(policy).toMatchObject({ attempts: 3, gapsS: [5, 5], intervalS: 5, lockoutS: 600 });
  });

  test("at the answer, the hottest attempt's start θ0 gives the same t_max in closed form", () => {
    // With equal attempts on one stage the attempt that starts hottest ends hottest, so the answer
    // T* must satisfy the closed form from that attempt's start: T* = −τ·ln((P·R_th − ΔT)/(P·R_th − θ0*)).
    const answer = longestShortUnderPolicy(build, policy);
    const theta0 = answer.startTemperatureC - 25;
    expect(theta0).toBeGreaterThan(0);
    expectClose(answer.longestS, -10 * Math.log((PR - DT) / (PR - theta0)), { rel: 2e-9 });
    // and it is shorter than the cold answer (the burst leaves the part warm)
    expect(answer.longestS).toBeLessThan(-10 * Math.log(1 - DT / PR));
  });

  test("hand-computed burst of three: θ0 of attempt k = θ_end(k−1)·e^(−(5 − T)/τ)", () => {
    // Independent check of the hottest start at the answer T: attempt 1 ends at PR(1 − e^(−T/τ));
    // attempt 2 starts after 5 − T s of cooling, ends at PR + (θ2 − PR)e^(−T/τ); attempt 3 likewise.
    const answer = longestShortUnderPolicy(build, policy);
    const T = answer.longestS;
    const a = Math.exp(-T / 10);
    const cool = Math.exp(-(5 - T) / 10);
    const end1 = PR * (1 - a);
    const start2 = end1 * cool;
    const end2 = PR + (start2 - PR) * a;
    const start3 = end2 * cool;
    const end3 = PR + (start3 - PR) * a;
    expectClose(answer.startTemperatureC - 25, start3, { rel: 1e-12 }); // same arithmetic: measured 0, rounding only
    // the third attempt ends at the allowed rise to the bisection's 1e-9 on T (measured 2.4e-10)
    expectClose(end3, DT, { rel: 1e-9 });
    expect(answer.binding).toBe("first burst");
  });

  test("a short lockout: the repeated bursts bind and the answer is shorter", () => {
    // 20 s lockout (2 τ): each burst starts from what the last one left (e^(−2) of its end rise and
    // more), so the periodic steady state of burst + lockout is hotter than the first burst
    const short = oneStageProfile({ ...BASE, retry: retry.replace("lockout: 10 min", "lockout: 20 s") });
    const p = short.parts[0]!;
    const answer = longestShortUnderPolicy((t) => shortedScenario(short, p, 50, t, MODELS), profileRetryPolicy(short.events)!);
    const first = longestShortUnderPolicy(build, policy);
    expect(answer.binding).toBe("repeated bursts");
    expect(answer.longestS).toBeLessThan(first.longestS);
    expect(answer.longestS).toBeGreaterThan(0);
  });
});

describe("supervisePrecharge: the timeout window and checks", () => {
  const profile = oneStageProfile({ ...BASE, checkTimesS: [0.002, 0.005, 0.01, 0.02] });
  const report = supervisePrecharge(profile, MODELS);

  test("lower end = τ·ln((Vs − V0)/((1 − k)·Vs)) of the worst corner (textbook RC charging)", () => {
    // Hayt, Kemmerly & Durbin, Engineering Circuit Analysis, 8th ed. (2012), §8.8 (driven RC circuit,
    // section from memory): Vc(t) = Vs − (Vs − V0)e^(−t/RC).
    // Worst corner: C = 2 mF, k = 0.95, and Vs = 50 V (with V0 = 5 V the ratio (Vs − V0)/((1 − k)Vs)
    // is 18 at 50 V against 17.5 at 40 V). The model is closed form too; 1e-9 covers rounding.
    const tau = 10 * 2e-3;
    expectClose(report.window.lowerS, tau * Math.log((50 - 5) / ((1 - 0.95) * 50)), { rel: 1e-9 });
    expect(report.window.lowerCorner).toBe("2.00 mF, 50.0 V, 95.0 %, no load");
    // every corner against its own closed form
    for (const c of report.corners) {
      const k = c.thresholdV / c.busVoltageV;
      expectClose(c.completionS, 10 * c.capacitanceF * Math.log((c.busVoltageV - 5) / ((1 - k) * c.busVoltageV)), { rel: 1e-9 });
    }
    expect(report.corners).toHaveLength(8);
  });

  test("upper end from cold and the margin", () => {
    expectClose(report.window.cold.longestS, -10 * Math.log(1 - DT / PR), { rel: 2e-9 });
    expect(report.window.underRetry).toBeNull();
    expect(report.window.exists).toBe(true);
    expectClose(report.window.marginS, report.window.upperS - report.window.lowerS, { rel: 1e-12 });
    expect(report.verdict).toBe("pass");
  });

  test("the recommended early-abort check never trips on any corner, and a short puts (Vs²/R)·t_check into the part", () => {
    const check = report.recommendedAbort!;
    expect(check.usable).toBe(true);
    // every corner simulated on its own by the circuit model (a fixed dwell ending at the check)
    // and by the textbook closed form (Hayt §8.8): both above the threshold
    for (const corner of healthyCorners(profile.supervision!, profile.circuit!)) {
      const run = chargeSeriesResistor(
        { resistanceOhm: 10, capacitanceF: corner.capacitanceF },
        { sourceVoltageV: corner.busVoltageV, initialVoltageV: 5, completion: { dwellS: check.timeS, timeoutS: check.timeS } },
      );
      const closed = corner.busVoltageV - (corner.busVoltageV - 5) * Math.exp(-check.timeS / (10 * corner.capacitanceF));
      expectClose(run.endVoltageV, closed, { rel: 1e-9 });
      expect(run.endVoltageV).toBeGreaterThan(check.thresholdV);
    }
    // Joule heating of the constant short current Vs/R for t_check (Hayt §2.4); exact segment integral
    expectClose(check.shortEnergyJ, P * check.timeS, { rel: 1e-12 });
    // the threshold keeps the stated margin below the slowest corner
    expectClose(check.thresholdV, (1 - SUPERVISE_DEFAULTS.checkMarginFraction) * check.lowestHealthyV, { rel: 1e-12 });
    // it is the usable check with the least energy
    for (const c of report.abortChecks) if (c.usable) expect(c.shortEnergyJ).toBeGreaterThanOrEqual(check.shortEnergyJ);
  });

  test("a check below the measurement floor is not usable", () => {
    // at 2 ms the slowest corner (2 mF, 40 V) is at 40 − 35·e^(−0.1) = 8.33 V; 0.8 of it is 6.66 V,
    // above the 4 V floor (10 % of 40 V): usable. A 7 V floor makes it unusable.
    const strict = supervisePrecharge({ ...profile, supervision: { ...profile.supervision!, minCheckVoltageV: 7 } }, MODELS);
    expect(report.abortChecks[0]!.usable).toBe(true);
    expect(strict.abortChecks[0]!.usable).toBe(false);
    expect(strict.recommendedAbort!.timeS).toBe(0.005);
  });

  test("rise-too-fast checks: no healthy corner reaches the threshold", () => {
    for (const check of report.riseChecks) {
      for (const corner of healthyCorners(profile.supervision!, profile.circuit!)) {
        const v = corner.busVoltageV - (corner.busVoltageV - 5) * Math.exp(-check.timeS / (10 * corner.capacitanceF));
        expect(v).toBeLessThan(check.thresholdV);
      }
    }
    // the fastest corner at 2 ms is 1 mF at 50 V: 50 − 45·e^(−0.2) = 13.16 V; threshold 1.2× = 15.8 V ≤ 0.8·40 V: usable
    expectClose(report.riseChecks[0]!.highestHealthyV, 50 - 45 * Math.exp(-0.2), { rel: 1e-9 });
    expect(report.recommendedRise!.timeS).toBe(0.002);
  });

  test("retry storm back to back: floor(t_max / timeout) attempts (back-to-back attempts are one long pulse)", () => {
    // zero wait between attempts of constant power P: N attempts of T are one pulse of N·T, safe
    // while N·T ≤ t_max = 2.877 s, so N = 2 at T = 1 s; the retry planner (maxAttempts) must agree.
    // Back to back is as soon as the default relay allows (30 ms apart): the two gaps cool the
    // part by θ·(1 − e^(−0.03/10)) at θ ≈ 48 K and 91 K, under 0.5 K in all, far less than the
    // (P·R_th − ΔT_max)/τ × (3 s − t_max) ≈ 4.6 K by which a third attempt passes the limit: N stays 2.
    expect(report.storm.backToBack.attempts).toBe(Math.floor(-10 * Math.log(1 - DT / PR) / 1));
    expect(report.storm.backToBack.unlimited).toBe(false);
    expect(report.storm.backToBackWaitS).toBe(0.03);
  });

  test("envelope: low ≤ high everywhere, energy rises linearly into the short", () => {
    const e = report.envelope;
    e.timeS.forEach((t, i) => {
      expect(e.lowV[i]!).toBeLessThanOrEqual(e.highV[i]! + 1e-12);
      expectClose(e.shortEnergyJ[i]!, P * t, { rel: 1e-12, abs: 1e-12 });
    });
  });
});

// The verdict on the profile's own timeout, no retry block: one attempt from cold into the short,
// θ(t) = P·R_th·(1 − e^(−t/τ)) = 500 K·(1 − e^(−t/10 s)) at its end (the closed form above). With a
// 20 K margin below 150 °C the allowed rise is 105 K and the limit's 125 K: 1 s gives 47.6 K
// (pass), 2.6 s gives 114.5 K (inside the margin: warn), 3.2 s gives 136.9 K (fail); every case
// more than 9 K from a boundary.
describe("supervisePrecharge: the verdict on the profile's timeout", () => {
  test.each([
    [1, "pass", true],
    [2.6, "warn", false],
    [3.2, "fail", false],
  ])("a %d s timeout: %s", (timeoutS, verdict, inside) => {
    const report = supervisePrecharge(oneStageProfile({ ...BASE, marginK: 20, timeoutS }), MODELS);
    expect(report.configuredInside).toBe(inside);
    expect(report.timeoutVerdict).toBe(verdict);
    expect(report.verdict).toBe(verdict);
  });

  test("a timeout shorter than the slowest healthy charge fails, however cool the part stays", () => {
    // C up to 0.5 F: τ = 5 s, to 95 % from 5 V about 14.5 s; a 1 s timeout stops healthy units
    const report = supervisePrecharge(oneStageProfile({ ...BASE, capacitanceF: [0.2, 0.5], marginK: 20 }), MODELS);
    expect(report.timeoutVerdict).toBe("pass");
    expect(report.verdict).toBe("fail");
  });
});

describe("supervisePrecharge: no safe timeout", () => {
  test("the ends cross: reported with the reason, verdict fail", () => {
    // C up to 0.5 F: τ = 5 s, to 95 % from 5 V about 14.5 s, while the short is survivable 2.88 s
    const report = supervisePrecharge(oneStageProfile({ ...BASE, capacitanceF: [0.2, 0.5] }), MODELS);
    expect(report.window.exists).toBe(false);
    expect(report.window.reason).toContain("needs");
    expect(report.verdict).toBe("fail");
    expect(report.problems[0]).toMatch(/^no safe timeout exists/);
  });

  test("a healthy corner that stalls (a load the resistor cannot charge past) leaves no window", () => {
    // a 10 ohm load against 10 ohm: the bus settles at Vs/2, below any 90 % threshold
    const loads = "    loads:\n      - { kind: resistive, resistance: 10 ohm }\n";
    const report = supervisePrecharge(oneStageProfile({ ...BASE, loads }), MODELS);
    expect(report.window.lowerS).toBe(Infinity);
    expect(report.window.exists).toBe(false);
    expect(report.window.reason).toContain("never completes");
  });
});

test("resolveScenario accepts the shorted scenario (planner contract)", () => {
  const profile = oneStageProfile(BASE);
  const corner = resolveScenario(shortedScenario(profile, profile.parts[0]!, 50, 1, MODELS));
  const trial = new AttemptCursor(corner).tryAt(0)!;
  expect(trial.record.durationS).toBe(1);
  expectClose(trial.record.energyJ, P * 1, { rel: 1e-12 });
});
