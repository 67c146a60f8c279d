import { type GoverningCorner, governingCorner } from "./GoverningCorner.js";
import { type IntervalScanOptions, everyCorner, firstAttempts, lowestInterval, onTimer, resolveScan } from "./minUniformInterval.js";
import { type RetryScenario, resolveCorners } from "./RetryScenario.js";
import type { RetrySpacing } from "./RetrySchedule.js";
import { type ForeverVerdict, retryForeverCheck } from "./retryForeverCheck.js";
import { type FeasibleBand, scanFeasibleBands, scanGrid } from "./scanFeasibleBands.js";

/** The answer to "how far apart must attempts be to retry for ever?". */
export interface ForeverIntervalAnswer {
  readonly spacing: RetrySpacing;
  /** shortest interval at which retrying for ever is safe [s], or null when none scanned is */
  readonly minimumIntervalS: number | null;
  /** every band of intervals at which retrying for ever is safe */
  readonly bands: readonly FeasibleBand[];
  /** the corner with the least headroom at the minimum (at the top of the scan when none is safe) */
  readonly governing: GoverningCorner;
  /** every corner's verdict at the minimum (or at the top of the scan) */
  readonly verdicts: readonly ForeverVerdict[];
  /** true when every verdict at the answer is proven in closed form (see retryForeverCheck) */
  readonly proven: boolean;
  readonly scannedFromS: number;
  readonly scannedToS: number;
  readonly evaluations: number;
}

/**
 * The shortest interval at which the firmware may retry for ever, from the
 * periodic steady state in closed form (retryForeverCheck per corner), with every band of safe
 * intervals (scan from the shortest interval the relay allows, then bisection of each edge; with
 * a timer resolution, whole timer steps re-checked as in minUniformInterval).
 * For one RC stage and rectangular attempts of power P and length t_on this reproduces
 *   T_min = −τ·ln(1 − P·R·(1 − e^(−t_on/τ))/ΔT_max)   (start-to-start spacing).
 * When a corner's first attempt alone is unsafe, no interval is, and the scan is skipped.
 * Cost O((scanPoints + edges × log2(1/relTol)) × corners × attempts to prove each verdict).
 * @example
 * const scenario = {
 *   name: "short", model: fosterToModal({ kind: "foster", stages: [{ rKPerW: 0.5, tauS: 2 }] }),
 *   ambientC: 40, limitC: 150, marginK: 20, initialVoltageV: 0,
 *   attempt: () => ({ trace: [constantPowerSegment(0, 0.5, 400)], durationS: 0.5, endVoltageV: 0 }),
 *   discharge: () => 0,
 * };
 * minForeverInterval([scenario]).minimumIntervalS // => 1.3528
 */
export function minForeverInterval(scenarios: readonly RetryScenario[], options: IntervalScanOptions = {}): ForeverIntervalAnswer {
  const corners = resolveCorners(scenarios);
  const scan = resolveScan(corners, options);
  const first = firstAttempts(corners);
  const from = lowestInterval(corners, scan.spacing, first);
  const grid = scanGrid(from, Math.max(scan.scanToS, from * 10), scan.scanPoints);
  const safeAt = everyCorner(corners.length, (i, t) => retryForeverCheck(corners[i]!, t, scan.spacing).safe);
  // a first attempt unsafe on its own (the same at every interval) leaves no interval to scan
  const { bands, evaluations } = first.every((f) => f.safe) ? onTimer(scanFeasibleBands(safeAt, grid), scan.timerResolutionS, safeAt) : { bands: [], evaluations: 0 };
  const at = bands[0]?.fromS ?? grid[grid.length - 1]!;
  const verdicts = corners.map((c) => retryForeverCheck(c, at, scan.spacing));
  const governing = governingCorner(
    verdicts.map((v) => ({ corner: v.corner, peakC: Math.max(v.transientPeakC, v.steadyPeakC ?? -Infinity), allowedC: v.allowedC, limitC: v.limitC, headroomK: v.headroomK })),
  );
  return {
    spacing: scan.spacing,
    minimumIntervalS: bands[0]?.fromS ?? null,
    bands,
    governing,
    verdicts,
    proven: verdicts.every((v) => v.method === "closed-form"),
    scannedFromS: grid[0]!,
    scannedToS: grid[grid.length - 1]!,
    evaluations,
  };
}
