// Benchmark (issue 4): a profile that expands to about 1,000,000 events — a shuttle that power-
// cycles every 20 minutes, day after day for years, with a fault burst every month — simulated
// with the real series-resistor model. Prints
// events, steps, time and heap before/after; the target (under 2 s, memory not growing with the
// event count) is read by people, never asserted.
import { defaultCircuitModels, loadProfile, simulateProfile } from "../../src/index.js";
import { shuttleProfileText } from "./shuttleProfile.js";

function profileText(years: number): string {
  return shuttleProfileText(Math.round(years * 12));
}

function measure(years: number): { events: number; steps: number; seconds: number; cpuSeconds: number; heapBeforeMB: number; heapAfterMB: number } {
  const profile = loadProfile(profileText(years), "bench.yaml");
  (globalThis as { gc?: () => void }).gc?.();
  const heapBefore = process.memoryUsage().heapUsed;
  const start = process.hrtime.bigint();
  const cpuStart = process.cpuUsage();
  const result = simulateProfile(profile, { models: defaultCircuitModels });
  const seconds = Number(process.hrtime.bigint() - start) / 1e9;
  const cpu = process.cpuUsage(cpuStart);
  const cpuSeconds = (cpu.user + cpu.system) / 1e6;
  (globalThis as { gc?: () => void }).gc?.();
  const heapAfter = process.memoryUsage().heapUsed;
  return { events: result.eventCount, steps: result.stepCount, seconds, cpuSeconds, heapBeforeMB: heapBefore / 2 ** 20, heapAfterMB: heapAfter / 2 ** 20 };
}

export async function run(print: (line: string) => void): Promise<void> {
  measure(1); // warm-up (mathjs load, JIT)
  // the heap after each run, with a full GC (node --expose-gc), shows whether memory grows with events
  for (const years of [1, 5, 13.3]) {
    const m = measure(years);
    print(
      `${years} years: ${m.events} events, ${m.steps} steps in ${m.seconds.toFixed(2)} s wall, ${m.cpuSeconds.toFixed(2)} s CPU ` +
        `(${(m.events / m.cpuSeconds / 1e3).toFixed(0)} k events per CPU second); heap after a full GC ${m.heapBeforeMB.toFixed(1)} → ${m.heapAfterMB.toFixed(1)} MB`,
    );
  }
}
