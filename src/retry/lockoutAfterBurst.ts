import { describeFound, inputError } from "../errors/InputError.js";
import { AttemptCursor } from "./AttemptCursor.js";
import { type GoverningCorner, governingCorner } from "./GoverningCorner.js";
import { PLAN_DEFAULTS } from "./planDefaults.js";
import { type RetryScenario, type ResolvedScenario, resolveCorners } from "./RetryScenario.js";
import type { BurstPlan } from "./RetrySchedule.js";
import { everyCorner } from "./minUniformInterval.js";
import { runBurst } from "./runBurst.js";
import { type FeasibleBand, scanFeasibleBands, scanGrid } from "./scanFeasibleBands.js";
import { alignBandsToTimer } from "./alignToTimer.js";

/** Options of {@link lockoutAfterBurst}; every field has a default (PLAN_DEFAULTS). */
export interface LockoutOptions {
  /** "back near ambient" threshold [K] (default PLAN_DEFAULTS.ambientReturnK) */
  readonly ambientReturnK?: number;
  /** top of the lockout scan [s] (default PLAN_DEFAULTS.scanSpanTauMultiple × slowest time constant) */
  readonly scanToS?: number;
  /** scan points (default PLAN_DEFAULTS.scanPoints) */
  readonly scanPoints?: number;
  /** the firmware timer's resolution [s]: lockouts are whole timer steps, each re-checked (default PLAN_DEFAULTS.timerResolutionS, 0: no rounding) */
  readonly timerResolutionS?: number;
}

/** The answer to "how long must the lockout after a burst be?". */
export interface LockoutAnswer {
  /** the first burst is itself safe in every corner (if not, the lockout answer is moot) */
  readonly burstSafe: boolean;
  /** highest temperature of the first burst (governing corner) */
  readonly burst: GoverningCorner;
  /** end of the first burst's last attempt (latest over corners) [s] */
  readonly burstEndS: number;
  /**
   * shortest lockout after which the same burst again is safe [s], from the end of the burst; null
   * when none scanned is, or when the first burst is itself unsafe (no lockout can make the policy
   * safe then, and none is scanned)
   */
  readonly minimumLockoutS: number | null;
  /** every band of safe lockouts */
  readonly bands: readonly FeasibleBand[];
  /** the corner with the least headroom in the second burst at the minimum lockout */
  readonly governing: GoverningCorner;
  /** the "back near ambient" threshold used [K] */
  readonly ambientReturnK: number;
  /** time after the burst's end until the part stays within ambientReturnK of ambient, worst corner [s] */
  readonly ambientReturnS: number;
  /** the corner that takes longest to get back near ambient */
  readonly ambientReturnCorner: string;
  readonly evaluations: number;
}

/**
 * After a burst, the shortest lockout before the same burst may run again, and
 * the time until the part is back within a set distance of ambient.
 *
 * The burst runs in every corner (its first attempt at t = 0). For a candidate lockout L, the
 * second burst starts L after the latest end of the first, with the capacitor discharged over
 * the wait, and is safe when every attempt's own peak stays at or below limit − margin in every
 * corner. Lockouts are scanned from the shortest wait the relay allows (the corners' minWaitS)
 * and each band edge bisected (scanFeasibleBands); with a timer resolution the bands are moved
 * onto the timer's grid and their lower ends re-checked (alignBandsToTimer); corners are tried
 * until the first that fails, and when the first burst is itself unsafe no lockout can make the
 * policy safe, so nothing is scanned. The return
 * to ambient is the last time the free cooling rise Σ c_m·e^(−t/tau_m) is above the threshold,
 * bracketed on a grid up to the time at which Σ|c_m|·e^(−t/tau_max) falls below it, and bisected.
 * Cost O((scanPoints + edges × log2(1/relTol)) × corners × N × cost of one attempt).
 * @throws InputError for bad corners, an empty burst or a threshold ≤ 0
 * @example
 * const scenario = {
 *   name: "short", model: fosterToModal({ kind: "foster", stages: [{ rKPerW: 0.5, tauS: 2 }] }),
 *   ambientC: 40, limitC: 150, marginK: 20, initialVoltageV: 0,
 *   attempt: () => ({ trace: [constantPowerSegment(0, 0.5, 400)], durationS: 0.5, endVoltageV: 0 }),
 *   discharge: () => 0,
 * };
 * lockoutAfterBurst([scenario], backoffBurst(3, 1, 2, 3)).minimumLockoutS // => 1.1268
 */
