import type { ModalModel } from "./ModalModel.js";
import { type ModalState, type SourcePowers, advanceModalState, createModalState, createModalStepper, modalRise } from "./modalStep.js";
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
   * false: every point hands the visitor the same point object and riseK array, refilled (the
   * visitor copies what it keeps; saves allocations on long runs). Default true: fresh ones.
   */
  readonly freshPoints?: boolean;
  /**
   * a rise per observed node [K] (e.g. a limit less the ambient): the run finds the first time
   * each node's rise goes above it, exactly, inside the step where that happens
   * (HistorySummary.firstCrossingS). Exact with findPeaks on (the default); with it off only step
   * ends are seen, so a crossing inside a step that ends below the level is missed. Default: none.
   */
  readonly crossingRiseK?: readonly number[];
  /** called when a node first crosses its crossingRiseK level, with the exact time [s], before the point that showed it is visited */
  readonly onCrossing?: (observed: number, timeS: number) => void;
  /** extra samples between step ends for plots and time-series files (default: none); see {@link HistorySampling} */
  readonly sampling?: HistorySampling;
  /** called for every extra sample (absolute time [s], rise per observed node [K]; the array is refilled, copy what you keep), in time order with the points */
  readonly onSample?: (timeS: number, riseK: readonly number[]) => void;
}

/**
 * Where a run samples the history between step ends (each sample exact: the closed-form modal
 * advance from the step start). Samples never feed the peaks, crossings or the summary: they are
 * only handed to HistoryOptions.onSample, so a run's answers do not depend on them.
 */
export interface HistorySampling {
  /** a sample at every whole multiple of this time inside each step [s] (evenly spaced on the absolute clock) */
  readonly everyS?: number;
  /**
   * geometric samples inside every step: the first a quarter of the model's fastest time constant
   * after the step start, each next one `ratio` times later (> 1), up to the step end: denser near
   * the start, where a sum of exponentials bends most, so every mode's decay is drawn as a curve
   * whatever the step's length (about log_ratio(4·duration/fastest tau) samples per step)
   */
  readonly ratio?: number;
  /** the step cut into this many equal parts, a sample at each inner cut (so a linear time axis sees the tail of a long step too) */
  readonly divisions?: number;
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
  /** per observed node, the first time its rise went above HistoryOptions.crossingRiseK [s]; undefined if never (or not asked) */
  readonly firstCrossingS: readonly (number | undefined)[];
}

/**
 * Integrate a modal model exactly over a stream of steps, tracking the peak of every observed
 * node (at step ends and at interior maxima found by interiorPeaks) and handing every point to
 * an optional visitor. Memory is O(sources × modes) whatever the number of steps (streaming).
 * Cost O(steps × sources × modes) plus the peak search on steps that are not provably monotone.
 * @example
 * const model = fosterToModal({ kind: "foster", stages: [{ rKPerW: 0.5, tauS: 0.01 }, { rKPerW: 1.5, tauS: 2 }] });
 * runThermalHistory(model, [{ startS: 0, durationS: 0.01, powers: [[{ a: 10, b: 0, lambda: 0 }]] }]).peakRiseK // => [3.235]
 */
export function runThermalHistory(model: ModalModel, steps: Iterable<TimedStep>, options: HistoryOptions = {}): HistorySummary {
  const run = new ThermalRun(model, options);
  for (const s of steps) run.push(s);
  return run.summary();
}

/**
 * The push form of {@link runThermalHistory}: the caller hands steps one at a time (`push`), in
 * time order, and reads the summary at any point. For producers that are themselves loops (a
 * profile walk) this saves wrapping them in a generator. Same arithmetic, same points.
 * Cost per step as runThermalHistory; memory O(sources × modes).
 * @example
 * const run = new ThermalRun(fosterToModal({ kind: "foster", stages: [{ rKPerW: 0.5, tauS: 0.01 }] }));
 * run.push({ startS: 0, durationS: 0.01, powers: [[{ a: 10, b: 0, lambda: 0 }]] });
 * run.summary().peakRiseK // => [3.161]
 */
