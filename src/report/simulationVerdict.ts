import type { RatingStatus } from "../stress/pulseEnergyRating.js";
import { type Verdict, ratingVerdict, worstVerdict } from "../stress/Verdict.js";

/** The verdict of a simulation or replay, with the reason in words. */
export interface SimulationVerdict {
  readonly verdict: Verdict;
  /** what made it so: the temperature verdict and the rating checks that set it */
  readonly reason: string;
}

/**
 * The verdict of `simulate` and `replay`: the worst of the temperature verdict (primary: each
 * part's peak against its limit and margin, peakVerdict) and the rating checks (secondary,
 * ratingVerdict: an event over a rating table fails, one outside a table was not checked and
 * warns). Cost O(1).
 */
export function simulationVerdict(temperature: Verdict, rating: RatingStatus, contactor: Verdict = "pass"): SimulationVerdict {
  const verdict = worstVerdict([temperature, ratingVerdict(rating), contactor]);
  const reasons: string[] = [];
  if (temperature === "fail") reasons.push("a part passes its temperature limit");
  if (rating === "fail") reasons.push("an event exceeds a part's rating table");
  if (contactor === "fail") reasons.push("the contactor closes onto more current than its making-current rating");
  if (verdict === "warn") {
    if (temperature === "warn") reasons.push("a part's peak is inside its design margin: above limit − margin, at or below the limit");
    if (rating === "outside-table") reasons.push("an event falls outside a rating table, so it was not checked");
    if (contactor === "warn") reasons.push("the contactor closes onto more than 80 % of its making-current rating");
  }
  if (verdict === "pass") reasons.push("every part stays at or below its limit less its design margin");
  return { verdict, reason: reasons.join("; ") };
}
