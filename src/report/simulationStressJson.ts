import type { ProfileStressResult } from "../profile/ProfileStress.js";
import type { RatingStatus } from "../stress/pulseEnergyRating.js";
import { type StressJson, stressReportJson } from "../stress/stressReportJson.js";
import type { SimulationJson } from "./simulationJson.js";
import { LIFETIME_CAUTION } from "../stress/stressCautions.js";

/** `simulate --json` with the stress layer's findings added (the JSON contract's keys unchanged in name). */
export type SimulationStressJson = Omit<SimulationJson, "parts"> & {
  /** the temperature verdict alone (the primary check): "fail" when a part passed its limit */
  readonly temperatureVerdict: "pass" | "fail";
  /** worst rating-table status over all parts and events (secondary check) */
  readonly ratingStatus: RatingStatus;
  /** how many times a year the profile occurs, as the profile states it; null when it does not */
  readonly occursPerYear: number | null;
  readonly parts: readonly (SimulationJson["parts"][number] & {
    /** rating checks per event, cycle summary and Miner damage (null without a lifetime model) */
    readonly stress: StressJson & { readonly checksOmitted: number };
  })[];
};

/**
 * Add the stress layer to the simulation JSON: each part gets `stress` (`ratingChecks` per event,
 * `cycles` summary, `damage` per repetition with projections), the top level gets `ratingStatus`,
 * `temperatureVerdict` and `occursPerYear`, and `cautions` the lifetime caution when damage was computed. The top-level `verdict` is the exit status in words:
 * "fail" when a temperature limit is crossed (primary) or an event fails a rating table
 * (secondary); each part's own `verdict` stays the temperature verdict.
 * Cost O(parts × (checks listed + top cycles)).
 */
export function simulationStressJson(base: SimulationJson, stress: ProfileStressResult, occursPerYear: number | undefined): SimulationStressJson {
  return {
    ...base,
    verdict: base.verdict === "fail" || stress.ratingStatus === "fail" ? "fail" : "pass",
    temperatureVerdict: base.verdict,
    ratingStatus: stress.ratingStatus,
    occursPerYear: occursPerYear ?? null,
    cautions: stress.parts.some((p) => p.report.damage !== undefined) ? [...base.cautions, LIFETIME_CAUTION] : base.cautions,
    parts: base.parts.map((p, i) => {
      const part = stress.parts[i]!;
      return { ...p, stress: { ...stressReportJson(part.report), checksOmitted: part.checksOmitted } };
    }),
  };
}
