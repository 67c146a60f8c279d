import { describe, expect, test } from "vitest";
import { runCli } from "../../src/cli/main.js";
import { GENERAL_CAUTION } from "../../src/internal.js";
import { memoryIo } from "../helpers/memoryIo.js";
import { shortedBusProfile } from "../helpers/shortedBusProfile.js";

// In-process runs of `heatledger simulate` through the CLI factory, on invented profiles.
const PULSES = (powerW: number) => `name: pulses
ambient: 25 degC
parts:
  - id: r
    network: net.yaml
    limits: { maxTemperature: 100 degC, margin: 10 K }
events:
  - repeat:
      count: 4
      period: 5 s
      events:
        - power-trace: { part: r, file: pulse.csv }
`;
const FILES = (powerW: number): Record<string, string> => ({
  "dir/p.yaml": PULSES(powerW),
  "dir/net.yaml": "form: foster\nstages:\n  - { r: 1 K/W, tau: 0.5 s }\n",
  "dir/pulse.csv": `time_s,power_W\n0,${powerW}\n1,${powerW}\n1.000001,0\n`,
});

describe("heatledger simulate (in process)", () => {
  // One RC stage (R = 1 K/W, tau = 0.5 s), 1 s pulses every 5 s: each pulse ends at
  // P·R·(1 − e^(−2))/(1 − e^(−10)) ≈ 0.8647·P·R above ambient, within 5e-5 of the first pulse's
  // rise (lumped capacitance, Incropera et al., Fundamentals of Heat and Mass Transfer, 7th ed.,
  // §5.2). 40 W → 59.6 °C (pass), 80 W → 94.2 °C (inside the 10 K margin below 100 °C: warn,
  // exit 0, exit 1 under --strict), 100 W → 111.5 °C (fail, exit 1). Each case is more than 4 K
  // from a boundary. The JSON verdict is the same word as the part's and the text report's.
  test.each([
    [40, 0, 0, "pass"],
    [80, 0, 1, "warn"],
    [100, 1, 1, "fail"],
  ])("%d W pulses: exit %d (%d with --strict), verdict %s", async (powerW, status, strictStatus, verdict) => {
    const io = memoryIo(FILES(powerW));
    expect(await runCli(["simulate", "dir/p.yaml", "--json"], io)).toBe(status);
    const json = JSON.parse(io.stdout.join("")) as { verdict: string; temperatureVerdict: string; parts: { verdict: string; events: unknown[] }[] };
    expect(json.verdict).toBe(verdict);
    expect(json.temperatureVerdict).toBe(verdict);
    expect(json.parts[0]!.verdict).toBe(verdict);
    expect(json).not.toHaveProperty("detailedVerdict");
    expect(json.parts[0]!.events.length).toBe(4);
    const text = memoryIo(FILES(powerW));
    expect(await runCli(["simulate", "dir/p.yaml", "--strict"], text)).toBe(strictStatus);
    expect(text.stdout.join("")).toContain(`Verdict: ${verdict} (`);
  });

  test("the text report ends with the cautions", async () => {
    const io = memoryIo(FILES(40));
    expect(await runCli(["simulate", "dir/p.yaml"], io)).toBe(0);
    const text = io.stdout.join("");
    expect(text).toContain("Verdict: pass (every part stays at or below its limit less its design margin).");
    expect(text.trimEnd().endsWith(GENERAL_CAUTION.slice(-30))).toBe(true);
    expect(text).not.toMatch(/NaN/);
  });

  // An attempt into a shorted bus never completes: the firmware's timer ends it. The outcome says so
  // ("timed-out"), and that the bus had stalled (held at 0 V) is a separate fact, busStalled.
  test("an attempt into a short: timed out by the timer, the bus stalled as a separate fact", async () => {
    const profile = shortedBusProfile("  - power-up: {}\n  - power-down: { off: 10 s }\n  - fault: { type: shorted-output }");
    const io = memoryIo({ "p.yaml": profile });
    expect(await runCli(["simulate", "p.yaml", "--json"], io)).toBe(0);
    const json = JSON.parse(io.stdout.join("")) as { parts: { events: { outcome: string; busStalled: boolean }[] }[] };
    expect(json.parts[0]!.events.map((e) => [e.outcome, e.busStalled])).toEqual([
      ["completed", false],
      ["none", false],
      ["timed-out", true],
    ]);
    const text = memoryIo({ "p.yaml": profile });
    await runCli(["simulate", "p.yaml"], text);
    const report = text.stdout.join("");
    expect(report).toContain("pre-charge attempts: 2 (1 completed, 1 timed out; the bus stalled in 1 of them)");
    expect(report).toMatch(/ timed-out\* /);
    expect(report).toContain("* timed out with the bus stalled below the completion threshold: it would never have got there");
    // "stalled" only ever describes the bus, never the attempt's outcome
    expect(report.replace(/bus stalled/g, "")).not.toContain("stalled");
  });

  test("--csv refuses to overwrite without --force, then writes with it", async () => {
    const io = memoryIo({ ...FILES(40), "out.csv": "old" });
    expect(await runCli(["simulate", "dir/p.yaml", "--csv", "out.csv"], io)).toBe(2);
    expect(io.stderr.join("")).toContain("out.csv: --csv: expected a path that does not exist yet (or add --force to overwrite), found an existing file");
    expect(io.files["out.csv"]).toBe("old");
    expect(await runCli(["simulate", "dir/p.yaml", "--csv", "out.csv", "--force"], io)).toBe(0);
    const lines = io.files["out.csv"]!.trim().split("\n");
    expect(lines[0]).toBe("time_s,event,point,r_C");
    expect(lines.length).toBeGreaterThan(8);
  });

  test("bad input: exit 2 and one line per problem, no stack trace", async () => {
    const io = memoryIo({ ...FILES(40), "dir/p.yaml": PULSES(40).replace("ambient: 25 degC", "ambiant: 25 degC") });
    expect(await runCli(["simulate", "dir/p.yaml"], io)).toBe(2);
    const err = io.stderr.join("");
    expect(err).toContain('dir/p.yaml:2: ambiant: expected one of the keys name, description, ambient, ambientProfile, heatSources, parts, circuit, events, retryPlan, supervision, firmware, occursPerYear (did you mean "ambient"?), found an unknown key');
    expect(err).not.toMatch(/\n\s+at /);
  });
});
