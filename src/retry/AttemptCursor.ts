import { describeFound, inputError } from "../errors/InputError.js";
import { type ModalState, type SourcePowers, advanceModalState, createModalState, createModalStepper, modalRise } from "../thermal/modalStep.js";
import { type PowerTerm, type PowerTrace, segmentEnergy, validatePowerTrace } from "../thermal/powerTrace.js";
import { type InteriorPeak, interiorPeaks } from "../thermal/segmentPeak.js";
import { traceSteps } from "../thermal/traceSteps.js";
import { type ModalModel, sourceIndex } from "../thermal/ModalModel.js";
import { PLAN_DEFAULTS } from "./planDefaults.js";
import type { AttemptOutcome, ResolvedScenario } from "./RetryScenario.js";

/** One simulated attempt, in absolute time. */
export interface AttemptRecord {
  /** 0-based index in the whole history */
  readonly attemptIndex: number;
  /** start [s] */
  readonly startS: number;
  /** time since the previous attempt ended [s]; null for the first attempt */
  readonly waitS: number | null;
  /** capacitor voltage at the start [V] */
  readonly startVoltageV: number;
  /** temperature of the observed node at the start [°C] */
  readonly startTemperatureC: number;
  /** length [s] */
  readonly durationS: number;
  /** capacitor voltage at the end [V] */
  readonly endVoltageV: number;
  /** energy into the part [J] */
  readonly energyJ: number;
  /**
   * the attempt's own peak [°C]: the highest temperature from its start on, had no further attempt
   * followed. The highest own peak of a history is exactly the history's peak (see AttemptCursor).
   */
  readonly peakC: number;
  /** when the own peak happens [s] */
  readonly peakTimeS: number;
}

/** An attempt tried but not yet kept, with the state it would leave. */
export interface AttemptTrial {
  readonly record: AttemptRecord;
  /** modal state at the attempt's end */
  readonly endState: ModalState;
  /** true when the own peak stays at or below limit − margin */
  readonly safe: boolean;
  /** allowed temperature minus own peak [K]; negative when unsafe */
  readonly headroomK: number;
  /** what the attempt model returned */
  readonly outcome: AttemptOutcome;
}

/**
 * Incremental simulation of one corner, one attempt at a time, so that solvers can try a start
 * time, look at the attempt's own peak, and keep it or try another, without re-running the
 * history. The modal state is kept at the end of the last kept attempt; trying an attempt that
 * starts `w` seconds later decays every mode by e^(−w/tau) (closed form), asks the discharge model
 * for the capacitor voltage after w and the attempt model for the power, and integrates the
 * attempt exactly (advanceModalState segment by segment, interiorPeaks inside), then follows the free cooling over
 * PLAN_DEFAULTS.tailTauMultiple slowest time constants for a late peak (an observed node away
 * from the source can keep warming after the pulse).
 *
 * Why own peaks: the power of a pre-charge attempt is never negative and heat flowing into a
 * passive RC network raises every node, so the real history is at least the no-further-power
 * history at every later time; within [t_k, t_k+1) the two coincide. Hence the highest own peak
 * over all attempts equals the history's peak, and a schedule is safe exactly when every
 * attempt's own peak is.
 * Source: superposition in a linear time-invariant system (Oppenheim & Willsky, Signals and
 * Systems, 2nd ed. (1997), §2.2), which splits the history into the attempts' own responses; the
 * non-negative response of a passive RC network to non-negative heat input is common practice
 * (C·dT/dt = −G·T + P: −C⁻¹·G has no negative entry off its diagonal, so e^(−C⁻¹·G·t) has none).
 * Cost per trial O(segments × sources × modes) plus the interior peak search.
 */
