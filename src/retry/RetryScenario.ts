import { describeFound, inputError } from "../errors/InputError.js";
import { type ModalModel, observedIndex, sourceIndex, validateModalModel } from "../thermal/ModalModel.js";
import type { PowerTrace } from "../thermal/powerTrace.js";

/** What an attempt model is told about the moment an attempt starts. */
export interface AttemptContext {
  /** 0-based index of the attempt in the whole history (bursts and lockouts included) */
  readonly attemptIndex: number;
  /** time since the previous attempt ended [s]; Infinity for the very first attempt */
  readonly waitS: number;
  /** capacitor (bus) voltage when the attempt starts [V] */
  readonly capacitorVoltageV: number;
  /** temperature of the observed node when the attempt starts [°C] (for temperature-dependent parts) */
  readonly partTemperatureC: number;
}

/** What one attempt does to the part and to the capacitor. */
export interface AttemptOutcome {
  /** power into the heated part, in attempt-local time (the attempt starts at t = 0), never negative */
  readonly trace: PowerTrace;
  /** how long the attempt lasts [s] (the next attempt cannot start earlier) */
  readonly durationS: number;
  /** capacitor voltage when the attempt ends [V] */
  readonly endVoltageV: number;
  /**
   * power into other sources of the same thermal model, by model source name, in attempt-local
   * time (for example the source resistor beside a MOSFET on one heatsink); default none
   */
  readonly otherTraces?: Readonly<Record<string, PowerTrace>>;
}

/** One pre-charge attempt into the fault: the circuit model seen by the planner. */
export type AttemptModel = (context: AttemptContext) => AttemptOutcome;

/**
 * The capacitor between attempts: its voltage after waiting `waitS` seconds from `voltageV`
 * (a bleeder, the load, or leakage). Must accept waitS = 0 (no change).
 */
export type DischargeModel = (voltageV: number, waitS: number) => number;

/**
 * One corner of the fault scenario: a thermal model of the part, the attempt and discharge models
 * at this corner's values, and the part's limit. Solvers take a list of corners and answer for the
 * worst one, which they name.
 */
export interface RetryScenario {
  /** the corner's name, used in every answer ("nominal", "hot, high bus") */
  readonly name: string;
  /** the part's thermal model */
  readonly model: ModalModel;
  /** model source the attempt's power enters (default: the first) */
  readonly source?: string;
  /** observed node whose temperature is limited (default: the first) */
  readonly observe?: string;
  /** ambient temperature [°C] */
  readonly ambientC: number;
  /** the part's maximum temperature [°C] */
  readonly limitC: number;
  /** design margin kept below the limit [K], ≥ 0 */
  readonly marginK: number;
  /** capacitor voltage before the first attempt [V] */
  readonly initialVoltageV: number;
  /** the attempt into the fault */
  readonly attempt: AttemptModel;
  /** the capacitor between attempts */
  readonly discharge: DischargeModel;
  /**
   * the shortest time from an attempt's end to the next attempt's start that the hardware allows
   * (the relay's release plus operate time, shortestAttemptWaitS) [s]; default 0. An attempt asked
   * to start sooner cannot happen: the solvers treat it like an attempt that would start before
   * the previous one ends.
   */
  readonly minWaitS?: number;
}

/** A corner with its defaults resolved and its limits checked: what the solvers work with. */
export interface ResolvedScenario {
  readonly name: string;
  readonly model: ModalModel;
  readonly sourceIndex: number;
  readonly observedIndex: number;
  readonly ambientC: number;
  readonly limitC: number;
  readonly marginK: number;
  /** the highest allowed temperature: limit − margin [°C] */
  readonly allowedC: number;
  /** the highest allowed rise over ambient [K] */
  readonly allowedRiseK: number;
  readonly initialVoltageV: number;
  readonly attempt: AttemptModel;
  readonly discharge: DischargeModel;
  /** shortest wait between attempts the hardware allows [s] */
  readonly minWaitS: number;
  /** slowest thermal time constant [s] */
  readonly slowestTauS: number;
}

