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
  /**
   * start-to-start only: what happens when an attempt outlasts its gap. "forbid" (default): the
   * burst is impossible (solvers treat it as unsafe); "start-at-end": the next attempt starts as
   * soon as the previous one ends and the relay has opened and closed again (the scenario's
   * minWaitS; how a firmware timer that is checked after the attempt behaves, and how duty
   * profiles expand retry blocks).
   */
  readonly overrun?: "forbid" | "start-at-end";
}

/**
 * The gaps of a retry block with back-off, start to start: the k-th gap is
 * min(interval·backoff^(k−1), maxInterval). Cost O(attempts).
 * @example
 * backoffBurst(4, 1, 2, 3).gapsS // => [1, 2, 3]
 */
export function backoffBurst(attempts: number, intervalS: number, backoff: number, maxIntervalS: number): BurstPlan {
  const gapsS: number[] = [];
  let gap = intervalS;
  for (let k = 1; k < attempts; k++) {
    gapsS.push(gap);
    gap = Math.min(gap * backoff, maxIntervalS);
  }
  return { gapsS, spacing: "start-to-start", overrun: "start-at-end" };
}

/**
 * A burst of `attempts` attempts at a uniform interval.
 * @example
 * uniformBurst(3, 2, "start-to-start") // => { gapsS: [2, 2], spacing: "start-to-start" }
 */
export function uniformBurst(attempts: number, intervalS: number, spacing: RetrySpacing): BurstPlan {
  return { gapsS: new Array<number>(Math.max(0, attempts - 1)).fill(intervalS), spacing };
}
