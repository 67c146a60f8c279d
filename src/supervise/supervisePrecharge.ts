import { inputError } from "../errors/InputError.js";
import { hottestSteadySurroundings } from "../profile/hottestSteadySurroundings.js";
import { inProfileFile } from "../profile/inProfileFile.js";
import type { CircuitModels } from "../profile/CircuitModels.js";
import type { DutyProfile, ProfilePart, SupervisionSpec } from "../profile/DutyProfile.js";
import { formatDuration } from "../text/formatTable.js";
import { ATTEMPT_TIMING_DEFAULTS, type AttemptTiming, shortestAttemptWaitS } from "../profile/attemptTiming.js";
import { ceilToTimer } from "../retry/alignToTimer.js";
import { type MaxAttemptsAnswer, maxAttempts } from "../retry/maxAttempts.js";
import { type RetryScenario, resolveScenario } from "../retry/RetryScenario.js";
import { AttemptCursor } from "../retry/AttemptCursor.js";
import { retryPolicyVerdict } from "../retry/retryPolicyVerdict.js";
import { type Verdict, peakVerdict, worstVerdict } from "../stress/Verdict.js";
import { type AbortCheck, type RiseCheck, abortChecks, riseChecks, traceEnergyUntil } from "./superviseChecks.js";
import { healthyCorners } from "./superviseCorners.js";
import { SUPERVISE_DEFAULTS } from "./superviseDefaults.js";
import { type ShortEndurance, longestShortFromState, longestShortUnderPolicy } from "./superviseEndurance.js";
import { type HealthyBus, healthyBus } from "./superviseHealthyBus.js";
import { type SupervisedRetryPolicy, profileRetryPolicy } from "./superviseRetryPolicy.js";
import { shortedScenario } from "./superviseShortScenario.js";
import { type ProtectedSupervision, superviseProtection } from "./superviseProtection.js";

/** One healthy corner's charge. */
export interface HealthyCornerResult {
  readonly name: string;
  readonly capacitanceF: number;
  readonly busVoltageV: number;
  readonly thresholdV: number;
  /** time to the completion threshold [s]; Infinity when it never completes */
  readonly completionS: number;
  readonly outcome: string;
  /** timed out with the bus stalled below the threshold */
  readonly busStalled: boolean;
  readonly reason: string;
}

/** The timeout window: the shortest timeout every healthy corner completes in, the longest the part survives into a short. */
export interface TimeoutWindow {
  /** shortest timeout that lets every healthy corner complete [s] (Infinity when a corner never completes) */
  readonly lowerS: number;
  /** the corner that sets it */
  readonly lowerCorner: string;
  /** longest timeout into a short from a cold part, worst corner */
  readonly cold: ShortEndurance;
  /** longest timeout into a short through the profile's retry policy (burst, lockout, repeated), worst corner; null without a retry policy */
  readonly underRetry: ShortEndurance | null;
  /** the upper end used: the retry answer when there is one, else the cold one [s] */
  readonly upperS: number;
  /** upperS − lowerS [s] (negative when the ends cross) */
  readonly marginS: number;
  /** upperS / lowerS */
  readonly marginRatio: number;
  /** a safe timeout exists: lowerS < upperS */
  readonly exists: boolean;
  /** why no safe timeout exists ("" when one does) */
  readonly reason: string;
}

/** The healthy envelope and the short-circuit energy, sampled for plots. */
export interface SupervisionEnvelope {
  readonly timeS: readonly number[];
  /** lowest healthy bus voltage [V] */
  readonly lowV: readonly number[];
  /** highest healthy bus voltage [V] */
  readonly highV: readonly number[];
  /** energy a short puts into the part from the start [J] */
  readonly shortEnergyJ: readonly number[];
}

/** Retry storms: attempts back to back (or at the policy's interval) into a short before the part crosses its limit. */
export interface RetryStorm {
  /** the timeout every attempt runs into [s] (the profile's) */
  readonly timeoutS: number;
  /** restart as soon as the relay allows after each timeout */
  readonly backToBack: MaxAttemptsAnswer;
  /** the wait between attempts back to back: the relay's release plus operate time, rounded up to the firmware timer [s] */
  readonly backToBackWaitS: number;
  /** restart at the retry policy's first interval (start to start); null without a policy */
  readonly atPolicyInterval: MaxAttemptsAnswer | null;
}

