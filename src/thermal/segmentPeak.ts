import type { ModalModel } from "./ModalModel.js";
import { type ModalState, type SourcePowers, advanceModalState, modalRise } from "./modalStep.js";
import { exponentialSumFalls } from "./exponentialSumFalls.js";
import { exponentialSumZero } from "./exponentialSumZero.js";
import { type PowerTerm, powerAt } from "./powerTrace.js";

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
 * Sign of dP/ds over the whole step for one source: 0 for constant power, ±1 when the derivative
 * keeps one sign (a ramp: dP/ds = Σb; a pure exponential a·e^(−lambda·s): sign of −lambda·a), or
 * undefined when it cannot be told cheaply (a·s·e^(−lambda·s) terms, or contributions of both signs).
 */
function powerTrend(terms: readonly PowerTerm[] | undefined): number | undefined {
  if (terms === undefined) return 0;
  let trend = 0;
  let ramp = 0;
  for (const t of terms) {
    if (t.lambda === 0) {
      ramp += t.b;
      continue;
    }
    if (t.b !== 0) return undefined;
    const sign = Math.sign(-t.lambda * t.a);
    if (sign === 0) continue;
    if (trend !== 0 && sign !== trend) return undefined;
    trend = sign;
  }
  const rampSign = Math.sign(ramp);
  if (rampSign !== 0 && trend !== 0 && rampSign !== trend) return undefined;
  return trend !== 0 ? trend : rampSign;
}

/**
 * True when the rise of node o is provably monotone over the step. Each mode's drive
 * u = P − y obeys du/ds = dP/ds − u/tau, so u keeps its starting sign when dP/ds has that same sign
 * (or is zero) over the step: a constant or rising power starting above a mode's state, or a
 * constant or falling power starting below it. When every mode's contribution gain·u/tau is thus of
 * one fixed sign, and all agree, the slope of the rise never changes sign. This covers pulses from
 * a cool state, rising edges, and cooling gaps, the bulk of any long history.
 */
function provablyMonotone(model: ModalModel, state: ModalState, powers: SourcePowers, o: number): boolean {
  const modes = model.tauS.length;
  const row = model.gainKPerW[o]!;
  let direction = 0;
  for (let src = 0; src < row.length; src++) {
    const terms = powers[src];
    // constant power (no terms, or one constant term) is by far the most common step: no trend
    let trend: number | undefined = 0;
    let p = 0;
    if (terms !== undefined && terms.length > 0) {
      const first = terms[0]!;
      if (terms.length === 1 && first.b === 0 && first.lambda === 0) p = first.a;
      else {
        trend = powerTrend(terms);
        if (trend === undefined) return false;
        p = powerAt(terms, 0);
      }
    }
    const gains = row[src]!;
    const base = src * modes;
    for (let m = 0; m < modes; m++) {
      const u = p - state[base + m]!;
      const side = u > 0 ? 1 : u < 0 ? -1 : 0;
      if (trend !== 0 && side !== 0 && side !== trend) return false;
      const g = gains[m]!;
      const sign = (g > 0 ? 1 : g < 0 ? -1 : 0) * (side !== 0 ? side : trend);
      if (sign === 0) continue;
      if (direction === 0) direction = sign;
      else if (sign !== direction) return false;
    }
  }
  return true;
}

/** The shared answer for steps without an interior peak (callers only read it). */
const NO_PEAKS = Object.freeze([]) as unknown as InteriorPeak[];

/**
 * Exponential sums S(x) = Σ_i k_i·e^(−r_i·x) built by the closed-form paths below live in these
 * module scratch arrays, rates ascending (the order the rule of signs needs), and are consumed by
 * singleTurnOfRates before the next call: no allocation per step. Grown on demand.
 */
let sumRates = new Float64Array(16);
let sumCoefficients = new Float64Array(16);

/** Make room for `size` entries, keeping those already there. */
function reserveSum(size: number): void {
  if (sumRates.length >= size) return;
  const rates = new Float64Array(2 * size);
  const coefficients = new Float64Array(2 * size);
  rates.set(sumRates);
  coefficients.set(sumCoefficients);
  sumRates = rates;
  sumCoefficients = coefficients;
}

