// Benchmark: a profile that expands to about 1,000,000 events — a shuttle that power-
// cycles every 20 minutes, day after day for years, with a fault burst every month — simulated
// with the real series-resistor model, (1) as the library call simulateProfile and (2) as a user
// runs it, `heatledger simulate FILE` in a fresh process (start-up, profile loading, the stress
// layer and the text report included). Prints events, steps, time and heap before/after; the
// target (under 2 s, memory not growing with the event count) is read by people, never asserted.
import { spawnSync } from "node:child_process";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { defaultCircuitModels, loadProfile, simulateProfile } from "../../src/internal.js";
import { projectRoot } from "./projectRoot.js";
import { shuttleProfileText } from "./shuttleProfile.js";

function profileText(years: number): string {
  return shuttleProfileText(Math.round(years * 12));
}

interface Measured {
  events: number;
  steps: number;
  seconds: number;
  cpuSeconds: number;
  heapBeforeMB: number;
  heapAfterMB: number;
}

function measureOnce(years: number): Measured {
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

/** The least-CPU of `runs` runs: the machine is a shared VM, the least disturbed run is the figure. */
function measure(years: number, runs: number): Measured {
  let chosen = measureOnce(years);
  for (let r = 1; r < runs; r++) {
    const m = measureOnce(years);
    if (m.cpuSeconds < chosen.cpuSeconds) chosen = m;
  }
  return chosen;
}

export async function run(print: (line: string) => void): Promise<void> {
  measureOnce(1); // warm-up (mathjs load, JIT)
  print("(1) simulateProfile (library), least CPU of 3 runs");
  // the heap after each run, with a full GC (node --expose-gc), shows whether memory grows with events
  for (const years of [1, 5, 13.3]) {
    const m = measure(years, 3);
    print(
      `${years} years: ${m.events} events, ${m.steps} steps in ${m.seconds.toFixed(2)} s wall, ${m.cpuSeconds.toFixed(2)} s CPU ` +
        `(${(m.events / m.cpuSeconds / 1e3).toFixed(0)} k events per CPU second); heap after a full GC ${m.heapBeforeMB.toFixed(1)} → ${m.heapAfterMB.toFixed(1)} MB`,
    );
  }
  print("(2) `heatledger simulate FILE` in a fresh process (built CLI), least wall time of 3 runs");
  const folder = mkdtempSync(join(tmpdir(), "heatledger-bench-"));
  try {
    for (const years of [1, 13.3]) {
      const file = join(folder, `shuttle-${years}y.yaml`);
      writeFileSync(file, profileText(years));
      let bestS = Infinity;
      let status: number | null = null;
      let eventsLine = "";
      for (let r = 0; r < 3; r++) {
        const start = process.hrtime.bigint();
        const child = spawnSync(process.execPath, [join(projectRoot, "bin/heatledger.js"), "simulate", file], { encoding: "utf8" });
        bestS = Math.min(bestS, Number(process.hrtime.bigint() - start) / 1e9);
        status = child.status;
        eventsLine = child.stdout.split("\n").find((l) => l.includes(" events over ")) ?? child.stderr.trim();
      }
      print(`${years} years: ${bestS.toFixed(2)} s wall, exit ${status} (${eventsLine.replace(/^profile \S+: /, "")})`);
    }
  } finally {
    rmSync(folder, { recursive: true, force: true });
  }
}
