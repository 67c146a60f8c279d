import type { ChargeThermalContext } from "../circuits/ChargeThermalContext.js";
import type { ModalModel } from "../thermal/ModalModel.js";
import type { ModalState } from "../thermal/modalStep.js";
import type { ProfilePart } from "./DutyProfile.js";

/**
 * Build the thermal context of a charge from the profile's combined modal model: the parts with a
 * circuit role (the ones a charge heats), the modes at least one of them sees (the others are
 * dropped, so separate networks cost nothing), their gains to each other, and, for each state
 * handed in, every coupled part's rise per mode, Σ_s gain[i][s][m]·y[s][m] over all sources
 * (a part heated only by power traces still warms a shared network).
 * Source: modal superposition (docs/engine.md, "The modal form").
 * Cost O(parts² × modes) once; O(coupled parts × parts × modes) per state.
 */
export function thermalContextSource(parts: readonly ProfilePart[], model: ModalModel): (state: ModalState) => ChargeThermalContext {
  const coupled = parts.flatMap((p, i) => (p.role === undefined ? [] : [i]));
  const M = model.tauS.length;
  const modes = model.tauS.flatMap((_, m) => (coupled.some((i) => model.gainKPerW[i]!.some((row) => row[m] !== 0)) ? [m] : []));
  const tauS = modes.map((m) => model.tauS[m]!);
  const gainKPerW = coupled.map((i) => coupled.map((j) => modes.map((m) => model.gainKPerW[i]![j]![m]!)));
  const roles = coupled.map((i) => parts[i]!.role!);
  const ambientC = coupled.map((i) => parts[i]!.ambientC);
  const sources = model.sources.length;
  return (state) => ({
    roles,
    ambientC,
    tauS,
    gainKPerW,
    startRiseK: coupled.map((i) =>
      modes.map((m) => {
        let sum = 0;
        for (let s = 0; s < sources; s++) sum += model.gainKPerW[i]![s]![m]! * state[s * M + m]!;
        return sum;
      }),
    ),
  });
}
