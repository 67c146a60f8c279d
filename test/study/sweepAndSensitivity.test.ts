import { readFileSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, test } from "vitest";
import { runCli } from "../../src/cli/main.js";
import { StudyProfile, computeSensitivities, defaultCircuitModels, loadProfile, planRetries, simulateProfile } from "../../src/internal.js";
import { memoryIo } from "../helpers/memoryIo.js";
import { ADIABATIC } from "../helpers/adiabaticProfile.js";

const ROOT = join(import.meta.dirname, "..", "..");
const BUNDLED = "profiles/warehouse-robot-48v.yaml";
const NETWORK = "profiles/networks/wirewound-resistor-foster.yaml";

describe("sweep", () => {
  test("a sweep of the series resistance reproduces single runs of simulate and retries point by point", async () => {
    const text = readFileSync(join(ROOT, BUNDLED), "utf8");
    const network = readFileSync(join(ROOT, NETWORK), "utf8");
    const io = memoryIo({ [BUNDLED]: text, [NETWORK]: network });
    expect(await runCli(["sweep", BUNDLED, "--vary", "circuit.resistance=15 ohm,22 ohm,47 ohm", "--answer", "peak,margin,energy,forever", "--json"], io)).toBe(0);
    const json = JSON.parse(io.stdout.join("")) as { points: { values: number[]; answers: Record<string, number> }[] };
    expect(json.points.map((p) => p.values[0])).toEqual([15, 22, 47]);
    for (const [i, ohm] of [15, 22, 47].entries()) {
      // the single run: the profile written by hand with that resistance, as simulate and retries load it
      expect(text).toContain("resistance: 22 ohm\n");
      const profile = loadProfile(text.replace("resistance: 22 ohm\n", `resistance: ${ohm} ohm\n`), BUNDLED, (p) => (p === "networks/wirewound-resistor-foster.yaml" ? network : ""));
      const single = simulateProfile(profile, { models: defaultCircuitModels }).parts[0]!;
      const answers = json.points[i]!.answers;
      expect(answers.peak).toBe(single.peakTemperatureC);
      expect(answers.margin).toBe(single.marginK);
      expect(answers.energy).toBe(single.energyJ);
      expect(answers.forever).toBe(planRetries(profile, defaultCircuitModels).forever.minimumIntervalS);
    }
  });

  test("a 2 × 3 grid: the text table stays within 100 columns and the CSV has one row per point", async () => {
    const io = memoryIo({ [BUNDLED]: readFileSync(join(ROOT, BUNDLED), "utf8"), [NETWORK]: readFileSync(join(ROOT, NETWORK), "utf8") });
    const args = ["sweep", BUNDLED, "--vary", "circuit.resistance=10 ohm..40 ohm:3:log", "--vary", "circuit.capacitance=2.2 mF,4.7 mF", "--answer", "peak,rise,margin,energy", "--csv", "out.csv"];
    expect(await runCli(args, io)).toBe(0);
    const report = io.stdout.join("");
    for (const line of report.split("\n")) expect(line.length).toBeLessThanOrEqual(100);
    expect(report).toContain("circuit.resistance [ohm]");
    expect(io.files["out.csv"]!.trim().split("\n")).toHaveLength(7);
    // 10·(40/10)^(1/2) = 20: the middle of a log range is the geometric mean
    expect(io.files["out.csv"]).toMatch(/\n20,0\.0022,/);
  });
});

// The adiabatic limit: one Foster stage with tau = 1e7 s (heat capacity tau/r = 100 J/K) takes the
// whole charging loss of a series-resistor pre-charge. Charging C from 0 to f·Vs through any
// resistance takes C·Vs·(f·Vs) from the source and stores C·(f·Vs)²/2 (capacitor energy C·v²/2:
// Hayt, Kemmerly & Durbin, Engineering Circuit Analysis, 8th ed., §7.1), so the loss is
// C·Vs²·(f − f²/2), independent of R; the rise is that energy over the heat capacity (E = C·ΔT
// when nothing flows out: Incropera et al., Fundamentals of Heat and Mass Transfer, 7th ed., §5.3).
// Hence d ln(ΔT)/d ln(C) = 1, d ln(ΔT)/d ln(Vs) = 2, d ln(ΔT)/d ln(R) = 0 exactly; what the
// stage leaks in the ~30 ms charge is about 1e-9 of the rise.

describe("sensitivities", () => {
  test("adiabatic limit: S = 1 for C, 2 for V, 0 for R (the charging loss C·V²·(f − f²/2))", () => {
    const study = new StudyProfile(ADIABATIC, "a.yaml");
    const params = ["circuit.capacitance", "circuit.busVoltage", "circuit.resistance"].map((p) => study.parameter(p, "--vary"));
    const result = computeSensitivities(study, params, ["rise"], { models: defaultCircuitModels });
    const s = result.map((r) => r.sensitivities[0]!.normalised!);
    expect(Math.abs(s[0]! - 1)).toBeLessThan(1e-6);
    expect(Math.abs(s[1]! - 2)).toBeLessThan(1e-6);
    expect(Math.abs(s[2]!)).toBeLessThan(1e-6);
    // and the rise itself: 2 mF · 3600 V² · (0.95 − 0.45125) / 100 J/K = 35.919 mK
    expect(result[0]!.sensitivities[0]!.nominal!).toBeCloseTo((0.002 * 3600 * (0.95 - 0.95 ** 2 / 2)) / 100, 8);
  });

  test("CLI: ranked table within 100 columns, JSON ranked by |S|; an absolute temperature is refused", async () => {
    const io = memoryIo({ "a.yaml": ADIABATIC });
    expect(await runCli(["sensitivity", "a.yaml", "--json"], io)).toBe(0);
    const json = JSON.parse(io.stdout.join("")) as { answers: { name: string; ranked: { path: string; normalised: number }[] }[] };
    expect(json.answers.map((a) => a.name)).toEqual(["rise"]);
    expect(json.answers[0]!.ranked.map((r) => r.path)).toEqual(["circuit.busVoltage", "circuit.capacitance", "circuit.resistance"]);
    const text = memoryIo({ "a.yaml": ADIABATIC });
    expect(await runCli(["sensitivity", "a.yaml"], text)).toBe(0);
    for (const line of text.stdout.join("").split("\n")) expect(line.length).toBeLessThanOrEqual(100);
    const bad = memoryIo({ "a.yaml": ADIABATIC });
    expect(await runCli(["sensitivity", "a.yaml", "--vary", "ambient"], bad)).toBe(2);
    expect(bad.stderr.join("")).toContain("absolute temperature in °C");
  });
});