/**
 * A value computed once per model and kept beside it (WeakMap), with the last model asked for
 * checked first: the hot path asks for the same model step after step.
 */
function perModel<T>(compute: (model: ModalModel) => T): (model: ModalModel) => T {
  const cache = new WeakMap<ModalModel, T>();
  let lastModel: ModalModel | undefined;
  let lastValue: T | undefined;
  return (model) => {
    if (model === lastModel) return lastValue!;
    let value = cache.get(model);
    if (value === undefined) {
      value = compute(model);
      cache.set(model, value);
    }
    lastModel = model;
    lastValue = value;
    return value;
  };
}

/** Mode indices from the slowest to the fastest (ascending rate 1/tau). */
const slowestFirst = perModel((model) => Int32Array.from(model.tauS.keys()).sort((i, j) => model.tauS[j]! - model.tauS[i]!));

/** Rates of the linear-power slope sum: 0, then 1/tau of every mode slowest first. */
const linearRates = perModel((model) => {
  const order = slowestFirst(model);
  const rates = new Float64Array(order.length + 1);
  order.forEach((m, p) => (rates[p + 1] = 1 / model.tauS[m]!));
  return rates;
});

/** Add value at rate into the first n scratch entries (merged when the rate is already there, else inserted in order); returns the new count. */
function addToSum(n: number, rate: number, value: number): number {
  let i = n;
  while (i > 0 && sumRates[i - 1]! > rate) i--;
  if (i > 0 && sumRates[i - 1] === rate) {
    sumCoefficients[i - 1]! += value;
    return n;
  }
  sumRates.copyWithin(i + 1, i, n);
  sumCoefficients.copyWithin(i + 1, i, n);
  sumRates[i] = rate;
  sumCoefficients[i] = value;
  return n + 1;
}

/** Sign changes among the first n scratch coefficients, in rate order, zeros skipped. */
function signChanges(n: number): number {
  let changes = 0;
  let last = 0;
  for (let i = 0; i < n; i++) {
    const value = sumCoefficients[i]!;
    const sign = value > 0 ? 1 : value < 0 ? -1 : 0;
    if (sign === 0) continue;
    if (last !== 0 && sign !== last) changes++;
    last = sign;
  }
  return changes;
}

/**
 * For steps where every source's power is linear (a + b·s, no exponentials), the slope of the rise
 * is an exponential sum S(s) = C + Σ_m k_m·e^(−s/tau_m) with C = Σ_src b·Σ_m gain and
 * k_m = Σ_src gain·(u_m(0) − b·tau_m)/tau_m. By the rule of signs for exponential sums, S has no
 * more zeros than its coefficients, ordered by rate (C first, then slower to faster modes), have
 * sign changes. Leaves the sum in the scratch and returns its length (the caller counts the
 * changes: with at most one there is at most one turn, bracketed by the step ends), or −1 when a
 * term is not linear. Source: generalised Descartes rule of signs for exponential sums (Laguerre), as in
 * Pólya & Szegő, Problems and Theorems in Analysis II, Part V (from memory).
 */
function linearSlopeSum(model: ModalModel, state: ModalState, powers: SourcePowers, o: number): number {
  const modes = model.tauS.length;
  const row = model.gainKPerW[o]!;
  const order = slowestFirst(model);
  const rates = linearRates(model);
  const n = modes + 1;
  reserveSum(n);
  sumRates.set(rates);
  sumCoefficients.fill(0, 0, n);
  // entry 0 is the constant C (rate 0), entry p ≥ 1 the mode order[p − 1], slowest first
  for (let src = 0; src < row.length; src++) {
    const terms = powers[src];
    let a = 0;
    let b = 0;
    if (terms !== undefined) {
      for (const t of terms) {
        if (t.lambda !== 0) return -1;
        a += t.a;
        b += t.b;
      }
    }
    const gains = row[src]!;
    const base = src * modes;
    for (let p = 1; p < n; p++) {
      const m = order[p - 1]!;
      const g = gains[m]!;
      if (g === 0) continue;
      sumCoefficients[0]! += g * b;
      // g·(a − y − b·tau)/tau, as g·(a − y)·(1/tau) − g·b
      sumCoefficients[p]! += g * (a - state[base + m]!) * rates[p]! - g * b;
    }
  }
  return n;
}