export class AttemptCursor {
  /**
   * Attempts integrated by every cursor of the process so far ({@link tryAt} calls that ran an
   * attempt): a work counter for tests and benchmarks, which compare it before and after a call.
   * No solver reads it.
   */
  static trialCount = 0;
  readonly corner: ResolvedScenario;
  /** state at the end of the last kept attempt (or zero) */
  private state: ModalState;
  private readonly scratch: ModalState;
  /** end of the last kept attempt [s], or null before the first */
  private lastEndS: number | null = null;
  /** capacitor voltage at the end of the last kept attempt [V] */
  private lastEndVoltageV: number;
  /** number of kept attempts */
  private count = 0;
  private readonly tailS: number;
  private readonly records: AttemptRecord[] = [];
  /** power per model source on the current span (only the attempt's source is ever set) */
  private readonly powers: (readonly PowerTerm[] | undefined)[];
  /** end of the step being integrated (scratch) */
  private readonly end: ModalState;
  /** zero power on every source (the free-cooling tail) */
  private readonly idle: SourcePowers;
  /** exact stepper of the several-source path, made on first use */
  private stepper: ReturnType<typeof createModalStepper> | undefined;

  constructor(corner: ResolvedScenario) {
    this.corner = corner;
    this.state = createModalState(corner.model);
    this.scratch = createModalState(corner.model);
    this.lastEndVoltageV = corner.initialVoltageV;
    this.tailS = PLAN_DEFAULTS.tailTauMultiple * corner.slowestTauS;
    this.powers = corner.model.sources.map(() => undefined);
    this.end = createModalState(corner.model);
    this.idle = corner.model.sources.map(() => undefined);
  }

  /** End of the last kept attempt [s] (0 before the first attempt). */
  get endS(): number {
    return this.lastEndS ?? 0;
  }

  /**
   * The earliest start the next attempt may have [s]: the end of the last kept attempt plus the
   * corner's shortest wait (the relay opening and closing again); 0 before the first attempt.
   */
  get earliestNextS(): number {
    return this.lastEndS === null ? 0 : this.lastEndS + (this.count > 0 ? this.corner.minWaitS : 0);
  }

  /** Start of the last kept attempt [s] (0 before the first attempt). */
  get lastStartS(): number {
    return this.records[this.records.length - 1]?.startS ?? 0;
  }

  /** Number of attempts kept. */
  get attempts(): number {
    return this.count;
  }

  /** Attempts kept so far. */
  get history(): readonly AttemptRecord[] {
    return this.records;
  }

  /** The modal state at the end of the last kept attempt (a copy). */
  get endState(): ModalState {
    return Float64Array.from(this.state);
  }

  /** Capacitor voltage at the end of the last kept attempt [V]. */
  get endVoltageV(): number {
    return this.lastEndVoltageV;
  }

  /**
   * Rise of the observed node [K] at an absolute time at or after the end of the last kept
   * attempt, with no further power (free cooling). Cost O(sources × modes).
   */
  riseAtK(timeS: number): number {
    this.decayInto(Math.max(0, timeS - this.endS), this.scratch);
    return modalRise(this.corner.model, this.scratch, this.corner.observedIndex);
  }

  /** Capacitor voltage [V] before an attempt starting at startS (the discharge model after the wait). */
  voltageAt(startS: number): number {
    if (this.lastEndS === null) return this.corner.initialVoltageV;
    return this.corner.discharge(this.lastEndVoltageV, Math.max(0, startS - this.lastEndS));
  }

  /**
   * Whether an attempt may start at absolute time startS: not before the end of the last kept
   * attempt, nor (after an attempt) sooner after it than the corner's shortest wait, a start short
   * of it by rounding only (1e-12 of the time) counting as on time. Cost O(1).
   */
  canStartAt(startS: number): boolean {
    if (this.lastEndS === null) return true;
    const waitS = startS - this.lastEndS;
    return !(waitS < 0 || (this.count > 0 && waitS < this.corner.minWaitS - 1e-12 * Math.max(1, Math.abs(startS))));
  }

