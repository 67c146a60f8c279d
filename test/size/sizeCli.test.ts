import { readFileSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, test } from "vitest";
import { runCli } from "../../src/cli/main.js";
import { GENERAL_CAUTION, LINEAR_MOSFET_CAUTION, parseNetwork } from "../../src/internal.js";
import { expectClose } from "../helpers/expectClose.js";
import { memoryIo } from "../helpers/memoryIo.js";

// In-process runs of `heatledger size` through the CLI factory: exit 0 (a size exists),
// 1 (none, with the reason), 2 (bad input, one line naming the field).
const bundled = (...names: string[]): Record<string, string> => {
  const folder = join(import.meta.dirname, "../../profiles");
  return Object.fromEntries(names.map((n) => [join("profiles", n), readFileSync(join(folder, n), "utf8")]));
};
const heatPump = () => bundled("heat-pump-trip-retries.yaml");
const PROFILE = "profiles/heat-pump-trip-retries.yaml";

describe("heatledger size (in process)", () => {
  test("the bundled heat-pump profile: exit 0, both tables with units, the circuit answer, the caution, no NaN", async () => {
    const io = memoryIo(heatPump());
    expect(await runCli(["size", PROFILE, "--material", "copper"], io)).toBe(0);
    const text = io.stdout.join("");
    for (const heading of ["Adiabatic bound", "worst event [J]", "C [J/K]", "m [g]", "Whole profile", "peak at k [°C]", "Charging element", "largest [Ω]", "Verdict: pass (a feasible size exists"]) expect(text).toContain(heading);
    expect(text).toContain(GENERAL_CAUTION.slice(0, 40));
    expect(text).not.toContain(LINEAR_MOSFET_CAUTION.slice(0, 30));
    expect(text).not.toMatch(/NaN|Infinity|undefined/);
  });

  test("--json: the sized peak is at the target and the largest resistance matches the RC closed form", async () => {
    const io = memoryIo(heatPump());
    expect(await runCli(["size", PROFILE, "--json"], io)).toBe(0);
    const json = JSON.parse(io.stdout.join("")) as {
      verdict: string;
      parts: { targetC: number; inversion: { status: string; peakTemperatureC: number } }[];
      circuit: { value: number; field: string };
    };
    expect(json.verdict).toBe("pass");
    expect(json).toHaveProperty("cautions", [GENERAL_CAUTION]);
    const part = json.parts[0]!;
    expect(part.inversion.status).toBe("sized");
    // SIZE_DEFAULTS.temperatureToleranceK = 0.01 K below the target
    expect(part.inversion.peakTemperatureC).toBeLessThanOrEqual(part.targetC);
    expect(part.inversion.peakTemperatureC).toBeGreaterThan(part.targetC - 0.1);
    // RC charging to 95 % of 400 V from 0 V with 1 mF in 500 ms, no source resistance (Hayt et al.,
    // Engineering Circuit Analysis, 8th ed. (2012), §8.8, section from memory):
    // R_max = 0.5 / (1e-3·ln 20) = 166.90 Ω
    expect(json.circuit.field).toBe("circuit.resistance");
    expectClose(json.circuit.value, 0.5 / (1e-3 * Math.log(20)), { rel: 1e-6 });
  });

  test("the bundled MOSFET profile carries the linear-mode caution, and parts on one heatsink get one scale", async () => {
    const io = memoryIo(bundled("home-storage-400v.yaml", "networks/mosfet-on-heatsink-graph.yaml"));
    expect(await runCli(["size", "profiles/home-storage-400v.yaml", "--json"], io)).toBe(0);
    const json = JSON.parse(io.stdout.join("")) as { parts: { id: string; sharedWith: string[]; inversion: { scale: number } }[] };
    expect(json.parts.map((p) => p.sharedWith)).toEqual([["source-resistor"], ["precharge-mosfet"]]);
    expect(json.parts[0]!.inversion.scale).toBe(json.parts[1]!.inversion.scale);
    const text = memoryIo(bundled("home-storage-400v.yaml", "networks/mosfet-on-heatsink-graph.yaml"));
    expect(await runCli(["size", "profiles/home-storage-400v.yaml", "--part", "source-resistor"], text)).toBe(0);
    expect(text.stdout.join("")).toContain(LINEAR_MOSFET_CAUTION.slice(0, 30));
  });

  test("--scale: the headings and words say what was scaled, the element answer comes with its mass and its network", async () => {
    const files = (): Record<string, string> => bundled("home-storage-400v.yaml", "networks/mosfet-on-heatsink-graph.yaml");
    const whole = memoryIo(files());
    expect(await runCli(["size", "profiles/home-storage-400v.yaml", "--material", "copper"], whole)).toBe(0);
    const wholeText = whole.stdout.join("");
    for (const words of ["Whole profile, whole body × k", "whole body × k", "C1 at k [J/K]", "every heat capacity of the shared network (whole body; C1 then", "--scale element gives the element's mass"]) expect(wholeText.replace(/\s+/g, " ")).toContain(words);
    expect(wholeText).not.toContain("element m [g]");
    const element = memoryIo(files());
    expect(await runCli(["size", "profiles/home-storage-400v.yaml", "--material", "copper", "--scale", "element"], element)).toBe(0);
    const elementText = element.stdout.join("");
    for (const words of ["Whole profile, element C1 × k", "k (C1 only)", "element C1 [J/K]", "element m [g]", "precharge-mosfet: an element capacity C1 = "]) expect(elementText.replace(/\s+/g, " ")).toContain(words);
    expect(elementText).not.toContain("whole body × k");
    // piped reports stay within 100 columns (memoryIo has 100)
    for (const line of [...wholeText.split("\n"), ...elementText.split("\n")]) expect([...line].length).toBeLessThanOrEqual(100);

    const json = memoryIo(files());
    expect(await runCli(["size", "profiles/home-storage-400v.yaml", "--material", "copper", "--scale", "element", "--json"], json)).toBe(0);
    const answer = JSON.parse(json.stdout.join("")) as {
      scale: string;
      parts: { id: string; inversion: { scope: string; status: string; capacityJPerK: number; massKg: number | null; sizedNetwork: unknown } }[];
    };
    expect(answer.scale).toBe("element");
    const mosfet = answer.parts[0]!.inversion;
    expect(mosfet.scope).toBe("element");
    expect(mosfet.status).toBe("sized");
    // m = C/c with copper c = 385 J/(kg·K) (MATERIALS; Incropera Table A.1, from memory); same doubles: 1e-12
    expectClose(mosfet.massKg!, mosfet.capacityJPerK / 385, { rel: 1e-12 });
    // the sized network reads back as a network file: only the die's capacity changed, to the element answer
    const network = parseNetwork(mosfet.sizedNetwork);
    expect(network.kind).toBe("graph");
    const nodes = network.kind === "graph" ? network.nodes : [];
    expectClose(nodes.find((n) => n.id === "die")!.cJPerK, mosfet.capacityJPerK, { rel: 1e-9 }); // 10 significant digits in the file
    expect(nodes.filter((n) => n.id !== "die").map((n) => n.cJPerK)).toEqual([0.9, 0.6, 85]);
  });

  test("a profile with no circuit, two parts, --part twice: one sized, one any, the circuit section says there is none", async () => {
    // invented: 100 W for 0.5 s into each part; "cool" has P·R = 10 K, under its 125 K allowance at any capacity
    const text = `name: no circuit
ambient: 25 degC
parts:
  - id: hot
    network: { form: foster, stages: [ { r: 2 K/W, tau: 1 s } ] }
    limits: { maxTemperature: 150 degC, margin: 0 K }
  - id: cool
    network: { form: foster, stages: [ { r: 0.1 K/W, tau: 1 s } ] }
    limits: { maxTemperature: 150 degC, margin: 0 K }
events:
  - power-trace: { part: hot, points: [[0, 100], [0.5 s, 100]] }
  - power-trace: { part: cool, points: [[0, 100], [0.5 s, 100]] }
`;
    const io = memoryIo({ "p.yaml": text });
    expect(await runCli(["size", "p.yaml", "--part", "hot", "--part", "cool", "--material", "aluminum"], io)).toBe(0);
    const out = io.stdout.join("");
    expect(out).toContain("no circuit in the profile");
    expect(out).toMatch(/\ncool +[\d.]+ +[\d.]+ +any /);
    expect(out).not.toMatch(/NaN|Infinity|undefined/);
    const jsonIo = memoryIo({ "p.yaml": text });
    expect(await runCli(["size", "p.yaml", "--part", "hot", "--json"], jsonIo)).toBe(0);
    const json = JSON.parse(jsonIo.stdout.join("")) as { parts: { id: string }[]; circuit: null };
    expect(json.parts.map((p) => p.id)).toEqual(["hot"]);
    expect(json.circuit).toBeNull();
  });

  test("no feasible size: exit 1, and the report says why", async () => {
    // 200 °C limit less 170 K is 30 °C, below the 40 °C ambient
    const io = memoryIo(heatPump());
    expect(await runCli(["size", PROFILE, "--margin", "170 K"], io)).toBe(1);
    expect(io.stdout.join("")).toContain(
      // wrapped at 100 columns, the unit kept with its number
      "Verdict: fail (no feasible size).\n- precharge-resistor: the target 30 °C (limit 200 °C less 170 K margin) is not above the ambient\n40 °C",
    );
    const jsonIo = memoryIo(heatPump());
    expect(await runCli(["size", PROFILE, "--margin", "170", "--json"], jsonIo)).toBe(1);
    const json = JSON.parse(jsonIo.stdout.join("")) as { verdict: string; parts: { inversion: { scale: number | null } }[] };
    expect(json.verdict).toBe("fail");
    expect(json.parts[0]!.inversion.scale).toBeNull();
  });

  // The bundled heat-pump profile wants 20 K below the resistor's 200 °C limit. Sized to a 5 K
  // margin the part peaks within 0.01 K under 195 °C: inside the profile's margin, not above the
  // limit, so warn (exit 0, 1 with --strict); sized to 30 K it peaks under 170 °C: pass.
  test.each([
    ["5 K", "warn", 0, 1],
    ["30 K", "pass", 0, 0],
  ])("--margin %s against the profile's 20 K: verdict %s, exit %d (%d with --strict)", async (margin, verdict, status, strictStatus) => {
    const io = memoryIo(heatPump());
    expect(await runCli(["size", PROFILE, "--margin", margin, "--json"], io)).toBe(status);
    expect((JSON.parse(io.stdout.join("")) as { verdict: string }).verdict).toBe(verdict);
    const text = memoryIo(heatPump());
    expect(await runCli(["size", PROFILE, "--margin", margin, "--strict"], text)).toBe(strictStatus);
    expect(text.stdout.join("")).toContain(`Verdict: ${verdict} (`);
  });

  test.each([
    {
      args: ["--material", "unobtainium"],
      message:
        'heatledger: --material: expected one of the material presets copper, aluminium, aluminium-2024, brass, steel, stainless-304, nichrome, constantan, nickel, silicon, alumina, silicon-carbide, steatite, ceramic, fr4, found "unobtainium"\n',
    },
    { args: ["--margin", "5 degC"], message: 'heatledger: --margin: expected a temperature difference such as "10 K" (or a number in K); write differences in K, found "5 degC" (an absolute temperature)\n' },
    { args: ["--margin=-3"], message: "heatledger: --margin: expected a margin ≥ 0 K, found -3\n" },
    { args: ["--scale", "body"], message: 'heatledger: --scale: expected whole or element, found "body"\n' },
    { args: ["--part", "nope"], message: 'heatledger: --part: expected one of the profile\'s parts (precharge-resistor), found "nope"\n' },
  ])("bad input $args: exit 2 with one line naming the flag", async ({ args, message }) => {
    const io = memoryIo(heatPump());
    expect(await runCli(["size", PROFILE, ...args], io)).toBe(2);
    expect(io.stderr.join("")).toBe(message);
    expect(io.stdout.join("")).toBe("");
  });

  test("a missing profile: exit 2 naming the file", async () => {
    const io = memoryIo({});
    expect(await runCli(["size", "nothere.yaml"], io)).toBe(2);
    expect(io.stderr.join("")).toBe("heatledger: nothere.yaml: expected a readable duty profile, found no such file\n");
  });
});
