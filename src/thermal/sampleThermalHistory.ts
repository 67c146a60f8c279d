import { describeFound, inputError } from "../errors/InputError.js";
import type { ModalModel } from "./ModalModel.js";
import { type ModalState, type SourcePowers, advanceModalState, createModalState, createModalStepper, modalRise } from "./modalStep.js";
import { interiorPeaks, riseSlope } from "./segmentPeak.js";
import type { TimedStep } from "./traceSteps.js";

/** A point of a sampled history. */
export interface SampledPoint {
  /** absolute time [s] */
  readonly timeS: number;
  /** rise over ambient per observed node [K] */
  readonly riseK: readonly number[];
  /** "sample": a requested time; "peak": a local maximum of observed node `node` */
  readonly kind: "sample" | "peak";
  /** for a peak, the observed node index whose local maximum it is; −1 for a sample */
  readonly node: number;
}

/** Options of {@link sampleThermalHistory}; see {@link SAMPLE_DEFAULTS}. */
export interface SampleOptions {
  /** report local maxima as well as the requested times */
  readonly findPeaks?: boolean;
  /** state at the first step's start (default: ambient); copied, not modified */
  readonly initialState?: ModalState;
}

/** Defaults of {@link SampleOptions}. */
export const SAMPLE_DEFAULTS = { findPeaks: true } as const;

const NO_POWER: SourcePowers = [];

/**
 * The thermal history at chosen times, plus every local maximum of every observed node, streamed
 * in time order.
 *
 * Samples inside a step are exact: the modal state is advanced in closed form from the step start
 * to the sample time (advanceModalState). Local maxima are (a) interior maxima inside a step
 * (interiorPeaks, to far better than 0.01 K) and (b) step boundaries where the rise was climbing
 * into the boundary and does not climb out of it (left slope > 0, right slope ≤ 0: the end of a
 * heating pulse). After the last step the power is zero: the last boundary is judged with zero
 * power, and requested times after it follow the free cooling of the network.
 * Memory O(sources × modes) whatever the number of steps (a generator: nothing is kept).
 * Source: closed-form modal update (see advanceModalState); a local maximum is where the
 * derivative changes sign from + to − (the first-derivative test of calculus).
 * Cost O(steps × sources × modes) plus the interior-peak search and O(modes) per sample.
 * @param steps steps in time order without gaps (for example from traceSteps)
 * @param timesS requested times [s], ascending, none before the first step's start
 * @throws InputError `out-of-range` for a requested time that is not finite, goes backwards, or
 *   precedes the first step
 * @example
 * const model = fosterToModal({ kind: "foster", stages: [{ rKPerW: 0.5, tauS: 0.01 }] });
 * const steps = [{ startS: 0, durationS: 0.01, powers: [[{ a: 10, b: 0, lambda: 0 }]] }];
 * [...sampleThermalHistory(model, steps, [0.005])][0].riseK // => [1.967]
 */
export function* sampleThermalHistory(
  model: ModalModel,
  steps: Iterable<TimedStep>,
  timesS: Iterable<number>,
  options: SampleOptions = {},
  field = "times",
): Generator<SampledPoint> {
  const findPeaks = options.findPeaks ?? SAMPLE_DEFAULTS.findPeaks;
  const observed = model.observed.length;
  const state = options.initialState === undefined ? createModalState(model) : Float64Array.from(options.initialState);
  const scratch = new Float64Array(state.length);
  const step = createModalStepper(model);
  const times = timesS[Symbol.iterator]();
  let index = -1;
  let previous = -Infinity;
  const nextTime = (): number | undefined => {
    const r = times.next();
    if (r.done === true) return undefined;
    index++;
    const t = r.value;
    if (!Number.isFinite(t)) throw inputError("out-of-range", `${field}[${index}]`, "a finite time in s", describeFound(t));
    if (t < previous) throw inputError("out-of-range", `${field}[${index}]`, `times in ascending order (at or after ${previous} s)`, describeFound(t));
    previous = t;
    return t;
  };
  const risesOf = (y: ModalState): number[] => {
    const out = new Array<number>(observed);
    for (let o = 0; o < observed; o++) out[o] = modalRise(model, y, o);
    return out;
  };
  let pending: number | undefined = nextTime();
  let first = true;
  let endS = 0;
  // The last boundary, not yet judged as a maximum: its time, rises and left slopes.
  let boundary: { timeS: number; riseK: number[]; leftSlope: number[] } | undefined;
  const slopesAt = (powers: SourcePowers, at: number): number[] => {
    const out = new Array<number>(observed);
    for (let o = 0; o < observed; o++) out[o] = riseSlope(model, state, powers, at, o);
    return out;
  };
  // Plain function (not a nested generator) so the per-step cost stays a few comparisons.
  const judgeBoundary = (powers: SourcePowers): SampledPoint[] | undefined => {
    const b = boundary;
    boundary = undefined;
    if (b === undefined || !findPeaks) return undefined;
    let out: SampledPoint[] | undefined;
    for (let o = 0; o < observed; o++) {
      if (b.leftSlope[o]! > 0 && riseSlope(model, state, powers, 0, o) <= 0) (out ??= []).push({ timeS: b.timeS, riseK: b.riseK, kind: "peak", node: o });
    }
    return out;
  };
  for (const s of steps) {
    if (first) {
      if (pending !== undefined && pending < s.startS)
        throw inputError("out-of-range", `${field}[${index}]`, `a time at or after the history's start (${s.startS} s)`, describeFound(pending));
      first = false;
      if (pending === s.startS) {
        yield { timeS: pending, riseK: risesOf(state), kind: "sample", node: -1 };
        pending = nextTime();
      }
    }
    if (!(s.durationS > 0)) continue;
    const boundaryPeaks = judgeBoundary(s.powers);
    if (boundaryPeaks !== undefined) yield* boundaryPeaks;
    const end = s.startS + s.durationS;
    let events: { atS: number; node: number }[] | undefined;
    if (findPeaks) for (let o = 0; o < observed; o++) for (const p of interiorPeaks(model, state, s.durationS, s.powers, o)) (events ??= []).push({ atS: p.atS, node: o });
    while (pending !== undefined && pending <= end) {
      (events ??= []).push({ atS: Math.max(0, pending - s.startS), node: -1 });
      pending = nextTime();
    }
    if (events !== undefined) {
      events.sort((a, b) => a.atS - b.atS);
      for (const e of events) {
        const riseK = risesOf(advanceModalState(model, state, e.atS, s.powers, scratch));
        yield { timeS: s.startS + e.atS, riseK, kind: e.node < 0 ? "sample" : "peak", node: e.node };
      }
    }
    step(state, s.durationS, s.powers);
    endS = end;
    if (findPeaks) {
      boundary = {
        timeS: end,
        riseK: risesOf(state),
        leftSlope: slopesAt(s.powers, s.durationS),
      };
    }
  }
  const lastPeaks = judgeBoundary(NO_POWER);
  if (lastPeaks !== undefined) yield* lastPeaks;
  while (pending !== undefined) {
    const riseK = risesOf(advanceModalState(model, state, Math.max(0, pending - endS), NO_POWER, scratch));
    yield { timeS: pending, riseK, kind: "sample", node: -1 };
    pending = nextTime();
  }
}
