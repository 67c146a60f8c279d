import type { ProfileStressResult } from "../profile/ProfileStress.js";
import type { RatingStatus } from "../stress/pulseEnergyRating.js";
import { type StressJson, stressReportJson } from "./stressReportJson.js";
import type { SimulationJson } from "./simulationJson.js";
import { LIFETIME_CAUTION } from "../text/stressCautions.js";
import type { Verdict } from "../stress/Verdict.js";
import { simulationVerdict } from "./simulationVerdict.js";

/** `simulate --json` with the stress layer's findings added (the JSON contract's keys unchanged in name). */
export type SimulationStressJson = Omit<SimulationJson, "parts"> & {
  /** the temperature verdict alone (the primary check), the worst part's: pass | warn | fail */
  readonly temperatureVerdict: Verdict;
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
 * `temperatureVerdict` and `occursPerYear`, and `cautions` the lifetime caution when damage was
 * computed. The top-level `verdict` is the run's (simulationVerdict: the worst of the temperature
 * verdict and the rating checks), the one the exit status follows; each part's own `verdict`
 * stays its temperature verdict.
 * Cost O(parts × (checks listed + top cycles)).
 * @example
 * const robot = profile("warehouse-robot-48v.yaml");
 * const digest = new EventDigest(robot.parts.map((p) => p.limitC));
 * const stress = new ProfileStress(robot);
 * const result = simulateProfile(robot, { models: defaultCircuitModels, onEvent: (e, t) => { digest.add(e, t); stress.addEvent(e); }, onPoint: (t, c, k, i) => stress.addPoint(t, c, k, i) });
 * simulationStressJson(simulationJson(robot, result, digest), stress.finish(result.endTimeS), robot.occursPerYear).ratingStatus // => "pass"
 */
export function simulationStressJson(base: SimulationJson, stress: ProfileStressResult, occursPerYear: number | undefined): SimulationStressJson {
  return {
    ...base,
    verdict: simulationVerdict(base.verdict, stress.ratingStatus, base.contactor?.verdict).verdict,
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