/**
 * For steps where every source's power is a sum of pure exponentials Σ a_k·e^(−lambda_k·s) (b = 0;
 * lambda_k = 0 is a constant), the slope of the rise is again an exponential sum. Mode m of a
 * source relaxes as y(s) = c_m·e^(−s/tau) + Σ_k a_k·e^(−lambda_k·s)/(1 − lambda_k·tau) with
 * c_m = y(0) − Σ_k a_k/(1 − lambda_k·tau), so u = P − y = −Σ_k a_k·(lambda_k·tau/(1 − lambda_k·tau))·e^(−lambda_k·s) − c_m·e^(−s/tau)
 * and the slope Σ gain·u/tau has one coefficient per distinct rate:
 *   rate lambda_k: −Σ gain·a_k·lambda_k/(1 − lambda_k·tau_m);   rate 1/tau_m: −Σ_src gain·c_m/tau_m.
 * With at most one sign change among the coefficients ordered by rate, the slope has at most one
 * zero (rule of signs for exponential sums, as in linearSlopeSum), found by singleTurnOfRates.
 * This is the resistor-charging step (constant, e^(−t/τ'), e^(−2t/τ') power), the bulk of every
 * pre-charge history. Leaves the sum in the scratch and returns its length; −1 when a rate
 * coincides with a mode's 1/tau (a resonant s·e^(−s/tau) term) or there are more sign changes:
 * the grid search handles those.
 */
function exponentialSlopeSum(model: ModalModel, state: ModalState, powers: SourcePowers, o: number): number {
  const plan = exponentialPlanFor(model, powers, o);
  if (plan === undefined) return -1;
  const n = plan.rates.length;
  reserveSum(n);
  sumRates.set(plan.rates);
  sumCoefficients.set(plan.fixed);
  for (let i = 0; i < plan.entry.length; i++) sumCoefficients[plan.entry[i]!]! += plan.factor[i]! * (state[plan.stateIndex[i]!]! - plan.offset[i]!);
  return signChanges(n) <= 1 ? n : -1;
}

/**
 * The state-free part of exponentialSlopeSum for one step's powers: the rates (ascending, merged),
 * the coefficients of the power's own rates lambda_k, and for every mode m of every source with a
 * gain the entry at rate 1/tau_m with factor −gain/tau_m and offset K = Σ_k a_k/(1 − lambda_k·tau_m),
 * so that entry += factor·(y_m(0) − K). undefined when the closed form does not apply (a b·s term,
 * or a lambda_k within 1e-3 relative of a mode's 1/tau_m).
 */
interface ExponentialPlan {
  readonly rates: Float64Array;
  readonly fixed: Float64Array;
  readonly entry: Int32Array;
  readonly stateIndex: Int32Array;
  readonly factor: Float64Array;
  readonly offset: Float64Array;
}

/** The last plan and what it was made for (a long history repeats one charging step's terms). */
let planModel: ModalModel | undefined;
let planObserved = -1;
let planTerms: (readonly PowerTerm[] | undefined)[] = [];
let lastPlan: ExponentialPlan | undefined;

function exponentialPlanFor(model: ModalModel, powers: SourcePowers, o: number): ExponentialPlan | undefined {
  const sources = model.gainKPerW[o]!.length;
  let same = model === planModel && o === planObserved && planTerms.length === sources;
  for (let src = 0; same && src < sources; src++) same = planTerms[src] === powers[src];
  if (same) return lastPlan;
  planModel = model;
  planObserved = o;
  planTerms = Array.from({ length: sources }, (_, src) => powers[src]);
  lastPlan = buildExponentialPlan(model, powers, o);
  return lastPlan;
}