  /**
   * Try an attempt starting at absolute time startS, without keeping it.
   * @returns null when startS is before the end of the last kept attempt, or (after an attempt)
   *   sooner after it than the corner's shortest wait (the attempts would overlap, or the relay
   *   could not open and close again in time); a start short of it by rounding only (1e-12 of the
   *   time) counts as on time
   * @throws InputError `bad-trace` / `not-finite` when the attempt or discharge model returns bad values
   */
  tryAt(startS: number): AttemptTrial | null {
    if (!this.canStartAt(startS)) return null;
    const waitS = this.lastEndS === null ? Infinity : startS - this.lastEndS;
    AttemptCursor.trialCount++;
    const c = this.corner;
    const field = `corners.${c.name}`;
    const start = createModalState(c.model);
    this.decayInto(this.lastEndS === null ? 0 : waitS, start);
    // start is integrated in place below; startRise is read first
    const startRise = modalRise(c.model, start, c.observedIndex);
    const voltage = this.voltageAt(startS);
    if (!Number.isFinite(voltage)) throw inputError("not-finite", `${field}.discharge`, "a finite capacitor voltage after the wait", describeFound(voltage));
    const outcome = c.attempt({ attemptIndex: this.count, waitS, capacitorVoltageV: voltage, partTemperatureC: c.ambientC + startRise });
    checkOutcome(outcome.trace, outcome.durationS, outcome.endVoltageV, `${field}.attempt[${this.count}]`);
    const others = this.otherTraces(outcome, `${field}.attempt[${this.count}]`);
    const { peakRise, peakAt, endState } = others === null ? this.integrate(start, startRise, outcome.trace, outcome.durationS) : this.integrateMany(start, startRise, others, outcome.durationS);
    let energyJ = 0;
    for (const seg of outcome.trace) energyJ += segmentEnergy(seg.terms, seg.durationS);
    // energyJ counts the scenario's own source only; other sources heat it through the network
    const record: AttemptRecord = {
      attemptIndex: this.count,
      startS,
      waitS: this.lastEndS === null ? null : waitS,
      startVoltageV: voltage,
      startTemperatureC: c.ambientC + startRise,
      durationS: outcome.durationS,
      endVoltageV: outcome.endVoltageV,
      energyJ,
      peakC: c.ambientC + peakRise,
      peakTimeS: startS + peakAt,
    };
    const headroomK = c.allowedRiseK - peakRise;
    return { record, endState, safe: headroomK >= 0, headroomK, outcome };
  }

  /** Keep a trial made by {@link tryAt} on this cursor (the trial must be the latest state's). */
  keep(trial: AttemptTrial): AttemptRecord {
    this.state = Float64Array.from(trial.endState);
    this.lastEndS = trial.record.startS + trial.record.durationS;
    this.lastEndVoltageV = trial.record.endVoltageV;
    this.count++;
    this.records.push(trial.record);
    return trial.record;
  }

  /**
   * A cursor that continues from a given state, as if `attempts` attempts had been kept and the
   * last one ended at `endS` with the capacitor at `endVoltageV` (used for the periodic steady
   * state). With `attempts` 0 the state is a starting state with no attempt before it, so the
   * corner's shortest wait does not apply to the first attempt. The history list starts empty.
   */
  static resume(corner: ResolvedScenario, at: { state: ModalState; endS: number; endVoltageV: number; attempts: number }): AttemptCursor {
    const cursor = new AttemptCursor(corner);
    cursor.state = Float64Array.from(at.state);
    cursor.lastEndS = at.endS;
    cursor.lastEndVoltageV = at.endVoltageV;
    cursor.count = at.attempts;
    return cursor;
  }

  /** An independent copy (same history), for look-ahead. */
  clone(): AttemptCursor {
    const copy = new AttemptCursor(this.corner);
    copy.state = Float64Array.from(this.state);
    copy.lastEndS = this.lastEndS;
    copy.lastEndVoltageV = this.lastEndVoltageV;
    copy.count = this.count;
    copy.records.push(...this.records);
    return copy;
  }

