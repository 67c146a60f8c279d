import { describeFound, inputError } from "../errors/InputError.js";
import type { TurningPoint } from "./turningPoints.js";

/** One counted cycle (count 1) or half cycle (count 0.5) of a temperature history. */
export interface RainflowCycle {
  /** range max − min [K] */
  readonly rangeK: number;
  /** (max + min)/2 [°C] */
  readonly meanC: number;
  /** lower turning point [°C] */
  readonly minC: number;
  /** upper turning point [°C] */
  readonly maxC: number;
  /** 1 for a full cycle, 0.5 for a half cycle */
  readonly count: 0.5 | 1;
  /** time spent rising from min to max within the cycle [s] (see {@link RainflowCounter}) */
  readonly heatingTimeS: number;
  /** duration of the closed cycle [s]; for a half cycle, twice its one-way time */
  readonly durationS: number;
  /** time of the cycle's first turning point [s] */
  readonly startS: number;
}

/**
 * How the history is closed: "open" counts the residue as half cycles (ASTM E1049-85 (2017)
 * §5.4.4); "repeating" treats the history as one period of a history that repeats for ever and
 * closes it on itself starting at its largest peak, so only full cycles remain (§5.4.5).
 */
export type RainflowMode = "open" | "repeating";

/** Options of {@link RainflowCounter}. */
export interface RainflowOptions {
  /** default "open" */
  readonly mode?: RainflowMode;
  /** period of a repeating history [s]; default: last time − first time pushed */
  readonly periodS?: number;
}

/**
 * Streaming rainflow counter. Points are pushed one by one (turning points; points that do not
 * reverse the direction are merged, equal values skipped) and cycles are handed to `onCycle` as
 * soon as they close. Memory is the residue stack only: O(number of nested ranges still open),
 * which stays small (logarithmic for random histories), whatever the length of the history.
 *
 * Counting rule, with the three most recent points of the stack forming ranges Y (older) and X
 * (newer), and Z the range before Y: while X ≥ Y and Y ≤ Z, Y is a closed cycle: it is counted
 * as one cycle and its two points are removed. In "open" mode, when Y contains the first point
 * of the stack (the starting point S) and X ≥ Y, Y is counted as one half cycle and S is
 * discarded, moving S to the next point; at the end every range left is a half cycle. This is
 * the procedure of ASTM E1049-85 (reapproved 2017) §5.4.4 steps 1-6. In "repeating" mode the
 * start rule is not applied during the pass (the "four-point" form: the pass extracts exactly
 * the closed loops), and at `finish()` the residue is rotated to start at its largest peak,
 * closed on that peak, and counted by §5.4.5 (every range a full cycle). That one pass plus
 * the closed residue equals §5.4.5 on the whole rotated history; Source for the equivalence:
 * Amzallag, Gerey, Robert, Bahuaud, "Standardization of the rainflow counting method for fatigue
 * analysis", Int. J. Fatigue 16(4), 1994, §3 (four-point method and residue), from memory; the
 * test suite checks the equivalence against the literal rotated count.
 *
 * Heating time and duration: the turning points carry times. A cycle whose first range rises
 * (valley then peak) heats for t_peak − t_valley; one that falls first heats on its closing
 * range until it regains its starting level, taken by linear interpolation on that range. The
 * cycle's duration adds that return time to its first range. Half cycles: heating time = their
 * one-way time, duration = twice it. (Common practice; turning points alone carry no finer
 * timing.)
 *
 * Cost O(1) amortised per point; memory O(stack).
 * @throws InputError `not-finite` for non-finite points, `bad-trace` for points out of time order,
 *   `out-of-range` for a non-positive period or one shorter than the history
 */
export class RainflowCounter {
  private readonly onCycle: (cycle: RainflowCycle) => void;
  private readonly mode: RainflowMode;
  private readonly periodS: number | undefined;
  private values = new Float64Array(64);
  private times = new Float64Array(64);
  private size = 0;
  private closed = false;
  private firstTimeS = Number.NaN;
  private lastTimeS = Number.NEGATIVE_INFINITY;
  private maxSize = 0;
  private finished = false;

  /**
   * @param onCycle receives every counted cycle and half cycle, as soon as it is known
   * @param options mode and period, see {@link RainflowOptions}
   */
  constructor(onCycle: (cycle: RainflowCycle) => void, options: RainflowOptions = {}) {
    this.onCycle = onCycle;
    this.mode = options.mode ?? "open";
    if (options.periodS !== undefined && !(options.periodS > 0 && Number.isFinite(options.periodS)))
      throw inputError("out-of-range", "periodS", "a period > 0 s", describeFound(options.periodS));
    this.periodS = options.periodS;
  }

  /** Largest number of points the stack ever held: the memory bound actually used. */
  get peakStackSize(): number {
    return this.maxSize;
  }

  /** The points still open (the residue), oldest first. */
  get residue(): TurningPoint[] {
    return Array.from({ length: this.size }, (_, i) => ({ timeS: this.times[i]!, value: this.values[i]! }));
  }

  /** Push the next point of the history (time [s], value [°C]). */
  push(timeS: number, value: number): void {
    if (this.finished) throw inputError("bad-trace", "history", "no points after the end of the history", `${timeS} s`);
    if (!Number.isFinite(timeS) || !Number.isFinite(value))
      throw inputError("not-finite", "history", "finite times and temperatures", `(${describeFound(timeS)}, ${describeFound(value)})`);
    if (timeS < this.lastTimeS) throw inputError("bad-trace", "history", "points in time order", `${timeS} s after ${this.lastTimeS} s`);
    if (Number.isNaN(this.firstTimeS)) this.firstTimeS = timeS;
    this.lastTimeS = timeS;
    this.add(timeS, value);
  }

