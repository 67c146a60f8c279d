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
  readonly timeS: number;
  readonly value: number;
}

/**
 * Streaming reduction of a history to its turning points (peaks and valleys), with a hysteresis
 * band: a candidate extreme is confirmed only once the history has moved back from it by more
 * than `hysteresisK`. The first point of the history is always kept (ASTM E1049-85 (2017)
 * §5.4.4 counts from the start of the record), the last candidate is emitted by `finish()`.
 * On a plateau the earliest time of the extreme is kept.
 *
 * Source: ASTM E1049-85 (reapproved 2017), §3.2.x (definitions of peak, valley, reversal) and
 * §5.1 (counting is done on the sequence of reversals); the hysteresis band is common practice
 * ("racetrack" or gate filtering of small reversals).
 * Memory O(1); cost O(1) per point.
 * @throws InputError `out-of-range` for a negative or non-finite hysteresis, `not-finite` for a
 *   non-finite point, `bad-trace` for a time earlier than the previous one
 */
export class TurningPointFilter {
  private readonly hysteresisK: number;
  private readonly emit: (timeS: number, value: number) => void;
  private started = false;
  private direction = 0;
  private firstValue = 0;
  private candidateValue = 0;
  private candidateTimeS = 0;
  private lastTimeS = Number.NEGATIVE_INFINITY;

  /**
   * @param emit receives each confirmed turning point (time [s], value), in time order
   * @param hysteresisK reversal threshold [K] (default {@link DEFAULT_CYCLE_HYSTERESIS_K})
   */
  constructor(emit: (timeS: number, value: number) => void, hysteresisK: number = DEFAULT_CYCLE_HYSTERESIS_K) {
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
      this.started = true;
      this.firstValue = value;
      this.emit(timeS, value);
      return;
    }
    const h = this.hysteresisK;
    if (this.direction === 0) {
      if (value - this.firstValue > h) this.direction = 1;
      else if (this.firstValue - value > h) this.direction = -1;
      else return;
      this.candidateValue = value;
      this.candidateTimeS = timeS;
      return;
    }
    if (this.direction > 0) {
      if (value > this.candidateValue) {
        this.candidateValue = value;
        this.candidateTimeS = timeS;
      } else if (this.candidateValue - value > h) {
        this.emit(this.candidateTimeS, this.candidateValue);
        this.direction = -1;
        this.candidateValue = value;
        this.candidateTimeS = timeS;
      }
    } else if (value < this.candidateValue) {
      this.candidateValue = value;
      this.candidateTimeS = timeS;
    } else if (value - this.candidateValue > h) {
      this.emit(this.candidateTimeS, this.candidateValue);
      this.direction = 1;
      this.candidateValue = value;
      this.candidateTimeS = timeS;
    }
  }

  /** End of the history: emit the pending extreme, if the history ever moved beyond the band. */
  finish(): void {
    if (this.direction !== 0) this.emit(this.candidateTimeS, this.candidateValue);
    this.direction = 0;
  }
}