function buildExponentialPlan(model: ModalModel, powers: SourcePowers, o: number): ExponentialPlan | undefined {
  const modes = model.tauS.length;
  const row = model.gainKPerW[o]!;
  let n = 0;
  const modeTerms: { rate: number; stateIndex: number; factor: number; offset: number }[] = [];
  for (let src = 0; src < row.length; src++) {
    const terms = powers[src] ?? [];
    for (const t of terms) if (t.b !== 0) return undefined;
    reserveSum(n + modes * (terms.length + 1));
    const gains = row[src]!;
    for (const m of slowestFirst(model)) {
      const g = gains[m]!;
      if (g === 0) continue;
      const tau = model.tauS[m]!;
      let offset = 0;
      for (const t of terms) {
        const denominator = 1 - t.lambda * tau;
        if (Math.abs(denominator) < 1e-3) return undefined;
        offset += t.a / denominator;
        if (t.lambda !== 0) n = addToSum(n, t.lambda, (-g * t.a * t.lambda) / denominator);
      }
      n = addToSum(n, 1 / tau, 0);
      modeTerms.push({ rate: 1 / tau, stateIndex: src * modes + m, factor: -g / tau, offset });
    }
  }
  const rates = sumRates.slice(0, n);
  return {
    rates,
    fixed: sumCoefficients.slice(0, n),
    entry: Int32Array.from(modeTerms, (t) => rates.indexOf(t.rate)),
    stateIndex: Int32Array.from(modeTerms, (t) => t.stateIndex),
    factor: Float64Array.from(modeTerms, (t) => t.factor),
    offset: Float64Array.from(modeTerms, (t) => t.offset),
  };
}

/**
 * ∫0^x S(s) ds of the scratch sum, exactly: Σ k_i·(1 − e^(−r_i·x))/r_i (k_i·x for r_i = 0), with
 * 1 − e^(−r·x) from expm1 so small r·x loses nothing. Since S is the slope of the rise, this is
 * the rise gained from the step start to x (fundamental theorem of calculus).
 */
function integralOfSum(n: number, x: number): number {
  let sum = 0;
  for (let i = 0; i < n; i++) {
    const r = sumRates[i]!;
    sum += r === 0 ? sumCoefficients[i]! * x : (-sumCoefficients[i]! * Math.expm1(-r * x)) / r;
  }
  return sum;
}

/**
 * The one zero in (0, h) of the scratch sum S(x) = Σ_{i<n} k_i·e^(−r_i·x) when S(0) > 0 ≥ S(h),
 * by Newton's method kept inside the bracket (bisection when a step leaves it); undefined when
 * there is none. Cost O(n) per iteration, no allocation.
 */
function singleTurnOfRates(n: number, h: number): number | undefined {
  // with at most one zero, a slope that does not start positive never turns down: no maximum
  let atZero = 0;
  for (let i = 0; i < n; i++) atZero += sumCoefficients[i]!;
  if (!(atZero > 0)) return undefined;
  let atEnd = 0;
  for (let i = 0; i < n; i++) atEnd += sumCoefficients[i]! * Math.exp(-sumRates[i]! * h);
  if (!(atEnd <= 0)) return undefined;
  let lo = 0;
  let hi = h;
  // Start from the last turn when the step has the same length (a long history repeats the same
  // charging step from nearly the same state, so Newton then needs two or three iterations), else
  // from the secant through the bracket ends; any start inside the bracket converges.
  let x = h === lastTurnStepS ? lastTurnS : (h * atZero) / (atZero - atEnd);
  if (!(x > lo && x < hi)) x = 0.5 * h;
  lastTurnStepS = h;
  lastTurnS = turnInside(n, h, lo, hi, x);
  return lastTurnS;
}

/** The previous turn found by singleTurnOfRates and its step length (a starting guess only). */
let lastTurnStepS = Number.NaN;
let lastTurnS = Number.NaN;

/**
 * Forget the previous turn: the warm start changes where Newton stops inside its 1e-12·h
 * tolerance, so the last bits of a peak depend on the run before it. Runs that must give the
 * same bits in any order (Monte Carlo samples split among workers) call this first. Cost O(1).
 */
export function forgetPeakGuess(): void {
  lastTurnStepS = Number.NaN;
  lastTurnS = Number.NaN;
}

/** Safeguarded Newton on the scratch sum inside [lo, hi] from x, S(lo) > 0 ≥ S(hi). */
function turnInside(n: number, h: number, lo: number, hi: number, x: number): number {
  return exponentialSumZero(sumCoefficients, 0, sumRates, 0, n, lo, hi, x, true, h);
}

