import type { GuardReport } from "../guard/planGuard.js";
import { reportCautions } from "../text/cautions.js";
import { GUARD_CAUTION } from "../text/guardCaution.js";

/** A number for JSON: non-finite values become null. */
const num = (x: number): number | null => (Number.isFinite(x) ? x : null);

/**
 * The `heatledger guard --json` object: verdict, tick [s], export (numeric, Q formats), inputs,
 * per part the discrete model (tauS, decay, zohGainKPerJ, boundGainKPerJ [K/J] by source and
 * mode), the may-start table (spanStartS, headroomK, governing corner), the heaviest tick's energy
 * [J] and the placement error it covers [K]; per corner the comparison with the fastest safe
 * schedule (start times [s], laterByS, burstRatio) and the admitted attempts' exact peaks [°C];
 * the files written; cautions. Every number SI; non-finite numbers are null. Cost O(size).
 * @example
 * const report = planGuard(profile("warehouse-robot-48v.yaml"), defaultCircuitModels);
 * guardJson(report, "robot.yaml", []).verdict // => "pass"
 */
export function guardJson(report: GuardReport, profile: string, written: readonly string[]): object {
  const g = report.guard;
  return {
    profile,
    verdict: report.verdict,
    tickS: g.tickS,
    numeric: report.numeric,
    fractionBits: report.fixed?.fractionBits ?? null,
    energyFractionBits: report.fixed?.energyFractionBits ?? null,
    inputs: g.inputs.map((i) => i.name),
    neverSafe: g.neverSafe,
    parts: g.channels.map((c) => ({
      part: c.part,
      tauS: c.modes.tauS,
      decay: c.modes.decay,
      zohGainKPerJ: c.modes.zohGainKPerJ,
      boundGainKPerJ: c.modes.boundGainKPerJ,
      spanStartS: c.spanStartS,
      headroomK: c.headroomK,
      governingCorner: c.governing,
      heaviestTickJ: c.heaviestTickJ,
      placementErrorK: c.placementErrorK,
    })),
    shortestWaitS: report.shortestWaitS,
    corners: report.conservatism.map((c, i) => {
      const b = report.bursts[i]!;
      return {
        corner: c.corner,
        fastestStartsS: c.fastestStartsS,
        guardStartsS: c.guardStartsS,
        laterByS: c.laterByS,
        burstRatio: c.burstRatio === null ? null : num(c.burstRatio),
        attempts: b.attempts.map((a) => ({ attempt: a.attempt, startS: a.startTick * g.tickS, waitS: a.waitS, peakC: a.peakC, headroomK: a.headroomK })),
        leastTickMarginK: b.leastTickMarginK,
        largestTickMarginK: b.largestTickMarginK,
        betweenTicksExcessK: b.betweenTicksExcessK,
      };
    }),
    written,
    cautions: [GUARD_CAUTION, ...reportCautions(report.linearMosfet)],
  };
}
