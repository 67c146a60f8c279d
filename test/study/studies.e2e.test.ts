import { spawnSync } from "node:child_process";
import { mkdtempSync, readFileSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { describe, expect, test } from "vitest";

// End to end: the built bin runs the README's study commands on the bundled robot profile.
const root = fileURLToPath(new URL("../..", import.meta.url));

function heatledger(...args: string[]): { status: number | null; stdout: string; stderr: string } {
  const run = spawnSync(process.execPath, ["bin/heatledger.js", ...args], { cwd: root, encoding: "utf8", maxBuffer: 1 << 30, env: { ...process.env, NO_COLOR: "1" } });
  return { status: run.status, stdout: run.stdout, stderr: run.stderr };
}

describe("design studies, the built bin", () => {
  test("sweep of the series resistance: one row per value, the profile's 22 ohm row equal to simulate's peak", () => {
    const sweep = heatledger("sweep", "profiles/warehouse-robot-48v.yaml", "--vary", "circuit.resistance=22 ohm,47 ohm", "--json");
    expect(sweep.stderr).toBe("");
    expect(sweep.status).toBe(0);
    const json = JSON.parse(sweep.stdout) as { points: { answers: { peak: number } }[] };
    const simulate = JSON.parse(heatledger("simulate", "profiles/warehouse-robot-48v.yaml", "--json").stdout) as { parts: { peakTemperatureC: number }[] };
    expect(json.points[0]!.answers.peak).toBe(simulate.parts[0]!.peakTemperatureC);
    expect(json.points[1]!.answers.peak).toBeLessThan(json.points[0]!.answers.peak);
  });

  test("montecarlo on two worker threads writes a worst unit whose network file sits beside it", () => {
    const dir = mkdtempSync(join(tmpdir(), "heatledger-study-"));
    const worst = join(dir, "worst.yaml");
    const run = heatledger("montecarlo", "profiles/warehouse-robot-48v.yaml", "--samples", "32", "--workers", "2", "--vary", "parts[0].network.stages[0].r=normal 10 %", "--worst", worst);
    expect(run.stderr).toBe("");
    expect(run.status).toBe(0);
    expect(run.stdout).toContain("32 samples, seed 1, 2 worker(s)");
    expect(readFileSync(worst, "utf8")).toContain("network: worst-wirewound-resistor-foster.yaml");
    const again = heatledger("simulate", worst, "--json");
    expect(again.status).toBe(0);
  });

  test("a study file, simulate --corners and compare's exit status, through the built bin", () => {
    const dir = mkdtempSync(join(tmpdir(), "heatledger-study-"));
    const spec = join(dir, "sweep.yaml");
    writeFileSync(spec, `study: sweep\nprofile: ${join(root, "profiles", "warehouse-robot-48v.yaml")}\nanswers: [peak]\nvary:\n  - { path: circuit.resistance, values: [22 ohm, 47 ohm] }\n`);
    const study = heatledger("study", spec, "--json");
    expect(study.stderr).toBe("");
    expect(study.status).toBe(0);
    expect((JSON.parse(study.stdout) as { points: unknown[] }).points).toHaveLength(2);
    const corners = heatledger("simulate", "profiles/heat-pump-trip-retries.yaml", "--corners", "--json");
    expect(corners.status).toBe(0);
    expect((JSON.parse(corners.stdout) as { corners: { names: string[] } }).corners.names).toEqual(["as written", "nominal", "hot and high", "cold and low"]);
    // 10 ohm makes the robot's resistor pass its limit in B: compare exits 1
    const compare = heatledger("compare", "profiles/warehouse-robot-48v.yaml", "--set", "circuit.resistance=10 ohm");
    expect(compare.status).toBe(1);
    expect(compare.stdout).toContain("Verdict: fail");
  });
});
