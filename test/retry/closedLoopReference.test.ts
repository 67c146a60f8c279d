import { describe, expect, test } from "vitest";
import { parse } from "yaml";
import { createOdexSolver } from "../../src/circuits/loadOdex.js";
import { expectClose } from "../helpers/expectClose.js";
import { DANGER_STEP, bundledText, planOf } from "../helpers/closedLoopFixtures.js";
import { shortedPart, si } from "../helpers/shortedPartByHand.js";

// An independent reference for the retry planner's fastest safe schedule: the part's thermal
// network is integrated as an ordinary differential equation by odex (Hairer and Wanner's
// extrapolation code, a general-purpose solver from the npm registry), with no project thermal
// or circuit code. Each Foster stage i (R_i, τ_i) is the lumped first-order system
//   dθ_i/dt = (P(t)·R_i − θ_i)/τ_i,   junction rise = Σ θ_i
// (Incropera et al., Fundamentals of Heat and Mass Transfer, 7th ed. (2011), §5.1 and §5.3, lumped
// capacitance, one equation per stage). The power is worked out by hand from the profile's
// circuit: into a shorted output the bus is held at 0 V, so the series resistor R carries
// I = Vs/(R + Rsrc) and dissipates P = I²·R for the whole completion timeout (Ohm's and Joule's
// laws). Values are read from the bundled YAML files with the yaml package and a unit table
// (test/helpers/shortedPartByHand.ts).

/** An odex solver for an n-state reference: 1e-12 relative and absolute tolerance, dense output on. */
function referenceSolver(n: number): ReturnType<typeof createOdexSolver> {
  const solver = createOdexSolver(n);
  solver.relativeTolerance = 1e-12;
  solver.absoluteTolerance = 1e-12;
  solver.maxSteps = 1e6;
  solver.denseOutput = true;
  return solver;
}

interface Reference {
  /** junction temperature at the end of each attempt [°C] */
  readonly attemptEndC: number[];
  /** highest junction temperature anywhere in odex's steps (dense output searched), over the whole history and a tail [°C] */
  readonly peakC: number;
}

/**
 * Integrate the Foster stages through attempts of `powerW` lasting `onS`, the k-th wait after
 * attempt k's end, then a tail of `tailS`. Each stretch of constant power is one odex run in
 * stretch-local time scaled to [0, 1] (odex wants unit-size problems), at 1e-12 relative and
 * absolute tolerance; the state is carried from stretch to stretch.
 */
function integrateSchedule(stages: readonly { r: number; tau: number }[], ambientC: number, powerW: number, onS: number, waitsS: readonly number[], tailS: number): Reference {
  const theta = stages.map(() => 0);
  let peakK = 0;
  const attemptEndC: number[] = [];
  const stretch = (lengthS: number, p: number): void => {
    if (!(lengthS > 0)) return;
    const solver = referenceSolver(stages.length);
    const f = (_x: number, y: number[]): number[] => stages.map((s, i) => (lengthS * (p * s.r - y[i]!)) / s.tau);
    const out = solver.solve(f, 0, [...theta], 1, (_n, xOld, x, y, dense) => {
      peakK = Math.max(peakK, y.reduce((a, b) => a + b, 0));
      if (dense !== undefined && x > xOld) peakK = Math.max(peakK, stepMaximum((t) => stages.reduce((sum, _s, i) => sum + dense(i, t), 0), xOld, x));
    });
    expect(out.outcome).toBe(0);
    out.y.forEach((v, i) => (theta[i] = v));
    peakK = Math.max(peakK, theta.reduce((a, b) => a + b, 0));
  };
  for (let k = 0; k <= waitsS.length; k++) {
    stretch(onS, powerW);
    attemptEndC.push(ambientC + theta.reduce((a, b) => a + b, 0));
    if (k < waitsS.length) stretch(waitsS[k]!, 0);
  }
  stretch(tailS, 0);
  return { attemptEndC, peakC: ambientC + peakK };
}

