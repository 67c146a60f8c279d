import { readFileSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, test } from "vitest";
import { parse, parseDocument } from "yaml";
import { runCli } from "../../src/cli/main.js";
import { GENERAL_CAUTION, InputError, loadProfile } from "../../src/internal.js";
import { memoryIo } from "../helpers/memoryIo.js";
import { ONE_STAGE_BASE, type OneStageSettings, oneStageProfileText } from "./superviseFixtures.js";

// In-process runs of `heatledger supervise` through the CLI factory, and the profile's
// supervision section's bad-input messages.
const BASE: OneStageSettings = ONE_STAGE_BASE;

describe("heatledger supervise (in process)", () => {
  test("a safe window: exit 0, text with every section and the cautions, no NaN", async () => {
    const io = memoryIo({ "p.yaml": oneStageProfileText(BASE) });
    expect(await runCli(["supervise", "p.yaml"], io)).toBe(0);
    const text = io.stdout.join("");
    for (const heading of ["Timeout window", "Early-abort checks", "Rise-too-fast checks", "Retry storms", "Healthy corners", "Summary (Markdown", "Verdict: pass ("]) expect(text).toContain(heading);
    expect(text).toContain(GENERAL_CAUTION.slice(0, 40));
    expect(text).not.toMatch(/NaN|Infinity/);
  });

  test("--checks writes the recommended checks as circuit.protection, refuses to overwrite without --force", async () => {
    const io = memoryIo({ "p.yaml": oneStageProfileText(BASE) });
    expect(await runCli(["supervise", "p.yaml", "--no-chart", "--checks", "c.yaml"], io)).toBe(0);
    const fragment = io.files["c.yaml"]!;
    expect(fragment).toMatch(/^protection:\n {2}busChecks:\n {4}- \{ at: [0-9.e-]+, below: [0-9.e-]+ \}/m);
    expect(io.stdout.join("")).toContain("Recommended checks and limits as profile protection");
    // pasted under circuit:, the profile loads with the checks on its completion rule
    const doc = parseDocument(oneStageProfileText(BASE));
    doc.setIn(["circuit", "protection"], (parse(fragment) as { protection: unknown }).protection);
    const pasted = doc.toString();
    expect(loadProfile(pasted, "p.yaml", () => "").circuit!.completion.protection!.busChecks!.length).toBeGreaterThan(0);
    const again = memoryIo({ "p.yaml": oneStageProfileText(BASE), "c.yaml": "old" });
    expect(await runCli(["supervise", "p.yaml", "--checks", "c.yaml"], again)).toBe(2);
    expect(again.files["c.yaml"]).toBe("old");
  });

  test("no safe timeout: exit 1, says so with the reason; --json carries exists: false", async () => {
    // C up to 0.5 F needs about 15 s to charge; the short is survivable for 2.88 s (see supervise.test.ts)
    const files = { "p.yaml": oneStageProfileText({ ...BASE, capacitanceF: [0.2, 0.5] }) };
    const io = memoryIo(files);
    expect(await runCli(["supervise", "p.yaml", "--no-chart"], io)).toBe(1);
    expect(io.stdout.join("")).toContain("NO SAFE TIMEOUT EXISTS: the slowest healthy corner");
    const jsonIo = memoryIo(files);
    expect(await runCli(["supervise", "p.yaml", "--json"], jsonIo)).toBe(1);
    const json = JSON.parse(jsonIo.stdout.join("")) as { verdict: string; window: { exists: boolean; lowerS: number; upperS: number } };
    expect(json.verdict).toBe("fail");
    expect(json.window.exists).toBe(false);
    expect(json).toHaveProperty("cautions", [GENERAL_CAUTION]);
    expect(json).not.toHaveProperty("caution");
    expect(json.window.lowerS).toBeGreaterThan(json.window.upperS);
  });

  test("--json: a short the part survives for ever is null (unbounded), never Infinity or NaN", async () => {
    // 5 V into 10 ohm: P = 2.5 W, P·R_th = 5 K below the 125 K allowed rise: no upper end
    const io = memoryIo({ "p.yaml": oneStageProfileText({ ...BASE, busV: [4, 5] }) });
    expect(await runCli(["supervise", "p.yaml", "--json"], io)).toBe(0);
    const text = io.stdout.join("");
    expect(text).not.toMatch(/NaN|Infinity/);
    const json = JSON.parse(text) as { window: { exists: boolean; upperS: number | null; cold: { longestS: number | null; bounded: boolean } } };
    expect(json.window.cold).toMatchObject({ longestS: null, bounded: false });
    expect(json.window.upperS).toBeNull();
    expect(json.window.exists).toBe(true);
  });

  test("the profile's timeout outside the window: exit 1", async () => {
    // the window is 57.8 ms to 2.88 s; a 5 s timeout outlasts what the part survives
    const io = memoryIo({ "p.yaml": oneStageProfileText({ ...BASE, timeoutS: 5 }) });
    expect(await runCli(["supervise", "p.yaml", "--no-chart"], io)).toBe(1);
    expect(io.stdout.join("")).toContain("is OUTSIDE the window");
    expect(io.stdout.join("")).toContain("Verdict: fail (at the profile's timeout, 5.00 s, a short takes the part above its limit).");
  });

  test("the bundled profile runs and its answers are inside their window", async () => {
    const folder = join(import.meta.dirname, "../../profiles");
    const files: Record<string, string> = {};
    for (const name of ["electric-boat-72v-supervision.yaml", "networks/wirewound-resistor-foster.yaml"]) files[join("profiles", name)] = readFileSync(join(folder, name), "utf8");
    const io = memoryIo(files);
    expect(await runCli(["supervise", "profiles/electric-boat-72v-supervision.yaml", "--json"], io)).toBe(0);
    const json = JSON.parse(io.stdout.join("")) as { window: { exists: boolean; lowerS: number; upperS: number }; configuredTimeoutS: number; recommendedAbort: { timeS: number } | null };
    expect(json.window.exists).toBe(true);
    expect(json.configuredTimeoutS).toBeGreaterThan(json.window.lowerS);
    expect(json.configuredTimeoutS).toBeLessThan(json.window.upperS);
    expect(json.recommendedAbort).not.toBeNull();
  });
});

