import { describeFound, inputError } from "../errors/InputError.js";
import { AttemptCursor, type AttemptRecord } from "./AttemptCursor.js";
import { burstAsAttempt } from "./burstAsAttempt.js";
import { type GoverningCorner, governingCorner } from "./GoverningCorner.js";
import { type RetryScenario, resolveCorners, resolveScenario } from "./RetryScenario.js";
import type { BurstPlan } from "./RetrySchedule.js";
import { type ForeverVerdict, retryForeverCheck } from "./retryForeverCheck.js";
import { runBurst } from "./runBurst.js";
import { type Verdict, peakVerdict, worstVerdict } from "../stress/Verdict.js";

/** Whether a firmware retry policy (a burst, then a lockout, again while the fault persists) is safe. */
export interface RetryPolicyVerdict {
  /**
   * the policy's verdict (src/stress/Verdict.ts), the worse of burstVerdict and cyclesVerdict:
   * "pass" when the burst and the repeated burst + lockout cycle stay at or below limit − margin
   * in every corner, "warn" when some peak is inside the margin but none above the limit, "fail"
   * when a peak is above the limit or an attempt would start before the previous one ends
   */
  readonly verdict: Verdict;
  /** the first burst's verdict, worst corner */
  readonly burstVerdict: Verdict;
  /** the repeated burst + lockout cycle's verdict, worst corner */
  readonly cyclesVerdict: Verdict;
  /** the first burst, from a cold part, is safe in every corner (burstVerdict is pass) */
  readonly burstSafe: boolean;
  /** the corner with the least headroom in the first burst */
  readonly burst: GoverningCorner;
  /** each corner's attempts of the first burst */
  readonly perCorner: readonly { readonly corner: string; readonly attempts: readonly AttemptRecord[] }[];
  /** burst, lockout, burst, ... for ever is safe in every corner (cyclesVerdict is pass) */
  readonly cyclesSafe: boolean;
  /** the corner with the least headroom over the repeated cycle */
  readonly cycles: GoverningCorner;
  /** each corner's verdict for the repeated cycle (closed form where proven) */
  readonly cycleVerdicts: readonly ForeverVerdict[];
  /** one sentence per problem found, naming the corner */
  readonly reasons: readonly string[];
}

/** Options of {@link retryPolicyVerdict}. */
export interface RetryPolicyVerdictOptions {
  /**
   * tell warn from fail for a repeated cycle above limit − margin by checking it again against the
   * limit (default true); false for callers that read only burstSafe / cyclesSafe (a bisection),
   * which then get "fail" for every unsafe cycle
   */
  readonly verdictWords?: boolean;
}

/**
 * Check a retry policy as firmware would run it into a persistent fault: the burst from a cold
 * part (attempt by attempt, own peaks), and the burst followed by the lockout repeated for ever,
 * through retryForeverCheck on the burst taken as one attempt (burstAsAttempt) with the lockout
 * as an end-to-start wait: periodic steady state of the super-cycle in closed form.
 * The verdict words (peakVerdict): the burst runs every attempt, so its highest own peak is known
 * and compared with limit − margin and with the limit; the repeated cycle's check stops at the
 * first attempt above limit − margin, so a cycle found unsafe is checked again against the limit
 * itself (margin 0): safe there is "warn", not safe "fail". Overlapping attempts are "fail".
 * Source: docs/design.md, "Periodic steady state" applied to the burst + lockout cycle, and
 * "Verdicts" (src/stress/Verdict.ts).
 * Cost O(corners × (N + cycles to settle × N) × cost of one attempt), twice for the cycles of a
 * corner found unsafe (the check against the limit) unless `verdictWords` is false.
 * @throws InputError for bad corners or a lockout that is not finite and ≥ 0
 * @example
 * const scenario = {
 *   name: "short", model: fosterToModal({ kind: "foster", stages: [{ rKPerW: 0.5, tauS: 2 }] }),
 *   ambientC: 40, limitC: 150, marginK: 20, initialVoltageV: 0,
 *   attempt: () => ({ trace: [constantPowerSegment(0, 0.5, 400)], durationS: 0.5, endVoltageV: 0 }),
 *   discharge: () => 0,
 * };
 * retryPolicyVerdict([scenario], backoffBurst(3, 1, 2, 3), 60).verdict // => "pass"
 */
