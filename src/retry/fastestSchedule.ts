import { describeFound, inputError } from "../errors/InputError.js";
import { AttemptCursor, type AttemptRecord, type AttemptTrial } from "./AttemptCursor.js";
import { checkAttempts } from "./minUniformInterval.js";
import { type GoverningCorner, governingCorner } from "./GoverningCorner.js";
import { PLAN_DEFAULTS } from "./planDefaults.js";
import { type RetryScenario, type ResolvedScenario, resolveCorners } from "./RetryScenario.js";
import { scanGrid } from "./scanFeasibleBands.js";
import { ceilToTimer, earliestOnTimer } from "./alignToTimer.js";

/** Options of {@link fastestSchedule}; every field has a default (PLAN_DEFAULTS). */
export interface FastestScheduleOptions {
  /** longest wait searched before an attempt [s] (default PLAN_DEFAULTS.scanSpanTauMultiple × slowest time constant) */
  readonly maxWaitS?: number;
  /** wait scan points (default PLAN_DEFAULTS.scanPoints) */
  readonly scanPoints?: number;
  /** the firmware timer's resolution [s]: every wait is a whole number of steps (default PLAN_DEFAULTS.timerResolutionS, 0: no rounding) */
  readonly timerResolutionS?: number;
}

/** One row of the fastest schedule. */
export interface ScheduledAttempt {
  /** 1-based attempt number */
  readonly attempt: number;
  /** start [s] from the first attempt's start (the latest over the corners) */
  readonly startS: number;
  /** wait after the previous attempt ended, the same in every corner [s]; null for the first */
  readonly waitS: number | null;
  /** this wait over the previous one; null for the first two attempts or a zero previous wait */
  readonly ratio: number | null;
  /** the corner with the least headroom for this attempt */
  readonly governing: GoverningCorner;
}

/** The fastest safe schedule and what it implies. */
export interface FastestScheduleAnswer {
  /** attempts scheduled (fewer than asked when an attempt cannot be made safe within maxWaitS) */
  readonly schedule: readonly ScheduledAttempt[];
  readonly requestedAttempts: number;
  /** why the schedule stopped early, or null */
  readonly stoppedBecause: string | null;
  /** geometric mean of the ratios of successive positive waits, (last/first)^(1/(n − 1)) over the n positive waits; null with fewer than 2 */
  readonly impliedBackoffRatio: number | null;
  /** end of the last attempt (latest over corners) [s] */
  readonly burstEndS: number;
  /** the shortest wait any attempt could have: the corners' shortest wait (relay) rounded up to the timer [s] */
  readonly shortestWaitS: number;
  /** each corner's attempts as simulated on the schedule */
  readonly perCorner: readonly { readonly corner: string; readonly attempts: readonly AttemptRecord[] }[];
}

/**
 * The fastest safe schedule: every attempt starts at the earliest moment at which
 * its own peak stays at or below limit − margin in every corner.
 *
 * Attempt 1 starts at t = 0. For each later attempt the waits after the previous attempt's end
 * (each corner from its own end, as a firmware timer started at the end or trip would) are
 * scanned upward from the shortest wait the relay allows (the corners' minWaitS) on the scan
 * grid, stopping at the first
 * wait that is safe in every corner; the edge between it and the unsafe wait before it is
 * bisected (relative tolerance PLAN_DEFAULTS.bisectionRelTol), keeping the safe side. Scanning
 * upward from 0 finds the earliest safe moment even when peak against wait is not monotone
 * (a quick retry into a nearly full capacitor can be safe when a slower one is not). Because each
 * attempt is placed at its own earliest safe moment and later attempts only add heat after it,
 * no attempt of the finished schedule is above the limit, and starting any of them earlier makes
 * it exceed (to within the bisection tolerance, and for waits on the unsafe side of the edge).
 * With a timer resolution every wait is a whole number of timer steps: the earliest safe wait is
 * rounded up and the attempt simulated again at the rounded wait (stepping up while it is not
 * safe), so the schedule kept is the rounded one.
 * Cost O(attempts × (scan points up to the answer + log2(1/relTol)) × corners × cost of one attempt).
 * @throws InputError for bad corners or options
 * @example
 * const scenario = {
 *   name: "short", model: fosterToModal({ kind: "foster", stages: [{ rKPerW: 0.5, tauS: 2 }] }),
 *   ambientC: 40, limitC: 150, marginK: 20, initialVoltageV: 0,
 *   attempt: () => ({ trace: [constantPowerSegment(0, 0.5, 400)], durationS: 0.5, endVoltageV: 0 }),
 *   discharge: () => 0,
 * };
 * fastestSchedule([scenario], 4).schedule.map((s) => s.waitS) // => [null, 0, 0.5843, 0.8528]
 */
