import type { PowerTrace } from "../thermal/powerTrace.js";
import { AttemptCursor, type AttemptTrial } from "./AttemptCursor.js";
import { attemptPeriodicSteadyState } from "./attemptPeriodicSteadyState.js";
import { PLAN_DEFAULTS } from "./planDefaults.js";
import type { AttemptOutcome, ResolvedScenario } from "./RetryScenario.js";
import type { RetrySpacing } from "./RetrySchedule.js";

/** Where the first unsafe attempt of a uniform retry train lies in one corner. */
export interface FirstUnsafeAttempt {
  /** 0-based index of the first attempt whose own peak is above limit − margin; null when every attempt up to lastIndex is safe */
  readonly index: number | null;
  /** own peak of that attempt [°C], or null */
  readonly peakC: number | null;
  /** highest own peak of the safe attempts before it (or up to lastIndex) [°C]; −Infinity when there are none */
  readonly worstSafePeakC: number;
  /**
   * an attempt examined, or the one after the last examined, cannot start when asked: before the
   * previous one ends, or sooner after it than the corner's shortest wait (the relay)
   */
  readonly overlap: boolean;
  /**
   * "closed-form": found by exponential search and bisection on the settled train (a few attempts
   * integrated, each from its start state in closed form); "simulated": attempt by attempt
   */
  readonly method: "closed-form" | "simulated";
}

/**
 * The first attempt of a uniform retry train (the first at t = 0 from a cold part, each further
 * one `intervalS` after the previous start or end) whose own peak is above limit − margin, looking
 * no further than attempt `lastIndex`. Decides what a linear scan of the attempts decides, without
 * integrating them all.
 *
 * 1. Attempts are integrated one by one (AttemptCursor) until one is unsafe or the capacitor's
 *    start voltage settles, as in retryForeverCheck (change below PLAN_DEFAULTS.voltageSettleRelTol
 *    of the largest voltage seen, or 1 µV); call the settled attempt j, with end state e_j.
 * 2. From then on every attempt is the settled one, a period P = its duration + the wait, and each
 *    mode's state at an attempt's end follows e_{k+1} = q·e_k + f, q = e^(−P/tau): the geometric
 *    partial sum e_k = e_∞ + q^(k−j)·(e_j − e_∞), with e_∞ = f/(1 − q) the periodic steady state
 *    (attemptPeriodicSteadyState). So the start state of any attempt k > j is known in closed form
 *    and its own peak costs one attempt integration (AttemptCursor.resume).
 * 3. Own peaks are non-decreasing in k from some attempt on, which makes "attempt k is unsafe"
 *    monotone there, so the first unsafe k is found by exponential search then bisection:
 *    O(log lastIndex) integrations instead of lastIndex. The proof, two cases:
 *    (A) every attempt so far was the settled attempt (a shorted bus: each starts at 0 V). The
 *        start state of attempt k + 1 minus that of attempt k is then the state the first attempt
 *        leaves (k + 1)·P after its start: the response of a passive RC network to non-negative
 *        heat, cooling freely. Its rise at every node and every later moment is ≥ 0 (the network
 *        matrix −C⁻¹·G has no negative entry off its diagonal, so e^(−C⁻¹·G·t) has none), so
 *        attempt k + 1's rise is at least attempt k's at every moment of its own window, and so is
 *        its own peak. Monotone from the first attempt.
 *    (B) otherwise, with D = e_∞ − e_j, W = e^(−wait/tau) and κ_m = W_m·Σ_s gain[o][s][m]·D[s][m]
 *        per mode, attempt k = j + 1 + n's rise t into its window is
 *        R_∞(t) − Σ_m κ_m·e^(−t/tau_m)·q_m^n, so going from n to n + 1 adds
 *        Σ_m κ_m·q_m^n·(1 − q_m)·e^(−t/tau_m). Let * be the slowest mode with κ > 0. If every
 *        mode with κ < 0 is no slower than * (tau_m ≤ tau_*; else this case does not apply), the
 *        increment is ≥ 0 at every t ≥ 0 once Σ_{κ_m<0} |κ_m|·(q_m/q_*)^n·(1 − q_m) ≤
 *        κ_*·(1 − q_*) (divide by q_*^n·e^(−t/tau_*): each ratio only shrinks with t and with n).
 *        The attempts before that n are integrated one by one.
 * 4. Each attempt integrated in closed form must be the settled attempt again (the attempt model
 *    asked at its start returns the same trace, length and end voltage to within
 *    PLAN_DEFAULTS.voltageSettleRelTol); if one is not (a part whose model reads its temperature,
 *    a voltage that has not really settled) or neither case of 3 applies, the attempts are
 *    integrated one by one up to lastIndex, as a plain scan would.
 * When the periodic steady state itself is safe and peaks are monotone, no attempt up to lastIndex
 * is unsafe (peaks rise towards the steady peak), and only attempt lastIndex is integrated, for
 * the highest safe peak.
 * Source: superposition in a linear time-invariant system and the per-mode geometric series
 * (Oppenheim & Willsky, Signals and Systems, 2nd ed. (1997), §2.2), the periodic steady state of
 * docs/engine.md ("Periodic steady state"); the non-negative response of a passive RC network to
 * non-negative heat is common practice (see AttemptCursor); exponential search (doubling) and
 * bisection over a monotone predicate, Press et al., Numerical Recipes, 3rd ed. (2007), §9.1.
 * Validity: the answer agrees with a plain scan exactly while attempts are integrated one by one,
 * and to the rounding of the closed-form start state (about 1e-12 K on the own peak) after that:
 * an attempt whose own peak is within that of limit − margin may be judged the other way.
 * Cost O((attempts to settle + log2(lastIndex)) × cost of one attempt) when the closed form
 * applies, else O(lastIndex × cost of one attempt).
 * @param lastIndex the last attempt index worth examining (≥ 0)
 */
