import { inputError } from "../errors/InputError.js";
import type { DutyProfile, ProfileCircuit } from "./DutyProfile.js";

/** One corner of a profile's corner set: its name, its field for messages and the profile at it. */
export interface ProfileCorner {
  /** the corner's name as the profile gives it */
  readonly name: string;
  /** its field in the profile, `retryPlan.corners[1]` */
  readonly field: string;
  /** the profile with the corner's values in place of its own */
  readonly profile: DutyProfile;
}

/** Where a profile keeps its tolerance corner set (docs/profile-format.md). */
export const PROFILE_CORNER_FIELD = "retryPlan.corners";

/**
 * The profile at each corner of its tolerance corner set (`retryPlan.corners`, the set the retry
 * planner uses): each corner changes only what it names — the circuit's bus voltage, capacitance
 * and series resistance, and the ambient of every part — and keeps everything else, as the
 * planner's own corners do (profileRetrySetup). A profile without a corner set gives [].
 * Source: corner semantics of docs/profile-format.md ("retryPlan"). Cost O(corners × parts).
 * @throws InputError `bad-profile` at `retryPlan.corners[i].resistance` when a corner sets a
 *   resistance for a circuit without a series resistor, or at `retryPlan.corners[i]` when a corner
 *   changes the circuit of a profile that has none
 */
export function profileCorners(profile: DutyProfile): ProfileCorner[] {
  const specs = profile.retryPlan?.corners ?? [];
  return specs.map((spec, i) => {
    const field = `${PROFILE_CORNER_FIELD}[${i}]`;
    const circuit = profile.circuit;
    const touchesCircuit = spec.busVoltage !== undefined || spec.capacitance !== undefined || spec.resistance !== undefined;
    if (touchesCircuit && circuit === undefined) throw inputError("bad-profile", field, "only an ambient (the profile has no circuit to change)", "a circuit value");
    if (spec.resistance !== undefined && circuit?.topology !== "series-resistor")
      throw inputError("bad-profile", `${field}.resistance`, "no resistance: it applies to series-resistor circuits only", `a ${circuit?.topology ?? "missing"} circuit`);
    const changed: ProfileCircuit | undefined =
      circuit === undefined
        ? undefined
        : ({
            ...circuit,
            ...(spec.busVoltage === undefined ? {} : { busVoltageV: spec.busVoltage }),
            ...(spec.capacitance === undefined ? {} : { capacitanceF: spec.capacitance }),
            ...(spec.resistance === undefined ? {} : { resistanceOhm: spec.resistance }),
          } as ProfileCircuit);
    const parts = spec.ambient === undefined ? profile.parts : profile.parts.map((p) => ({ ...p, ambientC: spec.ambient! }));
    const atCorner: DutyProfile = { ...profile, parts, ...(changed === undefined ? {} : { circuit: changed }) };
    return { name: spec.name, field, profile: atCorner };
  });
}
