import { describeFound, inputError } from "../errors/InputError.js";

/** One measured or read-off point of a transient thermal impedance curve. */
export interface ZthPoint {
  /** time since the power step (or pulse duration) [s], > 0 */
  readonly timeS: number;
  /** transient thermal impedance at that time [K/W], > 0 */
  readonly zthKPerW: number;
}

/**
 * Check Zth points before a fit: at least `minPoints` of them, every time and Zth finite and > 0,
 * times strictly increasing. Zth is not required to rise monotonically (read-off or measured
 * curves carry noise), but it must be positive: Zth(t) of a passive RC network is > 0 for t > 0.
 * Source: JEDEC JESD51-1 (1995), §3 (Zth as the step response of a passive thermal system).
 * Cost O(points).
 * @param points the points in time order
 * @param field dotted field path for messages (for example `points`)
 * @param minPoints the fewest points the caller can work with
 * @throws InputError `bad-network` naming the first bad point
 */
export function validateZthPoints(points: readonly ZthPoint[], field = "points", minPoints = 1): void {
  if (points.length < minPoints)
    throw inputError("bad-network", field, `at least ${minPoints} Zth points`, `${points.length}`);
  points.forEach((p, i) => {
    if (!Number.isFinite(p.timeS) || !(p.timeS > 0))
      throw inputError("bad-network", `${field}[${i}].time`, "a time > 0 s", describeFound(p.timeS));
    if (!Number.isFinite(p.zthKPerW) || !(p.zthKPerW > 0))
      throw inputError("bad-network", `${field}[${i}].zth`, "a thermal impedance > 0 K/W", describeFound(p.zthKPerW));
    const before = points[i - 1];
    if (before !== undefined && !(p.timeS > before.timeS))
      throw inputError(
        "bad-network",
        `${field}[${i}].time`,
        `a time later than the previous point's ${before.timeS} s (times must increase strictly)`,
        describeFound(p.timeS),
      );
  });
}
