import { type CornerAnswer, type CornerAnswers, cornerAnswer } from "../profile/CornerAnswers.js";
import type { CornerSimulation } from "../profile/simulateCorner.js";
import { PROFILE_CORNER_FIELD } from "../profile/profileCorners.js";
import { simulationVerdict } from "./simulationVerdict.js";

/**
 * The answers of `simulate` (and `replay`) over a corner set: for every part its peak (the
 * highest governs), margin (the lowest), energy (the highest) and, where a lifetime model gives
 * one, damage (the highest); each corner's verdict is simulationVerdict of its run.
 * Cost O(corners × parts).
 * @param names the profile as written, then the corners' names, in the order of runs
 * @param runs the profile as written first, then each corner (simulateCorner)
 */
export function simulationCornerAnswers(names: readonly string[], runs: readonly CornerSimulation[]): CornerAnswers {
  const answers: CornerAnswer[] = [];
  const parts = runs[0]?.result.parts ?? [];
  parts.forEach((part, i) => {
    const pick = (f: (run: CornerSimulation) => number | null): (number | null)[] => runs.map(f);
    answers.push(cornerAnswer(part.id, "peak", "°C", "highest", names, pick((r) => r.result.parts[i]!.peakTemperatureC)));
    answers.push(cornerAnswer(part.id, "margin", "K", "lowest", names, pick((r) => r.result.parts[i]!.marginK)));
    answers.push(cornerAnswer(part.id, "energy", "J", "highest", names, pick((r) => r.result.parts[i]!.energyJ)));
    const damage = pick((r) => {
      const d = r.stress.parts[i]?.report.damage?.damagePerRepetition;
      return d === undefined || !Number.isFinite(d) ? null : d;
    });
    if (damage.some((d) => d !== null)) answers.push(cornerAnswer(part.id, "damage", "", "highest", names, damage));
  });
  const verdicts = runs.map((r) => simulationVerdict(r.result.verdict, r.stress.ratingStatus, r.result.contactor?.verdict).verdict);
  return { source: PROFILE_CORNER_FIELD, corners: names, verdicts, answers };
}
