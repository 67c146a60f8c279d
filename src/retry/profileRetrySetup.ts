import { inputLimit } from "../format/inputLimits.js";
import { hottestSteadySurroundings, surroundingsBound } from "../profile/hottestSteadySurroundings.js";
import type { ChargeConditions, CircuitResult } from "../circuits/CircuitResult.js";
import { loadProblemsAt } from "../profile/loadProblemsAt.js";
import { circuitReadsTemperature } from "../profile/circuitReadsTemperature.js";
import { inputError } from "../errors/InputError.js";
import type { CircuitModels } from "../profile/CircuitModels.js";
import type { DutyProfile, FaultSpec, ProfileCircuit } from "../profile/DutyProfile.js";
import type { PowerTrace } from "../thermal/powerTrace.js";
import { ATTEMPT_TIMING_DEFAULTS, type AttemptTiming, shortestAttemptWaitS } from "../profile/attemptTiming.js";
import { ceilToTimer } from "./alignToTimer.js";
import { type RetryBlock, firstRetryBlock } from "./firstRetryBlock.js";
import { PLAN_DEFAULTS } from "./planDefaults.js";
import type { AttemptOutcome, RetryScenario } from "./RetryScenario.js";
import { type BurstPlan, type RetrySpacing, backoffBurst } from "./RetrySchedule.js";

export type { RetryBlock } from "./firstRetryBlock.js";

/** Everything `heatledger retries` needs from a profile, resolved. */
export interface ProfileRetrySetup {
  /** the profile's retry block with a fault (the first one, depth first) */
  readonly retry: RetryBlock;
  /** its fault */
  readonly fault: FaultSpec;
  /** the profile's own policy as a burst (start-to-start gaps with back-off, as the profile expands it) */
  readonly policy: BurstPlan;
  /** the profile's own lockout [s] */
  readonly lockoutS: number;
  /** one scenario per corner and watched part, named "corner / part" (or the corner alone with one part) */
  readonly scenarios: readonly RetryScenario[];
  /** the corner names, in order */
  readonly corners: readonly string[];
  /** ids of the parts watched (heated by the circuit, or sharing a network with a heated part) */
  readonly parts: readonly string[];
  /** attempts for the uniform-interval, fastest-schedule and back-off answers */
  readonly attempts: number;
  /** interval for the attempt-count answer [s] */
  readonly intervalS: number;
  readonly spacing: RetrySpacing;
  /** "back near ambient" distance [K] */
  readonly nearAmbientK: number;
  /** lockout map: rows 1..attempts, intervals log-spaced from fromS to toS */
  readonly map: { readonly attempts: number; readonly fromS: number; readonly toS: number; readonly points: number };
  /** the circuit is a linear-mode MOSFET (its report carries the extra caution) */
  readonly linearMosfet: boolean;
  /** the relay's switching times and the firmware's timer resolution (the profile's, or ATTEMPT_TIMING_DEFAULTS) */
  readonly timing: AttemptTiming;
  /** shortest wait between attempts the relay allows, rounded up to the timer [s]: no answer proposes less */
  readonly shortestWaitS: number;
}

/** Defaults of the profile's retryPlan section, declared once. */
export const RETRY_PLAN_DEFAULTS = {
  /** lockout map intervals, when the section gives none */
  mapPoints: 40,
  /** lockout map rows: the retry block's attempts times this, at least 10 */
  mapAttemptsFactor: 2,
  /** lockout map top: this many slowest thermal time constants */
  mapToTauMultiple: 5,
} as const;

/** Attempt outcomes remembered per corner and part. */
const ATTEMPT_MEMO_SIZE = 512;

