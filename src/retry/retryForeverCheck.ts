import { AttemptCursor } from "./AttemptCursor.js";
import { attemptPeriodicSteadyState } from "./attemptPeriodicSteadyState.js";
import { PLAN_DEFAULTS } from "./planDefaults.js";
import type { ResolvedScenario } from "./RetryScenario.js";
import type { RetrySpacing } from "./RetrySchedule.js";

/** Whether retrying for ever at one interval is safe in one corner, and why. */
export interface ForeverVerdict {
  readonly corner: string;
  readonly safe: boolean;
  /** an attempt would start before the previous one ended, or sooner after it than the corner's shortest wait (interval too short) */
  readonly overlap: boolean;
  /** own peak of an attempt in the periodic steady state [°C]; null when the start voltage never settled */
  readonly steadyPeakC: number | null;
  /** highest own peak of the attempts simulated before the proof closed (or the first unsafe one) [°C] */
  readonly transientPeakC: number;
  /** attempts simulated */
  readonly attemptsSimulated: number;
  /** "closed-form": proven from the periodic steady state and a bound on what is left of the start;
   *  "simulated": not proven; the start voltage did not settle within PLAN_DEFAULTS.voltageSettleAttempts
   *  attempts (or the bound did not close within PLAN_DEFAULTS.attemptCap), and only the attempts
   *  simulated were checked */
  readonly method: "closed-form" | "simulated";
  /** allowed − max(steady, transient) peak [K] */
  readonly headroomK: number;
  readonly allowedC: number;
  readonly limitC: number;
}

/**
 * One corner, one interval: is retrying for ever at this interval safe?
 *
 * 1. Attempts are simulated from the cold start (capacitor at its initial voltage) until the
 *    capacitor's start voltage settles (changes by less than PLAN_DEFAULTS.voltageSettleRelTol);
 *    any unsafe attempt on the way answers "no".
 * 2. The settled attempt's periodic steady state is computed in closed form
 *    (attemptPeriodicSteadyState); if its peak is above limit − margin, the answer is "no" (the peaks
 *    converge to it, so some finite attempt exceeds).
 * 3. What remains of the start is the excess x = y(now) − y(steady) of the modal state at an
 *    attempt's end; it decays by e^(−t/tau_m) from then on and adds at most Σ max(gain·x, 0) to
 *    any later own peak (linearity). When steady peak + that bound is within the limit, every
 *    later attempt is safe: proven. Otherwise one more attempt is simulated and the bound
 *    recomputed (it shrinks geometrically).
 * Source: docs/design.md, "Periodic steady state" (per-mode geometric series); the bound on what
 * is left of the start is superposition in the linear modal form (Oppenheim & Willsky, Signals and
 * Systems, 2nd ed. (1997), §2.2, mode by mode).
 * Validity: once settled, the attempt model must return the same attempt for the same start
 * voltage and wait.
 * Cost O(attempts to settle + attempts until the bound closes) × cost of one attempt.
 */
export function retryForeverCheck(corner: ResolvedScenario, intervalS: number, spacing: RetrySpacing): ForeverVerdict {
  const cursor = new AttemptCursor(corner);
  const base = { corner: corner.name, allowedC: corner.allowedC, limitC: corner.limitC };
  const model = corner.model;
  const gains = model.gainKPerW[corner.observedIndex]!;
  const modes = model.tauS.length;
  let transientPeakC = -Infinity;
  let previousV: number | null = null;
  let largestV = 0;
  let steady: ReturnType<typeof attemptPeriodicSteadyState> | null = null;
  const verdict = (safe: boolean, overlap: boolean, method: "closed-form" | "simulated"): ForeverVerdict => {
    const steadyPeakC = steady === null ? null : steady.attempt.record.peakC;
    const worst = Math.max(transientPeakC, steadyPeakC ?? -Infinity);
    return { ...base, safe, overlap, steadyPeakC, transientPeakC, attemptsSimulated: cursor.attempts, method, headroomK: overlap ? -Infinity : corner.allowedC - worst };
  };
  for (let k = 0; k < PLAN_DEFAULTS.attemptCap; k++) {
    const startS = k === 0 ? 0 : (spacing === "start-to-start" ? cursor.lastStartS : cursor.endS) + intervalS;
    const trial = cursor.tryAt(startS);
    if (trial === null) return verdict(false, true, "closed-form");
    cursor.keep(trial);
    transientPeakC = Math.max(transientPeakC, trial.record.peakC);
    if (!trial.safe) return verdict(false, false, "closed-form");
    const v = trial.record.startVoltageV;
    largestV = Math.max(largestV, Math.abs(v));
    const settled = previousV !== null && Math.abs(v - previousV) <= Math.max(PLAN_DEFAULTS.voltageSettleRelTol * largestV, 1e-6);
    previousV = v;
    if (steady === null) {
      if (!settled) {
        if (k + 1 >= PLAN_DEFAULTS.voltageSettleAttempts) return verdict(true, false, "simulated");
        continue;
      }
      const waitS = spacing === "start-to-start" ? intervalS - trial.outcome.durationS : intervalS;
      if (waitS < 0 || waitS < corner.minWaitS - 1e-12 * Math.max(1, intervalS)) return verdict(false, true, "closed-form");
      steady = attemptPeriodicSteadyState(corner, trial.outcome, waitS);
      if (!steady.attempt.safe) return verdict(false, false, "closed-form");
    }
    const now = cursor.endState;
    let bound = 0;
    for (let s = 0; s < model.sources.length; s++) {
      for (let m = 0; m < modes; m++) bound += Math.max(0, gains[s]![m]! * (now[s * modes + m]! - steady.endState[s * modes + m]!));
    }
    if (steady.attempt.record.peakC - corner.ambientC + bound <= corner.allowedRiseK) return verdict(true, false, "closed-form");
  }
  return verdict(true, false, "simulated");
}
