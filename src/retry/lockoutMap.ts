import { describeFound, inputError } from "../errors/InputError.js";
import { AttemptCursor } from "./AttemptCursor.js";
import { checkAttempts } from "./minUniformInterval.js";
import { PLAN_DEFAULTS } from "./planDefaults.js";
import { type RetryScenario, resolveCorners } from "./RetryScenario.js";
import { type RetrySpacing, uniformBurst } from "./RetrySchedule.js";
import { runBurst } from "./runBurst.js";
import { type Verdict, peakVerdict } from "../stress/Verdict.js";

/** One cell of the lockout map: a burst of `attempts` attempts at `intervalS`. */
export interface LockoutMapCell {
  readonly attempts: number;
  readonly intervalS: number;
  /** worst corner's highest temperature over the burst [°C]; null when the attempts would overlap */
  readonly peakC: number | null;
  /** that corner's limit − margin [°C] */
  readonly allowedC: number;
  /** that corner's limit [°C] */
  readonly limitC: number;
  /** fraction of the allowed rise used by the worst corner: (peak − ambient)/(allowed − ambient); null on overlap */
  readonly usedFraction: number | null;
  /**
   * the verdict words of every command (src/stress/Verdict.ts): "pass" within limit − margin,
   * "warn" above limit − margin and not above the limit, "fail" above the limit; and
   * "impossible": an attempt would start before the previous one ends
   */
  readonly status: Verdict | "impossible";
  /** the corner with the least headroom */
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
 * The lockout map: worst peak and verdict for every burst length 1..maxAttempts
 * and every interval. Each corner runs one burst of maxAttempts per interval; the peak of a
 * burst of n attempts is the highest own peak of its first n attempts (a shorter burst is a prefix
 * of the longer one, and own peaks do not depend on later attempts), so the whole column costs one
 * simulation. Cells take the corner with the least headroom.
 * Cost O(intervals × corners × maxAttempts × cost of one attempt).
 * @throws InputError for bad corners, a bad attempt count or an interval that is not finite and ≥ 0
 */
export function lockoutMap(scenarios: readonly RetryScenario[], maxAttempts: number, intervalsS: readonly number[], spacing: RetrySpacing = PLAN_DEFAULTS.spacing): LockoutMap {
  checkAttempts(maxAttempts, "maxAttempts");
  const corners = resolveCorners(scenarios);
  if (intervalsS.length === 0) throw inputError("out-of-range", "intervalsS", "at least one interval", "none");
  intervalsS.forEach((t, i) => {
    if (!(t >= 0) || !Number.isFinite(t)) throw inputError("out-of-range", `intervalsS[${i}]`, "a finite interval ≥ 0 s", describeFound(t));
  });
  const attempts = Array.from({ length: maxAttempts }, (_, a) => a + 1);
  const columns = intervalsS.map((t) => {
    const perCorner = corners.map((c) => runBurst(new AttemptCursor(c), uniformBurst(maxAttempts, t, spacing), 0).records);
    return attempts.map((n): LockoutMapCell => {
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