/**
 * Interior maxima of the rise of node o inside a step of length h starting from `state`.
 *
 * Steps whose rise is provably monotone skip the search. Steps with linear power and at most one
 * turn (see linearSlopeSum) are bracketed by their ends and solved by safeguarded Newton on the
 * closed-form slope; with more turns possible, an exact test (exponentialSumFalls) proves most of
 * them free of any maximum, and only the rest are searched. Otherwise the slope d(rise)/ds is evaluated
 * on a grid of {@link PEAK_GRID_POINTS} points (linear plus log-spaced near the start, where fast
 * modes turn) and each change of sign from + to − brackets a maximum. Each bracket is refined by
 * the Illinois variant of regula falsi on the sign of the slope until it is below 1e-12·h (far
 * finer than the 0.01 K the reports need). Endpoints are not returned: the caller sees them as
 * step ends.
 * Source: bracketing a maximum with derivative information, Press et al., Numerical Recipes, 3rd
 * ed. (2007), §9.1–9.2 (bracketing, false position), §9.4 (Newton with bracketing) and §10.4
 * (one-dimensional search with first derivatives; section from memory); the Illinois method,
 * Dowell & Jarratt, BIT 11 (1971) 168–174.
 * Cost O(grid × sources × modes × terms), or O(sources × modes) when provably monotone.
 * @returns the interior peaks in time order (usually none or one)
 */
export function interiorPeaks(model: ModalModel, state: ModalState, h: number, powers: SourcePowers, o = 0): InteriorPeak[] {
  if (!(h > 0) || provablyMonotone(model, state, powers, o)) return NO_PEAKS;
  let n = linearSlopeSum(model, state, powers, o);
  // linear power with several sign changes: an exact test first (most such steps have no
  // maximum); the grid below searches the few that have one
  if (n >= 0 && signChanges(n) > 1) {
    if (!exponentialSumFalls(sumCoefficients, sumRates, n, h)) return NO_PEAKS;
    n = -1;
  }
  if (n < 0) n = exponentialSlopeSum(model, state, powers, o);
  if (n >= 0) {
    const at = singleTurnOfRates(n, h);
    if (at === undefined || !(at < h * (1 - 1e-9))) return NO_PEAKS;
    return [{ atS: at, riseK: modalRise(model, state, o) + integralOfSum(n, at) }];
  }
  const scratch = new Float64Array(state.length);
  const peaks: InteriorPeak[] = [];
  let previousS = 0;
  let previousSlope = slopeAtTime(model, state, powers, o, 0, scratch);
  for (const s of peakGrid(model, h)) {
    const slope = slopeAtTime(model, state, powers, o, s, scratch);
    if (previousSlope > 0 && slope <= 0) {
      const at = refineTurn(model, state, powers, o, scratch, previousS, s, previousSlope, slope, h);
      // A turn in the very last bracket at the step end belongs to the caller (it sees step ends).
      if (at < h * (1 - 1e-9)) peaks.push({ atS: at, riseK: modalRise(model, advanceModalState(model, state, at, powers, scratch), o) });
    }
    previousS = s;
    previousSlope = slope;
  }
  return peaks;
}

/** Slope of the rise at time s into the step (state advanced exactly into scratch). */
function slopeAtTime(model: ModalModel, state: ModalState, powers: SourcePowers, o: number, s: number, scratch: ModalState): number {
  return riseSlope(model, advanceModalState(model, state, s, powers, scratch), powers, s, o);
}

/** Illinois regula falsi on the slope's sign inside [lo, hi] with slope(lo) > 0 ≥ slope(hi). */
function refineTurn(model: ModalModel, state: ModalState, powers: SourcePowers, o: number, scratch: ModalState, lo: number, hi: number, fLo: number, fHi: number, h: number): number {
  let side = 0;
  for (let i = 0; i < 200 && hi - lo > 1e-12 * h; i++) {
    let mid = (lo * fHi - hi * fLo) / (fHi - fLo);
    if (!(mid > lo && mid < hi)) mid = 0.5 * (lo + hi);
    if (mid <= lo || mid >= hi) break;
    const f = slopeAtTime(model, state, powers, o, mid, scratch);
    if (f === 0) return mid;
    if (f > 0) {
      lo = mid;
      fLo = f;
      if (side === 1) fHi *= 0.5;
      side = 1;
    } else {
      hi = mid;
      fHi = f;
      if (side === -1) fLo *= 0.5;
      side = -1;
    }
  }
  return 0.5 * (lo + hi);
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
