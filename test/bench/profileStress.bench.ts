// Benchmark (issue 5 wiring): what the stress layer adds to a long `simulate` run. The same
// profile (a shuttle that power-cycles every 20 minutes with a monthly fault burst, real
// series-resistor model, a pulse-energy table and a Coffin-Manson model on the resistor) is
// simulated without and with ProfileStress fed from the visitor, as the CLI feeds it. Prints
// events, CPU time of both and the heap after a full GC; figures are read by people, never asserted.
import { ProfileStress, defaultCircuitModels, loadProfile, simulateProfile } from "../../src/index.js";

function profileText(months: number): string {
  return `name: bench, power-ups every 20 minutes for ${months} months with monthly fault bursts
ambient: 40 degC
parts:
  - id: r
    role: resistor
    network: { form: foster, stages: [{ r: 0.3 K/W, tau: 30 ms }, { r: 1 K/W, tau: 2 s }, { r: 2 K/W, tau: 60 s }, { r: 1.5 K/W, tau: 900 s }] }
    limits: { maxTemperature: 200 degC }
    ratings: { pulseEnergy: [{ duration: 1 ms, energy: 5 J }, { duration: 10 s, energy: 500 J }] }
    lifetime: { model: coffin-manson, referenceCycles: 100000, referenceRange: 50 K, exponent: 4 }
circuit:
  topology: series-resistor
  busVoltage: 48 V
  capacitance: 3.3 mF
  resistance: 22 ohm
  completion: { fraction: 0.92, timeout: 600 ms }
  discharge: { kind: bleeder, resistance: 4.7 kohm }
events:
  - repeat:
      count: ${months}
      period: 30 day
      events:
        - repeat:
            count: ${29 * 72}
            period: 20 min
            events:
              - power-up: {}
              - run: 15 min
              - power-down: {}
        - retry: { attempts: 5, interval: 2 s, backoff: 2, fault: { type: shorted-output }, faultyAttempts: 3, lockout: 5 min }
        - run: 8 h
        - power-down: {}
`;
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
