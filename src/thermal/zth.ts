import type { ModalModel } from "./ModalModel.js";

/**
 * Transient thermal impedance: the rise at observed node o per watt of a power step at source s,
 *   Zth(t) = Σ_m gain[o][s][m] · (1 − e^(−t/tau_m))   [K/W].
 * Evaluated with expm1 so that Zth(t) for t ≪ tau keeps full relative precision.
 * Source: JEDEC JESD51-1 (1995), transient dual interface / Zth definition; Foster form of the
 * network step response.
 * Cost O(modes).
 * @param t time since the step [s], ≥ 0
 * @example
 * const model = fosterToModal({ kind: "foster", stages: [{ rKPerW: 0.5, tauS: 0.01 }] });
 * zth(model, 0.01) // => 0.3161
 */
export function zth(model: ModalModel, t: number, o = 0, s = 0): number {
  const gains = model.gainKPerW[o]![s]!;
  let sum = 0;
  for (let m = 0; m < gains.length; m++) sum += gains[m]! * -Math.expm1(-t / model.tauS[m]!);
  return sum;
}

/**
 * n log-spaced times from fromS to toS inclusive [s].
 * @example
 * logSpacedTimes(0.001, 1, 4) // => [0.001, 0.01, 0.1, 1]
 */
export function logSpacedTimes(fromS: number, toS: number, n: number): number[] {
  if (n === 1) return [fromS];
  const a = Math.log(fromS);
  const b = Math.log(toS);
  return Array.from({ length: n }, (_, i) => Math.exp(a + ((b - a) * i) / (n - 1)));
}
