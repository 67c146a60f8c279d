import { spawnSync } from "node:child_process";
import { fileURLToPath } from "node:url";
import { describe, expect, test } from "vitest";
import { expectClose } from "../helpers/expectClose.js";

// End to end: spawn the built bin (dist/ is built by vitest's global setup) on the bundled field
// log, an invented returned irrigation pump drive whose firmware restarted the pre-charge every
// 2 s into a flooded junction box (README, "Replaying a field log").
const root = fileURLToPath(new URL("../..", import.meta.url));
const LOG = "profiles/logs/irrigation-pump-returned-unit.csv";
const PROFILE = "profiles/irrigation-pump-decade.yaml";

function heatledger(...args: string[]): { status: number | null; stdout: string; stderr: string } {
  const run = spawnSync(process.execPath, ["bin/heatledger.js", ...args], { cwd: root, encoding: "utf8", maxBuffer: 1 << 30, env: { ...process.env, NO_COLOR: "1" } });
  return { status: run.status, stdout: run.stdout, stderr: run.stderr };
}

describe("heatledger replay, the built bin, on the bundled log", () => {
  test("text report: exit 1, the log, the first exceedance on its line, damage to date, the cautions last", () => {
    const run = heatledger("replay", LOG, "--profile", PROFILE, "--no-chart");
    expect(run.stderr).toBe("");
    expect(run.status).toBe(1);
    const lines = run.stdout.split("\n");
    expect(lines[0]).toBe("heatledger replay: 80 V irrigation pump drive, ten years of daily cycles with occasional faults");
    // the log line is 101 columns: piped, it wraps at 100 under itself
    expect(`${lines[2]} ${lines[3]!.trim()}`).toBe(`log ${LOG}: 79 entries over 5.03 d, from 2026-06-01T06:00:00.000Z`);
    expect(lines[4]).toBe("the profile's own 17 events are ignored: its parts, circuit and limits replay the log");
    // the storm's attempts start every 2 s from 06:02:36; the crossing falls in the attempt of line 80
    expect(lines[5]).toBe("precharge-resistor: first above its limit (180.0 °C) during line 80 (overload)");
    expect(lines[6]).toMatch(/^ {2}at 432246\.\d{3} s from the first line \(5\.00 d\), 2026-06-06T06:04:06\.\d{3}Z$/);
    expect(lines[7]).toMatch(/^ {2}damage to date \d\.\d\de-4 \(Miner's rule; 1 = end of cycling life\)$/);
    expect(run.stdout).toContain("Verdict: fail (a part passes its temperature limit");
    expect(run.stdout).toContain("cycles (open history, ASTM E1049 §5.4.4");
    expect(run.stdout).toMatch(/damage \(Coffin-Manson, Miner's rule\): [\d.e-]+ to date \(the whole log\)/);
    expect(run.stdout.trimEnd()).toMatch(/ignite nearby material\.$/);
    expect(run.stdout).not.toMatch(/NaN/);
  });

  test("--json: the simulate contract plus the replay object", () => {
    const run = heatledger("replay", LOG, "--profile", PROFILE, "--json");
    expect(run.status).toBe(1);
    const json = JSON.parse(run.stdout) as {
      verdict: string;
      occursPerYear: number | null;
      parts: { id: string; firstExceedanceS?: number; events: unknown[] }[];
      replay: { lines: number; timeKind: string; parts: { firstExceedanceS: number; firstExceedanceLine: { line: number }; damageToDate: number }[] };
    };
    expect(json.verdict).toBe("fail");
    expect(json.occursPerYear).toBeNull();
    expect(json.parts[0]!.events.length).toBe(79);
    expect(json.replay.lines).toBe(79);
    expect(json.replay.timeKind).toBe("timestamp");
    expect(json.replay.parts[0]!.firstExceedanceS).toBe(json.parts[0]!.firstExceedanceS);
    expect(json.replay.parts[0]!.firstExceedanceLine.line).toBe(80);
    expect(json.replay.parts[0]!.damageToDate).toBeGreaterThan(0);
  });

  // The attempt during which the resistor passes its 180 °C limit starts hot, about 146 °C, so its
  // single-pulse rating (the profile's table, stated from 25 °C by default) is derated to
  // (180 − T_start)/(180 − 25), about 22 % (common practice for resistor pulse ratings): its 92 J
  // fails where the underated table allowed it comfortably (197 J, 47 %). Every quantity is read
  // back from the report and checked against the formula: 1e-12 relative, a few roundings.
  test("the attempt that passes the limit fails its pulse-energy rating, derated for its hot start", () => {
    const run = heatledger("replay", LOG, "--profile", PROFILE, "--json");
    expect(run.status).toBe(1);
    const json = JSON.parse(run.stdout) as {
      parts: {
        firstExceedanceS: number;
        events: { index: number; startS: number }[];
        stress: { ratingChecks: { index: number; status: string; startTemperatureC: number; pulseEnergy: { status: string; energyJ: number; ratedEnergyJ: number; deratingFactor: number; allowedEnergyJ: number; utilisation: number } }[] };
      }[];
    };
    const part = json.parts[0]!;
    const crossing = part.events.filter((e) => e.startS <= part.firstExceedanceS).at(-1)!;
    const check = part.stress.ratingChecks.find((c) => c.index === crossing.index)!;
    expect(check.status).toBe("fail");
    const pe = check.pulseEnergy;
    expect(pe.status).toBe("fail");
    expect(check.startTemperatureC).toBeGreaterThan(100); // the storm has heated the part
    const k = (180 - check.startTemperatureC) / (180 - 25);
    expectClose(pe.deratingFactor, k, { rel: 1e-12 });
    expectClose(pe.allowedEnergyJ, pe.ratedEnergyJ * k, { rel: 1e-12 });
    expectClose(pe.utilisation, pe.energyJ / (pe.ratedEnergyJ * k), { rel: 1e-12 });
    expect(pe.utilisation).toBeGreaterThan(1);
    expect(pe.energyJ / pe.ratedEnergyJ).toBeLessThan(0.5); // the table alone would have passed it at under half
    // the first attempt of the log starts cold, at the 35 °C ambient: (180 − 35)/155 = 0.935
    const first = part.stress.ratingChecks[0]!;
    expect(first.startTemperatureC).toBe(35);
    expectClose(first.pulseEnergy.deratingFactor, 145 / 155, { rel: 1e-15 });
    const text = heatledger("replay", LOG, "--profile", PROFILE, "--no-chart").stdout;
    expect(text).toContain("ratings: FAIL");
    const highest = /highest pulse-energy use: event \d+ at [0-9.]+ s, from ([0-9.]+) °C: [0-9.]+ J, ([0-9.]+) % of [0-9.]+ J allowed \([0-9.]+ J rated, derated to [0-9.]+ %\)/.exec(text.replace(/\s+/g, " "));
    expect(highest).not.toBeNull();
    expect(Number(highest![1])).toBeGreaterThan(100);
    expect(Number(highest![2])).toBeGreaterThan(100);
  });

  test("bad input: exit 2, one line naming the file, line and column, no stack trace", () => {
    const run = heatledger("replay", PROFILE, "--profile", PROFILE);
    expect(run.status).toBe(2);
    expect(run.stdout).toBe("");
    expect(run.stderr).toMatch(/^heatledger: profiles\/irrigation-pump-decade\.yaml:\d+: /);
    expect(run.stderr).not.toMatch(/\n\s+at /);
  });
});
