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
  /** heating time: from the moment the history leaves the cycle's low level to its peak [s] (see {@link RainflowCounter}) */
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
  /**
   * band [K] within which the history counts as still at a point's level (the turning-point
   * hysteresis the points were filtered with); default 0, the level itself. It moves a point's
   * leave time later when points counted away after it came back within the band of its value.
   */
  readonly levelBandK?: number;
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
 * Heating time and duration. Each turning point carries the time the history reached it and
 * the time it left it (`leaveS`, the last time within the hysteresis band of the extreme; see
 * TurningPointFilter). A range from point p to point q travels from p's leave time to q's
 * reach time. The heating time of a cycle is the time from the LAST moment the history is at
 * its low level (within the hysteresis band) before the rise, to the peak:
 * - a cycle whose first range rises (valley a, peak b): t_reach(b) − t_leave(a);
 * - a cycle that falls first (peak a, valley b, closed by c): the history leaves b at t_leave(b)
 *   and regains a's level on the closing range b→c, taken by linear interpolation on that
 *   travel: (t_reach(c) − t_leave(b))·|a − b|/|c − b|.
 * So a 0.3 s pulse after hours at ambient heats for 0.3 s, not for the hours spent at ambient
 * (the time the power-cycling tests that lifetime models are fitted on call the heating or
 * "on" time: the current flows and the junction rises from its low to its high temperature).
 * The rule is common practice: no published source we can name states it for counted cycles.
 * The cycle's duration runs from the time it first reached its starting point to the time it
 * regains that level: t_reach(b) − t_reach(a) + (t_leave(b) − t_reach(b)) + the interpolated
 * return on the closing travel. Half cycles: heating time = their one-way travel time
 * t_reach(q) − t_leave(p), duration = twice it. (Turning points alone carry no finer timing.)
 * Points counted away between a stack point and the next one (an inner cycle, or a point that
 * did not reverse) belong to the travel between them; when such a point lies within
 * `levelBandK` of the earlier stack point, the history was back at that level then, so the
 * stack point's leave time moves to the removed point's leave time. Without this, a cycle
 * closed around consumed inner cycles (a daily pulse counted against the history's largest
 * peak, days later) would heat from the first day.
 *
 * Cost O(1) amortised per point; memory O(stack).
 * @throws InputError `not-finite` for non-finite points, `bad-trace` for points out of time order,
 *   `out-of-range` for a non-positive period or one shorter than the history
 * @example
 * const cycles = [];
 * const counter = new RainflowCounter((c) => cycles.push(c));
 * [20, 80, 30, 70, 20].forEach((value, timeS) => counter.push(timeS, value));
 * counter.finish();
 * cycles.map((c) => c.rangeK) // => [40, 60, 60]
 */
