import { type InputError, describeFound, inputError } from "../errors/InputError.js";
import { AttemptCursor } from "./AttemptCursor.js";
import { type GoverningCorner, governingCorner } from "./GoverningCorner.js";
import { PLAN_DEFAULTS } from "./planDefaults.js";
import { firstUnsafeAttempt } from "./firstUnsafeAttempt.js";
import { type ResolvedScenario, type RetryScenario, resolveCorners } from "./RetryScenario.js";
import type { RetrySpacing } from "./RetrySchedule.js";
import { type ForeverVerdict, retryForeverCheck } from "./retryForeverCheck.js";

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
 * the answer is "unlimited". Otherwise each corner's attempts run until the first whose own peak
 * is above limit − margin; the burst may have as many attempts as come before it, and the answer
 * is the smallest count over the corners (the corner with the least headroom among those with
 * that count governs). The work stops as soon as the answer is decided:
 * - corners are checked for retrying for ever in order, and only until the first that is not safe;
 * - the first unsafe attempt of each corner is found by firstUnsafeAttempt (exponential search
 *   and bisection on the settled train in closed form where its monotonicity is proven, else one
 *   by one), looking no further than the smallest count found so far: a corner whose attempts are
 *   all safe up to there cannot govern (a corner whose forever check already ran that many safe
 *   attempts is not run again).
 * So a profile whose first attempt is unsafe in a corner costs one attempt per remaining corner.
 * The count agrees with a plain scan of every attempt up to PLAN_DEFAULTS.attemptCap (see
 * firstUnsafeAttempt for the rounding of the closed form).
 * Cost O(corners × (attempts to settle + log2 PLAN_DEFAULTS.attemptCap) × cost of one attempt)
 * when the closed form applies, else O(corners × attempts until the first failure × cost of one attempt).
 * @throws InputError `out-of-range` when the interval is shorter than an attempt that the answer
 *   depends on (start-to-start spacing) plus the corners' shortest wait (the relay's release and
 *   operate times), a wait (end-to-start) is shorter than that shortest wait, or the interval is
 *   not a finite number ≥ 0
 * @example
 * const scenario = {
 *   name: "short", model: fosterToModal({ kind: "foster", stages: [{ rKPerW: 0.5, tauS: 2 }] }),
 *   ambientC: 40, limitC: 150, marginK: 20, initialVoltageV: 0,
 *   attempt: () => ({ trace: [constantPowerSegment(0, 0.5, 400)], durationS: 0.5, endVoltageV: 0 }),
 *   discharge: () => 0,
 * };
 * maxAttempts([scenario], 1).attempts // => 3
 */
export function maxAttempts(scenarios: readonly RetryScenario[], intervalS: number, spacing: RetrySpacing = PLAN_DEFAULTS.spacing): MaxAttemptsAnswer {
  const corners = resolveCorners(scenarios);
  if (!(intervalS >= 0) || !Number.isFinite(intervalS)) throw inputError("out-of-range", "intervalS", "a finite retry interval ≥ 0 s", describeFound(intervalS));
  const verdicts: ForeverVerdict[] = [];
  for (const c of corners) {
    const v = retryForeverCheck(c, intervalS, spacing);
    if (v.overlap) throw overlapError(c, intervalS, spacing);
    verdicts.push(v);
    if (!v.safe) break;
  }
  if (verdicts.length === corners.length && verdicts.every((v) => v.safe)) {
    const governing = governingCorner(
      verdicts.map((v) => ({ corner: v.corner, peakC: Math.max(v.transientPeakC, v.steadyPeakC ?? -Infinity), allowedC: v.allowedC, limitC: v.limitC, headroomK: v.headroomK })),
    );
    return { intervalS, spacing, attempts: null, unlimited: true, capped: false, governing, firstUnsafePeakC: null };
  }
  // the corner found unsafe first, then the others in order; `last` is the last attempt index that
  // can still change the answer (a later corner governs only with a count at most the best so far)
  const unsafe = verdicts.length - 1;
  const order = [unsafe, ...corners.map((_, i) => i).filter((i) => i !== unsafe)];
  const counted: { index: number; count: number; entry: GoverningCorner; failPeakC: number | null }[] = [];
  let last = PLAN_DEFAULTS.attemptCap - 1;
  for (const i of order) {
    const c = corners[i]!;
    const v = verdicts[i];
    if (v !== undefined && v.safe && v.attemptsSimulated > last) continue;
    const found = firstUnsafeAttempt(c, intervalS, spacing, last);
    if (found.overlap) throw overlapError(c, intervalS, spacing);
    if (found.index === null && last < PLAN_DEFAULTS.attemptCap - 1) continue;
    const count = found.index ?? PLAN_DEFAULTS.attemptCap;
    const peakC = found.peakC ?? found.worstSafePeakC;
    counted.push({ index: i, count, entry: { corner: c.name, peakC, allowedC: c.allowedC, limitC: c.limitC, headroomK: c.allowedC - peakC }, failPeakC: found.peakC });
    if (found.index !== null) last = Math.min(last, found.index);
  }
  let best: (typeof counted)[number] | null = null;
  for (const r of counted.sort((a, b) => a.index - b.index)) {
    if (best === null || r.count < best.count || (r.count === best.count && r.entry.headroomK < best.entry.headroomK)) best = r;
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

/**
 * The error for an interval too short in corner c: shorter than the relay's shortest wait
 * (end-to-start), or than an attempt plus that wait (start-to-start, naming the longest attempt seen).
 */
function overlapError(c: ResolvedScenario, intervalS: number, spacing: RetrySpacing): InputError {
  if (spacing === "end-to-start") return inputError("out-of-range", "intervalS", `a wait between attempts of at least ${c.minWaitS} s (the relay's release and operate times)`, `${intervalS} s`);
  const relay = c.minWaitS > 0 ? ` plus the ${c.minWaitS} s the relay needs to open and close again` : "";
  const cursor = new AttemptCursor(c);
  let longest = 0;
  for (let k = 0; k < 50; k++) {
    const trial = cursor.tryAt(k === 0 ? 0 : Math.max(cursor.lastStartS + intervalS, cursor.earliestNextS));
    if (trial === null) break;
    longest = Math.max(longest, cursor.keep(trial).durationS);
    if (longest + c.minWaitS > intervalS) break;
  }
  return inputError("out-of-range", "intervalS", `a start-to-start interval at least as long as an attempt${relay} (${longest + c.minWaitS} s in corner "${c.name}")`, `${intervalS} s`);
}