describe("supervision section: bad input", () => {
  const problems = (text: string) => {
    try {
      loadProfile(text, "p.yaml");
    } catch (error) {
      if (error instanceof InputError) return error.problems.map((p) => `${p.field}: expected ${p.expected}, found ${p.found}`);
      throw error;
    }
    throw new Error("no InputError");
  };
  const text = oneStageProfileText({ ...BASE, checkTimesS: [0.1, 0.5] });

  test.each([
    [
      "a completion threshold at or above 1",
      text.replace("completionFraction: [0.9, 0.95]", "completionFraction: [0.9, 1.0]"),
      "supervision.corners.completionFraction[1]: expected a completion fraction of the bus voltage, above 0 and below 1, such as 0.95, found 1",
    ],
    [
      "a corner set without capacitance",
      text.replace(/    capacitance: .*\n/, ""),
      "supervision.corners.capacitance: expected a capacitance such as \"4.7 mF\" (or a number in F) (required), found nothing",
    ],
    [
      "a check time beyond the timeout",
      text.replace("checkTimes: [0.1 s, 0.5 s]", "checkTimes: [0.1 s, 1.5 s]"),
      "supervision.checkTimes[1]: expected a check time before the pre-charge timeout (circuit.completion.timeout = 1 s), found 1.5 s",
    ],
    [
      "a short as a healthy load",
      text.replace("  startVoltage", "    loads: [ { kind: short } ]\n  startVoltage"),
      "supervision.corners.loads[0].kind: expected a load a healthy system can have (a short is the fault the checks detect), found \"short\"",
    ],
    [
      "a range given high first",
      text.replace("capacitance: [0.001 F, 0.002 F]", "capacitance: [0.002 F, 0.001 F]"),
      "supervision.corners.capacitance: expected a [low, high] pair with low ≤ high, found [\"0.002 F\",\"0.001 F\"]",
    ],
  ])("%s", (_name, bad, message) => {
    expect(problems(bad)).toContain(message);
  });

  test("through the CLI: exit 2 with file, line and field", async () => {
    const io = memoryIo({ "p.yaml": text.replace("completionFraction: [0.9, 0.95]", "completionFraction: [0.9, 1.0]") });
    expect(await runCli(["supervise", "p.yaml"], io)).toBe(2);
    expect(io.stderr.join("")).toMatch(/^heatledger: p\.yaml:\d+: supervision\.corners\.completionFraction\[1\]: expected/);
  });

  test("a profile without a supervision section: exit 2 naming the section", async () => {
    const io = memoryIo({ "p.yaml": text.replace(/supervision:[\s\S]*?events:/, "events:") });
    expect(await runCli(["supervise", "p.yaml"], io)).toBe(2);
    expect(io.stderr.join("")).toContain("supervision: expected a supervision section");
  });
});
