import { describeFound, inputError } from "../errors/InputError.js";
import { type ModalState, advanceModalState, createModalState, modalRise } from "../thermal/modalStep.js";
import { type PowerTerm, type PowerTrace, segmentEnergy, validatePowerTrace } from "../thermal/powerTrace.js";
import { interiorPeaks } from "../thermal/segmentPeak.js";
import { runThermalHistory } from "../thermal/runThermalHistory.js";
import { traceSteps } from "../thermal/traceSteps.js";
import { sourceIndex } from "../thermal/ModalModel.js";
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

  constructor(corner: ResolvedScenario) {
    this.corner = corner;
    this.state = createModalState(corner.model);
    this.scratch = createModalState(corner.model);
    this.lastEndVoltageV = corner.initialVoltageV;
    this.tailS = PLAN_DEFAULTS.tailTauMultiple * corner.slowestTauS;
    this.powers = corner.model.sources.map(() => undefined);
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
   * Try an attempt starting at absolute time startS, without keeping it.
   * @returns null when startS is before the end of the last kept attempt, or (after an attempt)
   *   sooner after it than the corner's shortest wait (the attempts would overlap, or the relay
   *   could not open and close again in time); a start short of it by rounding only (1e-12 of the
   *   time) counts as on time
   * @throws InputError `bad-trace` / `not-finite` when the attempt or discharge model returns bad values
   */
  tryAt(startS: number): AttemptTrial | null {
    const waitS = this.lastEndS === null ? Infinity : startS - this.lastEndS;
    if (waitS < 0 || (this.count > 0 && waitS < this.corner.minWaitS - 1e-12 * Math.max(1, Math.abs(startS)))) return null;
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
   * segment with advanceModalState, interior maxima by interiorPeaks, then the free-cooling tail
   * searched for a late peak. The same arithmetic as runThermalHistory over traceSteps, without
   * the stream machinery (this is the planner's inner loop).
   */
  private integrate(state: ModalState, startRise: number, trace: PowerTrace, durationS: number): { peakRise: number; peakAt: number; endState: ModalState } {
    const c = this.corner;
    const o = c.observedIndex;
    const powers = this.powers;
    let peakRise = startRise;
    let peakAt = 0;
    let t = 0;
    const span = (h: number, terms: readonly PowerTerm[] | undefined): void => {
      if (!(h > 0)) return;
      powers[c.sourceIndex] = terms;
      for (const p of interiorPeaks(c.model, state, h, powers, o)) {
        if (p.riseK > peakRise) {
          peakRise = p.riseK;
          peakAt = t + p.atS;
        }
      }
      advanceModalState(c.model, state, h, powers);
      t += h;
      const r = modalRise(c.model, state, o);
      if (r > peakRise) {
        peakRise = r;
        peakAt = t;
      }
    };
    for (const seg of trace) {
      span(seg.startS - t, undefined);
      span(Math.min(seg.durationS, durationS - t), seg.terms);
    }
    span(durationS - t, undefined);
    powers[c.sourceIndex] = undefined;
    for (const p of interiorPeaks(c.model, state, this.tailS, powers, o)) {
      if (p.riseK > peakRise) {
        peakRise = p.riseK;
        peakAt = durationS + p.atS;
      }
    }
    return { peakRise, peakAt, endState: state };
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
   * The general path for attempts that heat several sources: runThermalHistory over traceSteps
   * (which merges the traces into common steps), then the same free-cooling tail.
   */
  private integrateMany(state: ModalState, startRise: number, traces: readonly (PowerTrace | undefined)[], durationS: number): { peakRise: number; peakAt: number; endState: ModalState } {
    const c = this.corner;
    const o = c.observedIndex;
    const during = runThermalHistory(c.model, traceSteps(traces, 0, durationS), { initialState: state });
    let peakRise = startRise;
    let peakAt = 0;
    if (during.peakRiseK[o]! > peakRise) {
      peakRise = during.peakRiseK[o]!;
      peakAt = during.peakTimeS[o]!;
    }
    const endState = during.endState;
    const powers = this.powers.map(() => undefined);
    for (const p of interiorPeaks(c.model, endState, this.tailS, powers, o)) {
      if (p.riseK > peakRise) {
        peakRise = p.riseK;
        peakAt = durationS + p.atS;
      }
    }
    return { peakRise, peakAt, endState };
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
