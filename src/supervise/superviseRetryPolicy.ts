import type { ProfileEvent } from "../profile/DutyProfile.js";
import { firstRetryBlock } from "../retry/firstRetryBlock.js";
import { type BurstPlan, backoffBurst } from "../retry/RetrySchedule.js";

/** The retry policy of a profile: how firmware restarts a pre-charge that did not complete. */
export interface SupervisedRetryPolicy {
  /** where it is in the profile ("events[3].retry") */
  readonly field: string;
  /** attempts in a burst (N) */
  readonly attempts: number;
  /** start-to-start gaps before attempts 2..N [s]: min(interval·backoff^(k−1), maxInterval) */
  readonly gapsS: readonly number[];
  /** the burst as the retry planner runs it (backoffBurst: start to start, an overrun starts the next attempt at once) */
  readonly burst: BurstPlan;
  /** first start-to-start interval [s] */
  readonly intervalS: number;
  /** lockout after a failed burst [s] */
  readonly lockoutS: number;
}

/**
 * The first `retry` block of a profile (depth first, inside repeats too), as the supervisor's
 * retry policy; null when the profile has none. The burst is the retry planner's backoffBurst:
 * the k-th gap is min(interval·backoff^(k−1), maxInterval), as the profile expansion runs it.
 * Source: profile keys of our own (docs/profile-format.md).
 * Cost O(events + attempts).
 */
export function profileRetryPolicy(events: readonly ProfileEvent[]): SupervisedRetryPolicy | null {
  const e = firstRetryBlock(events);
  if (e === undefined) return null;
  const burst = backoffBurst(e.attempts, e.intervalS, e.backoff, e.maxIntervalS);
  return { field: e.field, attempts: e.attempts, gapsS: burst.gapsS, burst, intervalS: e.intervalS, lockoutS: e.lockoutS };
}
