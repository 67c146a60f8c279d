// Electro-thermal coupling: one charging event solved together with its parts' modal thermal
// states (runCoupledChargeEvent), against the same event with the threshold frozen (exact path).
// Target: a coupled event in under 2 ms; a profile of 10,000 coupled charges (the bundled 800 V
// threshold-drift inverter, power-up and power-down repeated) simulated in under 5 s.
// Figures are printed for people to read, never asserted. The machine is shared: CPU time (least
// of the rounds) is printed beside the wall time, with the load average at the end.
import { readFileSync } from "node:fs";
import { loadavg } from "node:os";
import { join } from "node:path";
import { type ChargeThermalContext, chargeLinearMosfet, defaultCircuitModels, loadProfile, simulateProfile } from "../../src/internal.js";
import { projectRoot } from "./projectRoot.js";

/** The bundled threshold-drift profile with its events replaced by `charges` power-up / power-down pairs. */
function coupledProfile(charges: number): ReturnType<typeof loadProfile> {
  const dir = join(projectRoot, "profiles");
  const text = readFileSync(join(dir, "string-inverter-800v-threshold-drift.yaml"), "utf8");
  const events = `events:\n  - repeat:\n      count: ${charges}\n      events:\n        - power-up: {}\n        - run: 2 min\n        - power-down: { off: 3 min }\n`;
  return loadProfile(`${text.slice(0, text.indexOf("\nevents:"))}\n${events}`, "bench.yaml", (path) => readFileSync(join(dir, path), "utf8"));
}

/** CPU time of the process since `start` [ms]. */
function cpuMs(start: NodeJS.CpuUsage): number {
  const used = process.cpuUsage(start);
  return (used.user + used.system) / 1000;
}

function time(label: string, repeats: number, fn: () => { traces: Readonly<Record<string, readonly unknown[]>> }, print: (line: string) => void): void {
  fn(); // warm-up (JIT)
  let best = Infinity;
  let bestCpu = Infinity;
  let segments = 0;
  for (let round = 0; round < 5; round++) {
    const start = performance.now();
    const cpu = process.cpuUsage();
    for (let i = 0; i < repeats; i++) segments = Object.values(fn().traces).reduce((n, t) => n + t.length, 0);
    bestCpu = Math.min(bestCpu, cpuMs(cpu) / repeats);
    best = Math.min(best, (performance.now() - start) / repeats);
  }
  const show = (ms: number) => (ms < 1 ? `${(ms * 1000).toFixed(1)} µs` : `${ms.toFixed(2)} ms`);
  print(`${label}: ${show(bestCpu)} CPU, ${show(best)} wall per event (least of 5 rounds), ${segments} trace segments`);
}

export async function run(print: (line: string) => void): Promise<void> {
  // the invented home-storage MOSFET: die 0.45 K/W with 5.4 ms, heatsink path 0.5 K/W with 2 s
  const thermal: ChargeThermalContext = { roles: ["mosfet"], ambientC: [40], tauS: [0.0054, 2], gainKPerW: [[[0.45, 0.5]]], startRiseK: [[0, 0]] };
  const params = { capacitanceF: 1.5e-3, gateVoltageV: 4.6, thresholdVoltageV: 3.5, sourceResistorOhm: 2.2, rdsOnOhm: 0.12, thresholdTempcoVPerK: -0.006 };
  const cond = { sourceVoltageV: 400, initialVoltageV: 0, completion: { withinV: 10, timeoutS: 3 } };
  time("linear MOSFET, -6 mV/K, frozen threshold (exact)", 20000, () => chargeLinearMosfet(params, cond), print);
  time("linear MOSFET, -6 mV/K, coupled with 2 modes (target < 2 ms)", 50, () => chargeLinearMosfet(params, { ...cond, thermal }), print);

  // BENCH_COUPLED_ROUNDS rounds (default 3), each with a fresh circuit memo as in a real run
  const profile = coupledProfile(Number(process.env["BENCH_COUPLED_CHARGES"] ?? 10_000));
  const rounds = Number(process.env["BENCH_COUPLED_ROUNDS"] ?? 3);
  let best = Infinity;
  let bestCpu = Infinity;
  let result: ReturnType<typeof simulateProfile> | undefined;
  for (let round = 0; round < rounds; round++) {
    const start = performance.now();
    const cpu = process.cpuUsage();
    result = simulateProfile(profile, { models: defaultCircuitModels });
    bestCpu = Math.min(bestCpu, cpuMs(cpu) / 1000);
    best = Math.min(best, (performance.now() - start) / 1000);
  }
  const charges = result!.outcomes.completed + result!.outcomes["timed-out"] + result!.outcomes.tripped;
  print(
    `profile of ${charges} coupled charges (${result!.eventCount} events, ${result!.stepCount} steps): ${bestCpu.toFixed(2)} s CPU, ${best.toFixed(2)} s wall ` +
      `(least of ${rounds}; ${((bestCpu / charges) * 1000).toFixed(3)} ms CPU per charge; target < 5 s)`,
  );
  print(`load average (1, 5, 15 min): ${loadavg().map((x) => x.toFixed(1)).join(", ")}`);
}
