import type { AttemptProtection } from "../circuits/AttemptProtection.js";
import type { BusLoad } from "../circuits/BusLoad.js";
import type { CircuitResult } from "../circuits/CircuitResult.js";
import type { CircuitModels } from "../profile/CircuitModels.js";
import { ATTEMPT_TIMING_DEFAULTS } from "../profile/attemptTiming.js";
import type { DutyProfile, ProfilePart } from "../profile/DutyProfile.js";
import { type ForeverIntervalAnswer, minForeverInterval } from "../retry/minForeverInterval.js";
import type { RetryScenario } from "../retry/RetryScenario.js";
import type { AbortCheck, RiseCheck } from "./superviseChecks.js";
import { shortedScenario } from "./superviseShortScenario.js";
import type { HealthyBus } from "./superviseHealthyBus.js";
import { type LimitRecommendation, superviseLimits } from "./superviseLimits.js";

/** What one recommended check lets through, and how close healthy charges come to it. */
export interface CheckExposure {
  readonly kind: "early-abort" | "rise-too-fast";
  readonly timeS: number;
  /** the threshold as written into the profile fragment (rounded toward the healthy side) [V] */
  readonly thresholdV: number;
  /** energy a hard short puts into the part before the check fires [J] (early abort only) */
  readonly shortEnergyJ: number | null;
  /**
   * the weakest resistive fault across the bus that the check still catches (the bus exactly at the
   * threshold at the check time), the energy it puts into the part before the check fires, and what
   * a fault a hair weaker puts in until the timeout or a recommended limit (I²t, on-time) ends it
   * (the check cannot see it); null for a rise check
   * or when no resistive fault holds the bus at the threshold
   */
  readonly partialFault: { readonly resistanceOhm: number; readonly energyBeforeFiringJ: number; readonly missedEnergyJ: number } | null;
  /**
   * the same for a fault that draws a constant current from the bus (always on): the smallest
   * current the check still catches; null for a rise check or when none is in reach
   */
  readonly currentFault: { readonly currentA: number; readonly energyBeforeFiringJ: number; readonly missedEnergyJ: number } | null;
  /** closest healthy corner's distance from the threshold [V], as a fraction of its voltage, and the corner */
  readonly healthyMarginV: number;
  readonly healthyMarginFraction: number;
  readonly healthyCorner: string;
}

/** The recommended checks as profile protection, what they let through, and the retry-for-ever interval they buy. */
export interface ProtectedSupervision {
  /** the checks and limits as `circuit.protection` would hold them (what `supervise --checks` writes) */
  readonly protection: AttemptProtection;
  readonly checks: readonly CheckExposure[];
  /** the firmware I²t limit and the maximum on-time, each when it helps (superviseLimits) */
  readonly limits: readonly LimitRecommendation[];
  /** shortest interval for retrying for ever into a short at the profile's timeout, without and with the whole protection */
  readonly foreverWithout: ForeverIntervalAnswer;
  readonly foreverWith: ForeverIntervalAnswer;
  /** the same with the limits alone (no bus checks: firmware that cannot measure the bus); null without limits */
  readonly foreverWithLimits: ForeverIntervalAnswer | null;
}

/** What superviseProtection needs of the healthy corners to recommend limits beside the checks. */
export interface HealthyCharges {
  readonly buses: readonly HealthyBus[];
  readonly marginFraction: number;
  readonly startVoltageV: number;
  readonly horizonS: number;
}

/** Significant digits of a threshold written into the profile fragment. */
export const CHECK_THRESHOLD_DIGITS = 4;

/** x rounded to CHECK_THRESHOLD_DIGITS significant digits, down (up = false) or up. */
function roundSignificant(x: number, up: boolean): number {
  if (!(x > 0)) return x;
  const step = 10 ** (Math.floor(Math.log10(x)) - CHECK_THRESHOLD_DIGITS + 1);
  let k = up ? Math.ceil(x / step) : Math.floor(x / step);
  const at = (j: number): number => Number((j * step).toPrecision(CHECK_THRESHOLD_DIGITS));
  // the written value must lie on the healthy side of x even after the decimal rounding
  while (up ? at(k) < x : at(k) > x) k += up ? 1 : -1;
  return at(k);
}