describe("fastest safe schedule against an odex integration of the Foster network", () => {
  test.each([{ name: "warehouse-robot-48v.yaml" }, { name: "electric-boat-72v-supervision.yaml" }])("$name: every attempt's peak, the history's peak, and 2 % shorter waits", ({ name }) => {
    const part = shortedPart(name);
    const plan = planOf(name);
    const corner = plan.fastest.perCorner;
    expect(corner).toHaveLength(1);
    const waits = plan.fastest.schedule.slice(1).map((s) => s.waitS!);
    const ref = integrateSchedule(part.stages, part.ambientC, part.powerW, part.timeoutS, waits, 3);
    // Tolerance 1e-7 K: odex at 1e-12 on states of up to ~130 K, over some tens of stretches,
    // measured within 4e-10 K of the planner's closed-form modal sums; 1e-7 K leaves room for the
    // solver's error control and is far below the 0.2 K a 2 % shorter wait adds.
    corner[0]!.attempts.forEach((a, k) => {
      expect(a.durationS).toBe(part.timeoutS);
      // a Foster stage under constant power approaches P·R_i from below and decays after, so an
      // attempt's own peak is at its end
      expectClose(ref.attemptEndC[k]!, a.peakC, { abs: 1e-7 });
    });
    // the highest temperature odex saw anywhere is an attempt's end, at or below limit − margin
    expectClose(ref.peakC, Math.max(...ref.attemptEndC), { abs: 1e-9 });
    expect(ref.peakC).toBeLessThanOrEqual(part.allowedC + 1e-7);
    // tight on the firmware timer's grid: the waits were rounded up from the thermal edge, so the
    // waits above the relay's shortest one timer step shorter go past limit − margin
    const step = plan.setup.timing.timerResolutionS;
    const stepSooner = integrateSchedule(part.stages, part.ambientC, part.powerW, part.timeoutS, waits.map((w) => (w > plan.setup.shortestWaitS ? w - step : w)), 3);
    expect(stepSooner.peakC).toBeGreaterThan(part.allowedC);
    // and the same schedule with every wait 2 % shorter goes past limit − margin in the reference too
    const sooner = integrateSchedule(part.stages, part.ambientC, part.powerW, part.timeoutS, waits.map((w) => w * (1 - DANGER_STEP)), 3);
    expect(sooner.peakC).toBeGreaterThan(part.allowedC + 0.1);
  });
});

// The heat pump's restarts: here the capacitor's charge decides the answer, so the reference
// integrates the circuit with the network. State [v, θ1, θ2]: while the pre-charge runs, the
// resistor R charges C from the bus Vs, dv/dt = (Vs − v)/(R·C), and dissipates P = (Vs − v)²/R;
// it completes at v = 0.95·Vs (the profile's completion fraction), which from v0 takes
// R·C·ln((Vs − v0)/(0.05·Vs)) (source-free and driven RC: Hayt, Kemmerly & Durbin, Engineering
// Circuit Analysis, 8th ed. (2012), §8.3 and §8.8, section numbers from memory); the contactor
// then closes (bus at Vs, resistor bypassed) and the drive trips `after` later; between restarts
// the active discharge resistor Rd drains the bus, dv/dt = −v/(Rd·C). Each stretch is one odex
// run in stretch-local time scaled to [0, 1].
interface HeatPumpCorner {
  readonly name: string;
  readonly vs: number;
  readonly c: number;
  readonly ambientC: number;
}

/**
 * Highest value of g on [a, b]: 16 samples, then golden-section search around the best one
 * (Press et al., Numerical Recipes, 3rd ed. (2007), §10.2). A pre-charge pulse decays while the
 * part warms, so the temperature can peak inside an odex step, between the points it reports;
 * g is odex's dense output there.
 */
function stepMaximum(g: (t: number) => number, a: number, b: number): number {
  const n = 16;
  let best = 0;
  for (let i = 1; i <= n; i++) if (g(a + ((b - a) * i) / n) > g(a + ((b - a) * best) / n)) best = i;
  let lo = a + ((b - a) * Math.max(0, best - 1)) / n;
  let hi = a + ((b - a) * Math.min(n, best + 1)) / n;
  const r = (Math.sqrt(5) - 1) / 2;
  for (let k = 0; k < 80 && hi - lo > 1e-15 * (b - a); k++) {
    const x1 = hi - r * (hi - lo);
    const x2 = lo + r * (hi - lo);
    if (g(x1) < g(x2)) lo = x1;
    else hi = x2;
  }
  return Math.max(g(a + ((b - a) * best) / n), g(0.5 * (lo + hi)));
}