/**
 * Check one corner and resolve its defaults.
 * @throws InputError `bad-network` for a bad thermal model or an unknown source/observed node;
 *   `out-of-range` for a limit minus margin that is not above ambient, a negative margin, a
 *   non-finite temperature or voltage, a shortest wait that is not finite and ≥ 0
 * @example
 * const scenario = {
 *   name: "short", model: fosterToModal({ kind: "foster", stages: [{ rKPerW: 0.5, tauS: 2 }] }),
 *   ambientC: 40, limitC: 150, marginK: 20, initialVoltageV: 0,
 *   attempt: () => ({ trace: [constantPowerSegment(0, 0.5, 400)], durationS: 0.5, endVoltageV: 0 }),
 *   discharge: () => 0,
 * };
 * resolveScenario(scenario).allowedC // => 130
 */
export function resolveScenario(scenario: RetryScenario, field = `corners.${scenario.name}`): ResolvedScenario {
  validateModalModel(scenario.model, `${field}.network`);
  const s = scenario.source === undefined ? 0 : sourceIndex(scenario.model, scenario.source, `${field}.source`);
  const o = scenario.observe === undefined ? 0 : observedIndex(scenario.model, scenario.observe, `${field}.observe`);
  for (const key of ["ambientC", "limitC", "marginK", "initialVoltageV"] as const) {
    if (!Number.isFinite(scenario[key])) throw inputError("not-finite", `${field}.${key}`, "a finite number", describeFound(scenario[key]));
  }
  const minWaitS = scenario.minWaitS ?? 0;
  if (!(minWaitS >= 0) || !Number.isFinite(minWaitS)) throw inputError("out-of-range", `${field}.minWaitS`, "a finite shortest wait ≥ 0 s", describeFound(minWaitS));
  if (scenario.marginK < 0) throw inputError("out-of-range", `${field}.marginK`, "a design margin ≥ 0 K", describeFound(scenario.marginK));
  const allowedC = scenario.limitC - scenario.marginK;
  if (!(allowedC > scenario.ambientC)) {
    throw inputError(
      "out-of-range",
      `${field}.limitC`,
      `a temperature limit above ambient (${scenario.ambientC} °C) plus the margin (${scenario.marginK} K)`,
      `${scenario.limitC} °C`,
    );
  }
  return {
    name: scenario.name,
    model: scenario.model,
    sourceIndex: s,
    observedIndex: o,
    ambientC: scenario.ambientC,
    limitC: scenario.limitC,
    marginK: scenario.marginK,
    allowedC,
    allowedRiseK: allowedC - scenario.ambientC,
    initialVoltageV: scenario.initialVoltageV,
    attempt: scenario.attempt,
    discharge: scenario.discharge,
    minWaitS,
    slowestTauS: Math.max(...scenario.model.tauS),
  };
}

/**
 * Check a corner set: at least one corner, unique names, each corner valid.
 * @throws InputError `bad-profile` for an empty set or a repeated name, and whatever resolveScenario throws
 * @example
 * const scenario = {
 *   name: "short", model: fosterToModal({ kind: "foster", stages: [{ rKPerW: 0.5, tauS: 2 }] }),
 *   ambientC: 40, limitC: 150, marginK: 20, initialVoltageV: 0,
 *   attempt: () => ({ trace: [constantPowerSegment(0, 0.5, 400)], durationS: 0.5, endVoltageV: 0 }),
 *   discharge: () => 0,
 * };
 * resolveCorners([scenario, { ...scenario, name: "hot", ambientC: 60 }]).map((c) => c.allowedRiseK) // => [90, 70]
 */
export function resolveCorners(corners: readonly RetryScenario[], field = "corners"): ResolvedScenario[] {
  if (corners.length === 0) throw inputError("bad-profile", field, "at least one corner", "none");
  const seen = new Set<string>();
  return corners.map((c, i) => {
    if (seen.has(c.name)) throw inputError("bad-profile", `${field}[${i}].name`, "a corner name used once", describeFound(c.name));
    seen.add(c.name);
    return resolveScenario(c, `${field}[${i}]`);
  });
}
