/**
 * How the wait of a retry policy is measured: from the start of one attempt to the start of the
 * next (a free-running timer; the classic "period"), or from the end of one attempt to the start
 * of the next (a timer started when the attempt trips or times out).
 */
export type RetrySpacing = "start-to-start" | "end-to-start";

/**
 * A burst of attempts: the first at the burst start, each further one a gap later, measured as
 * the spacing says. N attempts have N − 1 gaps.
 */
export interface BurstPlan {
  /** gaps before attempts 2..N [s], each ≥ 0 */
  readonly gapsS: readonly number[];
  readonly spacing: RetrySpacing;
}

/** A burst of `attempts` attempts at a uniform interval. */
export function uniformBurst(attempts: number, intervalS: number, spacing: RetrySpacing): BurstPlan {
  return { gapsS: new Array<number>(Math.max(0, attempts - 1)).fill(intervalS), spacing };
}
