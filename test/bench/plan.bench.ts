// Planner speed figures: a 50 × 50 lockout map (target < 1 s) and the fastest safe
// schedule of 100 attempts (target < 200 ms). Printed, never asserted (`npm run bench`).
import { fastestSchedule, fosterToModal, lockoutMap, scanGrid } from "../../src/internal.js";
import { chargeThenTrip, rectangularFault } from "../retry/scenarios.js";

function time<T>(work: () => T): { ms: number; result: T } {
  const t0 = performance.now();
  const result = work();
  return { ms: performance.now() - t0, result };
}

export async function run(print: (line: string) => void): Promise<void> {
  // Invented part: resistor on two Foster stages, a short-circuit fault dissipating 200 W for 0.2 s.
  const model = fosterToModal({ kind: "foster", stages: [{ rKPerW: 0.5, tauS: 2 }, { rKPerW: 3, tauS: 60 }] });
  const fault = rectangularFault("short", model, 200, 0.2, { ambientC: 40, limitC: 155, marginK: 10 });
  const trip = chargeThenTrip("trip", model, { sourceV: 400, resistanceOhm: 20, capacitanceF: 1e-3, fraction: 0.95, tripS: 0.02, bleedS: 0.05 }, { ambientC: 40, limitC: 155, marginK: 10 });
  const intervals = scanGrid(0.2, 60, 50, 2.5).slice(-50);
  for (const [label, corner, spacing] of [
    ["rectangular fault", fault, "start-to-start"],
    ["charge then trip (exponential power)", trip, "end-to-start"],
  ] as const) {
    const cold = time(() => lockoutMap([corner], 50, intervals, spacing));
    const warm = time(() => lockoutMap([corner], 50, intervals, spacing));
    print(`lockout map 50 x 50, ${label}: ${cold.ms.toFixed(0)} ms first run, ${warm.ms.toFixed(0)} ms second (target < 1000 ms)`);
  }
  const cold = time(() => fastestSchedule([fault], 100));
  const warm = time(() => fastestSchedule([fault], 100));
  print(`fastest schedule, 100 attempts, rectangular fault: ${cold.ms.toFixed(0)} ms first run, ${warm.ms.toFixed(0)} ms second (target < 200 ms); ${warm.result.schedule.length} attempts, burst ends at ${warm.result.burstEndS.toFixed(2)} s`);
}