export function firstUnsafeAttempt(corner: ResolvedScenario, intervalS: number, spacing: RetrySpacing, lastIndex: number): FirstUnsafeAttempt {
  const cursor = new AttemptCursor(corner);
  const nextStart = (): number => (cursor.attempts === 0 ? 0 : (spacing === "start-to-start" ? cursor.lastStartS : cursor.endS) + intervalS);
  let worst = -Infinity;
  let previousV: number | null = null;
  let largestV = 0;
  let first: AttemptOutcome | null = null;
  let allSame = true;
  let plan: TrainPlan | null = null;
  let planTried = false;
  for (let k = 0; k <= lastIndex; k++) {
    if (plan !== null && k === plan.from) {
      const found = searchTrain(corner, plan, k - 1, lastIndex, worst);
      if (found !== null) return found;
      plan = null;
    }
    const trial = cursor.tryAt(nextStart());
    if (trial === null) return { index: null, peakC: null, worstSafePeakC: worst, overlap: true, method: "simulated" };
    cursor.keep(trial);
    if (!trial.safe) return { index: k, peakC: trial.record.peakC, worstSafePeakC: worst, overlap: false, method: "simulated" };
    worst = Math.max(worst, trial.record.peakC);
    first ??= trial.outcome;
    allSame &&= sameAttempt(trial.outcome, first);
    const v = trial.record.startVoltageV;
    largestV = Math.max(largestV, Math.abs(v));
    const settled = previousV !== null && Math.abs(v - previousV) <= Math.max(PLAN_DEFAULTS.voltageSettleRelTol * largestV, 1e-6);
    previousV = v;
    if (settled && !planTried && k < lastIndex) {
      planTried = true;
      plan = trainPlan(corner, cursor, trial, k, intervalS, spacing, allSame, lastIndex);
      if (plan !== null && plan.from === k + 1) {
        const found = searchTrain(corner, plan, k, lastIndex, worst);
        if (found !== null) return found;
        plan = null;
      }
    }
  }
  return { index: null, peakC: null, worstSafePeakC: worst, overlap: !cursor.canStartAt(nextStart()), method: "simulated" };
}

/** The settled train in closed form. */
interface TrainPlan {
  /** the settled attempt j */
  readonly j: number;
  readonly outcome: AttemptOutcome;
  readonly waitS: number;
  readonly periodS: number;
  /** end state of attempt j and of the periodic steady state */
  readonly endJ: Float64Array;
  readonly endSteady: Float64Array;
  /** the periodic steady state's attempt is safe */
  readonly steadySafe: boolean;
  /** own peaks are monotone from this attempt index on */
  readonly from: number;
  /** which way: non-decreasing ("rising") or non-increasing ("falling") */
  readonly direction: "rising" | "falling";
}

