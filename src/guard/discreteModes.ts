import { describeFound, inputError } from "../errors/InputError.js";
import type { ModalModel } from "../thermal/ModalModel.js";

/**
 * One observed node of a modal model at the firmware tick: per mode m the decay over one tick and,
 * per heat source s, two input gains for the energy E deposited at that source during a tick.
 * The firmware state is the node's rise per mode, z_m = Σ_s gain[o][s][m]·y[s][m] [K].
 */
export interface DiscreteModes {
  /** the tick Ts [s] */
  readonly tickS: number;
  /** time constant per mode [s] */
  readonly tauS: readonly number[];
  /** a_m = e^(−Ts/τ_m) */
  readonly decay: readonly number[];
  /**
   * zero-order-hold gain [K/J], indexed [source][mode]: g·(1 − a_m)/Ts, the tick-end change of z_m
   * when E is spread evenly over the tick (mean power E/Ts held)
   */
  readonly zohGainKPerJ: readonly (readonly number[])[];
  /**
   * the guard's gain [K/J], indexed [source][mode]: the largest tick-end change of z_m per joule,
   * wherever in the tick the energy lands: g/τ_m for g ≥ 0 (all of it at the tick's end), g·a_m/τ_m
   * for g < 0 (all of it at the tick's start)
   */
  readonly boundGainKPerJ: readonly (readonly number[])[];
}

/**
 * Discretise observed node `o` of a modal model at the tick Ts.
 *
 * Each mode follows dy/dt = (P − y)/τ, so its rise share z = g·y follows the same equation with
 * input g·P. Over one tick, z(k+1) = a·z(k) + (g/τ)·∫0^Ts e^(−(Ts − θ)/τ)·P(θ) dθ with
 * a = e^(−Ts/τ). With P held at E/Ts (zero-order hold) the integral gives the ZOH gain
 * g·(1 − a)/Ts per joule, exact for power constant over each tick. The firmware only knows the
 * tick's energy, not where in the tick it fell: the kernel e^(−(Ts − θ)/τ) lies between a and 1,
 * so for P ≥ 0 the integral lies between a·E and E, and g/τ (g ≥ 0) or g·a/τ (g < 0) per joule
 * bounds the tick-end change from above wherever the energy lands. With that gain the firmware's
 * per-mode states never fall below the exact ones at tick instants (induction: a > 0).
 * Source: the zero-order-hold equivalent Φ = e^(F·T), Γ = ∫0^T e^(F·η) dη·G of a continuous
 * state-space model (Franklin, Powell & Workman, Digital Control of Dynamic Systems, 3rd ed.
 * (1998), §4.3.3, section from memory); the bound is the mean-value argument above.
 * Cost O(sources × modes). Valid for any Ts > 0 (1 − a is computed with expm1).
 * @throws InputError `out-of-range` for a tick that is not finite and > 0
 */
export function discreteModes(model: ModalModel, o: number, tickS: number, field = "--tick"): DiscreteModes {
  if (!(tickS > 0) || !Number.isFinite(tickS)) throw inputError("out-of-range", field, "a finite tick > 0 s", describeFound(tickS));
  const decay = model.tauS.map((tau) => Math.exp(-tickS / tau));
  const oneMinus = model.tauS.map((tau) => -Math.expm1(-tickS / tau));
  const row = model.gainKPerW[o]!;
  const zohGainKPerJ = row.map((gains) => gains.map((g, m) => (g * oneMinus[m]!) / tickS));
  const boundGainKPerJ = row.map((gains) => gains.map((g, m) => (g >= 0 ? g / model.tauS[m]! : (g * decay[m]!) / model.tauS[m]!)));
  return { tickS, tauS: [...model.tauS], decay, zohGainKPerJ, boundGainKPerJ };
}