/** Everything `heatledger supervise` reports. */
export interface SupervisionReport {
  readonly profile: string;
  /** the circuit is a linear-mode MOSFET (its report carries the MOSFET caution) */
  readonly linearMosfet: boolean;
  /** the part the energy and the checks are reported for (the first part heated by the circuit) */
  readonly part: string;
  /** highest bus voltage of the corner set: the short-circuit answers use it [V] */
  readonly shortBusVoltageV: number;
  readonly corners: readonly HealthyCornerResult[];
  readonly window: TimeoutWindow;
  /** the profile's own pre-charge timeout [s] and whether it lies inside the window */
  readonly configuredTimeoutS: number;
  readonly configuredInside: boolean;
  readonly marginFraction: number;
  /** measurement floor of the check thresholds [V] */
  readonly floorV: number;
  /** energy a short puts into the part until the profile's timeout [J] (what an early abort saves from) */
  readonly timeoutShortEnergyJ: number;
  readonly abortChecks: readonly AbortCheck[];
  readonly recommendedAbort: AbortCheck | null;
  readonly riseChecks: readonly RiseCheck[];
  readonly recommendedRise: RiseCheck | null;
  /** the recommended checks as profile protection, what each lets through, and the retry-for-ever interval they buy (null when no check is usable) */
  readonly protection: ProtectedSupervision | null;
  readonly policy: SupervisedRetryPolicy | null;
  /** the relay's switching times and the firmware's timer resolution used (the profile's, or ATTEMPT_TIMING_DEFAULTS) */
  readonly timing: AttemptTiming;
  readonly storm: RetryStorm;
  readonly envelope: SupervisionEnvelope;
  /**
   * the profile's timeout into a short, judged by the verdict rule (src/stress/Verdict.ts): every
   * attempt of the retry policy (or the one attempt from cold, without a policy) at that timeout,
   * worst part and bus voltage
   */
  readonly timeoutVerdict: Verdict;
  /**
   * pass: the profile's timeout is inside the window; warn: it is longer than the window allows,
   * and a short takes the part inside its margin but not above its limit; fail: above the limit,
   * or a timeout shorter than the slowest healthy charge (healthy units would be stopped)
   */
  readonly verdict: Verdict;
  /** one sentence per problem */
  readonly problems: readonly string[];
}

/**
 * The supervision parameters firmware must choose, for the profile's circuit and its
 * supervision corner set.
 * 1. Timeout window: the lower end is the slowest healthy corner's completion time (every corner
 *    run through the circuit model); the upper end the longest timeout the part survives into a
 *    shorted output, from cold (longestShortFromState) and through the profile's retry policy,
 *    burst and lockout repeated (longestShortUnderPolicy), worst over every heated part and both ends of the bus-voltage
 *    range. When the ends cross, no safe timeout exists (with the reason). The verdict judges the
 *    profile's own timeout: attempts into a short at that timeout through the retry policy, by the
 *    verdict rule (pass, warn, fail), and fail when it is shorter than the slowest healthy charge.
 * 2. Early-abort and rise-too-fast checks at the profile's check times, or at
 *    SUPERVISE_DEFAULTS.autoCheckFractions of the slowest completion time.
 * 3. Retry storms through the retry planner (maxAttempts) at the profile's timeout: attempts back
 *    to back (as soon as the relay can open and close again, on the firmware's timer), and at the
 *    policy's interval.
 * 4. The healthy envelope and the short-circuit energy curve for the plot.
 * 5. The recommended checks as profile protection (superviseProtection): what each lets through
 *    and the retry-for-ever interval into a short with and without them.
 * Cost O(corners × (checks + envelope points)) circuit runs plus O(parts × 2 × bisection steps ×
 * burst length) attempts.
 * @throws InputError when the profile has no circuit, no supervision section or no part heated by the circuit
 * @example
 * supervisePrecharge(profile("electric-boat-72v-supervision.yaml"), defaultCircuitModels).window.lowerS // => 0.5695
 */
export function supervisePrecharge(given: DutyProfile, models: CircuitModels): SupervisionReport {
  // a problem found while the answers are computed (a circuit model refusing a load) names the profile
  return inProfileFile(given.file, () => superviseProfile(given, models));
}