export class RainflowCounter {
  private readonly onCycle: (cycle: RainflowCycle) => void;
  private readonly mode: RainflowMode;
  private readonly periodS: number | undefined;
  private readonly levelBandK: number;
  private values = new Float64Array(64);
  private times = new Float64Array(64);
  private leaves = new Float64Array(64);
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
    const band = options.levelBandK ?? 0;
    if (!(band >= 0) || !Number.isFinite(band)) throw inputError("out-of-range", "levelBandK", "a temperature difference ≥ 0 K", describeFound(band));
    this.levelBandK = band;
  }

  /** Largest number of points the stack ever held: the memory bound actually used. */
  get peakStackSize(): number {
    return this.maxSize;
  }

  /** The points still open (the residue), oldest first. */
  get residue(): TurningPoint[] {
    return Array.from({ length: this.size }, (_, i) => ({ timeS: this.times[i]!, value: this.values[i]!, leaveS: this.leaves[i]! }));
  }

  /**
   * Push the next point of the history: the time it was reached [s], its value [°C] and the time
   * the history left it [s] (≥ timeS; default timeS, a point left at once).
   */
  push(timeS: number, value: number, leaveS: number = timeS): void {
    if (this.finished) throw inputError("bad-trace", "history", "no points after the end of the history", `${timeS} s`);
    if (!Number.isFinite(timeS) || !Number.isFinite(value) || !Number.isFinite(leaveS))
      throw inputError("not-finite", "history", "finite times and temperatures", `(${describeFound(timeS)}, ${describeFound(value)})`);
    if (timeS < this.lastTimeS) throw inputError("bad-trace", "history", "points in time order", `${timeS} s after ${this.lastTimeS} s`);
    if (leaveS < timeS) throw inputError("bad-trace", "history", "a point left no earlier than it was reached", `left at ${leaveS} s, reached at ${timeS} s`);
    if (Number.isNaN(this.firstTimeS)) this.firstTimeS = timeS;
    this.lastTimeS = leaveS;
    this.add(timeS, value, leaveS);
  }

  private add(timeS: number, value: number, leaveS: number): void {
    let n = this.size;
    const v = this.values;
    if (n >= 1) {
      const last = v[n - 1]!;
      if (value === last) {
        // the history stays at the level: it leaves it later
        this.leaves[n - 1] = leaveS;
        return;
      }
      if (n >= 2 && (last - v[n - 2]!) * (value - last) > 0) {
        // the previous top did not reverse: the new point extends its range
        this.absorb(n - 2, n - 1);
        n--;
        this.size = n;
      }
    }
    if (n === v.length) this.grow();
    this.values[n] = value;
    this.times[n] = timeS;
    this.leaves[n] = leaveS;
    this.size = n + 1;
    if (this.size > this.maxSize) this.maxSize = this.size;
    this.extract();
  }

  private grow(): void {
    const values = new Float64Array(this.values.length * 2);
    values.set(this.values);
    const times = new Float64Array(this.times.length * 2);
    times.set(this.times);
    const leaves = new Float64Array(this.leaves.length * 2);
    leaves.set(this.leaves);
    this.values = values;
    this.times = times;
    this.leaves = leaves;
  }

  private extract(): void {
    const v = this.values;
    const t = this.times;
    const l = this.leaves;
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
          l[0] = l[2]!;
          this.size = 1;
          continue;
        }
        if (this.mode === "repeating") return;
        // §5.4.4 step 5: Y contains the starting point: half cycle, discard S
        this.half(0);
        v[0] = v[1]!;
        t[0] = t[1]!;
        l[0] = l[1]!;
        v[1] = v[2]!;
        t[1] = t[2]!;
        l[1] = l[2]!;
        this.size = 2;
        continue;
      }
      const z = Math.abs(v[n - 3]! - v[n - 4]!);
      if (z < y) return;
      this.full(n - 3);
      this.absorb(n - 4, n - 3);
      this.absorb(n - 4, n - 2);
      v[n - 3] = v[n - 1]!;
      t[n - 3] = t[n - 1]!;
      l[n - 3] = l[n - 1]!;
      this.size = n - 2;
    }
  }

  /** Point `removed` is counted away after stack point `kept`: if it is within the level band of `kept`, the history was still at that level when it left it. */
  private absorb(kept: number, removed: number): void {
    if (Math.abs(this.values[removed]! - this.values[kept]!) <= this.levelBandK && this.leaves[removed]! > this.leaves[kept]!)
      this.leaves[kept] = this.leaves[removed]!;
  }

  /** Count the range from point i to i+1 as one cycle, closed by point i+2. */
  private full(i: number): void {
    const v = this.values;
    const t = this.times;
    const l = this.leaves;
    const a = v[i]!;
    const b = v[i + 1]!;
    const y = Math.abs(b - a);
    const x = Math.abs(v[i + 2]! - b);
    // reach a → reach b, then the stay at b, then back to a's level on the travel from b to the next point
    const firstS = t[i + 1]! - t[i]!;
    const stayS = l[i + 1]! - t[i + 1]!;
    const returnS = (t[i + 2]! - l[i + 1]!) * (x > 0 ? y / x : 1);
    const minC = Math.min(a, b);
    const maxC = Math.max(a, b);
    this.onCycle({
      rangeK: y,
      meanC: (minC + maxC) / 2,
      minC,
      maxC,
      count: 1,
      heatingTimeS: b > a ? t[i + 1]! - l[i]! : returnS,
      durationS: firstS + stayS + returnS,
      startS: t[i]!,
    });
  }

  /** Count the range from point i to i+1 as one half cycle. */
  private half(i: number): void {
    const a = this.values[i]!;
    const b = this.values[i + 1]!;
    const oneWayS = this.times[i + 1]! - this.leaves[i]!;
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
    for (let i = top; i < residue.length; i++) this.add(residue[i]!.timeS, residue[i]!.value, residue[i]!.leaveS!);
    // shifted into the next period; never before the history's end (first + (last − first) can round below last)
    for (let i = 0; i <= top; i++) {
      const p = residue[i]!;
      const timeS = Math.max(p.timeS + periodS, this.lastTimeS);
      this.add(timeS, p.value, Math.max(p.leaveS! + periodS, timeS));
    }
  }
}

/**
 * Rainflow-count a sequence of turning points in one call (a convenience over
 * {@link RainflowCounter}; for long histories use the class and consume cycles as they come).
 * Source: ASTM E1049-85 (reapproved 2017) §5.4.4 ("open") and §5.4.5 ("repeating").
 * Cost O(points); memory O(cycles) for the returned array.
 * @example
 * const history = [20, 80, 30, 70, 20].map((value, timeS) => ({ timeS, value }));
 * rainflow(history).map((c) => [c.rangeK, c.count]) // => [[40, 1], [60, 0.5], [60, 0.5]]
 */
export function rainflow(points: Iterable<TurningPoint>, options: RainflowOptions = {}): RainflowCycle[] {
  const cycles: RainflowCycle[] = [];
  const counter = new RainflowCounter((c) => cycles.push(c), options);
  for (const p of points) counter.push(p.timeS, p.value, p.leaveS ?? p.timeS);
  counter.finish();
  return cycles;
}
