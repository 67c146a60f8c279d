import { InputError } from "../../errors/InputError.js";
import { ProfileStress } from "../../profile/ProfileStress.js";
import { type LogReplay, replayLog, replayShell } from "../../replay/replayLog.js";
import { textPieces } from "../../replay/textPieces.js";
import { formatProfileStress } from "../../report/formatProfileStress.js";
import { formatSimulationText } from "../../report/formatSimulationText.js";
import { formatReplayHeader, logReplaySummary } from "../../report/replaySummary.js";
import { simulationJson } from "../../report/simulationJson.js";
import { simulationStressJson } from "../../report/simulationStressJson.js";
import { simulationVerdict } from "../../report/simulationVerdict.js";
import { verdictExitStatus } from "../../stress/Verdict.js";
import type { CliRun } from "../main.js";
import { readProfileFile } from "../readProfileFile.js";
import { readTextFile, refuseExistingOutput, refuseSharedOutputs } from "../readInputFile.js";
import { type Recorded, recordSimulation, writeTimeSeries } from "../recordSimulation.js";
import type { ReplayFlags } from "./replay.js";
import { simulateCorner } from "../../profile/simulateCorner.js";
import { writeCyclesFile } from "../writeCyclesFile.js";
import { simulationCorners } from "../simulationCorners.js";

/** The damage lines of a replay: one pass of the history is the whole log. */
const REPLAY_HISTORY_WORDS = { perRepetition: "to date (the whole log)", repetitions: "logs like this one" } as const;

/**
 * The run of `heatledger replay LOG --profile FILE` (flags and help are in replay.ts, which loads
 * this module only when the command runs): read the profile, stream the log into the replay with the
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
  refuseSharedOutputs([["--csv", options.csv], ["--cycles", options.cycles], ["--report", options.report], ["--svg", options.svg]]);
  refuseExistingOutput(run.io, options.csv, options.force === true, "--csv");
  refuseExistingOutput(run.io, options.report, options.force === true, "--report");
  refuseExistingOutput(run.io, options.svg, options.force === true, "--svg");
  refuseExistingOutput(run.io, options.cycles, options.force === true, "--cycles");
  // the log is streamed: read in blocks as the replay runs, so its length costs no memory
  const openLog = (): ReturnType<typeof textPieces> & { close?: () => void } => run.io.openText?.(file, "event log") ?? textPieces(readTextFile(run.io, file, "event log"));
  const source = openLog();
  const profileFile = options.profile;
  const replayed = (): { stress: ProfileStress; recorded: Recorded<LogReplay> } => {
    const loaded = readProfileFile(run.io, profileFile);
    const stress = new ProfileStress(replayShell(loaded), { mode: "open", keepCycles: options.report !== undefined || options.cycles !== undefined });
    return { stress, recorded: recordSimulation(run.io, loaded, options, stress, "replaying", (simulate) => replayLog(loaded, source, file, simulate)) };
  };
  let outcome: ReturnType<typeof replayed>;
  try {
    outcome = replayed();
  } finally {
    source.close?.();
  }
  const { stress, recorded } = outcome;
  const { result: replay, digest, envelope, csv, trace } = recorded;
  const profile = replay.profile;
  const result = replay.simulation;
  const stressResult = stress.finish(result.endTimeS);
  const summary = logReplaySummary(replay, stressResult);
  const csvNote = writeTimeSeries(run.io, csv, options.csv, options.force === true);
  const cyclesNote = writeCyclesFile(run.io, options.cycles, stressResult, options.force === true);
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
    // the log read again from its start for each corner
    const again = openLog();
    try {
      return simulateCorner(replayShell(corner.profile), models, "open", (simulate) => replayLog(corner.profile, again, file, simulate).simulation);
    } finally {
      again.close?.();
    }
  }, "replay");
  if (options.json) {
    const json = simulationStressJson(simulationJson(replay.profile, result, digest), stressResult, undefined);
    run.io.out(`${JSON.stringify({ ...json, replay: summary, ...(corners.json === undefined ? {} : { corners: corners.json }) }, null, 2)}\n`);
  } else {
    run.io.out(
      `${formatSimulationText(replay.profile, result, digest, envelope, run.io.columns, stressText, { command: "replay", lines: header }, stressResult.ratingStatus)}\n${csvNote}${cyclesNote}${chartNote}${corners.text}`,
    );
  }
  run.status = verdictExitStatus(corners.verdict ?? simulationVerdict(result.verdict, stressResult.ratingStatus, result.contactor?.verdict).verdict, options.strict === true);
}