/** The closed form of the train settled at attempt j, or null when it does not apply (see firstUnsafeAttempt, 2-3). */
function trainPlan(corner: ResolvedScenario, cursor: AttemptCursor, trial: AttemptTrial, j: number, intervalS: number, spacing: RetrySpacing, allSame: boolean, lastIndex: number): TrainPlan | null {
  const outcome = trial.outcome;
  const waitS = spacing === "start-to-start" ? intervalS - outcome.durationS : intervalS;
  // a wait the relay does not allow: the next attempt cannot start, which the caller's scan reports
  if (!(waitS >= 0) || waitS < corner.minWaitS) return null;
  const steady = attemptPeriodicSteadyState(corner, outcome, waitS);
  if (!sameAttempt(steady.attempt.outcome, outcome)) return null;
  const periodS = outcome.durationS + waitS;
  const endJ = cursor.endState;
  const base = { j, outcome, waitS, periodS, endJ, endSteady: steady.endState, steadySafe: steady.attempt.safe };
  if (allSame) return { ...base, from: j + 1, direction: "rising" };
  const after = monotoneAfter(corner, endJ, steady.endState, waitS, periodS, lastIndex - j);
  return after === null ? null : { ...base, from: j + 1 + after.n0, direction: after.direction };
}

/**
 * Case (B) of firstUnsafeAttempt: the least n ≥ 0 from which the own peak of attempt j + 1 + n
 * no longer falls, or null when the modes do not allow it within `limit`; or, when no κ is
 * positive, "falling" from n = 0 (every increment is ≤ 0: the settled attempts heat less than
 * those before them, and the peaks sink towards the steady one).
 */
function monotoneAfter(corner: ResolvedScenario, endJ: Float64Array, endSteady: Float64Array, waitS: number, periodS: number, limit: number): { n0: number; direction: "rising" | "falling" } | null {
  const model = corner.model;
  const modes = model.tauS.length;
  const gains = model.gainKPerW[corner.observedIndex]!;
  const kappa = new Float64Array(modes);
  for (let m = 0; m < modes; m++) {
    let sum = 0;
    for (let s = 0; s < model.sources.length; s++) sum += gains[s]![m]! * (endSteady[s * modes + m]! - endJ[s * modes + m]!);
    kappa[m] = Math.exp(-waitS / model.tauS[m]!) * sum;
  }
  let star = -1;
  for (let m = 0; m < modes; m++) if (kappa[m]! > 0 && (star < 0 || model.tauS[m]! > model.tauS[star]!)) star = m;
  if (star < 0) return { n0: 0, direction: "falling" };
  let negatives = false;
  for (let m = 0; m < modes; m++) {
    if (!(kappa[m]! < 0)) continue;
    negatives = true;
    if (model.tauS[m]! > model.tauS[star]!) return null;
  }
  if (!negatives) return { n0: 0, direction: "rising" };
  const tauStar = model.tauS[star]!;
  const rhs = kappa[star]! * -Math.expm1(-periodS / tauStar);
  for (let n = 0; n <= limit; n++) {
    let lhs = 0;
    for (let m = 0; m < modes; m++) {
      if (!(kappa[m]! < 0)) continue;
      const tau = model.tauS[m]!;
      lhs += -kappa[m]! * Math.exp(-n * periodS * (1 / tau - 1 / tauStar)) * -Math.expm1(-periodS / tau);
    }
    if (lhs <= rhs) return { n0: n, direction: "rising" };
  }
  return null;
}

/**
 * Exponential search then bisection for the first unsafe attempt after `known` (an index at or
 * after plan.from − 1 known to be safe, whose own peak is the highest so far, `worst`), each
 * attempt integrated from its closed-form start state. Null when an attempt integrated is not the
 * settled attempt (the caller goes on one by one).
 */
