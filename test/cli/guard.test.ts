import { readFileSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, test } from "vitest";
import { runCli } from "../../src/cli/main.js";
import { GENERAL_CAUTION, GUARD_CAUTION } from "../../src/internal.js";
import { memoryIo } from "../helpers/memoryIo.js";

// In-process runs of `heatledger guard` on the bundled warehouse-robot profile (files from a map).
const ROOT = join(import.meta.dirname, "..", "..");
const files = (): Record<string, string> => ({
  "profiles/warehouse-robot-48v.yaml": readFileSync(join(ROOT, "profiles/warehouse-robot-48v.yaml"), "utf8"),
  "profiles/networks/wirewound-resistor-foster.yaml": readFileSync(join(ROOT, "profiles/networks/wirewound-resistor-foster.yaml"), "utf8"),
});
const PROFILE = "profiles/warehouse-robot-48v.yaml";

describe("heatledger guard (in process)", () => {
  test("--json: the discrete model, the table, the comparison with the fastest schedule, the cautions", async () => {
    const io = memoryIo(files());
    expect(await runCli(["guard", PROFILE, "--json", "--attempts", "4"], io)).toBe(0);
    const json = JSON.parse(io.stdout.join("")) as Record<string, any>;
    expect(json["verdict"]).toBe("pass");
    expect(json["tickS"]).toBe(0.001);
    expect(json["numeric"]).toBe("fixed");
    expect(json["fractionBits"]).toBe(16);
    expect(json["inputs"]).toEqual(["element"]);
    const part = json["parts"][0];
    expect(part.tauS).toHaveLength(4);
    // a = e^(−Ts/τ) for each mode
    part.tauS.forEach((tau: number, m: number) => expect(part.decay[m]).toBeCloseTo(Math.exp(-0.001 / tau), 15));
    expect(part.headroomK).toHaveLength(25);
    expect(json["corners"][0].guardStartsS).toHaveLength(4);
    expect(json["cautions"]).toEqual([GUARD_CAUTION, GENERAL_CAUTION]);
    expect(JSON.stringify(json)).not.toMatch(/NaN|Infinity/);
  });

  test("the text report stays within 100 columns, names its units and ends with the cautions", async () => {
    const io = memoryIo(files());
    expect(await runCli(["guard", PROFILE, "--attempts", "3", "--numeric", "float"], io)).toBe(0);
    const text = io.stdout.join("");
    for (const line of text.split("\n")) expect(line.length).toBeLessThanOrEqual(100);
    expect(text).toContain("Export: double precision (rises in K, energies in J).");
    expect(text).toContain("tau [s]");
    expect(text).toContain("ZOH element [K/J]");
    expect(text).toContain("Verdict: pass");
    expect(text.replace(/\s+/g, " ")).toContain(GUARD_CAUTION);
    expect(text.replace(/\s+/g, " ")).toContain(GENERAL_CAUTION);
  });

  test("writes the C export, the model JSON and the vectors, and refuses to overwrite them without --force", async () => {
    const io = memoryIo(files());
    const args = ["guard", PROFILE, "--attempts", "2", "--c", "out/robot", "--model-json", "out/model.json", "--vectors", "out/vectors.json", "--name", "robot_guard"];
    expect(await runCli(args, io)).toBe(0);
    expect(io.files["out/robot.h"]).toContain("void robot_guard_tick(robot_guard_state *s, const int32_t energy[ROBOT_GUARD_INPUTS]);");
    expect(io.files["out/robot.c"]).toContain('#include "robot.h"');
    const model = JSON.parse(io.files["out/model.json"]!) as Record<string, any>;
    expect(model["kind"]).toBe("heatledger-thermal-guard");
    expect(model["fixed"].fractionBits).toBe(16);
    const vectors = JSON.parse(io.files["out/vectors.json"]!) as Record<string, any>;
    expect(vectors["corners"][0].attempts).toHaveLength(2);
    expect(vectors["corners"][0].lines.length).toBeGreaterThan(600);
    const again = memoryIo(io.files);
    expect(await runCli(args, again)).toBe(2);
    expect(again.stderr.join("")).toContain("--force");
    expect(await runCli([...args, "--force"], memoryIo(io.files))).toBe(0);
  });

  test.each([
    [["--numeric", "decimal"], "--numeric"],
    [["--q", "31"], "--q"],
    [["--name", "2guard"], "--name"],
    [["--tick", "0 s"], "--tick"],
    [["--attempts", "0"], "--attempts"],
  ])("bad flag %j: exit 2, naming the flag", async (flags, name) => {
    const io = memoryIo(files());
    expect(await runCli(["guard", PROFILE, ...flags], io)).toBe(2);
    expect(io.stderr.join("")).toContain(name);
  });

  test("a Q format too small for the rises is refused with the range it has", async () => {
    const io = memoryIo(files());
    expect(await runCli(["guard", PROFILE, "--q", "24"], io)).toBe(2);
    // Q7.24 holds rises up to 2^7 = 128 K; the robot's allowed rise is 130 K
    expect(io.stderr.join("")).toContain("holds rises up to 128 K");
  });
});
