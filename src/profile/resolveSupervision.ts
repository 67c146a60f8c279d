import type { BusLoad } from "../circuits/BusLoad.js";
import { describeFound } from "../errors/InputError.js";
import { type FieldReader, join } from "../format/FieldReader.js";
import type { ProfileCircuit, SupervisionSpec } from "./DutyProfile.js";
import type { LoadInput, SupervisionInput } from "./profileSchema.js";

/**
 * Resolve a profile's `supervision` section (already validated field by field by the schema)
 * against its circuit: ranges left out take the circuit's value, every check time must come
 * before the circuit's pre-charge timeout (a check after the timeout never runs), and a healthy
 * load may not be a short (the short is the fault the checks look for). Problems go to the
 * reader, so they are reported with every other problem of the profile.
 * Source: profile keys of our own (README, "Reading the supervision answers").
 * Cost O(check times + loads).
 * @param resolveLoad turns a load mapping into a BusLoad (the profile loader's own rules), or undefined after recording a problem
 * @returns the resolved section, or undefined when a problem was recorded
 */
export function resolveSupervision(
  reader: FieldReader,
  input: SupervisionInput,
  field: string,
  circuit: ProfileCircuit | undefined,
  resolveLoad: (load: LoadInput, field: string, busVoltageV: number) => BusLoad | undefined,
): SupervisionSpec | undefined {
  if (circuit === undefined) {
    reader.fail("bad-profile", field, "a `circuit` section (the supervision answers are about its pre-charge)", "a profile without one");
    return undefined;
  }
  let ok = true;
  const corners = input.corners;
  const busVoltageV = corners.busVoltage ?? { low: circuit.busVoltageV, high: circuit.busVoltageV };
  const loads: BusLoad[] = [];
  if (corners.loads === undefined) loads.push(circuit.load);
  else {
    corners.loads.forEach((l, i) => {
      const at = join(join(join(field, "corners"), "loads"), i);
      if (l.kind === "short") {
        reader.fail("bad-profile", join(at, "kind"), "a load a healthy system can have (a short is the fault the checks detect)", describeFound(l.kind));
        ok = false;
        return;
      }
      const load = resolveLoad(l, at, busVoltageV.low);
      if (load === undefined) ok = false;
      else loads.push(load);
    });
  }
  if (corners.loads === undefined && circuit.load.kind === "short") {
    reader.fail("bad-profile", join(join(field, "corners"), "loads"), "the healthy loads (the circuit's own load is a short)", "nothing");
    ok = false;
  }
  const timeoutS = circuit.completion.timeoutS;
  const times = (list: readonly number[] | undefined, key: string): number[] | undefined => {
    if (list === undefined) return undefined;
    list.forEach((t, i) => {
      if (!(t < timeoutS)) {
        reader.fail("out-of-range", join(join(field, key), i), `a check time before the pre-charge timeout (circuit.completion.timeout = ${timeoutS} s)`, `${t} s`);
        ok = false;
      }
    });
    return [...list].sort((a, b) => a - b);
  };
  const checkTimesS = times(input.checkTimes, "checkTimes");
  const riseCheckTimesS = times(input.riseCheckTimes, "riseCheckTimes");
  if (!ok) return undefined;
  return {
    capacitanceF: corners.capacitance,
    busVoltageV,
    ...(corners.completionFraction === undefined ? {} : { completionFraction: corners.completionFraction }),
    loads,
    startVoltageV: input.startVoltage ?? 0,
    ...(checkTimesS === undefined ? {} : { checkTimesS }),
    ...(riseCheckTimesS === undefined ? {} : { riseCheckTimesS }),
    ...(input.checkMargin === undefined ? {} : { checkMarginFraction: input.checkMargin }),
    ...(input.minCheckVoltage === undefined ? {} : { minCheckVoltageV: input.minCheckVoltage }),
  };
}
