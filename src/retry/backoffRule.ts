import { describeFound, inputError } from "../errors/InputError.js";
import { AttemptCursor, type AttemptRecord } from "./AttemptCursor.js";
import { type GoverningCorner, governingCorner } from "./GoverningCorner.js";
import { checkAttempts, everyCorner } from "./minUniformInterval.js";
import { PLAN_DEFAULTS } from "./planDefaults.js";
import { type RetryScenario, resolveCorners } from "./RetryScenario.js";
import { runBurst } from "./runBurst.js";
import { type FeasibleBand, scanFeasibleBands } from "./scanFeasibleBands.js";
import type { FastestScheduleAnswer } from "./fastestSchedule.js";
import { ceilToTimer } from "./alignToTimer.js";

/**
 * A back-off rule firmware can implement: wait_k = firstWait × growth^(k − 1) after attempt k's
 * end, each wait rounded up to a whole step of the firmware's timer.
 */
export interface BackoffRule {
  /** wait after the first attempt ends [s] */
  readonly firstWaitS: number;
  /** each wait over the one before, ≥ 1 */
  readonly growthFactor: number;
}

/** A back-off rule checked by simulation. */
export interface BackoffRuleAnswer {
  /** the rule, or null when no growth factor up to the scan's end is safe with this first wait */
  readonly rule: BackoffRule | null;
  readonly attempts: number;
  /** every band of safe growth factors for this first wait */
  readonly bands: readonly FeasibleBand[];
  /** end of the last attempt under the rule [s] (latest over corners), or null */
  readonly burstEndS: number | null;
  /** the corner with the least headroom under the rule (or at the largest factor when none is safe) */
  readonly governing: GoverningCorner;
  /** every corner's attempts under the rule, as simulated */
  readonly perCorner: readonly { readonly corner: string; readonly attempts: readonly AttemptRecord[] }[];
}

/** Options of {@link backoffRule}; every field has a default (PLAN_DEFAULTS). */
export interface BackoffRuleOptions {
  /** largest growth factor scanned (default PLAN_DEFAULTS.maxGrowthFactor) */
  readonly maxGrowthFactor?: number;
  /** growth factor scan points (default PLAN_DEFAULTS.growthScanPoints) */
  readonly scanPoints?: number;
  /** the firmware timer's resolution [s]: each wait is rounded up to it before the burst is simulated (default PLAN_DEFAULTS.timerResolutionS, 0: no rounding) */
  readonly timerResolutionS?: number;
}

/**
 * The back-off rule of the retry planner: a first wait and the smallest growth factor g such that waiting
 * firstWait·g^(k−1) after the end of attempt k keeps a burst of N attempts safe in every corner,
 * checked by simulating the whole burst. For each candidate first wait, growth factors from 1 to
 * maxGrowthFactor are scanned linearly and each band edge bisected (the burst is not always safer
 * with a larger factor: the capacitor's charge makes peak against wait non-monotone); of the
 * candidates, the rule whose burst ends first is returned. Candidates usually come from the
 * fastest schedule's waits (firstWaitCandidates). With a timer resolution the first wait and
 * every later wait are rounded up to whole timer steps (backoffWaits) and the burst is simulated
 * with the rounded waits, so the rule reported is checked as firmware would run it.
 * Cost O(candidates × (scan points + edges × log2(1/relTol)) × corners × N × cost of one attempt).
 * @throws InputError for bad corners, no candidate, a negative first wait or a growth factor range below 1
 * @example
 * const scenario = {
 *   name: "short", model: fosterToModal({ kind: "foster", stages: [{ rKPerW: 0.5, tauS: 2 }] }),
 *   ambientC: 40, limitC: 150, marginK: 20, initialVoltageV: 0,
 *   attempt: () => ({ trace: [constantPowerSegment(0, 0.5, 400)], durationS: 0.5, endVoltageV: 0 }),
 *   discharge: () => 0,
 * };
 * backoffRule([scenario], 4, [0.5, 1]).rule // => { firstWaitS: 0.5, growthFactor: 1.2167 }
 */
