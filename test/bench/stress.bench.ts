// Rainflow of 10 million turning points (target: under 2 s, memory bounded), then the
// same history through the turning-point filter and Miner's sum. Figures are printed, not asserted.
import { loadavg } from "node:os";
import { LESIT_PUBLISHED, MinerAccumulator, RainflowCounter, TurningPointFilter, lesitModel } from "../../src/internal.js";

const POINTS = 10_000_000;

/** Alternating random peaks and valleys in 20..150 °C (a fixed-seed linear congruential generator). */
function history(n: number): Float64Array {
  const values = new Float64Array(n);
  let seed = 20261202;
  const random = () => (seed = (Math.imul(seed, 1664525) + 1013904223) >>> 0) / 4294967296;
  let level = 80;
  for (let i = 0; i < n; i++) {
    // alternate direction so every point is a turning point
    const step = 1 + random() * 60;
    level = i % 2 === 0 ? Math.min(150, level + step) : Math.max(20, level - step);
    values[i] = level;
  }
  return values;
}

export async function run(print: (line: string) => void): Promise<void> {
  print(`machine load average (1 min): ${loadavg()[0]!.toFixed(1)} on 2 cores: figures scale with it`);
  let t0 = performance.now();
  const values = history(POINTS);
  print(`history: ${POINTS.toLocaleString("en")} turning points generated in ${((performance.now() - t0) / 1000).toFixed(2)} s (not counted below)`);

  for (const mode of ["open", "repeating"] as const) {
    let cycles = 0;
    let counted = 0;
    const heapBefore = process.memoryUsage().heapUsed;
    const cpuBefore = process.cpuUsage();
    const counter = new RainflowCounter(
      (c) => {
        cycles++;
        counted += c.count;
      },
      { mode },
    );
    t0 = performance.now();
    for (let i = 0; i < POINTS; i++) counter.push(i, values[i]!);
    counter.finish();
    const seconds = (performance.now() - t0) / 1000;
    const cpu = process.cpuUsage(cpuBefore);
    const cpuSeconds = (cpu.user + cpu.system) / 1e6;
    const heapAfter = process.memoryUsage().heapUsed;
    print(
      `rainflow ${mode}: ${seconds.toFixed(2)} s wall, ${cpuSeconds.toFixed(2)} s CPU (target < 2 s), ${cycles.toLocaleString("en")} cycles (${counted.toLocaleString("en")} counted), ` +
        `peak stack ${counter.peakStackSize} points, heap change ${((heapAfter - heapBefore) / 1048576).toFixed(1)} MiB`,
    );
  }

  const miner = new MinerAccumulator(lesitModel(LESIT_PUBLISHED));
  const cpuBefore = process.cpuUsage();
  const counter = new RainflowCounter((c) => miner.add(c), { mode: "repeating" });
  const filter = new TurningPointFilter((t, v) => counter.push(t, v), 1);
  t0 = performance.now();
  for (let i = 0; i < POINTS; i++) filter.push(i, values[i]!);
  filter.finish();
  counter.finish();
  const seconds = (performance.now() - t0) / 1000;
  const cpu = process.cpuUsage(cpuBefore);
  const d = miner.result();
  print(`filter (1 K) + rainflow + LESIT Miner sum: ${seconds.toFixed(2)} s wall, ${((cpu.user + cpu.system) / 1e6).toFixed(2)} s CPU, damage ${d.damagePerRepetition.toExponential(3)} per repetition`);
}