export function fastestSchedule(scenarios: readonly RetryScenario[], attempts: number, options: FastestScheduleOptions = {}): FastestScheduleAnswer {
  checkAttempts(attempts);
  const corners = resolveCorners(scenarios);
  const maxWaitS = options.maxWaitS ?? PLAN_DEFAULTS.scanSpanTauMultiple * Math.max(...corners.map((c) => c.slowestTauS));
  if (!(maxWaitS > 0) || !Number.isFinite(maxWaitS)) throw inputError("out-of-range", "maxWaitS", "a finite longest wait > 0 s", describeFound(maxWaitS));
  const resolutionS = options.timerResolutionS ?? PLAN_DEFAULTS.timerResolutionS;
  if (!(resolutionS >= 0) || !Number.isFinite(resolutionS)) throw inputError("out-of-range", "timerResolutionS", "a finite timer resolution ≥ 0 s", describeFound(resolutionS));
  const minWaitS = Math.max(...corners.map((c) => c.minWaitS));
  const grid = scanGrid(minWaitS, Math.max(maxWaitS, minWaitS), options.scanPoints ?? PLAN_DEFAULTS.scanPoints);
  const cursors = corners.map((c) => new AttemptCursor(c));
  const schedule: ScheduledAttempt[] = [];
  let stoppedBecause: string | null = null;
  const trialsAt = (startOf: (cursor: AttemptCursor) => number): AttemptTrial[] | null => {
    const trials: AttemptTrial[] = [];
    for (const cursor of cursors) {
      const t = cursor.tryAt(startOf(cursor));
      if (t === null || !t.safe) return null;
      trials.push(t);
    }
    return trials;
  };
  for (let k = 0; k < attempts; k++) {
    let waitS: number | null = null;
    let trials: AttemptTrial[] | null = null;
    if (k === 0) trials = trialsAt(() => 0);
    else {
      // Each corner waits from its own attempt's end (a firmware timer started when the attempt
      // ends or trips), so the wait is common and the start times may differ between corners.
      const after = (w: number) => (cursor: AttemptCursor) => cursor.endS + w;
      waitS = earliestWait(grid, (w) => trialsAt(after(w)) !== null, resolutionS);
      trials = waitS === null ? null : trialsAt(after(waitS));
    }
    if (trials === null) {
      stoppedBecause =
        k === 0
          ? `the first attempt alone exceeds limit − margin in corner "${firstUnsafeCorner(cursors, 0)}"`
          : `attempt ${k + 1} exceeds limit − margin after every wait up to ${maxWaitS} s`;
      break;
    }
    trials.forEach((t, i) => cursors[i]!.keep(t));
    const previousWait = schedule[schedule.length - 1]?.waitS ?? null;
    schedule.push({
      attempt: k + 1,
      startS: Math.max(...trials.map((t) => t.record.startS)),
      waitS,
      ratio: waitS !== null && previousWait !== null && previousWait > 0 ? waitS / previousWait : null,
      governing: governingCorner(trials.map((t, i) => entry(corners[i]!, t))),
    });
  }
  const waits = schedule.map((s) => s.waitS).filter((w): w is number => w !== null && w > 0);
  const first = waits[0];
  const last = waits[waits.length - 1];
  const impliedBackoffRatio = waits.length >= 2 && first !== undefined && last !== undefined && first > 0 ? (last / first) ** (1 / (waits.length - 1)) : null;
  return {
    schedule,
    requestedAttempts: attempts,
    stoppedBecause,
    impliedBackoffRatio,
    burstEndS: Math.max(...cursors.map((c) => c.endS)),
    shortestWaitS: ceilToTimer(minWaitS, resolutionS),
    perCorner: cursors.map((c) => ({ corner: c.corner.name, attempts: c.history })),
  };
}

function entry(c: ResolvedScenario, t: AttemptTrial): GoverningCorner {
  return { corner: c.name, peakC: t.record.peakC, allowedC: c.allowedC, limitC: c.limitC, headroomK: t.headroomK };
}

function firstUnsafeCorner(cursors: readonly AttemptCursor[], startS: number): string {
  for (const c of cursors) {
    const t = c.tryAt(startS);
    if (t === null || !t.safe) return c.corner.name;
  }
  return cursors[0]!.corner.name;
}

/**
 * The earliest safe wait: the grid scanned upward to its first safe point and the edge below it
 * bisected (continuous answer); with a timer resolution, that answer rounded up to a whole timer
 * step and re-checked, stepping up while it fails (earliestOnTimer), and when the steps give up,
 * the scan resumes above the last step tried. null when no wait on the grid is safe.
 */
function earliestWait(grid: readonly number[], safe: (w: number) => boolean, resolutionS: number): number | null {
  let from = 0;
  let unsafeBelow = -1;
  for (;;) {
    let continuous: number | null = null;
    let previous = unsafeBelow;
    for (let i = from; i < grid.length; i++) {
      const w = grid[i]!;
      if (safe(w)) {
        continuous = previous < 0 ? w : refine(previous, w, safe);
        break;
      }
      previous = w;
    }
    if (continuous === null) return null;
    const top = grid[grid.length - 1]!;
    const onTimer = earliestOnTimer(continuous, resolutionS, top, safe);
    if (onTimer !== null) return onTimer;
    // no whole timer step passed near the continuous answer: look again above the last one tried
    unsafeBelow = ceilToTimer(continuous, resolutionS) + (PLAN_DEFAULTS.timerAlignSteps - 1) * resolutionS;
    from = grid.findIndex((w) => w > unsafeBelow);
    if (from < 0) return null;
  }
}

/** Bisect between an unsafe lo and a safe hi; returns the safe side. */
function refine(lo: number, hi: number, safe: (x: number) => boolean): number {
  while (hi - lo > PLAN_DEFAULTS.bisectionRelTol * hi) {
    const mid = 0.5 * (lo + hi);
    if (mid <= lo || mid >= hi) break;
    if (safe(mid)) hi = mid;
    else lo = mid;
  }
  return hi;
}
