// A test double for the circuit models: outcomes are decided by the load (a short never charges;
// anything else completes) so the expansion logic can be checked against hand-counted schedules.
// Powers are constant (an invented 100 W for the attempt) — the physics lives in src/circuits and
// is checked there; here only counts, times and carried voltages matter.
import type { CircuitModels } from "../../src/internal.js";

export const FAKE_COMPLETE_S = 0.2;
export const FAKE_POWER_W = 100;

export function fakeModels(log: { initialV: number[] } = { initialV: [] }): CircuitModels {
  return {
    charge: (circuit, load, conditions) => {
      log.initialV.push(conditions.initialVoltageV);
      const fails = load.kind === "short";
      const durationS = fails ? conditions.completion.timeoutS : FAKE_COMPLETE_S;
      const role = circuit.topology === "series-resistor" ? "resistor" : circuit.topology === "converter" ? "switch" : "mosfet";
      return {
        outcome: fails ? "timed-out" : "completed",
        busStalled: fails,
        reason: fails ? "timeout" : "charged",
        durationS,
        endVoltageV: fails ? 0 : conditions.sourceVoltageV,
        traces: { [role]: [{ startS: 0, durationS, terms: [{ a: FAKE_POWER_W, b: 0, lambda: 0 }] }] },
        energy: { sourceJ: 0, storedJ: 0, loadJ: 0, partsJ: {} },
      };
    },
    // exponential bleed with a 10 s time constant, whatever the path: enough to see voltage carried
    discharge: (_path, _c, v, t) => v * Math.exp(-t / 10),
  };
}
