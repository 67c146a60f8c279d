import type { ProfileEvent } from "../profile/DutyProfile.js";

/** A retry block of a profile. */
export type RetryBlock = Extract<ProfileEvent, { kind: "retry" }>;

/**
 * The first retry block of a profile's events, depth first (inside repeats too), that `accept`
 * takes; undefined when there is none. The retry planner wants one with a fault, the supervisor
 * any. Cost O(events).
 */
export function firstRetryBlock(events: readonly ProfileEvent[], accept: (block: RetryBlock) => boolean = () => true): RetryBlock | undefined {
  for (const e of events) {
    if (e.kind === "retry" && accept(e)) return e;
    if (e.kind === "repeat") {
      const inner = firstRetryBlock(e.events, accept);
      if (inner !== undefined) return inner;
    }
  }
  return undefined;
}