/**
 * Build the planner's corners from a duty profile: the fault of its (first) retry block, its
 * circuit at every corner of `retryPlan.corners` (bus voltage, ambient, capacitance and
 * series resistance changed from the profile's values; with no corner set, the profile itself
 * is the one corner "nominal"), and every part the circuit heats (plus parts sharing a network
 * with one) with its own limit and margin. Each attempt is one pre-charge into the fault's bus
 * load from the capacitor's voltage after the wait, through `models.charge`; a completed charge
 * leaves the bus at its full voltage and, for a trip-after-close fault, lasts `after` longer
 * (the contactor closed, then tripped), as the profile's expansion does. The capacitor
 * discharges between attempts along the profile's discharge path (`models.discharge`). The
 * first attempt starts from an empty capacitor (the most energy). No attempt may start sooner
 * after the previous one's end than the relay's release plus operate time (`circuit.relay`, the
 * scenarios' minWaitS); the firmware's timer resolution (`firmware.timerResolution`) is handed
 * to the solvers through `timing`.
 * Source: event semantics of docs/profile-format.md, charge bookkeeping of docs/design.md ("Circuit bookkeeping").
 * Cost O(corners × parts).
 * @throws InputError `bad-profile` when the profile has no circuit, no retry block with a fault,
 *   or a corner sets a resistance for a topology without a series resistor; `out-of-range` when
 *   the lockout map's longest interval is not above its shortest
 * @example
 * profileRetrySetup(profile("warehouse-robot-48v.yaml"), defaultCircuitModels).attempts // => 8
 */
