import { describeFound, inputError } from "../errors/InputError.js";

/**
 * Default hysteresis of the turning-point filter [K]: a reversal of the temperature counts only
 * when it exceeds this. 1 K drops numerical ripple and sub-kelvin wobble, whose damage is
 * negligible under every lifetime model here (all fall off as ΔT^-n with n ≥ 2), while keeping
 * every cycle a lifetime model was fitted on (tens of kelvin). Common practice; a profile
 * setting (`cycleHysteresis`) overrides it.
 */
export const DEFAULT_CYCLE_HYSTERESIS_K = 1;

/** A peak or valley of a history: time [s] and value (temperature [°C]). */
export interface TurningPoint {
  /** when the history first reached the extreme [s] */
  readonly timeS: number;
  readonly value: number;
  /**
   * when the history left the extreme [s]: the last time it was within the hysteresis band of
   * the extreme before moving away (≥ timeS); default timeS. A valley's leave time starts the
   * heating of the rise that follows it (see {@link TurningPointFilter}).
   */
  readonly leaveS?: number;
}

/**
 * Streaming reduction of a history to its turning points (peaks and valleys), with a hysteresis
 * band: a candidate extreme is confirmed only once the history has moved back from it by more
 * than `hysteresisK`. The first point of the history is always kept (ASTM E1049-85 (2017)
 * §5.4.4 counts from the start of the record), the last candidate is emitted by `finish()`.
 *
 * Each turning point carries two times. `timeS` is when the history first reached the extreme
 * (on a plateau, the earliest time). `leaveS` is when it left it: the last point of the history
 * that lies within the hysteresis band of the extreme (|value − extreme| ≤ hysteresisK) before
 * the history moves out of the band for good; for the first point of the record, the last point
 * within the band of its value. A part that cools to ambient, sits there for hours and is then
 * pulsed has a valley reached hours before the pulse and left when the pulse starts: the rise
 * that follows heats from `leaveS`, not from `timeS` (see `RainflowCounter` for how a
 * cycle's heating time is read from them). The band is the filter's own: a wobble smaller than
 * the hysteresis does not end the stay at the low level, as it does not make a turning point.
 * The leave time is the last known point inside the band, not an interpolated crossing: it can
 * only be early, so a heating time read from it is never shorter than the true one (longer
 * heating gives fewer cycles to failure in every model here that reads it). Common practice
 * (no published source we can name for the leave-time rule).
 *
 * Source: ASTM E1049-85 (reapproved 2017), §3.2.x (definitions of peak, valley, reversal) and
 * §5.1 (counting is done on the sequence of reversals); the hysteresis band is common practice
 * ("racetrack" or gate filtering of small reversals).
 * Memory O(1); cost O(1) per point.
 * @throws InputError `out-of-range` for a negative or non-finite hysteresis, `not-finite` for a
 *   non-finite point, `bad-trace` for a time earlier than the previous one
 * @example
 * const kept = [];
 * const filter = new TurningPointFilter((timeS, value) => kept.push(value), 1);
 * [20, 40, 80, 79.5, 60, 30, 70, 20].forEach((value, timeS) => filter.push(timeS, value));
 * filter.finish();
 * kept // => [20, 80, 30, 70, 20]
 */
export class TurningPointFilter {
  private readonly hysteresisK: number;
  private readonly emit: (timeS: number, value: number, leaveS: number) => void;
  private started = false;
  private direction = 0;
  private firstValue = 0;
  private firstTimeS = 0;
  private candidateValue = 0;
  private candidateTimeS = 0;
  /** last time the history was within the band of the pending extreme (the first point, while direction is 0) */
  private candidateLeaveS = 0;
  private lastTimeS = Number.NEGATIVE_INFINITY;

  /**
   * @param emit receives each confirmed turning point (time it was reached [s], value, time it was
   *   left [s]), in time order
   * @param hysteresisK reversal threshold [K] (default {@link DEFAULT_CYCLE_HYSTERESIS_K})
   */
  constructor(emit: (timeS: number, value: number, leaveS: number) => void, hysteresisK: number = DEFAULT_CYCLE_HYSTERESIS_K) {
    if (!(hysteresisK >= 0) || !Number.isFinite(hysteresisK))
      throw inputError("out-of-range", "cycleHysteresis", "a temperature difference ≥ 0 K", describeFound(hysteresisK));
    this.hysteresisK = hysteresisK;
    this.emit = emit;
  }

  /** Feed the next point of the history (time [s], value [°C]). */
  push(timeS: number, value: number): void {
    if (!Number.isFinite(timeS) || !Number.isFinite(value))
      throw inputError("not-finite", "history", "finite times and temperatures", `(${describeFound(timeS)}, ${describeFound(value)})`);
    if (timeS < this.lastTimeS)
      throw inputError("bad-trace", "history", "points in time order", `${timeS} s after ${this.lastTimeS} s`);
    this.lastTimeS = timeS;
    if (!this.started) {
      // the first point is emitted once the history leaves its band, with the time it left
      this.started = true;
      this.firstValue = value;
      this.firstTimeS = timeS;
      this.candidateLeaveS = timeS;
      return;
    }
    const h = this.hysteresisK;
    if (this.direction === 0) {
      if (value - this.firstValue > h) this.direction = 1;
      else if (this.firstValue - value > h) this.direction = -1;
      else {
        this.candidateLeaveS = timeS;
        return;
      }
      this.emit(this.firstTimeS, this.firstValue, this.candidateLeaveS);
      this.candidate(timeS, value);
      return;
    }
    if (this.direction > 0) {
      if (value > this.candidateValue) this.candidate(timeS, value);
      else if (this.candidateValue - value > h) {
        this.emit(this.candidateTimeS, this.candidateValue, this.candidateLeaveS);
        this.direction = -1;
        this.candidate(timeS, value);
      } else this.candidateLeaveS = timeS;
    } else if (value < this.candidateValue) this.candidate(timeS, value);
    else if (value - this.candidateValue > h) {
      this.emit(this.candidateTimeS, this.candidateValue, this.candidateLeaveS);
      this.direction = 1;
      this.candidate(timeS, value);
    } else this.candidateLeaveS = timeS;
  }

  /** A new extreme candidate, reached (and, so far, left) at `timeS`. */
  private candidate(timeS: number, value: number): void {
    this.candidateValue = value;
    this.candidateTimeS = timeS;
    this.candidateLeaveS = timeS;
  }

  /**
   * End of the history: emit the pending extreme (or the first point, if the history never moved
   * beyond its band), with the last time the history was within its band.
   */
  finish(): void {
    if (this.direction !== 0) this.emit(this.candidateTimeS, this.candidateValue, this.candidateLeaveS);
    else if (this.started) this.emit(this.firstTimeS, this.firstValue, this.candidateLeaveS);
    this.direction = 0;
    this.started = false;
  }
}
