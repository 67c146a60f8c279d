import { InputError } from "../errors/InputError.js";

/** Where a circuit model's complaint about its `load.*` values is first put: the circuit's own load. */
export const CIRCUIT_LOAD_FIELD = "circuit.load";

/** The profile key of each `BusLoad` value a circuit model may name (`load.disableV` was written `disableAt`). */
const PROFILE_LOAD_KEYS: Readonly<Record<string, string>> = {
  resistanceOhm: "resistance",
  currentA: "current",
  powerW: "power",
  enableV: "enableAt",
  disableV: "disableAt",
};

/**
 * The profile key path of a circuit model's load field: `load.disableV` -> `circuit.load.disableAt`.
 * @param modelField the field the circuit model named, starting with `load`
 * @returns the path under {@link CIRCUIT_LOAD_FIELD}, or undefined when the field is not about the load
 */
export function circuitLoadField(modelField: string): string | undefined {
  if (modelField === "load") return CIRCUIT_LOAD_FIELD;
  if (!modelField.startsWith("load.")) return undefined;
  const key = modelField.slice("load.".length);
  return `${CIRCUIT_LOAD_FIELD}.${PROFILE_LOAD_KEYS[key] ?? key}`;
}

/**
 * Move a circuit model's complaint about the load to the key where that load was written: a
 * fault's or a power-up's own load (`events[2].fault.disableAt`) instead of the circuit's. The
 * problems under {@link CIRCUIT_LOAD_FIELD} get `loadField` as their prefix; every other problem,
 * and any error that is not an InputError, is returned as it was.
 * @param error what the circuit model threw
 * @param loadField the profile path of the load's keys; undefined: the circuit's own load (no change)
 */
export function loadProblemsAt(error: unknown, loadField: string | undefined): unknown {
  if (!(error instanceof InputError) || loadField === undefined || loadField === CIRCUIT_LOAD_FIELD) return error;
  const moved = (field: string): string =>
    field === CIRCUIT_LOAD_FIELD ? loadField : field.startsWith(`${CIRCUIT_LOAD_FIELD}.`) ? `${loadField}${field.slice(CIRCUIT_LOAD_FIELD.length)}` : field;
  return new InputError(error.problems.map((p) => ({ ...p, field: moved(p.field) })));
}