/** Bisection steps on log(resistance) for the weakest caught fault: 2^-60 of 30 decades. */
const FAULT_BISECTION_STEPS = 60;

/**
 * The recommended early-abort and rise-too-fast checks turned into profile protection
 * (thresholds rounded to CHECK_THRESHOLD_DIGITS digits toward the healthy side: an abort
 * threshold down, a rise threshold up, so the margin to every healthy corner only grows), and
 * for each: the energy into the part before it fires into a hard short (the short's trace
 * integrated to the check time) and into the weakest resistive fault it catches (found by
 * bisection on log R of the bus voltage at the check time, which rises with R), the healthy
 * margin, and the shortest interval for retrying for ever into a short (minForeverInterval on the
 * shorted scenarios at both bus-voltage ends) at the profile's timeout without and with the checks.
 * Beside the checks, the limits of superviseLimits (a firmware I²t limit, a maximum on-time) join
 * the same protection when they help, and the interval with the limits alone is answered too.
 * Cost: 2 × 60 circuit runs per check for the partial fault, about 60 per healthy corner for the
 * I²t, plus three retry-for-ever scans.
 */
export function superviseProtection(
  profile: DutyProfile,
  models: CircuitModels,
  heated: readonly ProfilePart[],
  busEnds: readonly number[],
  abort: AbortCheck | null,
  rise: RiseCheck | null,
  healthy: HealthyCharges,
): ProtectedSupervision | null {
  const circuit = profile.circuit!;
  const timeoutS = circuit.completion.timeoutS;
  const primary = heated[0]!;
  const highV = Math.max(...busEnds);
  const limits = superviseLimits(profile, models, primary.role!, healthy.buses, highV, healthy.marginFraction, healthy.startVoltageV, healthy.horizonS);
  if (abort === null && rise === null && limits.length === 0) return null;
  const busChecks = [
    ...(abort === null ? [] : [{ atS: abort.timeS, minV: roundSignificant(abort.thresholdV, false) }]),
    ...(rise === null ? [] : [{ atS: rise.timeS, maxV: roundSignificant(rise.thresholdV, true) }]),
  ];
  const i2t = limits.find((l) => l.kind === "firmware-i2t");
  const onTime = limits.find((l) => l.kind === "max-on-time");
  const limitProtection: AttemptProtection = {
    ...(i2t === undefined ? {} : { i2t: [{ limitA2s: i2t.value, kind: "firmware" as const }] }),
    ...(onTime === undefined ? {} : { maxOnTimeS: onTime.value }),
  };
  const protection: AttemptProtection = { ...(busChecks.length === 0 ? {} : { busChecks }), ...limitProtection };
  const checks: CheckExposure[] = [];
  if (abort !== null) {
    const thresholdV = busChecks[0]!.minV!;
    checks.push({
      kind: "early-abort",
      timeS: abort.timeS,
      thresholdV,
      shortEnergyJ: abort.shortEnergyJ,
      ...weakestCaughtFaults(profile, models, primary, highV, abort.timeS, thresholdV, timeoutS, limitProtection),
      healthyMarginV: abort.lowestHealthyV - thresholdV,
      healthyMarginFraction: (abort.lowestHealthyV - thresholdV) / abort.lowestHealthyV,
      healthyCorner: abort.slowestCorner,
    });
  }
  if (rise !== null) {
    const thresholdV = busChecks[busChecks.length - 1]!.maxV!;
    checks.push({
      kind: "rise-too-fast",
      timeS: rise.timeS,
      thresholdV,
      shortEnergyJ: null,
      partialFault: null,
      currentFault: null,
      healthyMarginV: thresholdV - rise.highestHealthyV,
      healthyMarginFraction: (thresholdV - rise.highestHealthyV) / thresholdV,
      healthyCorner: rise.fastestCorner,
    });
  }
  const scenarios = (p?: AttemptProtection): RetryScenario[] => heated.flatMap((part) => busEnds.map((v) => shortedScenario(profile, part, v, timeoutS, models, p)));
  // the timer the retry planner rounds to (planRetries passes the profile's), so the answers match
  const options = { timerResolutionS: (profile.timing ?? ATTEMPT_TIMING_DEFAULTS).timerResolutionS };
  return {
    protection,
    checks,
    limits,
    foreverWithout: minForeverInterval(scenarios(), options),
    foreverWith: minForeverInterval(scenarios(protection), options),
    foreverWithLimits: limits.length === 0 ? null : minForeverInterval(scenarios(limitProtection), options),
  };
}

