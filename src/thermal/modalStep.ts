import type { ModalModel } from "./ModalModel.js";
import type { PowerTerm } from "./powerTrace.js";
import { expIntegral0, expIntegral1 } from "./expIntegrals.js";

/**
 * The modal state: y[s·M + m] [W] for source s and mode m (M = number of modes), a plain vector
 * that an outer ODE integrator can also carry (electro-thermal coupling).
 */
export type ModalState = Float64Array;

/** Power on one step for each source of the model (undefined or [] = zero power). */
export type SourcePowers = readonly (readonly PowerTerm[] | undefined)[];

/** A zero modal state for a model (every node at ambient). */
export function createModalState(model: ModalModel): ModalState {
  return new Float64Array(model.sources.length * model.tauS.length);
}

/**
 * Advance every mode exactly across a step of length h under powers given as sums of terms
 * (a + b·s)·e^(−lambda·s). For one mode (dy/ds = (P − y)/tau) the closed form is, with A = h/tau,
 * B = lambda·h, d = B − A and x = |d|:
 *   y(h) = y(0)·e^(−A) + A·Σ_terms [a·J0 + b·h·J1]
 *   J0 = ∫0^1 e^(−A(1−u) − B·u) du = e^(−min(A,B))·φ0(x)
 *   J1 = ∫0^1 u·e^(−A(1−u) − B·u) du = e^(−A)·φ1(x) if d ≥ 0, else e^(−B)·(φ0(x) − φ1(x))
 * Every exponent is ≤ 0 for lambda ≥ 0, so nothing overflows, and φ0, φ1 are evaluated without
 * cancellation (expIntegrals), so the update is accurate for all mu·h = −d, including mu = 0
 * (lambda = 1/tau) and tau from microseconds to days.
 * Source: the variation-of-constants formula for a linear first-order ODE, e.g. Boyce & DiPrima,
 * Elementary Differential Equations, 10th ed. (2012), §2.1; exponential integrator form as in
 * Hochbruck & Ostermann, Acta Numerica 19 (2010), §2.
 * Cost O(sources × modes × terms); no time step, no accumulated drift.
 * @param model the modal model
 * @param state the state at the start of the step (not modified unless out === state)
 * @param h step length [s], ≥ 0 and finite
 * @param powers power terms per source
 * @param out where to write the state at the end (may be state itself)
 */
export function advanceModalState(model: ModalModel, state: ModalState, h: number, powers: SourcePowers, out: ModalState = state): ModalState {
  const modes = model.tauS.length;
  for (let m = 0; m < modes; m++) {
    const A = h / model.tauS[m]!;
    const decay = Math.exp(-A);
    for (let s = 0; s < model.sources.length; s++) {
      const k = s * modes + m;
      out[k] = state[k]! * decay + forcedResponse(A, decay, h, powers[s]);
    }
  }
  return out;
}

/** A·Σ[a·J0 + b·h·J1] for one mode (see advanceModalState). */
function forcedResponse(A: number, decay: number, h: number, terms: readonly PowerTerm[] | undefined): number {
  if (terms === undefined || terms.length === 0) return 0;
  let sum = 0;
  for (const t of terms) {
    if (t.lambda === 0 && t.b === 0) {
      sum += t.a * -Math.expm1(-A);
      continue;
    }
    const B = t.lambda * h;
    const d = B - A;
    const x = Math.abs(d);
    const p0 = expIntegral0(x);
    const J0 = (d >= 0 ? decay : Math.exp(-B)) * p0;
    let bPart = 0;
    if (t.b !== 0) {
      const J1 = d >= 0 ? decay * expIntegral1(x) : Math.exp(-B) * (p0 - expIntegral1(x));
      bPart = t.b * h * J1;
    }
    sum += A * (t.a * J0 + bPart);
  }
  return sum;
}

/** Number of step lengths whose decay factors {@link createModalStepper} keeps. */
export const STEPPER_CACHE_SIZE = 8;

/**
 * Below this h/tau the stepper takes 1 − e^(−h/tau) from expm1 and e^(−h/tau) as 1 + expm1(−h/tau)
 * (rounded once near 1, within an ulp of exp); above it, e^(−h/tau) from exp and 1 − e^(−h/tau)
 * by subtraction, whose relative error is at most 2^-53·e^(−0.7)/(1 − e^(−0.7)) ≈ 1.1·2^-53, i.e.
 * rounding. Either way one transcendental call per mode.
 */
const SUBTRACTION_SAFE_RATIO = 0.7;

/**
 * A stepper for long runs: the same arithmetic as {@link advanceModalState}, but the decay
 * factors e^(−h/tau) and 1 − e^(−h/tau) are cached for the {@link STEPPER_CACHE_SIZE} most recent
 * step lengths (tables allocated once, reused), so a pulse train whose segments repeat a few
 * durations costs one multiply-add per mode for constant power, and a step of a new length costs
 * one exp per mode and no allocation. Exponential power terms (a charging resistor) keep their
 * forced response per cached length while the same terms object recurs.
 * Cost O(sources × modes × terms) per call; O(modes × STEPPER_CACHE_SIZE) memory.
 */
