// Values of a bundled series-resistor profile read by hand, for the reference tests of the retry
// planner: the YAML is parsed with the yaml package and the quantities converted with a small unit
// table here, with no project code. Into a shorted output the bus is held at 0 V, so the series
// resistor R carries I = Vs/(R + Rsrc) and dissipates P = I²·R for the whole completion timeout
// (Ohm's and Joule's laws).
import { expect } from "vitest";
import { parse } from "yaml";
import { bundledText } from "./closedLoopFixtures.js";

/** SI value of a quantity as the bundled files write it ("40 ms", "0.35 K/W", "60 mohm", "45 degC"). */
export function si(q: string | number): number {
  if (typeof q === "number") return q;
  const [value, unit] = q.trim().split(/\s+/);
  const scale: Record<string, number> = { min: 60, s: 1, ms: 1e-3, "K/W": 1, K: 1, V: 1, ohm: 1, mohm: 1e-3, mF: 1e-3, degC: 1 };
  const k = scale[unit!];
  if (k === undefined) throw new Error(`no unit "${unit}" in the test's table`);
  return Number(value) * k;
}

export interface ShortedPart {
  readonly stages: { r: number; tau: number }[];
  readonly ambientC: number;
  /** the part's limit [°C] */
  readonly limitC: number;
  /** limit − margin [°C] */
  readonly allowedC: number;
  readonly powerW: number;
  readonly timeoutS: number;
}

/** The bundled profile's resistor, network and shorted-output power, read from the YAML files. */
export function shortedPart(name: string): ShortedPart {
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
    limitC: si(part.limits.maxTemperature),
    allowedC: si(part.limits.maxTemperature) - si(part.limits.margin),
    powerW: current * current * r,
    timeoutS: si(c.completion.timeout),
  };
}

