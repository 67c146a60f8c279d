import { describeFound, inputError } from "../errors/InputError.js";
import type { ModalModel } from "./ModalModel.js";
import { type ModalState, createModalState, modalRise } from "./modalStep.js";
import { type PowerTrace, validatePowerTrace } from "./powerTrace.js";
import { type HistoryPoint, runThermalHistory } from "./runThermalHistory.js";
import { traceSteps } from "./traceSteps.js";

/** One cycle of a periodic duty: power per model source on [0, periodS), repeated. */
export interface PeriodicCycle {
  /** the period T [s] > 0 */
  readonly periodS: number;
  /** one trace per model source (undefined: no power), segments inside [0, periodS] */
  readonly traces: readonly (PowerTrace | undefined)[];
}

/** Options of {@link periodicSteadyState}; see {@link PERIODIC_DEFAULTS}. */
export interface PeriodicOptions {
  /** number of repetitions N from a cold start (ambient); Infinity for the periodic steady state */
  readonly repetitions?: number;
  /** called for every step end and interior peak of the reported cycle (times within the cycle) */
  readonly onPoint?: (point: HistoryPoint) => void;
}

/** Defaults of {@link PeriodicOptions}. */
export const PERIODIC_DEFAULTS = { repetitions: Infinity } as const;

/** The reported cycle: the last of N repetitions, or the periodic steady state. */
export interface PeriodicResult {
  readonly periodS: number;
  readonly repetitions: number;
  /** modal state at the start of the reported cycle */
  readonly startState: ModalState;
  /** modal state at its end (for the steady state, equal to startState) */
  readonly endState: ModalState;
  /** rise per observed node at the start of the reported cycle [K] */
  readonly startRiseK: number[];
  /** highest rise per observed node within the reported cycle [K] */
  readonly peakRiseK: number[];
  /** time of that peak since the start of the cycle [s] */
  readonly peakTimeS: number[];
  /** end-of-cycle state of one cycle from ambient, d_m (the building block) */
  readonly singleCycleState: ModalState;
}

/**
 * The periodic steady state of a cycle repeated forever, or the last cycle of N repetitions from
 * ambient, without simulating the repetitions.
 *
 * Each modal state obeys a linear recurrence over one period: y_{k+1} = e^(−T/tau)·y_k + d, where
 * d is the state at the end of one cycle started from zero (computed exactly by the engine). Hence
 *   y_k = d·(1 + q + ... + q^(k−1)) = d·(1 − q^k)/(1 − q),   q = e^(−T/tau),
 * and for k → ∞, y_∞ = d/(1 − q). Both are evaluated with expm1: y_k = d·expm1(−k·T/tau)/expm1(−T/tau),
 * so neither very slow modes (T ≪ tau) nor very fast ones lose precision. The reported cycle (the
 * N-th, or the steady one) is then run once from y_{N−1} (or y_∞) with interior-peak search.
 * For power ≥ 0 each repetition only adds heat (the response of an RC network to non-negative
 * power is non-negative), so the last cycle is the hottest of the N; the cooling after it is not
 * part of the result.
 * Source: the first-order linear difference equation and its geometric-series solution, Boyce &
 * DiPrima, Elementary Differential Equations, 10th ed. (2012), §2.9; derivation above.
 * Cost O(segments per cycle × modes × sources) twice, independent of N.
 * @throws InputError `out-of-range` for a non-positive period or a repetition count that is not a
 *   positive integer or Infinity; `bad-trace` for segments outside the cycle
 * @example
 * const model = fosterToModal({ kind: "foster", stages: [{ rKPerW: 0.5, tauS: 0.01 }, { rKPerW: 1.5, tauS: 2 }] });
 * periodicSteadyState(model, { periodS: 1, traces: [[constantPowerSegment(0, 0.1, 20)]] }).peakRiseK // => [13.72]
 */
export function periodicSteadyState(model: ModalModel, cycle: PeriodicCycle, options: PeriodicOptions = {}, field = "cycle"): PeriodicResult {
  const T = cycle.periodS;
  const n = options.repetitions ?? PERIODIC_DEFAULTS.repetitions;
  if (!(T > 0) || !Number.isFinite(T)) throw inputError("out-of-range", `${field}.periodS`, "a finite period > 0 s", describeFound(T));
  if (!(n === Infinity || (Number.isInteger(n) && n >= 1)))
    throw inputError("out-of-range", `${field}.repetitions`, "a whole number of repetitions ≥ 1, or Infinity", describeFound(n));
  if (cycle.traces.length !== model.sources.length)
    throw inputError("bad-trace", `${field}.traces`, `one trace per heat source (${model.sources.length})`, String(cycle.traces.length));
  cycle.traces.forEach((trace, s) => {
    if (trace === undefined) return;
    const at = `${field}.traces[${s}]`;
    validatePowerTrace(trace, at);
    trace.forEach((seg, i) => {
      if (seg.startS < 0 || seg.startS + seg.durationS > T * (1 + 1e-12))
        throw inputError("bad-trace", `${at}[${i}]`, `a segment inside the cycle [0, ${T}] s`, `${seg.startS} s to ${seg.startS + seg.durationS} s`);
    });
  });
  const single = runThermalHistory(model, traceSteps(cycle.traces, 0, T), { findPeaks: false }).endState;
  const modes = model.tauS.length;
  const start = createModalState(model);
  const end = createModalState(model);
  for (let s = 0; s < model.sources.length; s++) {
    for (let m = 0; m < modes; m++) {
      const k = s * modes + m;
      const x = T / model.tauS[m]!;
      const denominator = Math.expm1(-x);
      start[k] = n === Infinity ? -single[k]! / denominator : (single[k]! * Math.expm1(-(n - 1) * x)) / denominator;
      end[k] = n === Infinity ? start[k]! : (single[k]! * Math.expm1(-n * x)) / denominator;
    }
  }
  const run = runThermalHistory(model, traceSteps(cycle.traces, 0, T), {
    initialState: start,
    ...(options.onPoint === undefined ? {} : { onPoint: options.onPoint }),
  });
  const observed = model.observed.length;
  const startRiseK = Array.from({ length: observed }, (_, o) => modalRise(model, start, o));
  // runThermalHistory floors its peaks at 0 and counts the start; keep the true start rise as a candidate.
  const peakRiseK = run.peakRiseK.map((p, o) => Math.max(p, startRiseK[o]!));
  const peakTimeS = run.peakTimeS.map((t, o) => (run.peakRiseK[o]! >= startRiseK[o]! ? t : 0));
  return { periodS: T, repetitions: n, startState: start, endState: n === Infinity ? start : end, startRiseK, peakRiseK, peakTimeS, singleCycleState: single };
}
