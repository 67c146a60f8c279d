import { createModalState, type ModalState } from "../thermal/modalStep.js";
import { AttemptCursor } from "../retry/AttemptCursor.js";
import { type ResolvedScenario, type RetryScenario, resolveScenario } from "../retry/RetryScenario.js";
import { retryPolicyVerdict } from "../retry/retryPolicyVerdict.js";
import { SUPERVISE_DEFAULTS } from "./superviseDefaults.js";
import type { SupervisedRetryPolicy } from "./superviseRetryPolicy.js";

/** The longest pre-charge timeout a part survives into a shorted output, in one corner. */
export interface ShortEndurance {
  /** the corner's name */
  readonly corner: string;
  /** longest timeout whose attempts all stay at or below limit − margin [s]; Infinity when unbounded; 0 when none */
  readonly longestS: number;
  /** false when the part survives the short for ever (its steady rise under the short power is within the limit) */
  readonly bounded: boolean;
  /** temperature of the part at the start of the hottest attempt, at the answer [°C] (under a retry policy: of the first burst) */
  readonly startTemperatureC: number;
  /** under a retry policy: what crosses the limit just above the answer, the first burst from cold or the bursts repeated after lockouts; null otherwise */
  readonly binding: "first burst" | "repeated bursts" | null;
  /** limit − margin [°C] */
  readonly allowedC: number;
  readonly limitC: number;
}

/** What one check of a timeout found: safe or not, and the hottest attempt start [°C]. */
interface TimeoutCheck {
  readonly safe: boolean;
  readonly startTemperatureC: number;
  readonly binding?: "first burst" | "repeated bursts";
}

/**
 * The longest timeout for which `check` finds every attempt safe, by bisection on the timeout.
 * Longer attempts into a short put at least as much heat into the part at every moment (the
 * power is non-negative and the earlier attempts' starts do not move), so safety is monotone in
 * the timeout and bisection finds the boundary; the bracket's upper end is
 * SUPERVISE_DEFAULTS.enduranceSpanTauMultiple slowest time constants, where the part is within
 * e^(−20) of its steady state: safe there counts as unbounded.
 * Cost O(log(1/bisectionRelTol) × cost of a check).
 */
function longestSafeTimeout(build: (timeoutS: number) => RetryScenario, check: (corner: ResolvedScenario, timeoutS: number) => TimeoutCheck): ShortEndurance {
  const probe = resolveScenario(build(1));
  const upper = SUPERVISE_DEFAULTS.enduranceSpanTauMultiple * probe.slowestTauS;
  const base = { corner: probe.name, allowedC: probe.allowedC, limitC: probe.limitC };
  const at = (t: number): TimeoutCheck => check(resolveScenario(build(t)), t);
  const top = at(upper);
  if (top.safe) return { ...base, longestS: Infinity, bounded: false, startTemperatureC: top.startTemperatureC, binding: null };
  const zero = at(0);
  if (!zero.safe) return { ...base, longestS: 0, bounded: true, startTemperatureC: zero.startTemperatureC, binding: zero.binding ?? null };
  let lo = 0;
  let hi = upper;
  let best = zero;
  let failing = top;
  while (hi - lo > SUPERVISE_DEFAULTS.bisectionRelTol * hi) {
    const mid = 0.5 * (lo + hi);
    const c = at(mid);
    if (c.safe) {
      lo = mid;
      best = c;
    } else {
      hi = mid;
      failing = c;
    }
  }
  return { ...base, longestS: lo, bounded: true, startTemperatureC: best.startTemperatureC, binding: failing.binding ?? null };
}

/**
 * The upper end of the timeout window, one corner: the longest timeout of one attempt into a shorted
 * output that keeps the part at or below limit − margin, starting from a given thermal state
 * (cold: all modes at zero, or the state a retry policy leaves).
 *
 * One Foster stage (R_th, τ) under constant power P from an initial rise θ0:
 *   θ(t) = P·R_th + (θ0 − P·R_th)·e^(−t/τ), so θ(t) = ΔT_max at
 *   t_max = −τ·ln((P·R_th − ΔT_max)/(P·R_th − θ0)), from cold t_max = −τ·ln(1 − ΔT_max/(P·R_th)),
 * unbounded when P·R_th ≤ ΔT_max (lumped capacitance, Incropera et al., Fundamentals of Heat and
 * Mass Transfer, 7th ed. (2011), §5.1 and §5.3). General networks and power traces are solved by
 * bisection on the exact modal history (AttemptCursor: own peak of the attempt, interior and
 * late peaks included).
 * Cost O(log(1/bisectionRelTol) × cost of one attempt).
 * @param startState modal state at the attempt's start (createModalState(model) layout); default cold
 */
export function longestShortFromState(build: (timeoutS: number) => RetryScenario, startState?: ModalState): ShortEndurance {
  return longestSafeTimeout(build, (corner) => {
    const state = startState ?? createModalState(corner.model);
    const cursor = AttemptCursor.resume(corner, { state, endS: 0, endVoltageV: corner.initialVoltageV, attempts: 0 });
    const trial = cursor.tryAt(0)!;
    return { safe: trial.safe, startTemperatureC: trial.record.startTemperatureC };
  });
}

/**
 * The upper end of the timeout window from the hottest state the retry policy leaves, one corner: the
 * longest timeout for which the profile's retry policy into a shorted output stays at or below
 * limit − margin: the burst from a cold part, and the burst followed by the lockout repeated for
 * as long as the fault persists. Each attempt lasts exactly the timeout (a short never
 * completes). The policy is checked by the retry planner (retryPolicyVerdict: the burst attempt
 * by attempt, the repeated burst + lockout cycle by its periodic steady state in closed form);
 * the hottest attempt start of the first burst is reported, and which of the two crosses the
 * limit just above the answer.
 * Cost O(log(1/bisectionRelTol) × cost of retryPolicyVerdict).
 */
export function longestShortUnderPolicy(build: (timeoutS: number) => RetryScenario, policy: SupervisedRetryPolicy): ShortEndurance {
  return longestSafeTimeout(build, (_corner, timeoutS) => {
    const verdict = retryPolicyVerdict([build(timeoutS)], policy.burst, policy.lockoutS, { verdictWords: false });
    const hottest = verdict.perCorner[0]!.attempts.reduce((m, r) => Math.max(m, r.startTemperatureC), -Infinity);
    return { safe: verdict.burstSafe && verdict.cyclesSafe, startTemperatureC: hottest, binding: verdict.burstSafe ? "repeated bursts" : "first burst" };
  });
}