export function profileRetrySetup(given: DutyProfile, models: CircuitModels): ProfileRetrySetup {
  // an ambient that varies and extra heat sources: plan at the constant ambient that bounds them
  const heatRiseK = given.surroundings === undefined ? undefined : surroundingsBound(given).heatRiseK;
  const profile = hottestSteadySurroundings(given);
  const circuit = profile.circuit;
  if (circuit === undefined) throw inputError("bad-profile", "circuit", "a pre-charge circuit (the retry planner needs one)", "none");
  const retry = firstRetryBlock(profile.events, (block) => block.fault !== undefined);
  if (retry === undefined) throw inputError("bad-profile", "events", "a retry block with a fault (the fault the planner retries into)", "none");
  const fault = retry.fault!;
  const plan = profile.retryPlan ?? {};
  const timing = profile.timing ?? ATTEMPT_TIMING_DEFAULTS;
  const heated = profile.parts.filter((p) => p.role !== undefined);
  const keys = new Set(heated.map((p) => p.networkKey));
  const watched = profile.parts.filter((p) => keys.has(p.networkKey));
  if (watched.length === 0) throw inputError("bad-profile", "parts", "a part with a circuit role (resistor, mosfet, source-resistor or switch)", "none");
  const cornerSpecs = plan.corners ?? [{ name: "nominal" }];
  const scenarios: RetryScenario[] = [];
  cornerSpecs.forEach((spec, ci) => {
    if (spec.resistance !== undefined && circuit.topology !== "series-resistor")
      throw inputError("bad-profile", `retryPlan.corners[${ci}].resistance`, "no resistance: it applies to series-resistor circuits only", `a ${circuit.topology} circuit`);
    const c: ProfileCircuit = {
      ...circuit,
      ...(spec.busVoltage === undefined ? {} : { busVoltageV: spec.busVoltage }),
      ...(spec.capacitance === undefined ? {} : { capacitanceF: spec.capacitance }),
      ...(spec.resistance === undefined ? {} : { resistanceOhm: spec.resistance }),
    } as ProfileCircuit;
    for (const part of watched) {
      const sameNetwork = heated.filter((h) => h.networkKey === part.networkKey);
      // The circuit model is the costly step of an attempt and solvers ask for the same start
      // again and again (a shorted bus always starts at 0 V): remember recent outcomes, keyed by
      // the start voltage, and by the part temperature when the model reads it (circuitReadsTemperature).
      const memo = new Map<string, AttemptOutcome>();
      const readsTemperature = circuitReadsTemperature(c);
      const attempt = (context: { capacitorVoltageV: number; partTemperatureC: number }): AttemptOutcome => {
        const key = readsTemperature ? `${context.capacitorVoltageV}|${context.partTemperatureC}` : `${context.capacitorVoltageV}`;
        const known = memo.get(key);
        if (known !== undefined) return known;
        const outcome = freshAttempt(context);
        if (memo.size >= ATTEMPT_MEMO_SIZE) memo.delete(memo.keys().next().value!);
        memo.set(key, outcome);
        return outcome;
      };
      const freshAttempt = (context: { capacitorVoltageV: number; partTemperatureC: number }): AttemptOutcome => {
        const partTemperatureC: Record<string, number> = {};
        for (const h of heated) partTemperatureC[h.role!] = context.partTemperatureC;
        const conditions: ChargeConditions = { sourceVoltageV: c.busVoltageV, initialVoltageV: context.capacitorVoltageV, completion: c.completion, partTemperatureC };
        let r: CircuitResult;
        try {
          r = models.charge(c, fault.load, conditions);
        } catch (error) {
          throw loadProblemsAt(error, fault.loadField);
        }
        const completed = r.outcome === "completed";
        // a charge that completes and then trips lasts until the trip, counted from the contactor's
        // contacts closing (its operate time after the completion)
        const durationS = r.durationS + (completed && fault.tripAfterS !== undefined ? (timing.contactorOperateS ?? 0) + fault.tripAfterS : 0);
        const own: PowerTrace = part.role === undefined ? [] : (r.traces[part.role] ?? []);
        const otherTraces: Record<string, PowerTrace> = {};
        for (const h of sameNetwork) {
          if (h === part) continue;
          const t = r.traces[h.role!];
          if (t !== undefined && t.length > 0) otherTraces[h.model.sources[h.sourceIndex]!] = t;
        }
        return { trace: own, durationS, endVoltageV: completed ? c.busVoltageV : r.endVoltageV, ...(Object.keys(otherTraces).length === 0 ? {} : { otherTraces }) };
      };
      scenarios.push({
        name: watched.length === 1 ? spec.name : `${spec.name} / ${part.id}`,
        model: part.model,
        source: part.model.sources[part.sourceIndex]!,
        observe: part.model.observed[part.observedIndex]!,
        ambientC: spec.ambient === undefined ? part.ambientC : spec.ambient + (heatRiseK?.[profile.parts.indexOf(part)] ?? 0),
        limitC: part.limitC,
        marginK: part.marginK,
        initialVoltageV: 0,
        attempt,
        discharge: (v, waitS) => models.discharge(c.discharge, c.capacitanceF, v, waitS),
        minWaitS: shortestAttemptWaitS(timing),
      });
    }
  });
  const slowest = Math.max(...watched.flatMap((p) => p.model.tauS));
  const attempts = plan.attempts ?? retry.attempts;
  const mapFromS = plan.map?.from ?? Math.min(retry.intervalS, slowest) / 10;
  const mapToS = plan.map?.to ?? RETRY_PLAN_DEFAULTS.mapToTauMultiple * slowest;
  if (!(mapToS > mapFromS)) throw inputError("out-of-range", "retryPlan.map.to", `a longest interval above the shortest (${mapFromS} s)`, `${mapToS} s`);
  return {
    retry,
    fault,
    policy: backoffBurst(retry.attempts, retry.intervalS, retry.backoff, retry.maxIntervalS),
    lockoutS: retry.lockoutS,
    scenarios,
    corners: cornerSpecs.map((s) => s.name),
    parts: watched.map((p) => p.id),
    attempts,
    intervalS: plan.interval ?? retry.intervalS,
    spacing: plan.spacing ?? PLAN_DEFAULTS.spacing,
    nearAmbientK: plan.nearAmbient ?? PLAN_DEFAULTS.ambientReturnK,
    map: {
      attempts: plan.map?.attempts ?? Math.min(inputLimit("maxMapSide"), Math.max(10, RETRY_PLAN_DEFAULTS.mapAttemptsFactor * retry.attempts)),
      fromS: mapFromS,
      toS: mapToS,
      points: plan.map?.points ?? RETRY_PLAN_DEFAULTS.mapPoints,
    },
    linearMosfet: circuit.topology === "linear-mosfet",
    timing,
    shortestWaitS: ceilToTimer(shortestAttemptWaitS(timing), timing.timerResolutionS),
  };
}
