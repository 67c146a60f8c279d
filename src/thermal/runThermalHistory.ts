import type { ModalModel } from "./ModalModel.js";
import { type ModalState, advanceModalState, createModalState, createModalStepper, modalRise } from "./modalStep.js";
import { interiorPeaks } from "./segmentPeak.js";
import type { TimedStep } from "./traceSteps.js";

/** A point of a thermal history handed to the visitor. */
export interface HistoryPoint {
  /** absolute time [s] */
  readonly timeS: number;
  /** rise over ambient per observed node [K] (a fresh array per point unless HistoryOptions.freshPoints is false) */
  readonly riseK: readonly number[];
  /** "step-end": the end of a step; "peak": an interior local maximum of some observed node */
  readonly kind: "step-end" | "peak";
}

/** Options of {@link runThermalHistory}; every field has a default. */
export interface HistoryOptions {
  /** search every step for interior maxima (default true) */
  readonly findPeaks?: boolean;
  /** called for every step end and interior peak, in time order (default: none, streaming) */
  readonly onPoint?: (point: HistoryPoint) => void;
  /** state at the start (default: all nodes at ambient); it is copied, not modified */
  readonly initialState?: ModalState;
  /**
   * false: every point hands the visitor the same riseK array, refilled (the visitor copies what
   * it keeps; saves an allocation per point on long runs). Default true: a fresh array per point.
   */
  readonly freshPoints?: boolean;
}

/** What a run leaves: peaks per observed node and the end state. */
export interface HistorySummary {
  /** highest rise seen per observed node [K] (0 if never above ambient) */
  readonly peakRiseK: number[];
  /** time of that rise [s] */
  readonly peakTimeS: number[];
  /** rise per observed node at the end [K] */
  readonly endRiseK: number[];
  /** end time [s] */
  readonly endTimeS: number;
  /** modal state at the end */
  readonly endState: ModalState;
  /** number of steps integrated */
  readonly steps: number;
}

/**
 * Integrate a modal model exactly over a stream of steps, tracking the peak of every observed
 * node (at step ends and at interior maxima found by interiorPeaks) and handing every point to
 * an optional visitor. Memory is O(sources × modes) whatever the number of steps (streaming).
 * Cost O(steps × sources × modes) plus the peak search on steps that are not provably monotone.
 */
export function runThermalHistory(model: ModalModel, steps: Iterable<TimedStep>, options: HistoryOptions = {}): HistorySummary {
  const findPeaks = options.findPeaks ?? true;
  const visit = options.onPoint;
  const observed = model.observed.length;
  const shared = options.freshPoints === false ? new Array<number>(observed).fill(0) : undefined;
  const pointArray = (): number[] => shared ?? new Array<number>(observed);
  const state = options.initialState === undefined ? createModalState(model) : Float64Array.from(options.initialState);
  const step = createModalStepper(model);
  const scratch = new Float64Array(state.length);
  const peakRiseK = new Array<number>(observed).fill(0);
  const peakTimeS = new Array<number>(observed).fill(0);
  const startRise = Array.from({ length: observed }, (_, o) => modalRise(model, state, o));
  startRise.forEach((r, o) => {
    if (r > peakRiseK[o]!) peakRiseK[o] = r;
  });
  let endTimeS = 0;
  let count = 0;
  for (const s of steps) {
    if (findPeaks) {
      let found: { atS: number; riseK: number; o: number }[] | undefined;
      for (let o = 0; o < observed; o++) {
        const peaks = interiorPeaks(model, state, s.durationS, s.powers, o);
        if (peaks.length === 0) continue;
        found ??= [];
        for (const p of peaks) found.push({ atS: p.atS, riseK: p.riseK, o });
      }
      if (found !== undefined) {
        found.sort((a, b) => a.atS - b.atS);
        for (const p of found) {
          if (p.riseK > peakRiseK[p.o]!) {
            peakRiseK[p.o] = p.riseK;
            peakTimeS[p.o] = s.startS + p.atS;
          }
        }
        if (visit !== undefined) {
          for (const p of found) {
            const riseK = pointArray();
            if (observed === 1) riseK[0] = p.riseK;
            else {
              advanceModalState(model, state, p.atS, s.powers, scratch);
              for (let o = 0; o < observed; o++) riseK[o] = modalRise(model, scratch, o);
            }
            visit({ timeS: s.startS + p.atS, riseK, kind: "peak" });
          }
        }
      }
    }
    step(state, s.durationS, s.powers);
    endTimeS = s.startS + s.durationS;
    count++;
    // The visitor gets an array (fresh unless freshPoints is false); without one nothing is allocated per step.
    const riseK: number[] | undefined = visit === undefined ? undefined : pointArray();
    for (let o = 0; o < observed; o++) {
      const r = modalRise(model, state, o);
      if (riseK !== undefined) riseK[o] = r;
      if (r > peakRiseK[o]!) {
        peakRiseK[o] = r;
        peakTimeS[o] = endTimeS;
      }
    }
    if (visit !== undefined) visit({ timeS: endTimeS, riseK: riseK!, kind: "step-end" });
  }
  return {
    peakRiseK,
    peakTimeS,
    endRiseK: Array.from({ length: observed }, (_, o) => modalRise(model, state, o)),
    endTimeS,
    endState: state,
    steps: count,
  };
}