  /**
   * Integrate one attempt exactly from `state` (modified in place into the end state): segment by
   * segment with advanceModalState, interior maxima by interiorPeaks (skipped where a bound shows
   * they cannot raise the attempt's peak, see peaksAbove), then the free-cooling tail searched for
   * a late peak. The same arithmetic as runThermalHistory over traceSteps, without the stream
   * machinery (this is the planner's inner loop).
   */
  private integrate(state: ModalState, startRise: number, trace: PowerTrace, durationS: number): { peakRise: number; peakAt: number; endState: ModalState } {
    const c = this.corner;
    const powers = this.powers;
    const peak = { rise: startRise, at: 0 };
    let t = 0;
    const span = (h: number, terms: readonly PowerTerm[] | undefined): void => {
      if (!(h > 0)) return;
      powers[c.sourceIndex] = terms;
      this.stepWithPeaks(state, h, powers, t, peak, (from, out) => advanceModalState(c.model, from, h, powers, out));
      t += h;
    };
    for (const seg of trace) {
      span(seg.startS - t, undefined);
      span(Math.min(seg.durationS, durationS - t), seg.terms);
    }
    span(durationS - t, undefined);
    powers[c.sourceIndex] = undefined;
    this.tailPeaks(state, durationS, peak);
    return { peakRise: peak.rise, peakAt: peak.at, endState: state };
  }

  /**
   * One step of an attempt: the end state (by `advance`, from `state` into a scratch array), the
   * interior maxima that could beat the running peak, then the end; `state` becomes the end state.
   */
  private stepWithPeaks(state: ModalState, h: number, powers: SourcePowers, atS: number, peak: { rise: number; at: number }, advance: (from: ModalState, out: ModalState) => void): void {
    const c = this.corner;
    const o = c.observedIndex;
    const end = this.end;
    advance(state, end);
    const r = modalRise(c.model, end, o);
    for (const p of peaksAbove(c.model, state, h, powers, o, Math.max(peak.rise, r), r)) {
      if (p.riseK > peak.rise) {
        peak.rise = p.riseK;
        peak.at = atS + p.atS;
      }
    }
    state.set(end);
    if (r > peak.rise) {
      peak.rise = r;
      peak.at = atS + h;
    }
  }

  /** Late maxima in the free cooling after the attempt (from its end state, left unchanged). */
  private tailPeaks(state: ModalState, durationS: number, peak: { rise: number; at: number }): void {
    const c = this.corner;
    const idle = this.idle;
    advanceModalState(c.model, state, this.tailS, idle, this.end);
    const r = modalRise(c.model, this.end, c.observedIndex);
    // the tail's end is not a candidate (the own peak looks for maxima inside it), only a bound
    for (const p of peaksAbove(c.model, state, this.tailS, idle, c.observedIndex, peak.rise, r)) {
      if (p.riseK > peak.rise) {
        peak.rise = p.riseK;
        peak.at = durationS + p.atS;
      }
    }
  }

  /** One trace per model source when the attempt heats more than the scenario's source, else null. */
  private otherTraces(outcome: AttemptOutcome, field: string): (PowerTrace | undefined)[] | null {
    if (outcome.otherTraces === undefined) return null;
    const model = this.corner.model;
    const traces: (PowerTrace | undefined)[] = model.sources.map(() => undefined);
    traces[this.corner.sourceIndex] = outcome.trace;
    let any = false;
    for (const [name, trace] of Object.entries(outcome.otherTraces)) {
      const i = sourceIndex(model, name, `${field}.otherTraces`);
      if (i === this.corner.sourceIndex) throw inputError("bad-trace", `${field}.otherTraces.${name}`, "a source other than the scenario's own", describeFound(name));
      checkOutcome(trace, outcome.durationS, outcome.endVoltageV, `${field}.otherTraces.${name}`);
      traces[i] = trace;
      any = true;
    }
    return any ? traces : null;
  }

