import { describe, expect, test } from "vitest";
import { runCli } from "../../src/cli/main.js";
import { GENERAL_CAUTION } from "../../src/text/cautions.js";
import { CART_24V_HEAD } from "../helpers/cartParts.js";
import { memoryIo } from "../helpers/memoryIo.js";

// In-process runs of `heatledger replay` through the CLI factory, on an invented profile and log.
const PROFILE = `${CART_24V_HEAD}events:
  - power-up: {}
  - run: 1 h
`;
const LOG = `time,event,note
0,power-up,morning
3600,power-down,
3700,power-up,
3760,note,
`;
const files = (log = LOG): Record<string, string> => ({ "dir/cart.yaml": PROFILE, "logs/unit.csv": log });

describe("heatledger replay (in process)", () => {
  test("the text report names the log, keeps simulate's sections and ends with the cautions", async () => {
    const io = memoryIo(files());
    expect(await runCli(["replay", "logs/unit.csv", "--profile", "dir/cart.yaml", "--no-chart"], io)).toBe(0);
    const text = io.stdout.join("");
    const lines = text.split("\n");
    expect(lines[0]).toBe("heatledger replay: invented 24 V cart");
    expect(lines[2]).toBe("log logs/unit.csv: 4 entries over 62.7 min (times in seconds from its first line)");
    expect(lines[3]).toBe("the profile's own 2 events are ignored: its parts, circuit and limits replay the log");
    expect(lines[4]).toBe("R1: never above its limit (90.00 °C)");
    expect(lines[5]).toBe("  damage to date not assessed (no lifetime model)");
    expect(text).toContain("line 2: power-up (morning)");
    expect(text).toContain("Verdict: pass (every part stays at or below its limit less its design margin).");
    expect(text).not.toContain("Temperature of R1");
    expect(text.trimEnd().endsWith(GENERAL_CAUTION.slice(-30))).toBe(true);
    expect(text).not.toMatch(/NaN/);
  });

  test("a limit crossed exits 1 and the header gives the moment and the log line", async () => {
    // twenty shorts 1 s apart: 70 W for 0.5 s each into 2.5 K/W (about 105 °C by the end)
    const burst = Array.from({ length: 20 }, (_, k) => `${10 + k},short,${k === 0 ? "bus shorted" : ""}`).join("\n");
    const io = memoryIo(files(`time,event,note\n0,power-up,\n5,power-down,\n${burst}\n60,note,\n`));
    expect(await runCli(["replay", "logs/unit.csv", "--profile", "dir/cart.yaml", "--json"], io)).toBe(1);
    const json = JSON.parse(io.stdout.join("")) as {
      verdict: string;
      parts: { firstExceedanceS?: number }[];
      replay: { lines: number; parts: { firstExceedanceS: number; firstExceedanceLine: { line: number; event: string } }[] };
    };
    expect(json.verdict).toBe("fail");
    expect(json.replay.lines).toBe(23);
    const first = json.replay.parts[0]!;
    expect(first.firstExceedanceLine.event).toBe("short");
    // the line in effect is the short that started within the second before the crossing
    expect(10 + (first.firstExceedanceLine.line - 4)).toBe(Math.floor(first.firstExceedanceS));
  });

  test("--cycles writes the rainflow cycles of the log, one row per cycle class, and refuses the --csv path", async () => {
    // twenty shorts 1 s apart heat R1 in steps: the cycles are those of the JSON's own count
    const burst = Array.from({ length: 20 }, (_, k) => `${10 + k},short,`).join("\n");
    const io = memoryIo(files(`time,event,note\n0,power-up,\n5,power-down,\n${burst}\n600,note,\n`));
    expect(await runCli(["replay", "logs/unit.csv", "--profile", "dir/cart.yaml", "--cycles", "cycles.csv"], io)).toBe(1);
    const csv = io.files["cycles.csv"]!.trimEnd().split("\n");
    const rows = Number(/Cycles: (\d+) rows written to cycles\.csv/.exec(io.stdout.join(""))![1]);
    expect(rows).toBeGreaterThan(0);
    expect(csv.length).toBe(rows + 1);
    expect(csv[0]).toContain("range");
    const shared = memoryIo(files());
    expect(await runCli(["replay", "logs/unit.csv", "--profile", "dir/cart.yaml", "--csv", "same.csv", "--cycles", "same.csv"], shared)).toBe(2);
    expect(shared.files["same.csv"]).toBeUndefined();
  });

  test("--csv refuses to overwrite without --force", async () => {
    const io = memoryIo({ ...files(), "out.csv": "old" });
    expect(await runCli(["replay", "logs/unit.csv", "--profile", "dir/cart.yaml", "--csv", "out.csv"], io)).toBe(2);
    expect(io.stderr.join("")).toContain("out.csv: --csv: expected a path that does not exist yet (or add --force to overwrite), found an existing file");
    expect(await runCli(["replay", "logs/unit.csv", "--profile", "dir/cart.yaml", "--csv", "out.csv", "--force"], io)).toBe(0);
    expect(io.files["out.csv"]!.split("\n")[0]).toContain("R1");
  });

  test("measured columns: the header and the JSON give the residuals of the replay against them", async () => {
    // the part at ambient and a measured ambient 5 K above the profile's: measured on that ambient,
    // the residuals are what the sensor adds (+1 K on one line, 0 on the others)
    const log = "time,event,note,ambient,measured:R1\n0,note,,30,30\n100,note,,30,31\n200,note,,,\n300,note,,30,30\n";
    const io = memoryIo(files(log));
    expect(await runCli(["replay", "logs/unit.csv", "--profile", "dir/cart.yaml", "--no-chart"], io)).toBe(0);
    const text = io.stdout.join("");
    expect(text).toContain("measured temperatures against the replay, on the log's measured ambient\n  (the replay's peaks, limits and damage keep the profile's ambient)\n");
    expect(text).toContain("  ambient measured on 3 lines: mean 30.00 °C, from 30.00 to 30.00 °C");
    expect(text).toContain("  R1: 3 values, replayed − measured: mean −0.333 K, RMS 0.577 K");
    expect(text).toContain("    largest −1.00 K at line 3 (100 s from the first line: replayed 30.00 °C, measured 31.00 °C)");
    for (const line of text.split("\n")) expect(line.length).toBeLessThanOrEqual(100);
    const json = memoryIo(files(log));
    expect(await runCli(["replay", "logs/unit.csv", "--profile", "dir/cart.yaml", "--json"], json)).toBe(0);
    const measured = (JSON.parse(json.stdout.join("")) as { replay: { measured: { ambient: string; parts: { id: string; count: number; maxAbsK: number; maxAt: { line: number } }[] } } }).replay.measured;
    expect(measured.ambient).toBe("measured");
    expect(measured.parts[0]).toMatchObject({ id: "R1", count: 3, maxAbsK: -1, maxAt: { line: 3 } });
    const plain = memoryIo(files());
    await runCli(["replay", "logs/unit.csv", "--profile", "dir/cart.yaml", "--json"], plain);
    expect((JSON.parse(plain.stdout.join("")) as { replay: { measured: unknown } }).replay.measured).toBeNull();
  });

  test.each([
    [["replay", "logs/unit.csv"], "heatledger: logs/unit.csv: --profile: expected a duty profile file (--profile FILE) whose parts, circuit and limits replay this log, found nothing\n"],
    [["replay", "logs/none.csv", "--profile", "dir/cart.yaml"], "heatledger: logs/none.csv: expected a readable event log, found no such file\n"],
    [["replay", "logs/unit.csv", "--profile", "dir/none.yaml"], "heatledger: dir/none.yaml: expected a readable duty profile, found no such file\n"],
  ])("%j: exit 2 with one clear line", async (args, message) => {
    const io = memoryIo(files());
    expect(await runCli(args, io)).toBe(2);
    expect(io.stderr.join("")).toBe(message);
    expect(io.stdout.join("")).toBe("");
  });
});