function heatPumpBurstPeakC(corner: HeatPumpCorner, stages: readonly { r: number; tau: number }[], circuit: { r: number; rd: number; fraction: number; afterS: number }, waitsS: readonly number[]): number {
  const y = [0, ...stages.map(() => 0)];
  let peakK = 0;
  const rise = (s: readonly number[]): number => s.slice(1).reduce((a, b) => a + b, 0);
  const stretch = (lengthS: number, dvdt: (v: number) => number, power: (v: number) => number): void => {
    if (!(lengthS > 0)) return;
    const solver = referenceSolver(y.length);
    const f = (_x: number, s: number[]): number[] => [lengthS * dvdt(s[0]!), ...stages.map((st, i) => (lengthS * (power(s[0]!) * st.r - s[i + 1]!)) / st.tau)];
    const out = solver.solve(f, 0, [...y], 1, (_n, xOld, x, s, dense) => {
      peakK = Math.max(peakK, rise(s));
      if (dense !== undefined && x > xOld) peakK = Math.max(peakK, stepMaximum((t) => stages.reduce((sum, _st, i) => sum + dense(i + 1, t), 0), xOld, x));
    });
    expect(out.outcome).toBe(0);
    out.y.forEach((v, i) => (y[i] = v));
    peakK = Math.max(peakK, rise(y));
  };
  const rc = circuit.r * corner.c;
  for (let k = 0; k <= waitsS.length; k++) {
    const threshold = circuit.fraction * corner.vs;
    if (y[0]! < threshold) {
      const chargeS = rc * Math.log((corner.vs - y[0]!) / (corner.vs - threshold));
      stretch(chargeS, (v) => (corner.vs - v) / rc, (v) => (corner.vs - v) ** 2 / circuit.r);
      expectClose(y[0]!, threshold, { rel: 1e-9 }); // the ODE reaches the threshold where the closed form says
    }
    y[0] = corner.vs; // contactor closed
    stretch(circuit.afterS, () => 0, () => 0);
    if (k < waitsS.length) stretch(waitsS[k]!, (v) => -v / (circuit.rd * corner.c), () => 0);
  }
  stretch(60, () => 0, () => 0);
  return corner.ambientC + peakK;
}

describe("heat pump, shortest uniform restart interval against an odex integration of circuit and network", () => {
  test("every edge of the bands holds at limit − margin in the reference, and 2 % beyond each crosses it", () => {
    const name = "heat-pump-trip-retries.yaml";
    const profile = parse(bundledText(name)) as Record<string, any>;
    const part = profile["parts"][0];
    expect(part.network.form).toBe("foster");
    const stages = (part.network.stages as { r: string; tau: string }[]).map((s) => ({ r: si(s.r), tau: si(s.tau) }));
    const c = profile["circuit"];
    expect(c.discharge.kind).toBe("active");
    const retry = profile["events"].find((e: Record<string, unknown>) => "retry" in e).retry;
    const circuit = { r: si(c.resistance), rd: si(c.discharge.resistance), fraction: c.completion.fraction as number, afterS: si(retry.fault.after) };
    const corners: HeatPumpCorner[] = (profile["retryPlan"].corners as Record<string, string>[]).map((k) => ({
      name: k["name"]!,
      vs: si(k["busVoltage"] ?? c.busVoltage),
      c: si(k["capacitance"] ?? c.capacitance),
      ambientC: si(k["ambient"] ?? profile["ambient"]),
    }));
    const allowedC = si(part.limits.maxTemperature) - si(part.limits.margin);
    const answer = planOf(name).uniformInterval;
    expect(answer.spacing).toBe("end-to-start");
    const worstAt = (waitS: number): number => Math.max(...corners.map((k) => heatPumpBurstPeakC(k, stages, circuit, new Array<number>(answer.attempts - 1).fill(waitS))));
    // the thermal edges, on the firmware timer's grid: the first band's end (rounded down) and
    // the second band's start (rounded up); one timer step beyond each is past the continuous edge
    const step = planOf(name).setup.timing.timerResolutionS;
    const edges = [
      { at: answer.bands[0]!.toS, step: answer.bands[0]!.toS + step, beyond: answer.bands[0]!.toS * (1 + DANGER_STEP) },
      { at: answer.bands[1]!.fromS, step: answer.bands[1]!.fromS - step, beyond: answer.bands[1]!.fromS * (1 - DANGER_STEP) },
    ];
    for (const e of edges) {
      // 1e-6 K: odex at 1e-12 on the charge and the two stages, measured within 1e-11 K of
      // simulate's peaks at the planner's edges; a 2 % move raises the peak by 1 K to 2 K
      expect(worstAt(e.at)).toBeLessThanOrEqual(allowedC + 1e-6);
      expect(worstAt(e.step)).toBeGreaterThan(allowedC);
      expect(worstAt(e.beyond)).toBeGreaterThan(allowedC + 0.1);
    }
  });
});