  /**
   * The general path for attempts that heat several sources: traceSteps merges the traces into
   * common steps, each advanced exactly (the stepper of runThermalHistory, same arithmetic) with
   * the interior maxima searched on the scenario's observed node only, then the same free-cooling
   * tail.
   */
  private integrateMany(state: ModalState, startRise: number, traces: readonly (PowerTrace | undefined)[], durationS: number): { peakRise: number; peakAt: number; endState: ModalState } {
    const step = (this.stepper ??= createModalStepper(this.corner.model));
    const peak = { rise: startRise, at: 0 };
    for (const s of traceSteps(traces, 0, durationS)) {
      this.stepWithPeaks(state, s.durationS, s.powers, s.startS, peak, (from, out) => {
        out.set(from);
        step(out, s.durationS, s.powers);
      });
    }
    this.tailPeaks(state, durationS, peak);
    return { peakRise: peak.rise, peakAt: peak.at, endState: state };
  }

  /** Start of the current state: the modal state after cooling w seconds from the last kept end. */
  private decayInto(w: number, out: ModalState): void {
    const model = this.corner.model;
    const modes = model.tauS.length;
    for (let m = 0; m < modes; m++) {
      const k = Math.exp(-w / model.tauS[m]!);
      for (let s = 0; s < model.sources.length; s++) out[s * modes + m] = this.state[s * modes + m]! * k;
    }
  }
}

/** The shared answer for a step that cannot beat the running peak. */
const NONE: readonly InteriorPeak[] = Object.freeze([]);

/**
 * Interior maxima of node o's rise inside a step that could lift the attempt's peak above
 * `beatK` (the higher of the running peak and the step's end rise `endRiseK` when the end counts):
 * interiorPeaks, skipped when a cheap upper bound on the rise over the step is below `beatK`.
 *
 * Two bounds, the lower one used. (1) Each mode obeys dy/dt = (P − y)/tau, so over the step
 * y(t) = y0 + w·(P̄ − y0), with P̄ a weighted mean of the power over [0, t] (between its least and
 * greatest value on the step, Pmin and Pmax) and w = 1 − e^(−t/tau) ≤ ρ = 1 − e^(−h/tau): hence
 * y0 + ρ·min(0, Pmin − y0) ≤ y ≤ y0 + ρ·max(0, Pmax − y0), and the rise Σ gain·y is at most the
 * sum of each gain times the end of its mode's range that the gain's sign favours. (2) The same
 * ranges bound the slope Σ gain·(P − y)/tau between −d and u, so r(t) ≤ r(0) + u·t and
 * r(t) ≤ r(h) + d·(h − t): the rise is at most the value where those two lines meet; a slope
 * bounded away from zero (either sign) leaves no interior maximum at all. Pmin and
 * Pmax are bounded term by term ((a + b·s)·e^(−lambda·s) is extreme at an end or where its
 * derivative vanishes). The skip keeps a margin of 1e-9 of the bounds' own magnitude, far above
 * rounding, so the attempt's peak is the same number as with the search.
 * Source: the variation-of-constants formula for dy/dt = (P − y)/tau (Boyce & DiPrima, Elementary
 * Differential Equations, 10th ed. (2012), §2.1), read as a convex combination of y0 and the mean
 * power; the two-line bound is the mean value theorem. Cost O(sources × modes × terms) when
 * skipped, plus interiorPeaks otherwise.
 */
