import { describe, expect, test } from "vitest";
import { parse } from "yaml";
import { type RetryPlanReport, defaultCircuitModels, planRetries } from "../../src/index.js";
import { createOdexSolver } from "../../src/circuits/loadOdex.js";
import { expectClose } from "../helpers/expectClose.js";
import { DANGER_STEP, bundledText, loadAs } from "./closedLoopFixtures.js";

// An independent reference for the retry planner's fastest safe schedule: the part's thermal
// network is integrated as an ordinary differential equation by odex (Hairer and Wanner's
// extrapolation code, a general-purpose solver from the npm registry), with no project thermal
// or circuit code. Each Foster stage i (R_i, τ_i) is the lumped first-order system
//   dθ_i/dt = (P(t)·R_i − θ_i)/τ_i,   junction rise = Σ θ_i
// (Incropera et al., Fundamentals of Heat and Mass Transfer, 7th ed. (2011), §5.2, lumped
// capacitance, one equation per stage). The power is worked out by hand from the profile's
// circuit: into a shorted output the bus is held at 0 V, so the series resistor R carries
// I = Vs/(R + Rsrc) and dissipates P = I²·R for the whole completion timeout (Ohm's and Joule's
// laws). Values are read from the bundled YAML files with the yaml package and a unit table here.

/** SI value of a quantity as the bundled files write it ("40 ms", "0.35 K/W", "60 mohm", "45 degC"). */
function si(q: string | number): number {
  if (typeof q === "number") return q;
  const [value, unit] = q.trim().split(/\s+/);
  const scale: Record<string, number> = { s: 1, ms: 1e-3, "K/W": 1, K: 1, V: 1, ohm: 1, mohm: 1e-3, degC: 1 };
  const k = scale[unit!];
  if (k === undefined) throw new Error(`no unit "${unit}" in the test's table`);
  return Number(value) * k;
}

interface Reference {
  /** junction temperature at the end of each attempt [°C] */
  readonly attemptEndC: number[];
  /** highest junction temperature at any step odex took, over the whole history and a tail [°C] */
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
    const solver = createOdexSolver(stages.length);
    solver.relativeTolerance = 1e-12;
    solver.absoluteTolerance = 1e-12;
    solver.maxSteps = 1e6;
    const f = (_x: number, y: number[]): number[] => stages.map((s, i) => (lengthS * (p * s.r - y[i]!)) / s.tau);
    const out = solver.solve(f, 0, [...theta], 1, (_n, _xOld, _x, y) => {
      peakK = Math.max(peakK, y.reduce((a, b) => a + b, 0));
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

interface ShortedPart {
  readonly stages: { r: number; tau: number }[];
  readonly ambientC: number;
  readonly allowedC: number;
  readonly powerW: number;
  readonly timeoutS: number;
}

/** The bundled profile's resistor, network and shorted-output power, read from the YAML files. */
function shortedPart(name: string): ShortedPart {
  const profile = parse(bundledText(name)) as Record<string, any>;
  const part = profile["parts"][0];
  const network = parse(bundledText(part.network)) as { form: string; stages: { r: string; tau: string }[] };
  expect(network.form).toBe("foster");
  const c = profile["circuit"];
  expect(c.topology).toBe("series-resistor");
  const vs = si(c.busVoltage);
  const r = si(c.resistance);
  const current = vs / (r + si(c.sourceResistance ?? 0));
  return {
    stages: network.stages.map((s) => ({ r: si(s.r), tau: si(s.tau) })),
    ambientC: si(profile["ambient"]),
    allowedC: si(part.limits.maxTemperature) - si(part.limits.margin),
    powerW: current * current * r,
    timeoutS: si(c.completion.timeout),
  };
}

const plans = new Map<string, RetryPlanReport>();
const planOf = (name: string): RetryPlanReport => {
  if (!plans.has(name)) plans.set(name, planRetries(loadAs(bundledText(name), name), defaultCircuitModels));
  return plans.get(name)!;
};

describe("fastest safe schedule against an odex integration of the Foster network", () => {
  test.each([{ name: "warehouse-robot-48v.yaml" }, { name: "electric-boat-72v-supervision.yaml" }])("$name: every attempt's peak, the history's peak, and 2 % shorter waits", ({ name }) => {
    const part = shortedPart(name);
    const plan = planOf(name);
    const corner = plan.fastest.perCorner;
    expect(corner).toHaveLength(1);
    const waits = plan.fastest.schedule.slice(1).map((s) => s.waitS!);
    const ref = integrateSchedule(part.stages, part.ambientC, part.powerW, part.timeoutS, waits, 30);
    // Tolerance 1e-7 K: odex at 1e-12 on states of up to ~130 K, over some tens of stretches,
    // measured within 4e-10 K of the planner's closed-form modal sums; 1e-7 K leaves room for the
    // solver's error control and is far below the 0.2 K a 2 % shorter wait adds.
    corner[0]!.attempts.forEach((a, k) => {
      expect(a.durationS).toBe(part.timeoutS);
      // a Foster stage under constant power approaches P·R_i from below and decays after, so an
      // attempt's own peak is at its end
      expectClose(ref.attemptEndC[k]!, a.peakC, { abs: 1e-7 });
    });
    // the highest temperature odex saw anywhere is an attempt's end, at limit − margin (the
    // planner's bisection stops on the safe side, within 1e-8 K here)
    expectClose(ref.peakC, Math.max(...ref.attemptEndC), { abs: 1e-9 });
    expect(ref.peakC).toBeLessThanOrEqual(part.allowedC + 1e-7);
    expectClose(ref.peakC, part.allowedC, { abs: 1e-7 });
    // and the same schedule with every wait 2 % shorter goes past limit − margin in the reference too
    const sooner = integrateSchedule(part.stages, part.ambientC, part.powerW, part.timeoutS, waits.map((w) => w * (1 - DANGER_STEP)), 30);
    expect(sooner.peakC).toBeGreaterThan(part.allowedC + 0.1);
  });
});
