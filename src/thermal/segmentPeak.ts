import type { ModalModel } from "./ModalModel.js";
import { type ModalState, type SourcePowers, advanceModalState, modalRise } from "./modalStep.js";
import { powerAt } from "./powerTrace.js";

/** An interior maximum of a node's rise inside one step. */
export interface InteriorPeak {
  /** time since the step start [s] */
  readonly atS: number;
  /** rise over ambient there [K] */
  readonly riseK: number;
}

/** Grid points per step used to bracket sign changes of d(rise)/ds, half linear and half log-spaced. */
export const PEAK_GRID_POINTS = 32;

/**
 * Slope of the rise of node o at time s into a step [K/s], given the modal state at that time:
 *   d(rise)/ds = Σ_s Σ_m gain[o][s][m]·(P_s(s) − y[s][m](s)) / tau_m.
 * Source: the modal equation dy/dt = (P − y)/tau (see ModalModel). Cost O(sources × modes × terms).
 */
export function riseSlope(model: ModalModel, state: ModalState, powers: SourcePowers, s: number, o: number): number {
  const modes = model.tauS.length;
  const row = model.gainKPerW[o]!;
  let slope = 0;
  for (let src = 0; src < row.length; src++) {
    const terms = powers[src];
    const p = terms === undefined ? 0 : powerAt(terms, s);
    for (let m = 0; m < modes; m++) slope += (row[src]![m]! * (p - state[src * modes + m]!)) / model.tauS[m]!;
  }
  return slope;
}

/**
 * True when the rise of node o is provably monotone over the step: every power is constant and
 * every mode's contribution gain·(P − y) moves in the same direction (each mode relaxes
 * monotonically toward its constant input, so the sum cannot turn). This covers pulses from a
 * cool state and cooling gaps on Foster networks, the bulk of any long history.
 */
function provablyMonotone(model: ModalModel, state: ModalState, powers: SourcePowers, o: number): boolean {
  const modes = model.tauS.length;
  const row = model.gainKPerW[o]!;
  let direction = 0;
  for (let src = 0; src < row.length; src++) {
    const terms = powers[src];
    let p = 0;
    if (terms !== undefined) {
      for (const t of terms) {
        if (t.b !== 0 || t.lambda !== 0) return false;
        p += t.a;
      }
    }
    for (let m = 0; m < modes; m++) {
      const v = row[src]![m]! * (p - state[src * modes + m]!);
      if (v === 0) continue;
      const sign = v > 0 ? 1 : -1;
      if (direction === 0) direction = sign;
      else if (sign !== direction) return false;
    }
  }
  return true;
}

/**
 * Interior maxima of the rise of node o inside a step of length h starting from `state`.
 *
 * The slope d(rise)/ds is evaluated on a grid of {@link PEAK_GRID_POINTS} points (linear plus
 * log-spaced near the start, where fast modes turn); each change of sign from + to − brackets a
 * maximum, refined by bisection on the sign of the slope until the bracket is below 1e-12·h
 * (far finer than the 0.01 K the reports need). Steps whose rise is provably monotone skip the
 * search. Endpoints are not returned: the caller sees them as step ends.
 * Source: bisection on the derivative, Press et al., Numerical Recipes, 3rd ed. (2007), §9.1 and
 * §10.3 (bracketing a maximum with derivative information).
 * Cost O(grid × sources × modes × terms), or O(sources × modes) when provably monotone.
 * @returns the interior peaks in time order (usually none or one)
 */
export function interiorPeaks(model: ModalModel, state: ModalState, h: number, powers: SourcePowers, o = 0): InteriorPeak[] {
  if (!(h > 0) || provablyMonotone(model, state, powers, o)) return [];
  const scratch = new Float64Array(state.length);
  const slopeAt = (s: number): number => riseSlope(model, advanceModalState(model, state, s, powers, scratch), powers, s, o);
  const grid = peakGrid(model, h);
  const peaks: InteriorPeak[] = [];
  let previousS = 0;
  let previousSlope = slopeAt(0);
  for (const s of grid) {
    const slope = slopeAt(s);
    if (previousSlope > 0 && slope <= 0) {
      let lo = previousS;
      let hi = s;
      while (hi - lo > 1e-12 * h) {
        const mid = 0.5 * (lo + hi);
        if (mid <= lo || mid >= hi) break;
        if (slopeAt(mid) > 0) lo = mid;
        else hi = mid;
      }
      const at = 0.5 * (lo + hi);
      // A turn in the very last bracket at the step end belongs to the caller (it sees step ends).
      if (at < h * (1 - 1e-9)) peaks.push({ atS: at, riseK: modalRise(model, advanceModalState(model, state, at, powers, scratch), o) });
    }
    previousS = s;
    previousSlope = slope;
  }
  return peaks;
}

/** Sorted grid in (0, h]: half linear, half log-spaced from min(h, fastest tau)/1e3 up to h. */
function peakGrid(model: ModalModel, h: number): number[] {
  const half = PEAK_GRID_POINTS / 2;
  const fastest = Math.min(...model.tauS);
  const from = Math.min(h, fastest) * 1e-3;
  const points: number[] = [];
  for (let i = 1; i <= half; i++) points.push((h * i) / half);
  const ratio = Math.log(h / from);
  for (let i = 0; i < half; i++) points.push(from * Math.exp((ratio * i) / half));
  return [...new Set(points)].sort((a, b) => a - b);
}
