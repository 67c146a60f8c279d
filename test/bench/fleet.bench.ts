// Fleet speed: units per second of `heatledger fleet` on 1 and 2 worker threads, fresh processes
// of the built CLI (start-up, every thread's module loading and the reading of the logs included),
// on generated units of the bundled irrigation pump drive with 10,000 log lines each (one unit in
// ten with a restart storm). The target fleet is 1,000 units; the default is 100
// (BENCH_FLEET_UNITS sets it, BENCH_FLEET_LINES the lines per unit), as 1,000 takes many minutes
// per run on a shared machine. Printed, never asserted.
import { spawnSync } from "node:child_process";
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fleetUnitLog } from "../helpers/fleetUnitLog.js";
import { projectRoot } from "./projectRoot.js";

const PROFILE = join(projectRoot, "profiles", "irrigation-pump-decade.yaml");

/** Wall and CPU seconds (every thread, from GNU time) of one fleet run of the built CLI. */
function fleetSeconds(folder: string, workers: number, out: string): { wall: number; cpu: number } {
  const args = ["-f", "%e %U %S", process.execPath, join(projectRoot, "bin", "heatledger.js"), "fleet", PROFILE, folder, "--workers", String(workers), "--ndjson", out, "--force"];
  const run = spawnSync("/usr/bin/time", args, { encoding: "utf8" });
  if (run.status !== 0 && run.status !== 1) throw new Error(`fleet exited ${run.status}: ${run.stderr}`);
  const [wall, user, system] = run.stderr.trim().split("\n").at(-1)!.split(" ").map(Number) as [number, number, number];
  return { wall, cpu: user + system };
}

export async function run(print: (line: string) => void): Promise<void> {
  const units = Number(process.env.BENCH_FLEET_UNITS ?? 100);
  const lines = Number(process.env.BENCH_FLEET_LINES ?? 10_000);
  const scratch = mkdtempSync(join(tmpdir(), "heatledger-fleet-bench-"));
  try {
    const folder = join(scratch, "logs");
    mkdirSync(folder);
    // four lines a day (two starts, each switched off), so lines/4 days
    for (let i = 0; i < units; i++) writeFileSync(join(folder, `unit-${i}.csv`), fleetUnitLog(i, i % 10 === 3 ? "storm" : "none", Math.ceil(lines / 4)).text);
    const least = (a: { wall: number; cpu: number }, b: { wall: number; cpu: number }) => (a.wall <= b.wall ? a : b);
    const out = join(scratch, "fleet.ndjson");
    const one = least(fleetSeconds(folder, 1, out), fleetSeconds(folder, 1, out));
    const two = least(fleetSeconds(folder, 2, out), fleetSeconds(folder, 2, out));
    const line = (n: number, r: { wall: number; cpu: number }) =>
      `${n} worker(s) ${r.wall.toFixed(1)} s wall, ${r.cpu.toFixed(1)} s CPU: ${(units / r.wall).toFixed(2)} units/s (${(units / r.cpu).toFixed(2)} per CPU-second)`;
    print(`fleet of ${units} units × ${lines} lines, irrigation-pump-decade.yaml: ${line(1, one)}; ${line(2, two)}; wall speed-up 1 → 2: ${(one.wall / two.wall).toFixed(2)}× (needs two idle cores)`);
  } finally {
    rmSync(scratch, { recursive: true, force: true });
  }
}
