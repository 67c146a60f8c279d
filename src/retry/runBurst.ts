import type { AttemptCursor, AttemptRecord } from "./AttemptCursor.js";
import type { BurstPlan } from "./RetrySchedule.js";

/** What a burst did in one corner. */
export interface BurstRun {
  /** the attempts run (all of them, or up to the first unsafe one when stopping early) */
  readonly records: readonly AttemptRecord[];
  /** index within the burst of the first attempt whose own peak is above limit − margin, or null */
  readonly firstUnsafe: number | null;
  /** index within the burst of the first attempt that would start before the previous one ended, or null */
  readonly overlapAt: number | null;
  /** lowest headroom (allowed − own peak) over the attempts run [K] */
  readonly worstHeadroomK: number;
  /** highest own peak over the attempts run [°C] */
  readonly peakC: number;
}

/**
 * Run a burst on a cursor, keeping every attempt: the first starts at `firstStartS`, each further
 * one its gap after the previous attempt's start or end (plan.spacing).
 * Cost O(attempts × cost of one attempt).
 * @param stopWhenUnsafe stop at the first unsafe attempt (predicates need no more)
 */
export function runBurst(cursor: AttemptCursor, plan: BurstPlan, firstStartS: number, stopWhenUnsafe = false): BurstRun {
  const records: AttemptRecord[] = [];
  let firstUnsafe: number | null = null;
  let worstHeadroomK = Infinity;
  let peakC = -Infinity;
  for (let i = 0; i <= plan.gapsS.length; i++) {
    let startS = i === 0 ? firstStartS : (plan.spacing === "start-to-start" ? cursor.lastStartS : cursor.endS) + plan.gapsS[i - 1]!;
    if (i > 0 && plan.overrun === "start-at-end" && startS < cursor.earliestNextS) startS = cursor.earliestNextS;
    const trial = cursor.tryAt(startS);
    if (trial === null) return { records, firstUnsafe, overlapAt: i, worstHeadroomK, peakC };
    records.push(cursor.keep(trial));
    worstHeadroomK = Math.min(worstHeadroomK, trial.headroomK);
    peakC = Math.max(peakC, trial.record.peakC);
    if (!trial.safe && firstUnsafe === null) {
      firstUnsafe = i;
      if (stopWhenUnsafe) break;
    }
  }
  return { records, firstUnsafe, overlapAt: null, worstHeadroomK, peakC };
}
