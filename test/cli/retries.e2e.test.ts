import { spawnSync } from "node:child_process";
import { fileURLToPath } from "node:url";
import { describe, expect, test } from "vitest";

// End to end: the built bin on the bundled retry-planning profile (the README's example).
const root = fileURLToPath(new URL("../..", import.meta.url));

function heatledger(...args: string[]): { status: number | null; stdout: string; stderr: string } {
  const run = spawnSync(process.execPath, ["bin/heatledger.js", ...args], { cwd: root, encoding: "utf8", maxBuffer: 1 << 30, env: { ...process.env, NO_COLOR: "1" } });
  return { status: run.status, stdout: run.stdout, stderr: run.stderr };
}

describe("heatledger retries, the built bin", () => {
  test("profiles/heat-pump-trip-retries.yaml: safe policy, two bands of safe intervals, every corner named", () => {
    // one spawn (the plan takes seconds on a shared machine); the JSON form is tested in process
    const run = heatledger("retries", "profiles/heat-pump-trip-retries.yaml");
    expect(run.stderr).toBe("");
    expect(run.status).toBe(0);
    expect(run.stdout).toContain("Verdict: pass (every peak at or below its limit less its design margin).");
    expect(run.stdout).toContain("Corners: nominal, hot and high, cold and low.");
    // quick restarts find the bus charged, medium ones find it empty with the part hot, slow ones
    // find the part cool: the invented scenario is built to show two bands
    expect(run.stdout).toContain("Safe intervals form 2 separate bands");
    // the quick band starts where the default relay (20 ms operate + 10 ms release) allows the
    // next attempt, never at 0 s
    expect(run.stdout).toMatch(/1\. Shortest uniform retry interval for 12 attempts \(end-to-start\):\n {3}30 ms; governing corner "hot and high"/);
    expect(run.stdout).toContain("~~  impossible  an attempt would start before the previous one ends and the relay has cycled");
  });
});
