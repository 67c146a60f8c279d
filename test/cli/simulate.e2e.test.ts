import { spawnSync } from "node:child_process";
import { mkdtempSync, readFileSync, readdirSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { afterAll, describe, expect, test } from "vitest";

// End to end: spawn the built bin (dist/ is built by vitest's global setup) on every bundled
// profile and on invented broken and failing ones; check the JSON contract (docs/design.md), the CSV
// columns and the exit codes 0 / 1 / 2.
const root = fileURLToPath(new URL("../..", import.meta.url));
const temp = mkdtempSync(join(tmpdir(), "heatledger-e2e-"));
afterAll(() => rmSync(temp, { recursive: true, force: true }));

function heatledger(...args: string[]): { status: number | null; stdout: string; stderr: string } {
  const run = spawnSync(process.execPath, ["bin/heatledger.js", ...args], { cwd: root, encoding: "utf8", maxBuffer: 1 << 30, env: { ...process.env, NO_COLOR: "1" } });
  return { status: run.status, stdout: run.stdout, stderr: run.stderr };
}

const bundled = readdirSync(join(root, "profiles")).filter((f) => f.endsWith(".yaml"));

describe("heatledger simulate, the built bin", () => {
  test("the bundle holds at least three example profiles, the README's among them", () => {
    expect(bundled.length).toBeGreaterThanOrEqual(3);
    expect(bundled).toContain("warehouse-robot-48v.yaml");
  });

  test.each(bundled)("profiles/%s: --json meets the contract, --csv has its columns", { timeout: 300_000 }, (file) => {
    const csv = join(temp, `${file}.csv`);
    const run = heatledger("simulate", `profiles/${file}`, "--json", "--csv", csv);
    expect(run.stderr).toBe("");
    const json = JSON.parse(run.stdout) as {
      verdict: string;
      parts: { id: string; peakTemperatureC: number; peakTimeS: number; limitC: number; marginK: number; events: Record<string, unknown>[] }[];
    };
    expect(["pass", "warn", "fail"]).toContain(json.verdict);
    expect(run.status).toBe(json.verdict === "fail" ? 1 : 0);
    expect(json.parts.length).toBeGreaterThan(0);
    for (const part of json.parts) {
      for (const key of ["peakTemperatureC", "peakTimeS", "limitC", "marginK"] as const) expect(Number.isFinite(part[key])).toBe(true);
      expect(typeof part.id).toBe("string");
      expect(part.events.length).toBeGreaterThan(0);
      for (const e of part.events.slice(0, 50)) {
        // the contract's keys first; a tripped attempt adds trippedBy, a contactor close closing
        const keys = Object.keys(e);
        expect(keys.slice(0, 7)).toEqual(["index", "kind", "startS", "energyJ", "peakTemperatureC", "outcome", "busStalled"]);
        for (const extra of keys.slice(7)) expect(["trippedBy", "closing"]).toContain(extra);
        expect(["completed", "timed-out", "tripped", "none"]).toContain(e.outcome);
        expect(Number.isFinite(e.peakTemperatureC as number)).toBe(true);
      }
    }
    const header = readFileSync(csv, "utf8").split("\n", 1)[0];
    expect(header).toBe(["time_s", "event", "point", ...json.parts.map((p) => `${p.id}_C`)].join(","));
  });

  test("the text report of the README's profile is readable and closes with the cautions", () => {
    const run = heatledger("simulate", "profiles/warehouse-robot-48v.yaml");
    expect(run.status).toBe(0);
    expect(run.stdout).toContain("Parts");
    expect(run.stdout).toContain("Temperature of precharge-resistor");
    expect(run.stdout).toMatch(/Caution: these results are only as good as[\s\S]*ignite nearby material\.\n*$/);
    expect(run.stdout).not.toMatch(/NaN|undefined/);
  });

  test("exit 1 when a limit is crossed", () => {
    const file = join(temp, "hot.yaml");
    writeFileSync(
      file,
      "name: hot\nambient: 25 degC\nparts:\n  - id: r\n    network: { form: foster, stages: [{ r: 2 K/W, tau: 1 s }] }\n    limits: { maxTemperature: 100 degC }\nevents:\n  - power-trace: { part: r, points: [[0, 100], [5 s, 100]] }\n",
    );
    const run = heatledger("simulate", file, "--json");
    expect(run.status).toBe(1);
    expect((JSON.parse(run.stdout) as { verdict: string }).verdict).toBe("fail");
  });

  test("exit 2 with a one-line message for bad input, never a stack trace", () => {
    const file = join(temp, "bad.yaml");
    writeFileSync(file, "name: bad\nambient: hot\nparts: []\nevents: []\n");
    const run = heatledger("simulate", file);
    expect(run.status).toBe(2);
    expect(run.stderr).toContain(`${file}:2: ambient: expected a temperature such as "40 degC" (or a number in degC), found "hot"`);
    expect(run.stderr).not.toMatch(/\n\s+at /);
    expect(heatledger("simulate", join(temp, "missing.yaml")).status).toBe(2);
  });
});
