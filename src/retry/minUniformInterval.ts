import { describeFound, inputError } from "../errors/InputError.js";
import { AttemptCursor, type AttemptTrial } from "./AttemptCursor.js";
import { type GoverningCorner, governingCorner } from "./GoverningCorner.js";
import { PLAN_DEFAULTS } from "./planDefaults.js";
import { type RetryScenario, type ResolvedScenario, resolveCorners } from "./RetryScenario.js";
import { type RetrySpacing, uniformBurst } from "./RetrySchedule.js";
import { runBurst } from "./runBurst.js";
import { type BandScan, type FeasibleBand, scanFeasibleBands, scanGrid } from "./scanFeasibleBands.js";
import { alignBandsToTimer } from "./alignToTimer.js";

/** Scan options shared by the interval solvers; every field has a default (PLAN_DEFAULTS). */
export interface IntervalScanOptions {
  /** how the interval is measured (default PLAN_DEFAULTS.spacing) */
  readonly spacing?: RetrySpacing;
  /** top of the scan [s] (default PLAN_DEFAULTS.scanSpanTauMultiple × the slowest time constant of any corner) */
  readonly scanToS?: number;
  /** scan points (default PLAN_DEFAULTS.scanPoints) */
  readonly scanPoints?: number;
  /**
   * the firmware timer's resolution [s]: answers and band ends are whole timer steps, each
   * re-checked (alignBandsToTimer); default PLAN_DEFAULTS.timerResolutionS (0: no rounding)
   */
  readonly timerResolutionS?: number;
}

/** The answer to "how far apart must N attempts be?". */
export interface UniformIntervalAnswer {
  readonly attempts: number;
  readonly spacing: RetrySpacing;
  /** the shortest safe interval [s], or null when no scanned interval is safe */
  readonly minimumIntervalS: number | null;
  /** every band of safe intervals, in increasing order */
  readonly bands: readonly FeasibleBand[];
  /** the corner with the least headroom at the minimum interval (at the top of the scan when none is safe) */
  readonly governing: GoverningCorner;
  /** the scanned range [s] */
  readonly scannedFromS: number;
  readonly scannedToS: number;
  /** predicate evaluations (each one burst per corner) */
  readonly evaluations: number;
}

/** Options resolved once; exported for the other interval solvers. */
export interface ResolvedScan {
  readonly spacing: RetrySpacing;
  readonly scanToS: number;
  readonly scanPoints: number;
  readonly timerResolutionS: number;
}

/** Resolve scan options against a corner set. */
export function resolveScan(corners: readonly ResolvedScenario[], options: IntervalScanOptions): ResolvedScan {
  const slowest = Math.max(...corners.map((c) => c.slowestTauS));
  const scanToS = options.scanToS ?? PLAN_DEFAULTS.scanSpanTauMultiple * slowest;
  if (!(scanToS > 0) || !Number.isFinite(scanToS)) throw inputError("out-of-range", "scanToS", "a finite scan end > 0 s", describeFound(scanToS));
  const scanPoints = options.scanPoints ?? PLAN_DEFAULTS.scanPoints;
  if (!Number.isInteger(scanPoints) || scanPoints < 2) throw inputError("out-of-range", "scanPoints", "an integer ≥ 2", describeFound(scanPoints));
  const timerResolutionS = options.timerResolutionS ?? PLAN_DEFAULTS.timerResolutionS;
  if (!(timerResolutionS >= 0) || !Number.isFinite(timerResolutionS)) throw inputError("out-of-range", "timerResolutionS", "a finite timer resolution ≥ 0 s", describeFound(timerResolutionS));
  return { spacing: options.spacing ?? PLAN_DEFAULTS.spacing, scanToS, scanPoints, timerResolutionS };
}

/** A band scan moved onto the timer's grid (alignBandsToTimer), its evaluations added. */
export function onTimer(scan: BandScan, timerResolutionS: number, feasible: (x: number) => boolean): BandScan {
  const aligned = alignBandsToTimer(scan.bands, timerResolutionS, feasible);
  return { bands: aligned.bands, evaluations: scan.evaluations + aligned.evaluations };
}

/** Check an attempt count. */
export function checkAttempts(attempts: number, field = "attempts"): void {
  if (!Number.isInteger(attempts) || attempts < 1) throw inputError("out-of-range", field, "a whole number of attempts ≥ 1", describeFound(attempts));
}

/**
 * Each corner's first attempt: at t = 0 from a cold part and the corner's initial voltage, the same
 * whatever interval, wait or spacing follows. When one of them is unsafe, so is every burst and
 * every retry train, and the scans need not run. Cost O(corners × cost of one attempt).
 */
export function firstAttempts(corners: readonly ResolvedScenario[]): AttemptTrial[] {
  return corners.map((c) => new AttemptCursor(c).tryAt(0)!);
}

