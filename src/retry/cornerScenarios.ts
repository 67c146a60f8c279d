import { describeFound, inputError } from "../errors/InputError.js";
import type { RetryScenario } from "./RetryScenario.js";

/** One corner of a corner set: a name and the parameters it changes from the nominal values (SI). */
export interface CornerSpec {
  readonly name: string;
  readonly values: Readonly<Record<string, number>>;
}

/**
 * Build one scenario per corner from nominal parameter values and a builder, so that a corner may
 * only change parameters the scenario has (bus voltage, ambient, capacitance, resistance, ...).
 * With no corners, the nominal values form the single corner "nominal".
 * Cost O(corners × parameters + corners × cost of the builder).
 * @param nominal every parameter the builder reads, with its nominal value
 * @param corners the corner set
 * @param build makes the scenario for a full parameter set and a corner name
 * @throws InputError `bad-profile` naming the field for an unknown parameter, a non-finite value,
 *   a missing or repeated name
 * @example
 * const scenario = {
 *   name: "short", model: fosterToModal({ kind: "foster", stages: [{ rKPerW: 0.5, tauS: 2 }] }),
 *   ambientC: 40, limitC: 150, marginK: 20, initialVoltageV: 0,
 *   attempt: () => ({ trace: [constantPowerSegment(0, 0.5, 400)], durationS: 0.5, endVoltageV: 0 }),
 *   discharge: () => 0,
 * };
 * const build = (p, name) => ({ ...scenario, name, ambientC: p.ambient });
 * cornerScenarios({ ambient: 40 }, [{ name: "hot", values: { ambient: 60 } }], build).map((s) => s.ambientC) // => [60]
 */
export function cornerScenarios(
  nominal: Readonly<Record<string, number>>,
  corners: readonly CornerSpec[],
  build: (parameters: Readonly<Record<string, number>>, name: string) => RetryScenario,
  field = "corners",
): RetryScenario[] {
  const known = Object.keys(nominal);
  if (corners.length === 0) return [build({ ...nominal }, "nominal")];
  const names = new Set<string>();
  return corners.map((corner, i) => {
    if (typeof corner.name !== "string" || corner.name.trim() === "") throw inputError("bad-profile", `${field}[${i}].name`, "a corner name", describeFound(corner.name));
    if (names.has(corner.name)) throw inputError("bad-profile", `${field}[${i}].name`, "a corner name used once", describeFound(corner.name));
    names.add(corner.name);
    const parameters: Record<string, number> = { ...nominal };
    for (const [key, value] of Object.entries(corner.values)) {
      if (!known.includes(key)) throw inputError("bad-profile", `${field}[${i}].${key}`, `one of the corner parameters ${known.join(", ")}`, describeFound(key));
      if (!Number.isFinite(value)) throw inputError("bad-profile", `${field}[${i}].${key}`, "a finite number", describeFound(value));
      parameters[key] = value;
    }
    return build(parameters, corner.name);
  });
}