function superviseProfile(given: DutyProfile, models: CircuitModels): SupervisionReport {
  // an ambient that varies and extra heat sources: answer at the constant ambient that bounds them
  const profile = hottestSteadySurroundings(given);
  const circuit = profile.circuit;
  if (circuit === undefined) throw inputError("bad-profile", "circuit", "a `circuit` section (the supervision answers are about its pre-charge)", "a profile without one");
  const spec: SupervisionSpec | undefined = profile.supervision;
  if (spec === undefined) throw inputError("bad-profile", "supervision", "a supervision section (corners: capacitance range, ...)", "a profile without one");
  const heated: ProfilePart[] = profile.parts.filter((p) => p.role !== undefined);
  if (heated.length === 0) throw inputError("bad-profile", "parts", "a part heated by the circuit (a part with a role)", "no part with a role");
  const primary = heated[0]!;
  const timeoutS = circuit.completion.timeoutS;
  const marginFraction = spec.checkMarginFraction ?? SUPERVISE_DEFAULTS.checkMarginFraction;
  const floorV = spec.minCheckVoltageV ?? SUPERVISE_DEFAULTS.minCheckVoltageFraction * spec.busVoltageV.low;
  const problems: string[] = [];

  // 1. healthy corners: the lower end of the window
  const horizonS = SUPERVISE_DEFAULTS.healthyHorizonTimeoutMultiple * timeoutS;
  const buses: HealthyBus[] = healthyCorners(spec, circuit).map((c) => healthyBus(models, circuit, c, spec.startVoltageV, horizonS));
  let slowest = buses[0]!;
  for (const b of buses) if (b.completionS > slowest.completionS) slowest = b;
  const lowerS = slowest.completionS;

  // 1. shorted output: the upper end, cold and through the retry burst
  const busEnds = spec.busVoltageV.low === spec.busVoltageV.high ? [spec.busVoltageV.high] : [spec.busVoltageV.high, spec.busVoltageV.low];
  const builders = heated.flatMap((part) => busEnds.map((v) => (t: number): RetryScenario => shortedScenario(profile, part, v, t, models)));
  const worst = (list: ShortEndurance[]): ShortEndurance => list.reduce((a, b) => (b.longestS < a.longestS ? b : a));
  const cold = worst(builders.map((b) => longestShortFromState(b)));
  const policy = profileRetryPolicy(profile.events);
  const underRetry = policy === null ? null : worst(builders.map((b) => longestShortUnderPolicy(b, policy)));
  const upperS = (underRetry ?? cold).longestS;
  const exists = lowerS < upperS;
  let reason = "";
  if (!Number.isFinite(lowerS)) reason = `the healthy corner "${slowest.corner.name}" never completes (${slowest.reason})`;
  else if (!exists)
    reason = `the slowest healthy corner ("${slowest.corner.name}") needs ${formatDuration(lowerS)}, but the part survives a short only ${formatDuration(upperS)}${underRetry === null ? " from cold" : " through the retry policy"} (corner "${(underRetry ?? cold).corner}")`;
  if (!exists) problems.push(`no safe timeout exists: ${reason}`);
  const window: TimeoutWindow = {
    lowerS,
    lowerCorner: slowest.corner.name,
    cold,
    underRetry,
    upperS,
    marginS: upperS - lowerS,
    marginRatio: upperS / lowerS,
    exists,
    reason,
  };
  const configuredInside = timeoutS >= lowerS && timeoutS <= upperS;
  if (exists && !configuredInside)
    problems.push(`the profile's timeout ${formatDuration(timeoutS)} is outside the window ${formatDuration(lowerS)} to ${Number.isFinite(upperS) ? formatDuration(upperS) : "unbounded"}`);
  // the verdict: the profile's own timeout into a short, as firmware would run it
  const timeoutVerdict = worstVerdict(builders.map((b) => shortVerdict(b(timeoutS), policy)));
  let verdict = timeoutS > upperS ? worstVerdict([timeoutVerdict, "warn"]) : timeoutVerdict;
  if (!(timeoutS >= lowerS)) verdict = "fail";

  // 2. checks; the short's power trace into the primary part at the highest bus voltage
  const base = Number.isFinite(lowerS) && lowerS < timeoutS ? lowerS : timeoutS;
  const autoTimes = SUPERVISE_DEFAULTS.autoCheckFractions.map((f) => f * base);
  const checkTimes = spec.checkTimesS ?? autoTimes;
  const riseTimes = spec.riseCheckTimesS ?? checkTimes;
  const tEnd = Math.max(Number.isFinite(lowerS) ? lowerS : 0, timeoutS, ...checkTimes, ...riseTimes);
  const shortRun = shortedScenario(profile, primary, spec.busVoltageV.high, tEnd, models).attempt({ attemptIndex: 0, waitS: Infinity, capacitorVoltageV: 0, partTemperatureC: primary.ambientC });
  const timeoutEnergyJ = traceEnergyUntil(shortRun.trace, timeoutS);
  const aborts = abortChecks(buses, checkTimes, marginFraction, floorV, shortRun.trace, timeoutEnergyJ);
  const recommendedAbort = aborts.filter((c) => c.usable).reduce<AbortCheck | null>((best, c) => (best === null || c.shortEnergyJ < best.shortEnergyJ ? c : best), null);
  const rises = riseChecks(buses, riseTimes, marginFraction, floorV, spec.busVoltageV.low);
  const recommendedRise = rises.find((c) => c.usable) ?? null;
  const protection = superviseProtection(profile, models, heated, busEnds, recommendedAbort, recommendedRise, { buses, marginFraction, startVoltageV: spec.startVoltageV, horizonS });

  // 3. retry storms at the profile's timeout, through the retry planner
  const stormScenarios = heated.flatMap((part) => busEnds.map((v) => shortedScenario(profile, part, v, timeoutS, models)));
  // back to back is as soon as the relay can open and close again, on the firmware's timer
  const timing = profile.timing ?? ATTEMPT_TIMING_DEFAULTS;
  const backToBackWaitS = ceilToTimer(shortestAttemptWaitS(timing), timing.timerResolutionS);
  const backToBack = maxAttempts(stormScenarios, backToBackWaitS, "end-to-start");
  const atPolicyInterval = policy === null ? null : maxAttempts(stormScenarios, Math.max(shortestAttemptWaitS(timing), policy.intervalS - timeoutS), "end-to-start");

  // 4. envelope
  const n = SUPERVISE_DEFAULTS.envelopePoints;
  const timeGrid = Array.from({ length: n }, (_, i) => (tEnd * i) / (n - 1));
  const lowV: number[] = [];
  const highV: number[] = [];
  for (const t of timeGrid) {
    let lo = Infinity;
    let hi = -Infinity;
    for (const b of buses) {
      const v = b.voltageAt(t);
      lo = Math.min(lo, v);
      hi = Math.max(hi, v);
    }
    lowV.push(lo);
    highV.push(hi);
  }
  const shortEnergyJ = timeGrid.map((t) => traceEnergyUntil(shortRun.trace, t));

  return {
    profile: profile.name,
    linearMosfet: circuit.topology === "linear-mosfet",
    part: primary.id,
    shortBusVoltageV: spec.busVoltageV.high,
    corners: buses.map((b) => ({
      name: b.corner.name,
      capacitanceF: b.corner.capacitanceF,
      busVoltageV: b.corner.busVoltageV,
      thresholdV: b.corner.thresholdV,
      completionS: b.completionS,
      outcome: b.outcome,
      busStalled: b.busStalled,
      reason: b.reason,
    })),
    window,
    configuredTimeoutS: timeoutS,
    configuredInside,
    marginFraction,
    floorV,
    timeoutShortEnergyJ: timeoutEnergyJ,
    abortChecks: aborts,
    recommendedAbort,
    riseChecks: rises,
    recommendedRise,
    protection,
    policy,
    timing,
    storm: { timeoutS, backToBack, backToBackWaitS, atPolicyInterval },
    envelope: { timeS: timeGrid, lowV, highV, shortEnergyJ },
    timeoutVerdict,
    verdict,
    problems,
  };
}

/**
 * The verdict of attempts into a short at one timeout: through the retry policy
 * (retryPolicyVerdict: the burst from cold and burst + lockout repeated), or, without a policy,
 * one attempt from a cold part (its own peak against limit − margin and the limit).
 * Cost: one retryPolicyVerdict, or one attempt.
 */
function shortVerdict(scenario: RetryScenario, policy: SupervisedRetryPolicy | null): Verdict {
  if (policy !== null) return retryPolicyVerdict([scenario], policy.burst, policy.lockoutS).verdict;
  const corner = resolveScenario(scenario);
  const trial = new AttemptCursor(corner).tryAt(0)!;
  return peakVerdict(trial.record.peakC, corner.limitC, corner.marginK);
}