/**
 * Shortest interval that could work: the corners' shortest wait between attempts (the relay's
 * release and operate times), plus the first attempt's own length for start-to-start spacing.
 */
export function lowestInterval(corners: readonly ResolvedScenario[], spacing: RetrySpacing, first: readonly AttemptTrial[] = firstAttempts(corners)): number {
  const minWaitS = Math.max(...corners.map((c) => c.minWaitS));
  if (spacing === "end-to-start") return minWaitS;
  let longest = 0;
  for (const trial of first) longest = Math.max(longest, trial.record.durationS + minWaitS);
  return longest;
}

/**
 * A test over every corner at a value `at` (an interval, a lockout, a growth factor) that stops at
 * the first corner failing it, trying first the corner that failed the previous call (scans ask
 * about neighbouring values, where the same corner usually binds). The answer is the plain
 * conjunction; only the work changes.
 */
export function everyCorner(count: number, holds: (corner: number, at: number) => boolean): (at: number) => boolean {
  let lead = 0;
  return (at) => {
    for (let k = 0; k < count; k++) {
      const i = (lead + k) % count;
      if (!holds(i, at)) {
        lead = i;
        return false;
      }
    }
    return true;
  };
}

/** Peak and headroom of a uniform burst in one corner (stopping at the first unsafe attempt when asked). */
export function uniformBurstVerdict(c: ResolvedScenario, attempts: number, intervalS: number, spacing: RetrySpacing, stopWhenUnsafe: boolean): GoverningCorner & { safe: boolean } {
  const run = runBurst(new AttemptCursor(c), uniformBurst(attempts, intervalS, spacing), 0, stopWhenUnsafe);
  const overlap = run.overlapAt !== null;
  return {
    corner: c.name,
    peakC: run.peakC,
    allowedC: c.allowedC,
    limitC: c.limitC,
    headroomK: overlap ? -Infinity : run.worstHeadroomK,
    safe: !overlap && run.firstUnsafe === null,
  };
}

/**
 * The shortest uniform retry interval for a burst of N attempts, for the worst
 * corner, with every band of safe intervals.
 *
 * For a candidate interval T, every corner runs the burst (attempt 1 at t = 0, then every T from
 * the previous start or end) with the capacitor discharging between attempts, and the burst is
 * safe when every attempt's own peak stays at or below limit − margin in every corner. Intervals
 * are scanned (scanFeasibleBands) from the shortest the relay allows (lowestInterval) and each
 * band edge is bisected; with a timer resolution the bands are moved onto the timer's grid and
 * their lower ends re-checked (alignBandsToTimer). The answer is the lower end of the first band.
 * When a corner's first attempt alone is unsafe (it is the same at every interval: cold part,
 * initial voltage) no interval is safe, and the scan is skipped.
 * Cost O((scanPoints + bands × 2·log2(1/relTol)) × corners × N × cost of one attempt), or
 * O(corners × N × cost of one attempt) when the first attempt decides.
 * @throws InputError for bad corners or options
 * @example
 * const scenario = {
 *   name: "short", model: fosterToModal({ kind: "foster", stages: [{ rKPerW: 0.5, tauS: 2 }] }),
 *   ambientC: 40, limitC: 150, marginK: 20, initialVoltageV: 0,
 *   attempt: () => ({ trace: [constantPowerSegment(0, 0.5, 400)], durationS: 0.5, endVoltageV: 0 }),
 *   discharge: () => 0,
 * };
 * minUniformInterval([scenario], 5).minimumIntervalS // => 1.2744
 */
export function minUniformInterval(scenarios: readonly RetryScenario[], attempts: number, options: IntervalScanOptions = {}): UniformIntervalAnswer {
  checkAttempts(attempts);
  const corners = resolveCorners(scenarios);
  const scan = resolveScan(corners, options);
  const first = firstAttempts(corners);
  const from = lowestInterval(corners, scan.spacing, first);
  const grid = scanGrid(from, Math.max(scan.scanToS, from * 10), scan.scanPoints);
  const safeAt = everyCorner(corners.length, (i, t) => uniformBurstVerdict(corners[i]!, attempts, t, scan.spacing, true).safe);
  const { bands, evaluations } = first.every((f) => f.safe) ? onTimer(scanFeasibleBands(safeAt, grid), scan.timerResolutionS, safeAt) : { bands: [], evaluations: 0 };
  const at = bands[0]?.fromS ?? grid[grid.length - 1]!;
  const governing = governingCorner(
    corners.map((c) => {
      const { safe: _safe, ...entry } = uniformBurstVerdict(c, attempts, at, scan.spacing, false);
      return entry;
    }),
  );
  return {
    attempts,
    spacing: scan.spacing,
    minimumIntervalS: bands[0]?.fromS ?? null,
    bands,
    governing,
    scannedFromS: grid[0]!,
    scannedToS: grid[grid.length - 1]!,
    evaluations,
  };
}
