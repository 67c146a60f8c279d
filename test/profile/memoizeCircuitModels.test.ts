import { describe, expect, test } from "vitest";
import { type ChargeConditions, type ProfileCircuit, memoizeCircuitModels } from "../../src/internal.js";
import { fakeModels } from "./fakeCircuit.js";

// The memo must be exact: a repeat with the very same inputs reuses the first result; any input
// that differs (even in the last bit of the initial voltage) solves the circuit again.
const circuit: ProfileCircuit = {
  topology: "series-resistor",
  resistanceOhm: 10,
  busVoltageV: 48,
  capacitanceF: 1e-3,
  load: { kind: "none" },
  completion: { fraction: 0.95, timeoutS: 1 },
  discharge: { kind: "none" },
};
const at = (initialVoltageV: number): ChargeConditions => ({ sourceVoltageV: 48, initialVoltageV, completion: circuit.completion });

describe("memoizeCircuitModels", () => {
  test("reuses a result only for identical inputs", () => {
    const log = { initialV: [] as number[] };
    const memo = memoizeCircuitModels(fakeModels(log));
    const first = memo.charge(circuit, circuit.load, at(0));
    expect(memo.charge(circuit, circuit.load, at(0))).toBe(first);
    expect(log.initialV).toEqual([0]);
    memo.charge(circuit, circuit.load, at(Number.MIN_VALUE));
    memo.charge(circuit, { kind: "short" }, at(0));
    expect(log.initialV).toEqual([0, Number.MIN_VALUE, 0]);
  });

  test("the call before and older calls both hit; a different completion rule object does not", () => {
    // two lookups: the call before is compared field by field, older ones by their key
    const log = { initialV: [] as number[] };
    const memo = memoizeCircuitModels(fakeModels(log));
    const a = memo.charge(circuit, circuit.load, at(0));
    const b = memo.charge(circuit, circuit.load, at(12));
    expect(memo.charge(circuit, circuit.load, at(0))).toBe(a);
    expect(memo.charge(circuit, circuit.load, at(12))).toBe(b);
    expect(memo.charge(circuit, circuit.load, at(12))).toBe(b);
    expect(log.initialV).toEqual([0, 12]);
    memo.charge(circuit, circuit.load, { ...at(12), completion: { ...circuit.completion } });
    expect(log.initialV).toEqual([0, 12, 12]);
  });

  test("forgets everything when the circuit changes", () => {
    const log = { initialV: [] as number[] };
    const memo = memoizeCircuitModels(fakeModels(log));
    memo.charge(circuit, circuit.load, at(0));
    memo.charge({ ...circuit }, circuit.load, at(0));
    expect(log.initialV).toEqual([0, 0]);
  });
});
