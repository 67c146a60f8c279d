import { describeFound, inputError } from "../errors/InputError.js";
import { AttemptCursor, type AttemptRecord } from "./AttemptCursor.js";
import { checkAttempts } from "./minUniformInterval.js";
import { PLAN_DEFAULTS } from "./planDefaults.js";
import { type ResolvedScenario, type RetryScenario, resolveCorners } from "./RetryScenario.js";
import type { RetrySpacing } from "./RetrySchedule.js";
import { type Verdict, peakVerdict } from "../stress/Verdict.js";

/** One cell of the lockout map: a burst of `attempts` attempts at `intervalS`. */
export interface LockoutMapCell {
  readonly attempts: number;
  readonly intervalS: number;
  /**
   * worst corner's highest temperature over the burst [°C]; null when the attempts would overlap,
   * or when a shorter burst at this interval already takes a part above its limit (not simulated:
   * the cell fails with it)
   */
  readonly peakC: number | null;
  /** that corner's limit − margin [°C] */
  readonly allowedC: number;
  /** that corner's limit [°C] */
  readonly limitC: number;
  /** fraction of the allowed rise used by the worst corner: (peak − ambient)/(allowed − ambient); null when peakC is */
  readonly usedFraction: number | null;
  /**
   * the verdict words of every command (src/stress/Verdict.ts): "pass" within limit − margin,
   * "warn" above limit − margin and not above the limit, "fail" above the limit; and
   * "impossible": an attempt would start before the previous one ends
   */
  readonly status: Verdict | "impossible";
  /** the corner with the least headroom (for a cell below a burst above a limit: the corner above its limit) */
  readonly corner: string;
}

/** An attempts × interval grid of verdicts. */
export interface LockoutMap {
  readonly spacing: RetrySpacing;
  /** 1..maxAttempts */
  readonly attempts: readonly number[];
  readonly intervalsS: readonly number[];
  /** cells[a][i]: attempts[a] attempts at intervalsS[i] */
  readonly cells: readonly (readonly LockoutMapCell[])[];
}

/**
 * The lockout map, worst peak and verdict for every burst length 1..maxAttempts
 * and every interval. Each corner runs one burst per interval; the peak of a burst of n attempts
 * is the highest own peak of its first n attempts (a shorter burst is a prefix of the longer one,
 * and own peaks do not depend on later attempts), so the whole column costs one simulation, and
 * its first attempt (at t = 0 from a cold part, the same at every interval) is integrated once per
 * corner for all columns. The corners advance together, one attempt at a time, and a column stops
 * after the first attempt that takes some corner above its part's limit: every longer burst
 * contains that attempt, so its cells fail too (status "fail", no peak, that corner named).
 * Cells take the corner with the least headroom.
 * Cost O(intervals × corners × attempts until a limit is crossed (at most maxAttempts) × cost of one attempt).
 * @throws InputError for bad corners, a bad attempt count or an interval that is not finite and ≥ 0
 * @example
 * const scenario = {
 *   name: "short", model: fosterToModal({ kind: "foster", stages: [{ rKPerW: 0.5, tauS: 2 }] }),
 *   ambientC: 40, limitC: 150, marginK: 20, initialVoltageV: 0,
 *   attempt: () => ({ trace: [constantPowerSegment(0, 0.5, 400)], durationS: 0.5, endVoltageV: 0 }),
 *   discharge: () => 0,
 * };
 * lockoutMap([scenario], 3, [0.6, 2, 10]).cells.map((row) => row[0].status) // => ["pass", "pass", "warn"]
 */
export function lockoutMap(scenarios: readonly RetryScenario[], maxAttempts: number, intervalsS: readonly number[], spacing: RetrySpacing = PLAN_DEFAULTS.spacing): LockoutMap {
  checkAttempts(maxAttempts, "maxAttempts");
  const corners = resolveCorners(scenarios);
  if (intervalsS.length === 0) throw inputError("out-of-range", "intervalsS", "at least one interval", "none");
  intervalsS.forEach((t, i) => {
    if (!(t >= 0) || !Number.isFinite(t)) throw inputError("out-of-range", `intervalsS[${i}]`, "a finite interval ≥ 0 s", describeFound(t));
  });
  const attempts = Array.from({ length: maxAttempts }, (_, a) => a + 1);
  const started = corners.map((c) => {
    const cursor = new AttemptCursor(c);
    cursor.keep(cursor.tryAt(0)!);
    return cursor;
  });
  const columns = intervalsS.map((t) => {
    const { perCorner, crossed } = columnBursts(corners, started, maxAttempts, t, spacing);
    return attempts.map((n): LockoutMapCell => {
      if (crossed !== null && n > crossed.attempts) {
        const c = corners[crossed.corner]!;
        return { attempts: n, intervalS: t, peakC: null, allowedC: c.allowedC, limitC: c.limitC, usedFraction: null, status: "fail", corner: c.name };
      }
      let worst: LockoutMapCell | null = null;
      let worstHeadroom = Infinity;
      corners.forEach((c, ci) => {
        const records = perCorner[ci]!;
        if (records.length < n) {
          if (worstHeadroom > -Infinity) {
            worst = { attempts: n, intervalS: t, peakC: null, allowedC: c.allowedC, limitC: c.limitC, usedFraction: null, status: "impossible", corner: c.name };
            worstHeadroom = -Infinity;
          }
          return;
        }
        let peakC = -Infinity;
        for (let k = 0; k < n; k++) peakC = Math.max(peakC, records[k]!.peakC);
        const headroom = c.allowedC - peakC;
        if (headroom < worstHeadroom) {
          worstHeadroom = headroom;
          const status = peakVerdict(peakC, c.limitC, c.marginK);
          worst = { attempts: n, intervalS: t, peakC, allowedC: c.allowedC, limitC: c.limitC, usedFraction: (peakC - c.ambientC) / c.allowedRiseK, status, corner: c.name };
        }
      });
      return worst!;
    });
  });
  return { spacing, attempts, intervalsS: [...intervalsS], cells: attempts.map((_, a) => columns.map((col) => col[a]!)) };
}

/**
 * One column: every corner's burst at interval t (each from its cursor after the first attempt),
 * attempt by attempt in step, until maxAttempts, an overlap (that corner stops), or the first
 * attempt above a part's limit (every corner stops; `crossed` names the burst length and the
 * first corner, in order, above its limit).
 */
function columnBursts(
  corners: readonly ResolvedScenario[],
  started: readonly AttemptCursor[],
  maxAttempts: number,
  t: number,
  spacing: RetrySpacing,
): { perCorner: AttemptRecord[][]; crossed: { attempts: number; corner: number } | null } {
  const cursors = started.map((s) => s.clone());
  const perCorner = cursors.map((c) => [...c.history]);
  const running = cursors.map(() => true);
  for (let k = 0; k < maxAttempts; k++) {
    if (k > 0) {
      cursors.forEach((cursor, ci) => {
        if (!running[ci]) return;
        const trial = cursor.tryAt((spacing === "start-to-start" ? cursor.lastStartS : cursor.endS) + t);
        if (trial === null) running[ci] = false;
        else perCorner[ci]!.push(cursor.keep(trial));
      });
    }
    const over = corners.findIndex((c, ci) => perCorner[ci]!.length === k + 1 && perCorner[ci]![k]!.peakC > c.limitC);
    if (over >= 0) return { perCorner, crossed: { attempts: k + 1, corner: over } };
    if (!running.some((r) => r)) break;
  }
  return { perCorner, crossed: null };
}
