import type { ProfileEvent } from "../profile/DutyProfile.js";

/** The retry policy of a profile: how firmware restarts a pre-charge that did not complete. */
export interface SupervisedRetryPolicy {
  /** where it is in the profile ("events[3].retry") */
  readonly field: string;
  /** attempts in a burst (N) */
  readonly attempts: number;
  /** start-to-start gaps before attempts 2..N [s]: min(interval·backoff^(k−1), maxInterval) */
  readonly gapsS: readonly number[];
  /** first start-to-start interval [s] */
  readonly intervalS: number;
  /** lockout after a failed burst [s] */
  readonly lockoutS: number;
}

/**
 * The first `retry` block of a profile (depth first, inside repeats too), as the supervisor's
 * retry policy; null when the profile has none. The gaps follow the profile's back-off exactly as
 * the profile expansion runs them: the k-th gap is min(interval·backoff^(k−1), maxInterval).
 * Source: profile keys of our own (DEVELOPERS.md, "Profile format").
 * Cost O(events + attempts).
 */
export function profileRetryPolicy(events: readonly ProfileEvent[]): SupervisedRetryPolicy | null {
  for (const e of events) {
    if (e.kind === "retry") {
      const gapsS: number[] = [];
      let gap = e.intervalS;
      for (let k = 1; k < e.attempts; k++) {
        gapsS.push(gap);
        gap = Math.min(gap * e.backoff, e.maxIntervalS);
      }
      return { field: e.field, attempts: e.attempts, gapsS, intervalS: e.intervalS, lockoutS: e.lockoutS };
    }
    if (e.kind === "repeat") {
      const inner = profileRetryPolicy(e.events);
      if (inner !== null) return inner;
    }
  }
  return null;
}
