import { InputError } from "../../errors/InputError.js";
import { ProfileStress } from "../../profile/ProfileStress.js";
import { parseEventLog } from "../../replay/parseEventLog.js";
import { replayEventLog, replayProfile } from "../../replay/replayEventLog.js";
import { formatProfileStress } from "../../report/formatProfileStress.js";
import { formatSimulationText } from "../../report/formatSimulationText.js";
import { formatReplayHeader, replaySummary } from "../../report/replaySummary.js";
import { simulationJson } from "../../report/simulationJson.js";
import { simulationStressJson } from "../../report/simulationStressJson.js";
import { simulationVerdict } from "../../report/simulationVerdict.js";
import { verdictExitStatus } from "../../stress/Verdict.js";
import type { CliRun } from "../main.js";
import { readProfileFile } from "../readProfileFile.js";
import { readTextFile, refuseExistingOutput } from "../readInputFile.js";
import { recordSimulation, writeTimeSeries } from "../recordSimulation.js";
import type { ReplayFlags } from "./replay.js";
import { simulateCorner } from "../../profile/simulateCorner.js";
import { simulationCorners } from "../simulationCorners.js";

/** The damage lines of a replay: one pass of the history is the whole log. */
const REPLAY_HISTORY_WORDS = { perRepetition: "to date (the whole log)", repetitions: "logs like this one" } as const;

/**
 * The run of `heatledger replay LOG --profile FILE` (flags and help are in replay.ts, which loads
 * this module only when the command runs): read the log and the profile, replay the log with the
 * stress checks (the log is a one-off history for the cycle count), write the --csv file and print
 * the report; sets the exit status from the verdict as `simulate` does.
 * @throws InputError for a missing --profile, a bad log or profile, or an output file that exists without --force
 */
export async function replayAction(run: CliRun, file: string, options: ReplayFlags): Promise<void> {
  if (options.profile === undefined)
    throw new InputError({
      code: "bad-option",
      file,
      line: 0,
      field: "--profile",
      expected: "a duty profile file (--profile FILE) whose parts, circuit and limits replay this log",
      found: "nothing",
    });
  refuseExistingOutput(run.io, options.csv, options.force === true, "--csv");
  refuseExistingOutput(run.io, options.report, options.force === true, "--report");
  refuseExistingOutput(run.io, options.svg, options.force === true, "--svg");
  const log = parseEventLog(readTextFile(run.io, file, "event log"), file);
  const profile = readProfileFile(run.io, options.profile);
  const replayed = replayProfile(profile, log);
  const stress = new ProfileStress(replayed, { mode: "open", keepCycles: options.report !== undefined });
  const { result: replay, digest, envelope, csv, trace } = recordSimulation(run.io, profile, options, stress, "replaying", (simulate) => replayEventLog(profile, log, simulate, replayed));
  const result = replay.simulation;
  const stressResult = stress.finish(result.endTimeS);
  const summary = replaySummary(log, replay, stressResult);
  const csvNote = writeTimeSeries(run.io, csv, options.csv, options.force === true);
  const stressText = formatProfileStress(replay.profile, stressResult, {
    history: REPLAY_HISTORY_WORDS,
    damageNote: "Damage to date is Miner's rule over the whole log, counted as a one-off history (ASTM E1049 §5.4.4: half cycles from the residue); the cycling life left depends on what the unit did outside the log.",
  });
  const header = formatReplayHeader(summary, profile.parts.map((p) => p.limitC));
  let chartNote = "";
  if (trace !== undefined) {
    const { writeSimulationReport } = await import("../simulationReport.js");
    const text = formatSimulationText(replay.profile, result, digest, undefined, 100, stressText, { command: "replay", lines: header }, stressResult.ratingStatus);
    chartNote = await writeSimulationReport(run.io, options, { command: "replay", profile: replay.profile, result, digest, trace, stress: stressResult, text });
  }
  // --corners: the log replayed on the profile at each corner of its corner set
  const corners = simulationCorners(run, profile, options.corners === true, { result, stress: stressResult }, (corner, models) => {
    const at = replayProfile(corner.profile, log);
    return simulateCorner(at, models, "open", (simulate) => replayEventLog(corner.profile, log, simulate, at).simulation);
  }, "replay");
  if (options.json) {
    const json = simulationStressJson(simulationJson(replay.profile, result, digest), stressResult, undefined);
    run.io.out(`${JSON.stringify({ ...json, replay: summary, ...(corners.json === undefined ? {} : { corners: corners.json }) }, null, 2)}\n`);
  } else {
    run.io.out(
      `${formatSimulationText(replay.profile, result, digest, envelope, run.io.columns, stressText, { command: "replay", lines: header }, stressResult.ratingStatus)}\n${csvNote}${chartNote}${corners.text}`,
    );
  }
  run.status = verdictExitStatus(corners.verdict ?? simulationVerdict(result.verdict, stressResult.ratingStatus, result.contactor?.verdict).verdict, options.strict === true);
}
