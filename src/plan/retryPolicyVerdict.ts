import { describeFound, inputError } from "../errors/InputError.js";
import { AttemptCursor, type AttemptRecord } from "./AttemptCursor.js";
import { burstAsAttempt } from "./burstAsAttempt.js";
import { type GoverningCorner, governingCorner } from "./GoverningCorner.js";
import { type RetryScenario, resolveCorners, resolveScenario } from "./RetryScenario.js";
import type { BurstPlan } from "./RetrySchedule.js";
import { type ForeverVerdict, retryForeverCheck } from "./retryForeverCheck.js";
import { runBurst } from "./runBurst.js";

/** Whether a firmware retry policy (a burst, then a lockout, again while the fault persists) is safe. */
export interface RetryPolicyVerdict {
  /** "safe" when the burst and the repeated burst + lockout cycle stay at or below limit − margin in every corner */
  readonly verdict: "safe" | "unsafe";
  /** the first burst, from a cold part, is safe in every corner */
  readonly burstSafe: boolean;
  /** the corner with the least headroom in the first burst */
  readonly burst: GoverningCorner;
  /** each corner's attempts of the first burst */
  readonly perCorner: readonly { readonly corner: string; readonly attempts: readonly AttemptRecord[] }[];
  /** burst, lockout, burst, ... for ever is safe in every corner */
  readonly cyclesSafe: boolean;
  /** the corner with the least headroom over the repeated cycle */
  readonly cycles: GoverningCorner;
  /** each corner's verdict for the repeated cycle (closed form where proven) */
  readonly cycleVerdicts: readonly ForeverVerdict[];
  /** one sentence per problem found, naming the corner */
  readonly reasons: readonly string[];
}

/**
 * Check a retry policy as firmware would run it into a persistent fault: the burst from a cold
 * part (attempt by attempt, own peaks), and the burst followed by the lockout repeated for ever,
 * through retryForeverCheck on the burst taken as one attempt (burstAsAttempt) with the lockout
 * as an end-to-start wait: periodic steady state of the super-cycle in closed form.
 * Source: docs/design.md, "Periodic steady state" applied to the burst + lockout cycle.
 * Cost O(corners × (N + cycles to settle × N) × cost of one attempt).
 * @throws InputError for bad corners or a lockout that is not finite and ≥ 0
 */
export function retryPolicyVerdict(scenarios: readonly RetryScenario[], burst: BurstPlan, lockoutS: number): RetryPolicyVerdict {
  const corners = resolveCorners(scenarios);
  if (!(lockoutS >= 0) || !Number.isFinite(lockoutS)) throw inputError("out-of-range", "lockoutS", "a finite lockout ≥ 0 s", describeFound(lockoutS));
  const reasons: string[] = [];
  const runs = corners.map((c) => ({ c, run: runBurst(new AttemptCursor(c), burst, 0) }));
  const burstEntries = runs.map(({ c, run }) => ({ corner: c.name, peakC: run.peakC, allowedC: c.allowedC, limitC: c.limitC, headroomK: run.overlapAt === null ? run.worstHeadroomK : -Infinity }));
  for (const { c, run } of runs) {
    if (run.overlapAt !== null)
      reasons.push(`corner "${c.name}": attempt ${run.overlapAt + 1} would start before attempt ${run.overlapAt} ends${c.minWaitS > 0 ? ` and the relay has opened and closed again (${c.minWaitS} s)` : ""}`);
    else if (run.firstUnsafe !== null)
      reasons.push(`corner "${c.name}": attempt ${run.firstUnsafe + 1} of the burst reaches ${run.records[run.firstUnsafe]!.peakC.toFixed(1)} °C, above limit − margin ${c.allowedC.toFixed(1)} °C`);
  }
  const cycleVerdicts = scenarios.map((s, i) => retryForeverCheck(resolveScenario(burstAsAttempt(s, burst), `corners[${i}]`), lockoutS, "end-to-start"));
  // each corner's hottest point of the repeated cycle: the way in (transient) or the settled cycle
  const cyclePeaksC = cycleVerdicts.map((v) => Math.max(v.transientPeakC, v.steadyPeakC ?? -Infinity));
  cycleVerdicts.forEach((v, i) => {
    if (v.overlap) reasons.push(`corner "${v.corner}": a ${lockoutS} s lockout is shorter than the relay's release and operate times (${corners[i]!.minWaitS} s): the next burst cannot start that soon`);
    else if (!v.safe)
      reasons.push(`corner "${v.corner}": repeating burst + ${lockoutS} s lockout while the fault persists reaches ${cyclePeaksC[i]!.toFixed(1)} °C, above limit − margin ${v.allowedC.toFixed(1)} °C`);
  });
  const burstSafe = runs.every(({ run }) => run.overlapAt === null && run.firstUnsafe === null);
  const cyclesSafe = cycleVerdicts.every((v) => v.safe);
  return {
    verdict: burstSafe && cyclesSafe ? "safe" : "unsafe",
    burstSafe,
    burst: governingCorner(burstEntries),
    perCorner: runs.map(({ c, run }) => ({ corner: c.name, attempts: run.records })),
    cyclesSafe,
    cycles: governingCorner(cycleVerdicts.map((v, i) => ({ corner: v.corner, peakC: cyclePeaksC[i]!, allowedC: v.allowedC, limitC: v.limitC, headroomK: v.headroomK }))),
    cycleVerdicts,
    reasons,
  };
}