  private add(timeS: number, value: number): void {
    let n = this.size;
    const v = this.values;
    if (n >= 1) {
      const last = v[n - 1]!;
      if (value === last) return;
      if (n >= 2 && (last - v[n - 2]!) * (value - last) > 0) {
        // the previous top did not reverse: the new point extends its range
        n--;
        this.size = n;
      }
    }
    if (n === v.length) this.grow();
    this.values[n] = value;
    this.times[n] = timeS;
    this.size = n + 1;
    if (this.size > this.maxSize) this.maxSize = this.size;
    this.extract();
  }

  private grow(): void {
    const values = new Float64Array(this.values.length * 2);
    values.set(this.values);
    const times = new Float64Array(this.times.length * 2);
    times.set(this.times);
    this.values = values;
    this.times = times;
  }

  private extract(): void {
    const v = this.values;
    const t = this.times;
    for (;;) {
      const n = this.size;
      if (n < 3) return;
      const x = Math.abs(v[n - 1]! - v[n - 2]!);
      const y = Math.abs(v[n - 2]! - v[n - 3]!);
      if (x < y) return;
      if (n === 3) {
        if (this.closed) {
          // §5.4.5: the start is the largest peak, every range is a full cycle
          this.full(n - 3);
          v[0] = v[2]!;
          t[0] = t[2]!;
          this.size = 1;
          continue;
        }
        if (this.mode === "repeating") return;
        // §5.4.4 step 5: Y contains the starting point: half cycle, discard S
        this.half(0);
        v[0] = v[1]!;
        t[0] = t[1]!;
        v[1] = v[2]!;
        t[1] = t[2]!;
        this.size = 2;
        continue;
      }
      const z = Math.abs(v[n - 3]! - v[n - 4]!);
      if (z < y) return;
      this.full(n - 3);
      v[n - 3] = v[n - 1]!;
      t[n - 3] = t[n - 1]!;
      this.size = n - 2;
    }
  }

  /** Count the range from point i to i+1 as one cycle, closed by point i+2. */
  private full(i: number): void {
    const v = this.values;
    const t = this.times;
    const a = v[i]!;
    const b = v[i + 1]!;
    const y = Math.abs(b - a);
    const x = Math.abs(v[i + 2]! - b);
    const firstS = t[i + 1]! - t[i]!;
    const returnS = (t[i + 2]! - t[i + 1]!) * (x > 0 ? y / x : 1);
    const minC = Math.min(a, b);
    const maxC = Math.max(a, b);
    this.onCycle({
      rangeK: y,
      meanC: (minC + maxC) / 2,
      minC,
      maxC,
      count: 1,
      heatingTimeS: b > a ? firstS : returnS,
      durationS: firstS + returnS,
      startS: t[i]!,
    });
  }

  /** Count the range from point i to i+1 as one half cycle. */
  private half(i: number): void {
    const a = this.values[i]!;
    const b = this.values[i + 1]!;
    const oneWayS = this.times[i + 1]! - this.times[i]!;
    const minC = Math.min(a, b);
    const maxC = Math.max(a, b);
    this.onCycle({
      rangeK: maxC - minC,
      meanC: (minC + maxC) / 2,
      minC,
      maxC,
      count: 0.5,
      heatingTimeS: oneWayS,
      durationS: 2 * oneWayS,
      startS: this.times[i]!,
    });
  }

  /**
   * End of the history. "open": every range left in the residue is a half cycle (§5.4.4 step 6).
   * "repeating": the residue is closed on itself at its largest peak and counted (§5.4.5).
   * The counter accepts no points afterwards.
   * @param periodS period of a repeating history [s], overriding the constructor's (the caller
   *   may know the history's true end only now)
   */
  finish(periodS?: number): void {
    if (this.finished) return;
    if (periodS !== undefined && !(periodS > 0 && Number.isFinite(periodS)))
      throw inputError("out-of-range", "periodS", "a period > 0 s", describeFound(periodS));
    const period = periodS ?? this.periodS ?? this.lastTimeS - this.firstTimeS;
    const spanS = Number.isNaN(this.firstTimeS) ? 0 : this.lastTimeS - this.firstTimeS;
    if (this.mode === "repeating" && period < spanS)
      throw inputError("out-of-range", "periodS", `a period at least as long as the history (${spanS} s)`, `${period} s`);
    this.finished = true;
    if (this.mode === "repeating" && this.size >= 2) this.close(period);
    for (let i = 0; i + 1 < this.size; i++) this.half(i);
    this.size = Math.min(this.size, 1);
  }

  private close(periodS: number): void {
    const residue = this.residue;
    let top = 0;
    for (let i = 1; i < residue.length; i++) if (residue[i]!.value > residue[top]!.value) top = i;
    this.size = 0;
    this.closed = true;
    for (let i = top; i < residue.length; i++) this.add(residue[i]!.timeS, residue[i]!.value);
    // shifted into the next period; never before the history's end (first + (last − first) can round below last)
    for (let i = 0; i <= top; i++) this.add(Math.max(residue[i]!.timeS + periodS, this.lastTimeS), residue[i]!.value);
  }
}

/**
 * Rainflow-count a sequence of turning points in one call (a convenience over
 * {@link RainflowCounter}; for long histories use the class and consume cycles as they come).
 * Source: ASTM E1049-85 (reapproved 2017) §5.4.4 ("open") and §5.4.5 ("repeating").
 * Cost O(points); memory O(cycles) for the returned array.
 */
export function rainflow(points: Iterable<TurningPoint>, options: RainflowOptions = {}): RainflowCycle[] {
  const cycles: RainflowCycle[] = [];
  const counter = new RainflowCounter((c) => cycles.push(c), options);
  for (const p of points) counter.push(p.timeS, p.value);
  counter.finish();
  return cycles;
}
