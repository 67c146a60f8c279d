// Design-study speed figures: a 20 × 20 sweep of simulate on a bundled profile (target < 10 s on
// one core), and Monte Carlo samples per second per core on 1 and 2 worker threads with the
// speed-up from 1 to 2 (fresh processes of the built CLI: start-up and every thread's module loading included). Printed, never asserted.
// BENCH_MC_SAMPLES sets the Monte Carlo sample count (default 400; 10,000 takes minutes).
import { readFileSync } from "node:fs";
import { join } from "node:path";
import { projectRoot } from "./projectRoot.js";
import { spawnSync } from "node:child_process";
import { StudyProfile, defaultCircuitModels, parseSweepAxis, runSweep } from "../../src/internal.js";

const PROFILE = join(projectRoot, "profiles", "warehouse-robot-48v.yaml");

/** Wall and CPU seconds (every thread, from GNU time) of one montecarlo run of the built CLI in a fresh process. */
async function monteCarloSeconds(workers: number, samples: number): Promise<{ wall: number; cpu: number }> {
  const args = ["-f", "%e %U %S", process.execPath, join(projectRoot, "bin", "heatledger.js"), "montecarlo", PROFILE, "--samples", String(samples), "--seed", "3", "--workers", String(workers), "--vary", "circuit.resistance=tolerance 5 %", "--vary", "circuit.busVoltage=normal 1 %", "--vary", "parts[0].network.stages[0].r=normal 10 % within 25 %"];
  const run = spawnSync("/usr/bin/time", args, { encoding: "utf8" });
  if (run.status !== 0) throw new Error(`montecarlo exited ${run.status}: ${run.stderr}`);
  const [wall, user, system] = run.stderr.trim().split("\n").at(-1)!.split(" ").map(Number) as [number, number, number];
  return { wall, cpu: user + system };
}

export async function run(print: (line: string) => void): Promise<void> {
  const folder = join(projectRoot, "profiles");
  const study = new StudyProfile(readFileSync(PROFILE, "utf8"), PROFILE, (p) => readFileSync(join(folder, p), "utf8"));
  const axes = [parseSweepAxis(study, "circuit.resistance=10 ohm..100 ohm:20:log", "--vary"), parseSweepAxis(study, "circuit.capacitance=1 mF..10 mF:20:log", "--vary")];
  let best = Infinity;
  for (let k = 0; k < 2; k++) {
    const t0 = performance.now();
    runSweep(study, axes, ["peak", "margin"], { models: defaultCircuitModels });
    best = Math.min(best, (performance.now() - t0) / 1000);
  }
  print(`sweep 20 × 20 of simulate, warehouse-robot-48v.yaml: ${best.toFixed(2)} s (${((best / 400) * 1000).toFixed(1)} ms per point; target < 10 s, one core)`);
  const samples = Number(process.env.BENCH_MC_SAMPLES ?? 400);
  const least = (a: { wall: number; cpu: number }, b: { wall: number; cpu: number }) => (a.wall <= b.wall ? a : b);
  const one = least(await monteCarloSeconds(1, samples), await monteCarloSeconds(1, samples));
  const two = least(await monteCarloSeconds(2, samples), await monteCarloSeconds(2, samples));
  const line = (n: number, r: { wall: number; cpu: number }) => `${n} worker(s) ${r.wall.toFixed(2)} s wall, ${r.cpu.toFixed(2)} s CPU (${(samples / r.cpu).toFixed(0)} samples per CPU-second)`;
  print(`montecarlo ${samples} samples, warehouse-robot-48v.yaml: ${line(1, one)}; ${line(2, two)}; wall speed-up 1 → 2: ${(one.wall / two.wall).toFixed(2)}× (needs two idle cores)`);
}
