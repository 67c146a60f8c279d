import type { CircuitModels } from "../profile/CircuitModels.js";
import type { DutyProfile } from "../profile/DutyProfile.js";
import { AttemptCursor } from "../retry/AttemptCursor.js";
import { fastestSchedule } from "../retry/fastestSchedule.js";
import { resolveScenario } from "../retry/RetryScenario.js";
import { profileRetrySetup } from "../retry/profileRetrySetup.js";
import { type Verdict, peakVerdict, worstVerdict } from "../stress/Verdict.js";
import { GUARD_DEFAULTS, type GuardNumeric } from "./guardDefaults.js";
import type { GuardEstimator } from "./GuardEstimator.js";
import { FixedPointEstimator, type FixedPointGuard, fixedPointGuard } from "./fixedPointGuard.js";
import { FloatEstimator, type FloatGuard, floatGuard } from "./floatGuard.js";
import { type GuardBurst, runGuardBurst } from "./runGuardBurst.js";
import { type ThermalGuard, buildThermalGuard } from "./thermalGuard.js";

/** Options of {@link planGuard}; every field has a default. */
export interface GuardOptions {
  /** the firmware tick [s] (default: the profile's timer resolution) */
  readonly tickS?: number;
  /** the number type of the export the report runs (default "fixed") */
  readonly numeric?: GuardNumeric;
  /** fractional bits of the fixed-point rises (default GUARD_DEFAULTS.fractionBits) */
  readonly fractionBits?: number;
  /** fractional bits of the fixed-point energies (default GUARD_DEFAULTS.energyFractionBits) */
  readonly energyFractionBits?: number;
  /** attempts compared and put in the test vectors (default: the profile's, at most GUARD_DEFAULTS.vectorAttempts) */
  readonly attempts?: number;
  /** keep the tick-by-tick test vectors (default false) */
  readonly vectors?: boolean;
}

/** One corner's comparison of the guard with the retry planner's fastest safe schedule. */
export interface GuardConservatism {
  readonly corner: string;
  /** attempt starts of the fastest safe schedule in this corner [s] */
  readonly fastestStartsS: readonly number[];
  /** attempt starts the guard allowed [s] */
  readonly guardStartsS: readonly number[];
  /** guard start − fastest start per attempt [s] */
  readonly laterByS: readonly number[];
  /** the guard's burst end over the fastest schedule's (1 = as fast) */
  readonly burstRatio: number | null;
}

/** Everything `heatledger guard` reports. */
export interface GuardReport {
  readonly guard: ThermalGuard;
  readonly numeric: GuardNumeric;
  /** the fixed-point constants (null when numeric is "float") */
  readonly fixed: FixedPointGuard | null;
  readonly float: FloatGuard;
  readonly attempts: number;
  /** the bursts the exported guard ran, one per corner (with the vectors when asked for) */
  readonly bursts: readonly GuardBurst[];
  readonly conservatism: readonly GuardConservatism[];
  /** the relay's shortest wait the guard respects [s] */
  readonly shortestWaitS: number;
  /** pass when every attempt the guard admitted stays within limit − margin (else the worst peak's verdict) */
  readonly verdict: Verdict;
  readonly linearMosfet: boolean;
}

/**
 * The firmware guard of a duty profile and what it costs: build it on the retry planner's corners
 * (profileRetrySetup, buildThermalGuard), round it for the chosen number type (fixedPointGuard or
 * floatGuard), run it as firmware would in every corner (runGuardBurst: each admitted attempt is
 * simulated exactly, and its own peak must stay under limit − margin), and compare its attempt
 * starts with the retry planner's fastest safe schedule on the firmware tick (fastestSchedule with
 * the tick as timer resolution): the guard can never be faster, and the difference is its
 * conservatism.
 * Cost O(corners × (attempts × cost of one attempt + ticks × parts × modes)).
 * @throws InputError from profileRetrySetup, buildThermalGuard and fixedPointGuard
 * @example
 * const report = planGuard(profile("warehouse-robot-48v.yaml"), defaultCircuitModels);
 * report.conservatism[0].burstRatio // => 1.0151
 */
export function planGuard(profile: DutyProfile, models: CircuitModels, options: GuardOptions = {}): GuardReport {
  const setup = profileRetrySetup(profile, models);
  const tickS = options.tickS ?? (setup.timing.timerResolutionS > 0 ? setup.timing.timerResolutionS : 1e-3);
  const guard = buildThermalGuard(setup, tickS);
  const numeric = options.numeric ?? "fixed";
  const fixed = numeric === "fixed" ? fixedPointGuard(guard, options.fractionBits, options.energyFractionBits) : null;
  const float = floatGuard(guard);
  const estimator = (): GuardEstimator => (fixed !== null ? new FixedPointEstimator(fixed) : new FloatEstimator(float));
  const attempts = options.attempts ?? Math.min(setup.attempts, GUARD_DEFAULTS.vectorAttempts);
  const bursts = setup.corners.map((_, c) => runGuardBurst(guard, setup, c, estimator(), attempts, { record: options.vectors === true }));
  const fastest = guard.neverSafe ? null : fastestSchedule(setup.scenarios, attempts, { timerResolutionS: tickS });
  const conservatism = bursts.map((b, c): GuardConservatism => {
    const own = fastest?.perCorner.filter((_, i) => Math.floor(i / setup.parts.length) === c)[0]?.attempts ?? [];
    const fastestStartsS = own.map((a) => a.startS);
    const guardStartsS = b.attempts.map((a) => a.startTick * tickS);
    const laterByS = guardStartsS.slice(0, fastestStartsS.length).map((s, i) => s - fastestStartsS[i]!);
    const fastestEnd = own.length === 0 ? 0 : own[own.length - 1]!.startS + own[own.length - 1]!.durationS;
    const full = guardStartsS.length === attempts && fastestStartsS.length === attempts;
    return { corner: b.corner, fastestStartsS, guardStartsS, laterByS, burstRatio: full && fastestEnd > 0 ? b.burstEndS / fastestEnd : null };
  });
  const peaks = bursts.flatMap((b, c) =>
    b.attempts.flatMap((a) => a.peakC.map((peak, p) => peakVerdict(peak, setup.scenarios[c * setup.parts.length + p]!.limitC, setup.scenarios[c * setup.parts.length + p]!.marginK))),
  );
  // with no attempt admitted, the first attempt alone decides
  const first = guard.neverSafe ? firstAttemptVerdicts(setup) : [];
  return { guard, numeric, fixed, float, attempts, bursts, conservatism, shortestWaitS: setup.shortestWaitS, verdict: worstVerdict([...peaks, ...first]), linearMosfet: setup.linearMosfet };
}

/** The verdict of the first attempt from ambient in every corner and part (the guard's "never"). */
function firstAttemptVerdicts(setup: ReturnType<typeof profileRetrySetup>): Verdict[] {
  return setup.scenarios.map((s, i) => {
    const trial = new AttemptCursor(resolveScenario(s, `corners[${i}]`)).tryAt(0)!;
    return peakVerdict(trial.record.peakC, s.limitC, s.marginK);
  });
}