function peaksAbove(model: ModalModel, state: ModalState, h: number, powers: SourcePowers, o: number, beatK: number, endRiseK: number): readonly InteriorPeak[] {
  const modes = model.tauS.length;
  const row = model.gainKPerW[o]!;
  let bound = 0;
  let slopeHi = 0;
  let slopeLo = 0;
  let scale = 0;
  let slopeScale = 0;
  for (let s = 0; s < row.length; s++) {
    const terms = powers[s];
    let pMax = 0;
    let pMin = 0;
    if (terms !== undefined) {
      for (const t of terms) {
        const [lo, hi] = termRange(t, h);
        pMin += lo;
        pMax += hi;
      }
    }
    const gains = row[s]!;
    for (let m = 0; m < modes; m++) {
      const g = gains[m]!;
      if (g === 0) continue;
      const y0 = state[s * modes + m]!;
      const tau = model.tauS[m]!;
      const rho = -Math.expm1(-h / tau);
      const yHi = y0 + rho * Math.max(0, pMax - y0);
      const yLo = y0 + rho * Math.min(0, pMin - y0);
      const k = g / tau;
      if (g > 0) {
        bound += g * yHi;
        slopeHi += k * (pMax - yLo);
        slopeLo += k * (pMin - yHi);
      } else {
        bound += g * yLo;
        slopeHi += k * (pMin - yHi);
        slopeLo += k * (pMax - yLo);
      }
      const size = Math.abs(y0) + Math.max(Math.abs(pMax), Math.abs(pMin));
      scale += Math.abs(g) * size;
      slopeScale += Math.abs(k) * size;
    }
  }
  // a slope of one sign throughout (clear of rounding) leaves no interior maximum at all
  if (slopeLo > 1e-9 * slopeScale || slopeHi < -1e-9 * slopeScale) return NONE;
  const riseAtStart = modalRise(model, state, o);
  const up = Math.max(slopeHi, 0);
  const down = Math.max(-slopeLo, 0);
  let lines = Math.max(riseAtStart, endRiseK);
  if (up + down > 0) {
    const at = Math.min(h, Math.max(0, (endRiseK - riseAtStart + down * h) / (up + down)));
    lines = riseAtStart + up * at;
    scale += (up + down) * h;
  }
  if (Math.min(bound, lines) + 1e-9 * scale <= beatK) return NONE;
  return interiorPeaks(model, state, h, powers, o);
}

/** Least and greatest value of (a + b·s)·e^(−lambda·s) over s in [0, h]. */
function termRange(t: PowerTerm, h: number): [number, number] {
  const atStart = t.a;
  const atEnd = (t.a + t.b * h) * (t.lambda === 0 ? 1 : Math.exp(-t.lambda * h));
  let lo = Math.min(atStart, atEnd);
  let hi = Math.max(atStart, atEnd);
  if (t.b !== 0 && t.lambda !== 0) {
    // d/ds [(a + b·s)·e^(−lambda·s)] = (b − lambda·(a + b·s))·e^(−lambda·s) vanishes at s = 1/lambda − a/b
    const s = 1 / t.lambda - t.a / t.b;
    if (s > 0 && s < h) {
      const v = (t.b / t.lambda) * Math.exp(-t.lambda * s);
      lo = Math.min(lo, v);
      hi = Math.max(hi, v);
    }
  }
  return [lo, hi];
}

function checkOutcome(trace: PowerTrace, durationS: number, endVoltageV: number, field: string): void {
  if (!(durationS >= 0) || !Number.isFinite(durationS)) throw inputError("out-of-range", `${field}.durationS`, "a finite attempt duration ≥ 0 s", describeFound(durationS));
  if (!Number.isFinite(endVoltageV)) throw inputError("not-finite", `${field}.endVoltageV`, "a finite capacitor voltage", describeFound(endVoltageV));
  validatePowerTrace(trace, `${field}.trace`);
  const last = trace[trace.length - 1];
  if (last !== undefined && last.startS + last.durationS > durationS * (1 + 1e-12) + 1e-15)
    throw inputError("bad-trace", `${field}.trace`, `power only within the attempt (0 to ${durationS} s)`, `a segment ending at ${last.startS + last.durationS} s`);
  const first = trace[0];
  if (first !== undefined && first.startS < 0) throw inputError("bad-trace", `${field}.trace[0].startS`, "a start ≥ 0 s (attempt-local time)", describeFound(first.startS));
}
