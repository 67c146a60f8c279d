import type { ModalModel } from "../thermal/ModalModel.js";

/**
 * The heat capacity a part's own power meets first: the C with which its temperature starts to
 * rise under a power step, Zth(t) ≈ t/C for t much shorter than every time constant, so
 *   C_first = 1 / Σ_m (gain_m / tau_m)   [J/K]
 * over the modes from the part's source to its observed node. For a Cauer ladder or a lumped
 * element heated and observed at its first node this is exactly its first capacity C1; for a
 * Foster network it is 1/Σ(R_i/tau_i). It is also the capacity of the adiabatic bound: a pulse of
 * energy E raises the part by at most E/C_first, since dZth/dt = Σ (R_m/tau_m)·e^(−t/tau_m) ≤ 1/C_first.
 * Scaling the network's capacities by k scales C_first by k.
 * Source: initial slope of the step response of a first-order-sum (Foster) impedance,
 * Z(t) = Σ R_m·(1 − e^(−t/tau_m)); the initial rate of a heated lump, dT/dt = q/(ρVc), is that of
 * Incropera et al., Fundamentals of Heat and Mass Transfer, 7th ed. (2011), §5.1 and §5.3 (lumped
 * capacitance).
 * Validity: gains of the part's own source to its own node are ≥ 0 (always so for a passive network).
 * Cost O(modes).
 * @returns Infinity when the part has no mode from its source to its node (it never heats)
 */
export function sizeShortTimeCapacity(model: ModalModel, observedIndex: number, sourceIndex: number): number {
  let slope = 0;
  model.gainKPerW[observedIndex]![sourceIndex]!.forEach((g, m) => (slope += g / model.tauS[m]!));
  return slope > 0 ? 1 / slope : Infinity;
}