export class ThermalRun {
  private readonly model: ModalModel;
  private readonly findPeaks: boolean;
  private readonly visit: ((point: HistoryPoint) => void) | undefined;
  private readonly observed: number;
  private readonly state: ModalState;
  private readonly step: (state: ModalState, h: number, powers: SourcePowers) => ModalState;
  private readonly scratch: ModalState;
  private readonly shared: number[] | undefined;
  private readonly reusedPoint: { timeS: number; riseK: number[]; kind: HistoryPoint["kind"] } | undefined;
  private readonly peakRiseK: number[];
  private readonly peakTimeS: number[];
  private endTimeS = 0;
  private count = 0;
  /** crossing levels (rise [K]) per observed node, and the first crossing times found */
  private readonly levels: readonly number[] | undefined;
  private readonly crossings: (number | undefined)[];
  /** nodes still below their level (none: no start state is kept per step) */
  private pending: number;
  private readonly startState: ModalState;
  private readonly sampling: HistorySampling | undefined;
  private readonly onSample: ((timeS: number, riseK: readonly number[]) => void) | undefined;
  private readonly sampleRise: number[];
  private readonly fastestTauS: number;
  private readonly onCrossing: ((observed: number, timeS: number) => void) | undefined;

  constructor(model: ModalModel, options: HistoryOptions = {}) {
    this.model = model;
    this.findPeaks = options.findPeaks ?? true;
    this.visit = options.onPoint;
    this.observed = model.observed.length;
    this.state = options.initialState === undefined ? createModalState(model) : Float64Array.from(options.initialState);
    this.step = createModalStepper(model);
    this.scratch = new Float64Array(this.state.length);
    this.shared = options.freshPoints === false ? new Array<number>(this.observed).fill(0) : undefined;
    this.reusedPoint = this.shared === undefined ? undefined : { timeS: 0, riseK: this.shared, kind: "step-end" };
    this.peakRiseK = new Array<number>(this.observed).fill(0);
    this.peakTimeS = new Array<number>(this.observed).fill(0);
    this.levels = options.crossingRiseK;
    this.crossings = new Array<number | undefined>(this.observed).fill(undefined);
    this.startState = new Float64Array(this.state.length);
    this.pending = 0;
    this.onSample = options.onSample;
    this.sampling = options.onSample === undefined ? undefined : options.sampling;
    this.sampleRise = new Array<number>(this.observed).fill(0);
    this.onCrossing = options.onCrossing;
    this.fastestTauS = model.tauS.length === 0 ? 1 : Math.min(...model.tauS);
    for (let o = 0; o < this.observed; o++) {
      const r = modalRise(model, this.state, o);
      if (r > this.peakRiseK[o]!) this.peakRiseK[o] = r;
      if (this.levels === undefined) continue;
      // a node already above its level at the start crosses at the start
      if (r > this.levels[o]!) {
        this.crossings[o] = 0;
        this.onCrossing?.(o, 0);
      } else this.pending++;
    }
  }

  /**
   * Record node o's first crossing of its level inside the current step, whose start state is
   * startState and whose first point above the level is at t (an interior peak or the step end).
   * On [0, t] the rise starts at or below the level and every interior maximum before t is at or
   * below it (a higher one would have been the first point above), so rise − level changes sign
   * once there: bisection on its sign (exact rise at every trial, advanceModalState) finds the
   * crossing to 1e-12 of the step. Source: bisection, Press et al., Numerical Recipes, 3rd ed.
   * (2007), §9.1.
   */
  private cross(o: number, startS: number, t: number, powers: SourcePowers): void {
    const level = this.levels![o]!;
    let lo = 0;
    let hi = t;
    for (let i = 0; i < 200 && hi - lo > 1e-12 * t; i++) {
      const mid = 0.5 * (lo + hi);
      if (modalRise(this.model, advanceModalState(this.model, this.startState, mid, powers, this.scratch), o) > level) hi = mid;
      else lo = mid;
    }
    this.crossings[o] = startS + hi;
    this.pending--;
    this.onCrossing?.(o, startS + hi);
  }

  private pointArray(): number[] {
    return this.shared ?? new Array<number>(this.observed);
  }

