import { describeFound, inputError } from "../errors/InputError.js";
import { expIntegral0, expIntegral1 } from "./expIntegrals.js";

/**
 * One term of a power expression on a segment: (a + b·s)·e^(−lambda·s) watts, with s the time
 * since the segment start. Constant power is {a: P, b: 0, lambda: 0}; a ramp has b ≠ 0; resistor
 * charging gives exponentials.
 */
export interface PowerTerm {
  /** constant coefficient [W] */
  readonly a: number;
  /** linear coefficient [W/s] */
  readonly b: number;
  /** decay rate [1/s] */
  readonly lambda: number;
}

/** A stretch of time with a power given as a sum of {@link PowerTerm}s. */
export interface PowerSegment {
  /** start time [s] */
  readonly startS: number;
  /** duration [s], ≥ 0 */
  readonly durationS: number;
  /** the power on the segment; an empty list is zero power */
  readonly terms: readonly PowerTerm[];
}

/** A part's power history: segments in time order, not overlapping; gaps are zero power. */
export type PowerTrace = readonly PowerSegment[];

/**
 * Constant power P [W] from startS for durationS [s].
 * @example
 * constantPowerSegment(0, 0.01, 50).terms // => [{ a: 50, b: 0, lambda: 0 }]
 */
export function constantPowerSegment(startS: number, durationS: number, watts: number): PowerSegment {
  return { startS, durationS, terms: watts === 0 ? [] : [{ a: watts, b: 0, lambda: 0 }] };
}

/**
 * Power at time s into a segment: Σ (a + b·s)·e^(−lambda·s) [W]. Cost O(terms).
 * @example
 * powerAt([{ a: 10, b: 0, lambda: 0 }, { a: 0, b: 2, lambda: 0 }], 0.5) // => 11
 */
export function powerAt(terms: readonly PowerTerm[], s: number): number {
  let sum = 0;
  for (const t of terms) sum += (t.a + t.b * s) * (t.lambda === 0 ? 1 : Math.exp(-t.lambda * s));
  return sum;
}

/**
 * Energy of a segment, exact: ∫0^h (a + b·s)·e^(−lambda·s) ds = a·h·φ0(lambda·h) + b·h²·φ1(lambda·h)
 * with φ0(x) = (1 − e^(−x))/x and φ1(x) = (1 − e^(−x)(1 + x))/x² (see expIntegrals). [J]
 * Cost O(terms).
 * @example
 * segmentEnergy([{ a: 40, b: 0, lambda: 0 }], 0.25) // => 10
 */
export function segmentEnergy(terms: readonly PowerTerm[], durationS: number): number {
  let sum = 0;
  for (const t of terms) {
    const x = t.lambda * durationS;
    sum += t.a * durationS * expIntegral0(x) + t.b * durationS * durationS * expIntegral1(x);
  }
  return sum;
}

/**
 * Re-origin terms at s = delta, exactly: (a + b·(delta + s'))·e^(−lambda·(delta + s'))
 * = ((a + b·delta)·e^(−lambda·delta) + b·e^(−lambda·delta)·s')·e^(−lambda·s').
 * Used to split a segment at an interior time. Cost O(terms).
 */
export function shiftTerms(terms: readonly PowerTerm[], delta: number): PowerTerm[] {
  return terms.map((t) => {
    const k = t.lambda === 0 ? 1 : Math.exp(-t.lambda * delta);
    return { a: (t.a + t.b * delta) * k, b: t.b * k, lambda: t.lambda };
  });
}

/**
 * Check a power trace: finite coefficients, non-negative durations, segments in time order and
 * not overlapping.
 * @throws InputError `bad-trace` naming the segment index
 */
export function validatePowerTrace(trace: PowerTrace, field = "trace"): void {
  let end = -Infinity;
  trace.forEach((seg, i) => {
    const at = `${field}[${i}]`;
    if (!Number.isFinite(seg.startS)) throw inputError("bad-trace", `${at}.startS`, "a finite start time in s", describeFound(seg.startS));
    if (!(seg.durationS >= 0) || !Number.isFinite(seg.durationS))
      throw inputError("bad-trace", `${at}.durationS`, "a finite duration ≥ 0 s", describeFound(seg.durationS));
    if (seg.startS < end - 1e-12 * Math.max(1, Math.abs(end)))
      throw inputError("bad-trace", `${at}.startS`, `a start at or after the previous segment's end (${end} s)`, describeFound(seg.startS));
    seg.terms.forEach((t, k) => {
      for (const key of ["a", "b", "lambda"] as const) {
        if (!Number.isFinite(t[key])) throw inputError("bad-trace", `${at}.terms[${k}].${key}`, "a finite number", describeFound(t[key]));
      }
    });
    end = seg.startS + seg.durationS;
  });
}
