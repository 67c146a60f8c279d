import { readFileSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, test } from "vitest";
import { InputError, defaultCircuitModels, hottestSteadySurroundings, loadProfile, profileRetrySetup, simulateProfile } from "../../src/internal.js";

const root = join(import.meta.dirname, "..", "..", "profiles");
const bundled = (path: string): string => readFileSync(join(root, path), "utf8");

/** A reader of the bundled files plus some of the test's own. */
function reader(extra: Record<string, string>): (path: string) => string {
  return (path) => extra[path] ?? bundled(path);
}

/** Temperatures [°C] of every part at every step end, in time order. */
function stepEnds(text: string, extra: Record<string, string> = {}): { timeS: number; temperatureC: number[] }[] {
  const out: { timeS: number; temperatureC: number[] }[] = [];
  simulateProfile(loadProfile(text, "t.yaml", reader(extra)), {
    models: defaultCircuitModels,
    onPoint: (timeS, temperatureC, kind) => {
      if (kind === "step-end") out.push({ timeS, temperatureC: temperatureC.slice() });
    },
  });
  return out;
}

describe("an ambient that varies", () => {
  test("a profile whose ambient trace is one constant row gives exactly the constant-ambient results", () => {
    // Outside reference: none needed, an identity: the trace adds an input that is zero on every
    // step, so the results must be those of the plain `ambient:` key to the last bit.
    const text = bundled("warehouse-robot-48v.yaml");
    const constant = simulateProfile(loadProfile(text, "w.yaml", reader({})), { models: defaultCircuitModels });
    const traced = text.replace(/^ambient: 45 degC.*$/m, "ambientProfile: { file: flat.csv }");
    expect(traced).not.toBe(text);
    const viaTrace = simulateProfile(loadProfile(traced, "w.yaml", reader({ "flat.csv": "time [s], ambient [degC]\n0, 45\n" })), { models: defaultCircuitModels });
    expect(viaTrace.parts).toEqual(constant.parts);
    expect(viaTrace.eventCount).toBe(constant.eventCount);
  });

  test("a Foster part follows the ambient at once: with no power its temperature is the ambient", () => {
    // Closed form: a Foster network's rise is counted from the ambient at its reference end, so
    // with zero power T(t) = T_amb(t) exactly (the project's convention for Foster networks,
    // docs/profile-format.md). The table's daily points are straight between them.
    const text = `name: f
ambientProfile: { table: [[0 h, 20 degC], [6 h, 14 degC], [15 h, 38 degC]] }
parts:
  - { id: r, network: networks/wirewound-resistor-foster.yaml, limits: { maxTemperature: 200 degC } }
events:
  - wait: 30 h
`;
    const ambientAt = (t: number): number => {
      const h = (t / 3600) % 24;
      if (h <= 6) return 20 + ((14 - 20) * h) / 6;
      if (h <= 15) return 14 + ((38 - 14) * (h - 6)) / 9;
      return 38 + ((20 - 38) * (h - 15)) / 9;
    };
    const points = stepEnds(text);
    expect(points.length).toBe(4); // 6 h, 15 h, 24 h (the table's corners) and 30 h
    for (const p of points) expect(p.temperatureC[0]).toBeCloseTo(ambientAt(p.timeS), 9);
    const result = simulateProfile(loadProfile(text, "t.yaml", reader({})), { models: defaultCircuitModels });
    expect(result.parts[0]!.peakTemperatureC).toBeCloseTo(38, 9);
    expect(result.parts[0]!.peakTimeS).toBeCloseTo(15 * 3600, 3);
  });

  test("a daily cosine reaches its maximum at maxAt and its minimum twelve hours later", () => {
    // Closed form: T(h) = (max + min)/2 + (max − min)/2·cos(2π(h − maxAt)/24 h), drawn as 96 straight
    // pieces whose corners lie on the cosine (maxAt and maxAt + 12 h are corners here).
    const text = `name: d
ambientProfile: { daily: { min: 21 degC, max: 41 degC, maxAt: 15 h }, startAt: 6 h }
parts:
  - { id: r, network: networks/wirewound-resistor-foster.yaml, limits: { maxTemperature: 200 degC } }
events:
  - wait: 24 h
`;
    const profile = loadProfile(text, "d.yaml", reader({}));
    expect(profile.parts[0]!.ambientC).toBeCloseTo(31 + 10 * Math.cos((2 * Math.PI * (6 - 15)) / 24), 12);
    const low: { timeS: number; c: number }[] = [];
    const result = simulateProfile(profile, { models: defaultCircuitModels, onPoint: (timeS, c) => low.push({ timeS, c: c[0]! }) });
    expect(result.parts[0]!.peakTemperatureC).toBeCloseTo(41, 9);
    expect(result.parts[0]!.peakTimeS).toBeCloseTo(9 * 3600, 6);
    const coldest = low.reduce((a, b) => (b.c < a.c ? b : a));
    expect(coldest.c).toBeCloseTo(21, 9);
    expect(coldest.timeS).toBeCloseTo(21 * 3600, 6);
  });

  test("after a step in ambient a one-node part settles as 1 − e^(−t/RC) to the new ambient", () => {
    // Closed form: C·dT/dt = (T_amb − T)/R, so after a step ΔT at t0, T = T0 + ΔT·(1 − e^(−(t−t0)/(R·C)))
    // (Incropera et al., Fundamentals of Heat and Mass Transfer, 7th ed. (2011), §5.1, lumped
    // capacitance). The step is a 1 µs ramp; its effect on the comparison is below 1e-8 K.
    const text = `name: l
ambientProfile: { file: step.csv }
parts:
  - id: r
    network: { form: graph, nodes: [{ id: n, c: 50 J/K }], links: [{ from: n, to: ambient, r: 2 K/W }], sources: [n], observed: [n] }
    limits: { maxTemperature: 200 degC }
events:
  - wait: 100 s
  - wait: 200 s
  - wait: 400 s
  - wait: 800 s
`;
    const step = "time [s], ambient [degC]\n0, 25\n60, 25\n60.000001, 45\n";
    const points = stepEnds(text, { "step.csv": step });
    const tau = 100;
    let checked = 0;
    for (const p of points) {
      if (p.timeS < 61) continue;
      expect(p.temperatureC[0]).toBeCloseTo(25 + 20 * (1 - Math.exp(-(p.timeS - 60) / tau)), 6);
      checked++;
    }
    expect(checked).toBe(4);
    // 14 time constants after the step the node is at the new ambient
    expect(points[points.length - 1]!.temperatureC[0]).toBeCloseTo(45, 4);
  });
});

