import type { CircuitModels } from "../profile/CircuitModels.js";
import type { DutyProfile } from "../profile/DutyProfile.js";
import { PROFILE_CORNER_FIELD, type ProfileCorner, profileCorners } from "../profile/profileCorners.js";
import type { CornerSimulation } from "../profile/simulateCorner.js";
import { type CornerAnswersJson, cornerAnswersJson } from "../report/cornerAnswersJson.js";
import { formatCornerAnswers } from "../report/formatCornerAnswers.js";
import { simulationCornerAnswers } from "../report/simulationCornerAnswers.js";
import { type Verdict, worstVerdict } from "../stress/Verdict.js";
import { wrapText } from "../text/cautions.js";
import type { CliRun } from "./main.js";
import { runCorners } from "./runCorners.js";

/** The name of the profile as written in a corners table (a corner may itself be called "nominal"). */
export const AS_WRITTEN = "as written";

/** What `--corners` adds to a report: text, the JSON "corners", and the verdict over the corners. */
export interface CornerReport {
  /** the corners section, or the note on a corner set left out; "" when there is nothing to say */
  readonly text: string;
  /** undefined without --corners */
  readonly json?: CornerAnswersJson;
  /** the worst verdict over the corners; undefined without --corners */
  readonly verdict?: Verdict;
}

/**
 * The note a report without --corners prints for a profile that has a corner set ("" for one
 * without, so its report stays as it was).
 */
export function cornerNote(profile: DutyProfile, width: number, command: string): string {
  const count = profile.retryPlan?.corners?.length ?? 0;
  if (count === 0) return "";
  return `${wrapText(`Note: the profile has ${count} corner${count === 1 ? "" : "s"} in ${PROFILE_CORNER_FIELD}; only the profile as written was run (${command} --corners runs them all).`, Math.min(width, 100))}\n`;
}

/** The row names of a corners table: the profile as written, then each corner. */
export function cornerNames(corners: readonly ProfileCorner[]): string[] {
  const names = corners.map((c) => c.name);
  return [names.includes(AS_WRITTEN) ? `${AS_WRITTEN} (profile)` : AS_WRITTEN, ...names];
}

/**
 * The --corners part of `simulate` and `replay`: run the profile at every corner (the nominal run
 * is the one the command already made), and build the section, JSON and verdict over them all.
 * Without the flag, only the note of cornerNote.
 * @param simulateAt runs one corner
 * @throws InputError for a corner the profile's circuit cannot take, or what the simulator throws
 */
export function simulationCorners(
  run: CliRun,
  profile: DutyProfile,
  wanted: boolean,
  nominal: CornerSimulation,
  simulateAt: (corner: ProfileCorner, models: CircuitModels) => CornerSimulation,
  command = "simulate",
): CornerReport {
  if (!wanted) return { text: cornerNote(profile, run.io.columns, command) };
  const corners = profileCorners(profile);
  const runs = [nominal, ...runCorners(run.io, corners, "corners", simulateAt)];
  const answers = simulationCornerAnswers(cornerNames(corners), runs);
  const none = corners.length === 0 ? `${wrapText(`The profile has no corner set (${PROFILE_CORNER_FIELD}): only the profile as written was run.`, Math.min(run.io.columns, 100))}\n` : "";
  return { text: `\n${none}${formatCornerAnswers(answers, run.io.columns)}`, json: cornerAnswersJson(answers), verdict: worstVerdict(answers.verdicts) };
}
