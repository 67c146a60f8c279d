import { describeFound, inputError } from "../errors/InputError.js";

/**
 * A quantity given as a function of time that is straight between its points (an ambient
 * temperature in °C, a heat source's power in W): before the first point it holds the first
 * value, after the last point the last value; with `periodS` it repeats instead, the points then
 * covering one period from 0 (the value at periodS is the value at 0). The thermal engine
 * integrates such an input exactly (a straight piece is a term a + b·s, see powerTrace.ts).
 */
export interface PiecewiseLinearSeries {
  /** times [s], strictly increasing; with periodS: from 0, all below periodS */
  readonly timesS: readonly number[];
  /** the value at each time (any unit; the user of the series knows which) */
  readonly values: readonly number[];
  /** the series repeats with this period [s] (a daily ambient: 86 400 s); undefined: it holds its ends */
  readonly periodS?: number;
}

/** One straight piece of a series: from startS to endS [s], value + slope·(t − startS). */
export interface SeriesPiece {
  readonly startS: number;
  /** end of the piece [s]; Infinity where the series holds its last value for ever */
  readonly endS: number;
  /** value at startS */
  readonly value: number;
  /** slope [value unit per s] */
  readonly slope: number;
}

/**
 * Check a series: at least one point, finite values, times strictly increasing, and with a
 * period, times in [0, period).
 * @throws InputError `bad-trace` naming the point
 */
export function validateSeries(series: PiecewiseLinearSeries, field = "series"): void {
  const { timesS, values, periodS } = series;
  if (timesS.length === 0 || timesS.length !== values.length) throw inputError("bad-trace", field, "at least one (time, value) point", `${timesS.length} times and ${values.length} values`);
  if (periodS !== undefined && !(periodS > 0 && Number.isFinite(periodS))) throw inputError("bad-trace", `${field}.period`, "a finite period > 0 s", describeFound(periodS));
  timesS.forEach((t, i) => {
    if (!Number.isFinite(t)) throw inputError("bad-trace", `${field}[${i}]`, "a finite time in s", describeFound(t));
    if (!Number.isFinite(values[i]!)) throw inputError("bad-trace", `${field}[${i}]`, "a finite value", describeFound(values[i]));
    if (i > 0 && !(t > timesS[i - 1]!)) throw inputError("bad-trace", `${field}[${i}]`, `a time after the previous point's ${timesS[i - 1]} s`, `${t} s`);
    if (periodS !== undefined && !(t >= 0 && t < periodS)) throw inputError("bad-trace", `${field}[${i}]`, `a time of the period, from 0 up to ${periodS} s`, `${t} s`);
  });
}

/**
 * The straight piece of a series that holds time t (t at a point belongs to the piece starting
 * there). Binary search: cost O(log points).
 * @example
 * seriesPieceAt({ timesS: [0, 10], values: [20, 30] }, 5) // => { startS: 0, endS: 10, value: 20, slope: 1 }
 */
export function seriesPieceAt(series: PiecewiseLinearSeries, t: number): SeriesPiece {
  const { timesS, values, periodS } = series;
  const n = timesS.length;
  if (periodS !== undefined) {
    const cycle = Math.floor(t / periodS);
    const offset = cycle * periodS;
    const local = t - offset;
    // the period's points plus the wrap point (periodS, values[0]); before the first point the
    // piece comes from the previous period's last point
    const k = lastAtOrBefore(timesS, local);
    const fromT = k < 0 ? timesS[n - 1]! - periodS : timesS[k]!;
    const fromV = k < 0 ? values[n - 1]! : values[k]!;
    const toT = k < 0 ? timesS[0]! : k + 1 < n ? timesS[k + 1]! : timesS[0]! + periodS;
    const toV = k < 0 ? values[0]! : k + 1 < n ? values[k + 1]! : values[0]!;
    const slope = (toV - fromV) / (toT - fromT);
    return { startS: offset + fromT, endS: offset + toT, value: fromV, slope };
  }
  const k = lastAtOrBefore(timesS, t);
  if (k < 0) return { startS: -Infinity, endS: timesS[0]!, value: values[0]!, slope: 0 };
  if (k === n - 1) return { startS: timesS[k]!, endS: Infinity, value: values[k]!, slope: 0 };
  return { startS: timesS[k]!, endS: timesS[k + 1]!, value: values[k]!, slope: (values[k + 1]! - values[k]!) / (timesS[k + 1]! - timesS[k]!) };
}

/**
 * The value of a series at time t (straight between points). Cost O(log points).
 * @example
 * seriesValueAt({ timesS: [0, 10], values: [20, 30] }, 2.5) // => 22.5
 */
export function seriesValueAt(series: PiecewiseLinearSeries, t: number): number {
  const piece = seriesPieceAt(series, t);
  return piece.slope === 0 ? piece.value : piece.value + piece.slope * (t - piece.startS);
}

/** Index of the last time ≤ t, or −1. */
function lastAtOrBefore(timesS: readonly number[], t: number): number {
  let lo = 0;
  let hi = timesS.length - 1;
  if (!(t >= timesS[0]!)) return -1;
  while (lo < hi) {
    const mid = (lo + hi + 1) >> 1;
    if (timesS[mid]! <= t) lo = mid;
    else hi = mid - 1;
  }
  return lo;
}
