import { describeFound, inputError } from "../errors/InputError.js";
import { AttemptCursor } from "./AttemptCursor.js";
import { type GoverningCorner, governingCorner } from "./GoverningCorner.js";
import { PLAN_DEFAULTS } from "./planDefaults.js";
import { type RetryScenario, resolveCorners } from "./RetryScenario.js";
import type { RetrySpacing } from "./RetrySchedule.js";
import { retryForeverCheck } from "./retryForeverCheck.js";

/** The answer to "how many attempts may run at this interval?". */
export interface MaxAttemptsAnswer {
  readonly intervalS: number;
  readonly spacing: RetrySpacing;
  /** the largest safe burst (0 when even the first attempt is unsafe; PLAN_DEFAULTS.attemptCap when capped); null when unlimited */
  readonly attempts: number | null;
  /** retrying for ever at this interval is safe in every corner (attempts is then meaningless: no lockout needed) */
  readonly unlimited: boolean;
  /** neither unlimited nor a failing attempt found within PLAN_DEFAULTS.attemptCap attempts */
  readonly capped: boolean;
  /** the corner whose first unsafe attempt comes first (or with the least headroom when unlimited) */
  readonly governing: GoverningCorner;
  /** own peak of the first unsafe attempt in the governing corner [°C], or null */
  readonly firstUnsafePeakC: number | null;
}

/**
 * The largest number of attempts a burst may have at a given interval.
 *
 * If retrying for ever at the interval is safe in every corner (retryForeverCheck, closed form),
 * the answer is "unlimited". Otherwise each corner runs attempts until the first whose own peak
 * is above limit − margin; the burst may have as many attempts as come before it, and the answer
 * is the smallest count over the corners.
 * Cost O(corners × attempts until the first failure × cost of one attempt).
 * @throws InputError `out-of-range` when the interval is shorter than an attempt (start-to-start
 *   spacing) plus the corners' shortest wait (the relay's release and operate times), a wait
 *   (end-to-start) is shorter than that shortest wait, or the interval is not a finite number ≥ 0
 */
export function maxAttempts(scenarios: readonly RetryScenario[], intervalS: number, spacing: RetrySpacing = PLAN_DEFAULTS.spacing): MaxAttemptsAnswer {
  const corners = resolveCorners(scenarios);
  if (!(intervalS >= 0) || !Number.isFinite(intervalS)) throw inputError("out-of-range", "intervalS", "a finite retry interval ≥ 0 s", describeFound(intervalS));
  const verdicts = corners.map((c) => retryForeverCheck(c, intervalS, spacing));
  const overlapping = verdicts.findIndex((v) => v.overlap);
  if (overlapping >= 0) {
    const c = corners[overlapping]!;
    const relay = c.minWaitS > 0 ? ` plus the ${c.minWaitS} s the relay needs to open and close again` : "";
    if (spacing === "end-to-start") throw inputError("out-of-range", "intervalS", `a wait between attempts of at least ${c.minWaitS} s (the relay's release and operate times)`, `${intervalS} s`);
    const cursor = new AttemptCursor(c);
    let longest = 0;
    for (let k = 0; k < 50; k++) {
      const trial = cursor.tryAt(k === 0 ? 0 : Math.max(cursor.lastStartS + intervalS, cursor.earliestNextS));
      if (trial === null) break;
      longest = Math.max(longest, cursor.keep(trial).durationS);
      if (longest + c.minWaitS > intervalS) break;
    }
    throw inputError("out-of-range", "intervalS", `a start-to-start interval at least as long as an attempt${relay} (${longest + c.minWaitS} s in corner "${c.name}")`, `${intervalS} s`);
  }
  if (verdicts.every((v) => v.safe)) {
    const governing = governingCorner(
      verdicts.map((v) => ({ corner: v.corner, peakC: Math.max(v.transientPeakC, v.steadyPeakC ?? -Infinity), allowedC: v.allowedC, limitC: v.limitC, headroomK: v.headroomK })),
    );
    return { intervalS, spacing, attempts: null, unlimited: true, capped: false, governing, firstUnsafePeakC: null };
  }
  let best: { count: number; entry: GoverningCorner; failPeakC: number | null } | null = null;
  for (const c of corners) {
    const cursor = new AttemptCursor(c);
    let count = 0;
    let failPeakC: number | null = null;
    let worst = -Infinity;
    for (let k = 0; k < PLAN_DEFAULTS.attemptCap; k++) {
      const trial = cursor.tryAt(k === 0 ? 0 : (spacing === "start-to-start" ? cursor.lastStartS : cursor.endS) + intervalS);
      if (trial === null) break;
      cursor.keep(trial);
      if (!trial.safe) {
        failPeakC = trial.record.peakC;
        break;
      }
      worst = Math.max(worst, trial.record.peakC);
      count++;
    }
    const peakC = failPeakC ?? worst;
    const entry: GoverningCorner = { corner: c.name, peakC, allowedC: c.allowedC, limitC: c.limitC, headroomK: c.allowedC - peakC };
    if (best === null || count < best.count || (count === best.count && entry.headroomK < best.entry.headroomK)) best = { count, entry, failPeakC };
  }
  return {
    intervalS,
    spacing,
    attempts: best!.count,
    unlimited: false,
    capped: best!.failPeakC === null,
    governing: best!.entry,
    firstUnsafePeakC: best!.failPeakC,
  };
}
