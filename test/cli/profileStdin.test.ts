import { spawnSync } from "node:child_process";
import { fileURLToPath } from "node:url";
import { describe, expect, test } from "vitest";
import { runCli } from "../../src/cli/main.js";
import { starterProfileText } from "../../src/internal.js";
import { memoryIo } from "../helpers/memoryIo.js";

// `-` in place of a profile reads it from standard input; messages name it "<stdin>" and the
// files it names are read relative to the working folder.

const root = fileURLToPath(new URL("../..", import.meta.url));

function stdinIo(input: string | undefined, files: Record<string, string> = {}) {
  const io = memoryIo(files);
  return input === undefined ? io : { ...io, readStdin: () => input };
}

const NAMED = `name: named files
ambient: 25 degC
parts:
  - { id: r, network: nets/r.yaml, limits: { maxTemperature: 100 degC } }
events:
  - power-trace: { part: r, points: [[0, 10], ["1 s", 10], ["1.001 s", 0]] }
`;

describe("a profile on standard input", () => {
  test("simulate - runs the profile piped in, and the report names it <stdin>", async () => {
    const io = stdinIo(starterProfileText("series-resistor"));
    expect(await runCli(["simulate", "-", "--no-chart"], io)).toBe(0);
    expect(io.stdout.join("")).toContain("profile <stdin>: 14 events");
  });

  test("files it names are read relative to the working folder", async () => {
    // One RC stage, 1 K/W: 10 W for 1 s against tau = 1 s rises 10·(1 − e^(−1)) = 6.321 K
    // (lumped capacitance, Incropera et al., Fundamentals of Heat and Mass Transfer, 7th ed., §5.3);
    // the 1 ms ramp down adds less than 10 W·1 ms·1 K/J = 0.01 K
    const io = stdinIo(NAMED, { "nets/r.yaml": "form: foster\nstages:\n  - { r: 1 K/W, tau: 1 s }\n" });
    expect(await runCli(["simulate", "-", "--json"], io)).toBe(0);
    const json = JSON.parse(io.stdout.join("")) as { parts: { peakTemperatureC: number }[] };
    expect(json.parts[0]!.peakTemperatureC).toBeCloseTo(25 + 10 * (1 - Math.exp(-1)), 1);
    expect(json.parts[0]!.peakTemperatureC).toBeGreaterThanOrEqual(25 + 10 * (1 - Math.exp(-1)));
    const missing = stdinIo(NAMED);
    expect(await runCli(["simulate", "-"], missing)).toBe(2);
    expect(missing.stderr.join("")).toContain("nets/r.yaml");
  });

  test.each([
    ["simulate", ["simulate", "-"]],
    ["retries", ["retries", "-"]],
    ["sweep", ["sweep", "-", "--vary", "circuit.capacitance=1 mF..2 mF:3"]],
  ])("%s: errors in the piped profile name <stdin> and its line", async (_name, args) => {
    const io = stdinIo("name: bad\nambient: hot\nparts: []\nevents: []\n");
    expect(await runCli(args, io)).toBe(2);
    const err = io.stderr.join("");
    expect(err).toMatch(/^heatledger: <stdin>:2: ambient: expected /m);
    expect(err).not.toContain(" -:");
  });

  test("nothing piped in, or no standard input at all, is one clear message", async () => {
    const empty = stdinIo("  \n");
    expect(await runCli(["simulate", "-"], empty)).toBe(2);
    expect(empty.stderr.join("")).toBe("heatledger: <stdin>: expected a duty profile on standard input, found nothing\n");
    const none = stdinIo(undefined);
    expect(await runCli(["simulate", "-"], none)).toBe(2);
    expect(none.stderr.join("")).toBe("heatledger: <stdin>: expected a duty profile on standard input, found no standard input\n");
  });

  test("the built bin: init - piped into simulate - (and a terminal-free empty stdin is refused)", () => {
    const init = spawnSync(process.execPath, ["bin/heatledger.js", "init", "-", "--circuit", "converter"], { cwd: root, encoding: "utf8" });
    expect(init.status).toBe(0);
    const sim = spawnSync(process.execPath, ["bin/heatledger.js", "simulate", "-", "--json"], { cwd: root, encoding: "utf8", input: init.stdout });
    expect(sim.status, sim.stderr).toBe(0);
    expect((JSON.parse(sim.stdout) as { profile: { file: string } }).profile.file).toBe("<stdin>");
    const empty = spawnSync(process.execPath, ["bin/heatledger.js", "simulate", "-"], { cwd: root, encoding: "utf8", input: "" });
    expect(empty.status).toBe(2);
    expect(empty.stderr).toBe("heatledger: <stdin>: expected a duty profile on standard input, found nothing\n");
  });
});