  /** Integrate one more step (it starts where the previous one ended). */
  push(s: TimedStep): void {
    const { model, state, observed, visit, peakRiseK, peakTimeS } = this;
    const levels = this.pending > 0 ? this.levels : undefined;
    if (levels !== undefined) this.startState.set(state);
    const samples = this.sampling === undefined ? undefined : this.sampleOffsets(s.startS, s.durationS);
    let nextSample = 0;
    const sampleUntil = (atS: number): void => {
      if (samples === undefined) return;
      while (nextSample < samples.length && samples[nextSample]! < atS) this.emitSample(s, samples[nextSample++]!);
    };
    if (this.findPeaks) {
      let found: { atS: number; riseK: number; o: number }[] | undefined;
      for (let o = 0; o < observed; o++) {
        const peaks = interiorPeaks(model, state, s.durationS, s.powers, o);
        if (peaks.length === 0) continue;
        found ??= [];
        for (const p of peaks) found.push({ atS: p.atS, riseK: p.riseK, o });
      }
      if (found !== undefined) {
        if (found.length > 1) found.sort((a, b) => a.atS - b.atS);
        for (const p of found) {
          if (p.riseK > peakRiseK[p.o]!) {
            peakRiseK[p.o] = p.riseK;
            peakTimeS[p.o] = s.startS + p.atS;
          }
          if (levels !== undefined && this.crossings[p.o] === undefined && p.riseK > levels[p.o]!) this.cross(p.o, s.startS, p.atS, s.powers);
        }
        if (visit !== undefined) {
          for (const p of found) {
            sampleUntil(p.atS);
            const riseK = this.pointArray();
            if (observed === 1) riseK[0] = p.riseK;
            else {
              advanceModalState(model, state, p.atS, s.powers, this.scratch);
              for (let o = 0; o < observed; o++) riseK[o] = modalRise(model, this.scratch, o);
            }
            visit(this.point(s.startS + p.atS, riseK, "peak"));
          }
        }
      }
    }
    sampleUntil(s.durationS);
    this.step(state, s.durationS, s.powers);
    const endTimeS = s.startS + s.durationS;
    this.endTimeS = endTimeS;
    this.count++;
    // The visitor gets an array (fresh unless freshPoints is false); without one nothing is allocated per step.
    const riseK: number[] | undefined = visit === undefined ? undefined : this.pointArray();
    for (let o = 0; o < observed; o++) {
      const r = modalRise(model, state, o);
      if (riseK !== undefined) riseK[o] = r;
      if (r > peakRiseK[o]!) {
        peakRiseK[o] = r;
        peakTimeS[o] = endTimeS;
      }
      if (levels !== undefined && this.crossings[o] === undefined && r > levels[o]!) this.cross(o, s.startS, s.durationS, s.powers);
    }
    if (visit !== undefined) visit(this.point(endTimeS, riseK!, "step-end"));
  }

  /** Offsets [s] of the samples strictly inside a step, ascending (HistorySampling). */
  private sampleOffsets(startS: number, durationS: number): number[] {
    const out: number[] = [];
    const ratio = this.sampling?.ratio;
    if (ratio !== undefined && ratio > 1) for (let t = 0.25 * this.fastestTauS; t < durationS; t *= ratio) out.push(t);
    const divisions = this.sampling?.divisions ?? 0;
    for (let k = 1; k < divisions; k++) out.push((durationS * k) / divisions);
    const everyS = this.sampling?.everyS;
    if (everyS !== undefined && everyS > 0) {
      const endS = startS + durationS;
      for (let k = Math.floor(startS / everyS) + 1; k * everyS < endS; k++) {
        const offset = k * everyS - startS;
        if (offset > 0) out.push(offset);
      }
    }
    out.sort((a, b) => a - b);
    // a time two rules give is sampled once
    let kept = 0;
    for (const t of out) if (kept === 0 || t - out[kept - 1]! > 1e-12 * durationS) out[kept++] = t;
    out.length = kept;
    return out;
  }

  /** Hand onSample the rise at `offsetS` into step s (the state is still the step's start state). */
  private emitSample(s: TimedStep, offsetS: number): void {
    advanceModalState(this.model, this.state, offsetS, s.powers, this.scratch);
    for (let o = 0; o < this.observed; o++) this.sampleRise[o] = modalRise(this.model, this.scratch, o);
    this.onSample!(s.startS + offsetS, this.sampleRise);
  }

  /** The point handed to the visitor: one object refilled when freshPoints is false, else a new one. */
  private point(timeS: number, riseK: number[], kind: HistoryPoint["kind"]): HistoryPoint {
    const reused = this.reusedPoint;
    if (reused === undefined) return { timeS, riseK, kind };
    reused.timeS = timeS;
    reused.riseK = riseK;
    reused.kind = kind;
    return reused;
  }

  /** Peaks so far, the state now (the run's own: copy it to keep it past further pushes). */
  summary(): HistorySummary {
    const { model, state, observed } = this;
    return {
      peakRiseK: this.peakRiseK.slice(),
      peakTimeS: this.peakTimeS.slice(),
      endRiseK: Array.from({ length: observed }, (_, o) => modalRise(model, state, o)),
      endTimeS: this.endTimeS,
      endState: state,
      steps: this.count,
      firstCrossingS: this.crossings.slice(),
    };
  }
}