export function lockoutAfterBurst(scenarios: readonly RetryScenario[], burst: BurstPlan, options: LockoutOptions = {}): LockoutAnswer {
  const corners = resolveCorners(scenarios);
  const ambientReturnK = options.ambientReturnK ?? PLAN_DEFAULTS.ambientReturnK;
  if (!(ambientReturnK > 0) || !Number.isFinite(ambientReturnK)) throw inputError("out-of-range", "ambientReturnK", "a finite distance from ambient > 0 K", describeFound(ambientReturnK));
  burst.gapsS.forEach((g, i) => {
    if (!(g >= 0) || !Number.isFinite(g)) throw inputError("out-of-range", `burst.gapsS[${i}]`, "a finite gap ≥ 0 s", describeFound(g));
  });
  const first = corners.map((c) => {
    const cursor = new AttemptCursor(c);
    return { c, cursor, run: runBurst(cursor, burst, 0) };
  });
  const burstEndS = Math.max(...first.map((f) => f.cursor.endS));
  const burstEntry = governingCorner(first.map((f) => ({ corner: f.c.name, peakC: f.run.peakC, allowedC: f.c.allowedC, limitC: f.c.limitC, headroomK: f.run.overlapAt === null ? f.run.worstHeadroomK : -Infinity })));
  const second = (lockoutS: number) =>
    first.map((f) => {
      const run = runBurst(f.cursor.clone(), burst, burstEndS + lockoutS, true);
      return { f, run, entry: { corner: f.c.name, peakC: run.peakC, allowedC: f.c.allowedC, limitC: f.c.limitC, headroomK: run.overlapAt === null ? run.worstHeadroomK : -Infinity } };
    });
  const slowest = Math.max(...corners.map((c) => c.slowestTauS));
  // the second burst cannot start sooner than the relay allows after the first one's end
  const minWaitS = Math.max(...corners.map((c) => c.minWaitS));
  const scanToS = options.scanToS ?? PLAN_DEFAULTS.scanSpanTauMultiple * slowest;
  const grid = scanGrid(minWaitS, Math.max(scanToS, minWaitS), options.scanPoints ?? PLAN_DEFAULTS.scanPoints);
  const resolutionS = options.timerResolutionS ?? PLAN_DEFAULTS.timerResolutionS;
  if (!(resolutionS >= 0) || !Number.isFinite(resolutionS)) throw inputError("out-of-range", "timerResolutionS", "a finite timer resolution ≥ 0 s", describeFound(resolutionS));
  const safeAfter = everyCorner(first.length, (i, lockoutS) => {
    const run = runBurst(first[i]!.cursor.clone(), burst, burstEndS + lockoutS, true);
    return run.firstUnsafe === null && run.overlapAt === null;
  });
  // after an unsafe first burst no lockout makes the policy safe: the scan is skipped (no bands)
  const burstSafe = first.every((f) => f.run.firstUnsafe === null && f.run.overlapAt === null);
  const scanned = burstSafe ? scanFeasibleBands(safeAfter, grid) : { bands: [], evaluations: 0 };
  const aligned = alignBandsToTimer(scanned.bands, resolutionS, safeAfter);
  const bands = aligned.bands;
  const evaluations = scanned.evaluations + aligned.evaluations;
  const at = bands[0]?.fromS ?? grid[grid.length - 1]!;
  const governing = governingCorner(second(at).map((s) => s.entry));
  let ambientReturnS = 0;
  let ambientReturnCorner = corners[0]!.name;
  for (const f of first) {
    const t = returnTime(f.c, f.cursor, burstEndS, ambientReturnK);
    if (t > ambientReturnS) {
      ambientReturnS = t;
      ambientReturnCorner = f.c.name;
    }
  }
  return {
    burstSafe,
    burst: burstEntry,
    burstEndS,
    minimumLockoutS: bands[0]?.fromS ?? null,
    bands,
    governing,
    ambientReturnK,
    ambientReturnS,
    ambientReturnCorner,
    evaluations,
  };
}

/** Time after fromS [s] from which the free-cooling rise stays at or below thresholdK. */
function returnTime(c: ResolvedScenario, cursor: AttemptCursor, fromS: number, thresholdK: number): number {
  const rise = (t: number): number => cursor.riseAtK(fromS + t);
  const state = cursor.endState;
  const model = c.model;
  const modes = model.tauS.length;
  const gains = model.gainKPerW[c.observedIndex]!;
  let total = 0;
  for (let s = 0; s < model.sources.length; s++) for (let m = 0; m < modes; m++) total += Math.abs(gains[s]![m]! * state[s * modes + m]!);
  // Beyond this time even the sum of absolute contributions, decaying no slower than the slowest mode, is below the threshold.
  const beyond = Math.max(0, c.slowestTauS * Math.log(total / thresholdK)) - (fromS - cursor.endS);
  if (beyond <= 0) return 0;
  const grid = scanGrid(0, beyond, PLAN_DEFAULTS.scanPoints);
  let last = -1;
  grid.forEach((t, i) => {
    if (rise(t) > thresholdK) last = i;
  });
  if (last < 0) return 0;
  let lo = grid[last]!;
  let hi = grid[last + 1] ?? beyond;
  while (hi - lo > PLAN_DEFAULTS.bisectionRelTol * hi) {
    const mid = 0.5 * (lo + hi);
    if (mid <= lo || mid >= hi) break;
    if (rise(mid) > thresholdK) lo = mid;
    else hi = mid;
  }
  return hi;
}