function searchTrain(corner: ResolvedScenario, plan: TrainPlan, known: number, lastIndex: number, worst: number): FirstUnsafeAttempt | null {
  const model = corner.model;
  const modes = model.tauS.length;
  const sources = model.sources.length;
  const state = new Float64Array(plan.endJ.length);
  const probe = (k: number): AttemptTrial | null => {
    const n = k - 1 - plan.j;
    for (let m = 0; m < modes; m++) {
      const qn = Math.exp((-n * plan.periodS) / model.tauS[m]!);
      for (let s = 0; s < sources; s++) {
        const i = s * modes + m;
        state[i] = plan.endSteady[i]! + qn * (plan.endJ[i]! - plan.endSteady[i]!);
      }
    }
    const trial = AttemptCursor.resume(corner, { state, endS: 0, endVoltageV: plan.outcome.endVoltageV, attempts: k }).tryAt(plan.waitS);
    return trial !== null && sameAttempt(trial.outcome, plan.outcome) ? trial : null;
  };
  let lo = known;
  let loPeak = worst;
  if (plan.direction === "falling") {
    // non-increasing from attempt known + 1: it decides; the last attempt is integrated too, to
    // check that the attempts are still the settled one there
    const next = probe(known + 1);
    if (next === null) return null;
    if (!next.safe) return { index: known + 1, peakC: next.record.peakC, worstSafePeakC: worst, overlap: false, method: "closed-form" };
    if (lastIndex > known + 1 && probe(lastIndex) === null) return null;
    return { index: null, peakC: null, worstSafePeakC: Math.max(worst, next.record.peakC), overlap: false, method: "closed-form" };
  }
  if (plan.steadySafe) {
    // monotone and bounded by the safe steady peak: nothing up to lastIndex is unsafe
    if (lastIndex <= lo) return { index: null, peakC: null, worstSafePeakC: worst, overlap: false, method: "closed-form" };
    const last = probe(lastIndex);
    if (last === null) return null;
    if (last.safe) return { index: null, peakC: null, worstSafePeakC: Math.max(worst, last.record.peakC), overlap: false, method: "closed-form" };
    // the steady peak bounds every own peak from above, so this cannot happen but by rounding at the limit: search
  }
  let hi = -1;
  let hiPeak = 0;
  for (let step = 1; lo < lastIndex; step *= 2) {
    const k = Math.min(lo + step, lastIndex);
    const trial = probe(k);
    if (trial === null) return null;
    if (!trial.safe) {
      hi = k;
      hiPeak = trial.record.peakC;
      break;
    }
    lo = k;
    loPeak = Math.max(loPeak, trial.record.peakC);
  }
  if (hi < 0) return { index: null, peakC: null, worstSafePeakC: loPeak, overlap: false, method: "closed-form" };
  while (hi - lo > 1) {
    const mid = lo + Math.floor((hi - lo) / 2);
    const trial = probe(mid);
    if (trial === null) return null;
    if (trial.safe) {
      lo = mid;
      loPeak = Math.max(loPeak, trial.record.peakC);
    } else {
      hi = mid;
      hiPeak = trial.record.peakC;
    }
  }
  return { index: hi, peakC: hiPeak, worstSafePeakC: loPeak, overlap: false, method: "closed-form" };
}

/** True when two attempt outcomes are the same attempt to within PLAN_DEFAULTS.voltageSettleRelTol. */
function sameAttempt(a: AttemptOutcome, b: AttemptOutcome): boolean {
  if (a === b) return true;
  const tol = PLAN_DEFAULTS.voltageSettleRelTol;
  const close = (x: number, y: number, floor = 0): boolean => Math.abs(x - y) <= Math.max(tol * Math.max(Math.abs(x), Math.abs(y)), floor);
  if (!close(a.durationS, b.durationS) || !close(a.endVoltageV, b.endVoltageV, 1e-6)) return false;
  if (!sameTrace(a.trace, b.trace, close)) return false;
  const ka = Object.keys(a.otherTraces ?? {});
  const kb = Object.keys(b.otherTraces ?? {});
  if (ka.length !== kb.length) return false;
  for (const key of ka) {
    const tb = b.otherTraces?.[key];
    if (tb === undefined || !sameTrace(a.otherTraces![key]!, tb, close)) return false;
  }
  return true;
}

function sameTrace(a: PowerTrace, b: PowerTrace, close: (x: number, y: number) => boolean): boolean {
  if (a === b) return true;
  if (a.length !== b.length) return false;
  for (let i = 0; i < a.length; i++) {
    const sa = a[i]!;
    const sb = b[i]!;
    if (!close(sa.startS, sb.startS) || !close(sa.durationS, sb.durationS) || sa.terms.length !== sb.terms.length) return false;
    for (let t = 0; t < sa.terms.length; t++) {
      const ta = sa.terms[t]!;
      const tb = sb.terms[t]!;
      if (!close(ta.a, tb.a) || !close(ta.b, tb.b) || !close(ta.lambda, tb.lambda)) return false;
    }
  }
  return true;
}
