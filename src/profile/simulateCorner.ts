import type { CircuitModels } from "./CircuitModels.js";
import type { DutyProfile } from "./DutyProfile.js";
import { ProfileStress, type ProfileStressResult } from "./ProfileStress.js";
import { type SimulateOptions, type SimulationResult, simulateProfile } from "./simulateProfile.js";
import type { RainflowMode } from "../stress/rainflowCounter.js";

/** What one run of a profile at a corner found: the simulation and its stress checks. */
export interface CornerSimulation {
  readonly result: SimulationResult;
  readonly stress: ProfileStressResult;
}

/**
 * Run a profile (at one corner of its corner set, profileCorners) with the stress checks, as
 * `simulate` does but recording nothing else: peaks, margins, energies, the rating checks and the
 * Miner damage. Cost: one simulation.
 * @param profile the profile at the corner (for a replay: the log's profile, replayProfile)
 * @param models the circuit models
 * @param mode how the cycle count closes the history ("repeating" for a profile, "open" for a log)
 * @param simulate runs the simulator with the given options (default simulateProfile on `profile`)
 * @throws InputError what the simulator throws for the profile
 */
export function simulateCorner(
  profile: DutyProfile,
  models: CircuitModels,
  mode: RainflowMode = "repeating",
  simulate: (options: SimulateOptions) => SimulationResult = (options) => simulateProfile(profile, options),
): CornerSimulation {
  const stress = new ProfileStress(profile, { mode });
  const result = simulate({
    models,
    wantSamples: stress.wantsSamples,
    onEvent: (event) => stress.addEvent(event),
    onPoint: (timeS, temperatureC, kind, eventIndex) => stress.addPoint(timeS, temperatureC, kind, eventIndex),
  });
  return { result, stress: stress.finish(result.endTimeS) };
}