/** What a fault of one family does at one strength: the part's energy until a time, the bus voltage then. */
type FaultRun = (strength: number, untilS: number, protection?: AttemptProtection) => CircuitResult;

/**
 * The weakest fault of a one-parameter family that the early-abort check catches at the highest
 * bus voltage: the strength that holds the bus exactly at the threshold at the check time (the bus
 * voltage then is monotone in the strength: a smaller resistance or a larger current pulls it
 * lower), found by bisection on the log of the strength between `strong` (caught) and `weak` (not
 * caught); the part's energy until the check fires, and until the timeout or a recommended limit
 * ends it (a fault a hair weaker runs that long: the check cannot see it). Null when even the
 * strong end leaves the bus above the threshold, or the weak end below it.
 */
function weakestCaught(run: FaultRun, role: string, strong: number, weak: number, timeS: number, thresholdV: number, timeoutS: number, limits: AttemptProtection) {
  const caught = (x: number): boolean => run(x, timeS).endVoltageV < thresholdV;
  let lo = Math.log(strong);
  let hi = Math.log(weak);
  if (!caught(strong) || caught(weak)) return null;
  for (let n = 0; n < FAULT_BISECTION_STEPS; n++) {
    const mid = 0.5 * (lo + hi);
    if (caught(Math.exp(mid))) lo = mid;
    else hi = mid;
  }
  const x = Math.exp(lo);
  return { strength: x, energyBeforeFiringJ: run(x, timeS).energy.partsJ[role] ?? 0, missedEnergyJ: run(x, timeoutS, limits).energy.partsJ[role] ?? 0 };
}

/**
 * The weakest resistive fault (1 µΩ to 1 GΩ) and the weakest constant-current fault (always on;
 * from the current that holds the bus at 0 V, Vs over the circuit's resistance, down to 1e-9 of it)
 * the early-abort check catches. A constant-power fault is not searched: it switches on only at its
 * enable voltage, so whether a check sees it depends on that voltage (below the threshold: caught
 * like an overload; above it: never, the bus passes the threshold first) rather than on its power,
 * and there is no single weakest one (docs/planners.md, "Supervision answers").
 */
function weakestCaughtFaults(profile: DutyProfile, models: CircuitModels, part: ProfilePart, busV: number, timeS: number, thresholdV: number, timeoutS: number, limits: AttemptProtection) {
  const circuit = { ...profile.circuit!, busVoltageV: busV } as NonNullable<DutyProfile["circuit"]>;
  const runWith =
    (load: (x: number) => BusLoad): FaultRun =>
    (x, untilS, protection) =>
      models.charge(circuit, load(x), { sourceVoltageV: busV, initialVoltageV: 0, completion: { dwellS: untilS, timeoutS: untilS, ...(protection === undefined ? {} : { protection }) } });
  const role = part.role!;
  const resistive = weakestCaught(runWith((ohm) => ({ kind: "resistive", resistanceOhm: ohm })), role, 1e-6, 1e9, timeS, thresholdV, timeoutS, limits);
  // the largest current the source can push into a bus at 0 V: the short-circuit current of the
  // path, found from the shorted run's energy balance (source energy / (Vs · t))
  const short = models.charge(circuit, { kind: "short" }, { sourceVoltageV: busV, initialVoltageV: 0, completion: { dwellS: timeS, timeoutS: timeS } });
  const shortCurrentA = short.energy.sourceJ / (busV * timeS);
  const current =
    shortCurrentA > 0 && Number.isFinite(shortCurrentA)
      ? weakestCaught(runWith((a) => ({ kind: "constant-current", currentA: a })), role, shortCurrentA, 1e-9 * shortCurrentA, timeS, thresholdV, timeoutS, limits)
      : null;
  return {
    partialFault: resistive === null ? null : { resistanceOhm: resistive.strength, energyBeforeFiringJ: resistive.energyBeforeFiringJ, missedEnergyJ: resistive.missedEnergyJ },
    currentFault: current === null ? null : { currentA: current.strength, energyBeforeFiringJ: current.energyBeforeFiringJ, missedEnergyJ: current.missedEnergyJ },
  };
}
