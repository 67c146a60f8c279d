import { readFileSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, test } from "vitest";
import { runCli } from "../../src/cli/main.js";
import { memoryIo } from "../helpers/memoryIo.js";

// A study file means what the same command line means: the same JSON, to the bit. Its own
// mistakes are named by file, line and key.
const ROOT = join(import.meta.dirname, "..", "..");
const ROBOT = "profiles/warehouse-robot-48v.yaml";
const NETWORK = "profiles/networks/wirewound-resistor-foster.yaml";
const files = (extra: Record<string, string>) => memoryIo({ [ROBOT]: readFileSync(join(ROOT, ROBOT), "utf8"), [NETWORK]: readFileSync(join(ROOT, NETWORK), "utf8"), ...extra });

describe("heatledger study FILE", () => {
  test("a sweep file gives the JSON of the same sweep command line", async () => {
    const spec = readFileSync(join(ROOT, "profiles/studies/robot-resistance-sweep.yaml"), "utf8");
    const viaFile = files({ "profiles/studies/robot-resistance-sweep.yaml": spec });
    expect(await runCli(["study", "profiles/studies/robot-resistance-sweep.yaml", "--json"], viaFile)).toBe(0);
    const direct = files({});
    expect(await runCli(["sweep", ROBOT, "--vary", "circuit.resistance=10 ohm..100 ohm:5:log", "--answer", "peak,margin,forever", "--json"], direct)).toBe(0);
    expect(viaFile.stdout.join("")).toBe(direct.stdout.join(""));
  });

  test("a compare file with set gives the JSON and exit status of compare --set", async () => {
    const spec = "study: compare\nprofile: ../warehouse-robot-48v.yaml\nset:\n  - { path: circuit.resistance, value: 47 ohm }\n";
    const viaFile = files({ "profiles/studies/c.yaml": spec });
    const direct = files({});
    const a = await runCli(["study", "profiles/studies/c.yaml", "--json"], viaFile);
    const b = await runCli(["compare", ROBOT, "--set", "circuit.resistance=47 ohm", "--json"], direct);
    expect(a).toBe(b);
    expect(viaFile.stdout.join("")).toBe(direct.stdout.join(""));
  });

  test("bad keys and values are named with the study file, the line and the key", async () => {
    const spec = [
      "study: sweep", //                                                         line 1
      "profile: ../warehouse-robot-48v.yaml", //                                 line 2
      "vary:", //                                                                line 3
      "  - { path: circuit.capacitance, from: 1 mF, to: 2 mF, pionts: 3 }", //   line 4
      "",
    ].join("\n");
    const io = files({ "profiles/studies/bad.yaml": spec });
    expect(await runCli(["study", "profiles/studies/bad.yaml"], io)).toBe(2);
    const err = io.stderr.join("");
    expect(err).toContain('profiles/studies/bad.yaml:4: vary[0].pionts: expected one of the keys path, values, from, to, points, scale (did you mean "points"?)');
    // a path the profile does not have: the command's own message, at the spec's key and line
    const unknown = files({ "profiles/studies/bad.yaml": "study: sweep\nprofile: ../warehouse-robot-48v.yaml\nvary:\n  - { path: circuit.capacitance, values: [1 mF] }\n  - { path: circuit.resistanse, values: [10 ohm] }\n" });
    expect(await runCli(["study", "profiles/studies/bad.yaml"], unknown)).toBe(2);
    expect(unknown.stderr.join("")).toContain('profiles/studies/bad.yaml:5: vary[1]: expected a parameter path of profiles/warehouse-robot-48v.yaml: circuit.resistanse is not in it (did you mean "circuit.resistance"?)');
    const command = files({ "profiles/studies/bad.yaml": "study: sweeep\nprofile: x.yaml\n" });
    expect(await runCli(["study", "profiles/studies/bad.yaml"], command)).toBe(2);
    expect(command.stderr.join("")).toContain("profiles/studies/bad.yaml:1: study: expected one of sweep, sensitivity, montecarlo, compare");
    const samples = files({ "profiles/studies/bad.yaml": "study: montecarlo\nprofile: ../warehouse-robot-48v.yaml\nsamples: 0\nvary:\n  - { path: circuit.resistance, distribution: tolerance 5 % }\n" });
    expect(await runCli(["study", "profiles/studies/bad.yaml"], samples)).toBe(2);
    expect(samples.stderr.join("")).toContain("profiles/studies/bad.yaml:3: samples: expected a whole number ≥ 1");
  });
});
