import { spawnSync } from "node:child_process";
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { afterAll, describe, expect, test } from "vitest";
import { CYCLES_CSV_COLUMNS } from "../../src/internal.js";

// End to end: spawn the built bin (dist/ is built by vitest's global setup) on the bundled
// profiles that carry stress keys; check the JSON's stress additions (damage, cycles, rating
// checks per event, the JSON contract's keys unchanged), the --cycles CSV and the exit codes.
const root = fileURLToPath(new URL("../..", import.meta.url));
const temp = mkdtempSync(join(tmpdir(), "heatledger-stress-e2e-"));
afterAll(() => rmSync(temp, { recursive: true, force: true }));

function heatledger(...args: string[]): { status: number | null; stdout: string; stderr: string } {
  const run = spawnSync(process.execPath, ["bin/heatledger.js", ...args], { cwd: root, encoding: "utf8", maxBuffer: 1 << 30, env: { ...process.env, NO_COLOR: "1" } });
  return { status: run.status, stdout: run.stdout, stderr: run.stderr };
}

interface PartJson {
  id: string;
  peakTemperatureC: number;
  peakTimeS: number;
  limitC: number;
  marginK: number;
  events: unknown[];
  stress: {
    ratingStatus: string;
    ratingChecks: { index: number; status: string; soa: { pointsChecked: number } | null; pulseEnergy: { utilisation: number | null } | null }[];
    cycles: { fullCycles: number; halfCycles: number; mode: string };
    damage: { model: string; perRepetition: number; repetitionsToEndOfLife: number | null; yearsToEndOfLife: number | null } | null;
  };
}

describe("heatledger simulate with stress keys, the built bin", () => {
  test.each([
    ["home-storage-400v.yaml", "precharge-mosfet", "soa", 52],
    ["irrigation-pump-decade.yaml", "precharge-resistor", "pulseEnergy", 0.1],
  ] as const)("profiles/%s: JSON has damage, cycles and rating checks; --cycles has its columns", { timeout: 300_000 }, (file, partId, table, perYear) => {
    const cycles = join(temp, `${file}.cycles.csv`);
    const run = heatledger("simulate", `profiles/${file}`, "--json", "--cycles", cycles);
    expect(run.stderr).toBe("");
    const json = JSON.parse(run.stdout) as { verdict: string; temperatureVerdict: string; ratingStatus: string; occursPerYear: number; parts: PartJson[] };
    expect(run.status).toBe(json.verdict === "fail" ? 1 : 0);
    expect(json.occursPerYear).toBe(perYear);
    const part = json.parts.find((p) => p.id === partId)!;
    // the JSON contract's keys are still there, beside the new `stress`
    for (const key of ["peakTemperatureC", "peakTimeS", "limitC", "marginK"] as const) expect(Number.isFinite(part[key])).toBe(true);
    expect(part.stress.ratingChecks.length).toBeGreaterThan(0);
    for (const c of part.stress.ratingChecks) expect(c[table]).not.toBeNull();
    expect(part.stress.cycles.mode).toBe("repeating");
    expect(part.stress.cycles.halfCycles).toBe(0);
    expect(part.stress.cycles.fullCycles).toBeGreaterThan(0);
    const d = part.stress.damage!;
    expect(d.perRepetition).toBeGreaterThan(0);
    // calendar life = repetitions / occurrences per year (Miner projection); 1e-12 relative
    expect(Math.abs(d.yearsToEndOfLife! - d.repetitionsToEndOfLife! / perYear)).toBeLessThanOrEqual(1e-12 * d.yearsToEndOfLife!);
    const lines = readFileSync(cycles, "utf8").trim().split("\n");
    expect(lines[0]).toBe(CYCLES_CSV_COLUMNS.join(","));
    const rows = lines.slice(1).filter((l) => l.startsWith(`${partId},`));
    expect(rows.length).toBe(part.stress.cycles.fullCycles);
    // a second run refuses to overwrite the cycles file without --force (exit 2)
    const again = heatledger("simulate", `profiles/${file}`, "--cycles", cycles);
    expect(again.status).toBe(2);
    expect(again.stderr).toContain("--cycles: expected a path that does not exist yet (or add --force to overwrite), found an existing file");
  });

  test("the text report of the linear-MOSFET profile shows the stress sections and one linear-mode caution", { timeout: 300_000 }, () => {
    const run = heatledger("simulate", "profiles/home-storage-400v.yaml", "--no-chart");
    expect(run.stdout).toContain("Stress — precharge-mosfet");
    expect(run.stdout).toContain("Stress — source-resistor");
    expect(run.stdout).toContain("damage: cycling damage was not assessed (no lifetime model for this part).");
    expect(run.stdout).toContain("Rating checks (secondary to the temperature verdict):");
    expect(run.stdout.split("Caution (linear-mode MOSFET)").length - 1).toBe(1);
    expect(run.stdout).not.toMatch(/NaN|undefined/);
  });

  test("exit 1 when an event fails a rating table while the temperature passes", () => {
    const file = join(temp, "rated.yaml");
    // 50 W for 2 s: 100 J at t_eq = 2 s against an invented 80 J row at 2 s (the 1 ns fall puts
    // t_eq a hair past the row, still inside the table: about 80 J, 125 %); the peak rise
    // 50·2·(1 − e^−2) = 86.5 K stays under the 150 °C limit from 25 °C (lumped stage, Incropera
    // §5.1 and §5.3)
    writeFileSync(
      file,
      "name: rated\nambient: 25 degC\nparts:\n  - id: r\n    network: { form: foster, stages: [{ r: 2 K/W, tau: 1 s }] }\n    limits: { maxTemperature: 150 degC }\n" +
        "    ratings: { pulseEnergy: [{ duration: 1 s, energy: 50 J }, { duration: 2 s, energy: 80 J }, { duration: 10 s, energy: 300 J }] }\n" +
        "events:\n  - power-trace: { part: r, points: [[0, 50], [2 s, 50], [2.000000001 s, 0]] }\n  - wait: 20 s\n",
    );
    const run = heatledger("simulate", file, "--json");
    expect(run.status).toBe(1);
    const json = JSON.parse(run.stdout) as { verdict: string; temperatureVerdict: string; ratingStatus: string };
    expect(json).toMatchObject({ verdict: "fail", temperatureVerdict: "pass", ratingStatus: "fail" });
  });
});