export function createModalStepper(model: ModalModel): (state: ModalState, h: number, powers: SourcePowers) => ModalState {
  const modes = model.tauS.length;
  const sources = model.sources.length;
  const taus = Float64Array.from(model.tauS);
  const keys = new Float64Array(STEPPER_CACHE_SIZE).fill(Number.NaN);
  const decays = Array.from({ length: STEPPER_CACHE_SIZE }, () => new Float64Array(modes));
  const rises = Array.from({ length: STEPPER_CACHE_SIZE }, () => new Float64Array(modes));
  // Response to a unit ramp b = 1 W/s over the step, h·A·(φ0(A) − φ1(A)) (advanceModalState with
  // lambda = 0), filled on first use per cached length.
  const ramps = Array.from({ length: STEPPER_CACHE_SIZE }, () => new Float64Array(modes));
  const rampReady = new Uint8Array(STEPPER_CACHE_SIZE);
  // Forced response of one exponential term list per cached length, A·Σ[a·J0 + b·h·J1] per mode:
  // it does not depend on the state, and a long history repeats the same charging step (the same
  // terms object) many times. Keyed by the terms object itself; cleared when the slot is reused.
  const forcedTerms: (readonly PowerTerm[] | undefined)[] = new Array<readonly PowerTerm[] | undefined>(STEPPER_CACHE_SIZE).fill(undefined);
  const forced = Array.from({ length: STEPPER_CACHE_SIZE }, () => new Float64Array(modes));
  let next = 0;
  let last = 0;
  const slot = (h: number): number => {
    if (keys[last] === h) return last;
    for (let i = 0; i < STEPPER_CACHE_SIZE; i++) {
      if (keys[i] === h) {
        last = i;
        return i;
      }
    }
    const i = next;
    next = (next + 1) % STEPPER_CACHE_SIZE;
    const decay = decays[i]!;
    const rise = rises[i]!;
    for (let m = 0; m < modes; m++) {
      // h/tau as a division, exactly as advanceModalState; the factors agree with its exp and
      // expm1 to an ulp (see SUBTRACTION_SAFE_RATIO)
      const A = h / taus[m]!;
      if (A < SUBTRACTION_SAFE_RATIO) {
        const e = Math.expm1(-A);
        decay[m] = 1 + e;
        rise[m] = -e;
      } else {
        const d = Math.exp(-A);
        decay[m] = d;
        rise[m] = 1 - d;
      }
    }
    keys[i] = h;
    rampReady[i] = 0;
    forcedTerms[i] = undefined;
    last = i;
    return i;
  };
  const rampTable = (i: number, h: number): Float64Array => {
    const ramp = ramps[i]!;
    if (rampReady[i] === 0) {
      for (let m = 0; m < modes; m++) {
        const A = h / taus[m]!;
        ramp[m] = h * A * (expIntegral0(A) - expIntegral1(A));
      }
      rampReady[i] = 1;
    }
    return ramp;
  };
  return (state, h, powers) => {
    const i = slot(h);
    const decay = decays[i]!;
    const rise = rises[i]!;
    for (let s = 0; s < sources; s++) {
      const terms = powers[s];
      const base = s * modes;
      if (terms === undefined || terms.length === 0) {
        for (let m = 0; m < modes; m++) state[base + m]! *= decay[m]!;
      } else if (terms.length === 1 && terms[0]!.lambda === 0 && terms[0]!.b === 0) {
        const a = terms[0]!.a;
        for (let m = 0; m < modes; m++) state[base + m] = state[base + m]! * decay[m]! + a * rise[m]!;
      } else if (allPolynomial(terms)) {
        // a + b·s: the forced response is linear in a and b, so both factors come from the cache
        let a = 0;
        let b = 0;
        for (const t of terms) {
          a += t.a;
          b += t.b;
        }
        const ramp = rampTable(i, h);
        for (let m = 0; m < modes; m++) state[base + m] = state[base + m]! * decay[m]! + a * rise[m]! + b * ramp[m]!;
      } else {
        const f = forced[i]!;
        if (forcedTerms[i] !== terms) {
          for (let m = 0; m < modes; m++) f[m] = forcedResponse(h / taus[m]!, decay[m]!, h, terms);
          forcedTerms[i] = terms;
        }
        for (let m = 0; m < modes; m++) state[base + m] = state[base + m]! * decay[m]! + f[m]!;
      }
    }
    return state;
  };
}

/** True when every term is a + b·s (no exponential). */
function allPolynomial(terms: readonly PowerTerm[]): boolean {
  for (const t of terms) if (t.lambda !== 0) return false;
  return true;
}

/**
 * Rise of observed node o over ambient [K]: Σ_s Σ_m gain[o][s][m]·y[s][m]. Cost O(sources × modes).
 */
export function modalRise(model: ModalModel, state: ModalState, o = 0): number {
  const modes = model.tauS.length;
  const row = model.gainKPerW[o]!;
  let sum = 0;
  for (let s = 0; s < row.length; s++) {
    const gains = row[s]!;
    for (let m = 0; m < modes; m++) sum += gains[m]! * state[s * modes + m]!;
  }
  return sum;
}
