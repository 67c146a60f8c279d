// Benchmark: what the stress layer adds to a long `simulate` run. The same
// profile (a shuttle that power-cycles every 20 minutes with a monthly fault burst, real
// series-resistor model, a pulse-energy table and a Coffin-Manson model on the resistor) is
// simulated without and with ProfileStress fed from the visitor, as the CLI feeds it. Prints
// events, CPU time of both and the heap after a full GC; figures are read by people, never asserted.
import { ProfileStress, defaultCircuitModels, loadProfile, simulateProfile } from "../../src/internal.js";
import { shuttleProfileText } from "./shuttleProfile.js";

function profileText(months: number): string {
  return shuttleProfileText(
    months,
    "    ratings: { pulseEnergy: [{ duration: 1 ms, energy: 5 J }, { duration: 10 s, energy: 500 J }] }\n" +
      "    lifetime: { model: coffin-manson, referenceCycles: 100000, referenceRange: 50 K, exponent: 4 }\n",
  );
}

function cpuOf(work: () => void): number {
  const start = process.cpuUsage();
  work();
  const cpu = process.cpuUsage(start);
  return (cpu.user + cpu.system) / 1e6;
}

export async function run(print: (line: string) => void): Promise<void> {
  const gc = (globalThis as { gc?: () => void }).gc;
  for (const months of [1, 1, 6]) {
    const profile = loadProfile(profileText(months), "bench.yaml");
    let events = 0;
    const plain = cpuOf(() => {
      events = simulateProfile(profile, { models: defaultCircuitModels }).eventCount;
    });
    gc?.();
    const heapBefore = process.memoryUsage().heapUsed;
    let cycles = 0;
    const withStress = cpuOf(() => {
      const stress = new ProfileStress(profile);
      const result = simulateProfile(profile, {
        models: defaultCircuitModels,
        wantSamples: stress.wantsSamples,
        onEvent: (event) => stress.addEvent(event),
        onPoint: (timeS, temperatureC, kind, eventIndex) => stress.addPoint(timeS, temperatureC, kind, eventIndex),
      });
      cycles = stress.finish(result.endTimeS).parts[0]!.report.cycleSummary.fullCycles;
    });
    gc?.();
    const heapAfter = process.memoryUsage().heapUsed;
    print(
      `${months} months: ${events} events; ${plain.toFixed(2)} s CPU without the stress layer, ${withStress.toFixed(2)} s with it ` +
        `(${cycles} cycles counted); heap after a full GC ${(heapBefore / 2 ** 20).toFixed(1)} → ${(heapAfter / 2 ** 20).toFixed(1)} MB`,
    );
  }
}