export function backoffRule(scenarios: readonly RetryScenario[], attempts: number, firstWaitCandidatesS: readonly number[], options: BackoffRuleOptions = {}): BackoffRuleAnswer {
  checkAttempts(attempts);
  const corners = resolveCorners(scenarios);
  if (firstWaitCandidatesS.length === 0) throw inputError("out-of-range", "firstWaitS", "at least one candidate first wait", "none");
  firstWaitCandidatesS.forEach((w, i) => {
    if (!(w >= 0) || !Number.isFinite(w)) throw inputError("out-of-range", `firstWaitS[${i}]`, "a finite first wait ≥ 0 s", describeFound(w));
  });
  const top = options.maxGrowthFactor ?? PLAN_DEFAULTS.maxGrowthFactor;
  if (!(top >= 1) || !Number.isFinite(top)) throw inputError("out-of-range", "maxGrowthFactor", "a finite growth factor ≥ 1", describeFound(top));
  const points = options.scanPoints ?? PLAN_DEFAULTS.growthScanPoints;
  const grid = [...new Set(Array.from({ length: points }, (_, i) => 1 + ((top - 1) * i) / Math.max(1, points - 1)))];
  const resolutionS = options.timerResolutionS ?? PLAN_DEFAULTS.timerResolutionS;
  if (!(resolutionS >= 0) || !Number.isFinite(resolutionS)) throw inputError("out-of-range", "timerResolutionS", "a finite timer resolution ≥ 0 s", describeFound(resolutionS));
  let best: BackoffRuleAnswer | null = null;
  for (const candidateS of firstWaitCandidatesS) {
    const firstWaitS = ceilToTimer(candidateS, resolutionS);
    const runAll = (g: number) =>
      corners.map((c) => {
        const gaps = backoffWaits(firstWaitS, g, attempts - 1, resolutionS);
        const cursor = new AttemptCursor(c);
        const run = runBurst(cursor, { gapsS: gaps, spacing: "end-to-start" }, 0);
        return { c, cursor, run };
      });
    // a wait shorter than the relay allows makes the burst impossible (overlapAt), never safe
    const safe = everyCorner(corners.length, (i, g) => {
      const run = runBurst(new AttemptCursor(corners[i]!), { gapsS: backoffWaits(firstWaitS, g, attempts - 1, resolutionS), spacing: "end-to-start" }, 0, true);
      return run.firstUnsafe === null && run.overlapAt === null;
    });
    const { bands } = scanFeasibleBands(safe, grid);
    const g = bands[0]?.fromS ?? null;
    const runs = runAll(g ?? top);
    const governing = governingCorner(runs.map((r) => ({ corner: r.c.name, peakC: r.run.peakC, allowedC: r.c.allowedC, limitC: r.c.limitC, headroomK: r.run.worstHeadroomK })));
    const answer: BackoffRuleAnswer = {
      rule: g === null ? null : { firstWaitS, growthFactor: g },
      attempts,
      bands,
      burstEndS: g === null ? null : Math.max(...runs.map((r) => r.cursor.endS)),
      governing,
      perCorner: runs.map((r) => ({ corner: r.c.name, attempts: r.run.records })),
    };
    if (best === null || (answer.burstEndS !== null && (best.burstEndS === null || answer.burstEndS < best.burstEndS))) best = answer;
  }
  return best!;
}

/**
 * The waits of a back-off rule as firmware runs it: firstWait·growth^k for k = 0, 1, ..., each
 * rounded up to a whole step of the timer (ceilToTimer). Cost O(count).
 */
export function backoffWaits(firstWaitS: number, growthFactor: number, count: number, timerResolutionS: number): number[] {
  return Array.from({ length: count }, (_, k) => ceilToTimer(firstWaitS * growthFactor ** k, timerResolutionS));
}

/**
 * Candidate first waits for {@link backoffRule} from a fastest schedule: up to `count` of its
 * positive waits, spread evenly over the sorted distinct values (the shortest and the longest
 * included). Cost O(attempts log attempts).
 */
export function firstWaitCandidates(answer: FastestScheduleAnswer, count = 8): number[] {
  const waits = [...new Set(answer.schedule.map((s) => s.waitS).filter((w): w is number => w !== null && w > 0))].sort((a, b) => a - b);
  if (waits.length <= count) return waits;
  return [...new Set(Array.from({ length: count }, (_, i) => waits[Math.round((i * (waits.length - 1)) / (count - 1))]!))];
}