describe("extra heat sources and the planners' bound", () => {
  const text = bundled("rooftop-inverter-hot-afternoon.yaml");

  test("the bound is the hottest ambient plus each heat source's highest power times its steady resistance", () => {
    // Closed form: the steady transfer resistance from the sink to both observed nodes of this
    // graph is the sink's only path to ambient, 0.22 K/W (no heat flows along element-housing-sink
    // in steady state when only the sink is heated); the trace's highest power is 175 W.
    const profile = loadProfile(text, "r.yaml", reader({}));
    const bounded = hottestSteadySurroundings(profile);
    expect(bounded.surroundings).toBeUndefined();
    for (const p of bounded.parts) expect(p.ambientC).toBeCloseTo(41 + 175 * 0.22, 9);
  });

  test("the retry planner runs at the bound, and a corner's own ambient still gets the heat sources' rise", () => {
    // Closed form as above: 41 °C + 175 W × 0.22 K/W; a corner at 30 °C: 30 °C + 38.5 K.
    const profile = loadProfile(text, "r.yaml", reader({}));
    expect(profileRetrySetup(profile, defaultCircuitModels).scenarios.map((s) => s.ambientC)).toEqual([79.5, 79.5].map((c) => expect.closeTo(c, 9)));
    const cornered = loadProfile(`${text}  corners: [{ name: cool, ambient: 30 degC }]\n`, "r.yaml", reader({}));
    expect(profileRetrySetup(cornered, defaultCircuitModels).scenarios.map((s) => s.ambientC)).toEqual([68.5, 68.5].map((c) => expect.closeTo(c, 9)));
  });

  test("bad surroundings keys are named with what was expected", () => {
    const base = `name: b
ambient: 20 degC
parts:
  - { id: r, network: networks/wirewound-resistor-foster.yaml, limits: { maxTemperature: 200 degC } }
events:
  - wait: 1 h
`;
    const problems = (t: string): string[] => {
      try {
        loadProfile(t, "b.yaml", reader({}));
      } catch (error) {
        if (error instanceof InputError) return error.problems.map((p) => `${p.field}: expected ${p.expected}, found ${p.found}`);
        throw error;
      }
      return [];
    };
    expect(problems(base.replace("ambient: 20 degC", "ambient: 20 degC\nambientProfile: { daily: { min: 10 degC, max: 20 degC, maxAt: 14 h } }"))).toEqual([
      'ambient: expected exactly one of ambient (a constant such as "40 degC") or ambientProfile (a daily profile or a trace), found both',
    ]);
    expect(problems(`${base}heatSources: [{ part: r, node: element, power: 10 W }]\n`)).toEqual([
      "heatSources[0].node: expected a graph or Cauer network (an extra heat source sits on a physical node; Foster stages are not nodes), found a Foster network",
    ]);
    const graph = bundled("rooftop-inverter-hot-afternoon.yaml").replace("node: sink", "node: fins");
    expect(problems(graph)).toEqual(['heatSources[0].node: expected a node of the network (element, housing, sink), found "fins"']);
  });
});