export function retryPolicyVerdict(scenarios: readonly RetryScenario[], burst: BurstPlan, lockoutS: number, options: RetryPolicyVerdictOptions = {}): RetryPolicyVerdict {
  const words = options.verdictWords ?? true;
  const corners = resolveCorners(scenarios);
  if (!(lockoutS >= 0) || !Number.isFinite(lockoutS)) throw inputError("out-of-range", "lockoutS", "a finite lockout ≥ 0 s", describeFound(lockoutS));
  const reasons: string[] = [];
  const runs = corners.map((c) => ({ c, run: runBurst(new AttemptCursor(c), burst, 0) }));
  const burstVerdicts = runs.map(({ c, run }): Verdict => (run.overlapAt !== null ? "fail" : peakVerdict(run.peakC, c.limitC, c.marginK)));
  const burstEntries = runs.map(({ c, run }) => ({ corner: c.name, peakC: run.peakC, allowedC: c.allowedC, limitC: c.limitC, headroomK: run.overlapAt === null ? run.worstHeadroomK : -Infinity }));
  for (const { c, run } of runs) {
    if (run.overlapAt !== null)
      reasons.push(`corner "${c.name}": attempt ${run.overlapAt + 1} would start before attempt ${run.overlapAt} ends${c.minWaitS > 0 ? ` and the relay has opened and closed again (${c.minWaitS} s)` : ""}`);
    else if (run.firstUnsafe !== null) {
      const first = run.records[run.firstUnsafe]!;
      reasons.push(`corner "${c.name}": attempt ${run.firstUnsafe + 1} of the burst reaches ${first.peakC.toFixed(1)} °C, above limit − margin ${c.allowedC.toFixed(1)} °C${limitWords(first.peakC, c.limitC)}`);
      const over = run.records.findIndex((r) => r.peakC > c.limitC);
      if (over > run.firstUnsafe) reasons.push(`corner "${c.name}": attempt ${over + 1} of the burst reaches ${run.records[over]!.peakC.toFixed(1)} °C${limitWords(run.records[over]!.peakC, c.limitC)}`);
    }
  }
  const cycleCheck = (s: RetryScenario, i: number): ForeverVerdict => retryForeverCheck(resolveScenario(burstAsAttempt(s, burst), `corners[${i}]`), lockoutS, "end-to-start");
  const cycleVerdicts = scenarios.map(cycleCheck);
  // a cycle above limit − margin: the same check against the limit itself tells warn from fail
  const cycleWords = cycleVerdicts.map((v, i): Verdict => {
    if (v.safe) return "pass";
    if (v.overlap || !words) return "fail";
    return cycleCheck({ ...scenarios[i]!, marginK: 0 }, i).safe ? "warn" : "fail";
  });
  // each corner's hottest point of the repeated cycle: the way in (transient) or the settled cycle
  const cyclePeaksC = cycleVerdicts.map((v) => Math.max(v.transientPeakC, v.steadyPeakC ?? -Infinity));
  cycleVerdicts.forEach((v, i) => {
    if (v.overlap) reasons.push(`corner "${v.corner}": a ${lockoutS} s lockout is shorter than the relay's release and operate times (${corners[i]!.minWaitS} s): the next burst cannot start that soon`);
    else if (!v.safe)
      reasons.push(
        `corner "${v.corner}": repeating burst + ${lockoutS} s lockout while the fault persists reaches ${cyclePeaksC[i]!.toFixed(1)} °C, above limit − margin ${v.allowedC.toFixed(1)} °C` +
          (!words ? "" : cycleWords[i] === "warn" ? `, not above the limit ${v.limitC.toFixed(1)} °C` : `; it passes the limit ${v.limitC.toFixed(1)} °C`),
      );
  });
  const burstSafe = runs.every(({ run }) => run.overlapAt === null && run.firstUnsafe === null);
  const cyclesSafe = cycleVerdicts.every((v) => v.safe);
  const burstVerdict = worstVerdict(burstVerdicts);
  const cyclesVerdict = worstVerdict(cycleWords);
  return {
    verdict: worstVerdict([burstVerdict, cyclesVerdict]),
    burstVerdict,
    cyclesVerdict,
    burstSafe,
    burst: governingCorner(burstEntries),
    perCorner: runs.map(({ c, run }) => ({ corner: c.name, attempts: run.records })),
    cyclesSafe,
    cycles: governingCorner(cycleVerdicts.map((v, i) => ({ corner: v.corner, peakC: cyclePeaksC[i]!, allowedC: v.allowedC, limitC: v.limitC, headroomK: v.headroomK }))),
    cycleVerdicts,
    reasons,
  };
}

/** ", not above the limit 150.0 °C" or "; it passes the limit 150.0 °C": the warn / fail distinction in words. */
function limitWords(peakC: number, limitC: number): string {
  return peakC <= limitC ? `, not above the limit ${limitC.toFixed(1)} °C` : `; it passes the limit ${limitC.toFixed(1)} °C`;
}
