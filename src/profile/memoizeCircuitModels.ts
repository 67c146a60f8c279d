import type { CircuitResult } from "../circuits/CircuitResult.js";
import type { CircuitModels } from "./CircuitModels.js";
import { circuitReadsTemperature } from "./circuitReadsTemperature.js";

/** How many distinct charge events a memo keeps, declared once. */
export const CIRCUIT_MEMO_SIZE = 64;

/**
 * Wrap circuit models so that a charge repeated with exactly the same inputs (same circuit, load,
 * initial voltage to the last bit, completion rule and, for temperature-dependent models, the same
 * part temperatures) reuses the first result instead of solving the circuit again. Long profiles
 * repeat the same power-up from an empty capacitor thousands of times; the results are immutable,
 * so sharing them is exact. Discharges are cheap closed forms and pass through.
 * Cost O(1) per hit (the call before is compared field by field; else a short string key: object
 * ids of load and completion rule, the voltages and, when the model reads them, the part
 * temperatures); memory O(CIRCUIT_MEMO_SIZE) results.
 */
export function memoizeCircuitModels(models: CircuitModels, size = CIRCUIT_MEMO_SIZE): CircuitModels {
  const memo = new Map<string, CircuitResult>();
  let lastCircuit: unknown;
  // loads and completion rules are the profile's own objects, reused event after event: an id
  // per object makes the key cheap; an unseen object gets a fresh id (never a false hit)
  const ids = new WeakMap<object, number>();
  let nextId = 0;
  const idOf = (o: object): number => {
    let id = ids.get(o);
    if (id === undefined) {
      id = nextId++;
      ids.set(o, id);
    }
    return id;
  };
  // the call before, checked first without building a key: a long profile mostly repeats it
  let last: { load: unknown; sourceV: number; initialV: number; completion: unknown; wantSamples: boolean; result: CircuitResult } | undefined;
  return {
    discharge: models.discharge,
    charge: (circuit, load, conditions) => {
      if (circuit !== lastCircuit) {
        memo.clear();
        last = undefined;
        lastCircuit = circuit;
      }
      const readsTemperature = circuitReadsTemperature(circuit);
      const wantSamples = conditions.wantSamples === true;
      if (
        !readsTemperature &&
        last !== undefined &&
        last.load === load &&
        last.sourceV === conditions.sourceVoltageV &&
        last.initialV === conditions.initialVoltageV &&
        last.completion === conditions.completion &&
        last.wantSamples === wantSamples
      )
        return last.result;
      const result = keyed(circuit, load, conditions, readsTemperature);
      last = readsTemperature ? undefined : { load, sourceV: conditions.sourceVoltageV, initialV: conditions.initialVoltageV, completion: conditions.completion, wantSamples, result };
      return result;
    },
  };

  function keyed(circuit: ChargeArgs[0], load: ChargeArgs[1], conditions: ChargeArgs[2], readsTemperature: boolean): CircuitResult {
    const key = `${idOf(load)}|${conditions.sourceVoltageV}|${conditions.initialVoltageV}|${idOf(conditions.completion)}|${
      readsTemperature ? JSON.stringify([conditions.partTemperatureC ?? {}, conditions.thermal?.startRiseK ?? []]) : ""
    }|${conditions.wantSamples === true}`;
    const hit = memo.get(key);
    if (hit !== undefined) return hit;
    const result = models.charge(circuit, load, conditions);
    if (memo.size >= size) memo.delete(memo.keys().next().value!);
    memo.set(key, result);
    return result;
  }
}

type ChargeArgs = Parameters<CircuitModels["charge"]>;
