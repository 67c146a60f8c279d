import { dirname, isAbsolute, join } from "node:path";
import { InputError } from "../../errors/InputError.js";
import { defaultCircuitModels } from "../../profile/defaultCircuitModels.js";
import { loadProfile } from "../../profile/loadProfile.js";
import { ProfileStress } from "../../profile/ProfileStress.js";
import { parseEventLog } from "../../replay/parseEventLog.js";
import { replayEventLog, replayProfile } from "../../replay/replayEventLog.js";
import { EVENT_DIGEST_DEFAULTS, EventDigest } from "../../report/EventDigest.js";
import { formatProfileStress } from "../../report/formatProfileStress.js";
import { formatSimulationText } from "../../report/formatSimulationText.js";
import { PeakEnvelope } from "../../report/PeakEnvelope.js";
import { formatReplayHeader, replaySummary } from "../../report/replaySummary.js";
import { SimulationCsv } from "../../report/SimulationCsv.js";
import { simulationJson } from "../../report/simulationJson.js";
import { simulationStressJson } from "../../report/simulationStressJson.js";
import { EXIT_LIMIT, EXIT_OK } from "../CliIo.js";
import type { CliRun } from "../main.js";
import { simulationProgress } from "../simulationProgress.js";
import { readTextFile, writeOutputFile } from "../readInputFile.js";
import type { ReplayFlags } from "./replay.js";

/** The damage lines of a replay: one pass of the history is the whole log. */
const REPLAY_HISTORY_WORDS = { perRepetition: "to date (the whole log)", repetitions: "logs like this one" } as const;

/**
 * The run of `heatledger replay LOG --profile FILE` (flags and help are in replay.ts, which loads
 * this module only when the command runs): read the log and the profile, replay the log with the
 * stress checks (the log is a one-off history for the cycle count), write the --csv file and print
 * the report; sets the exit status from the verdict as `simulate` does.
 * @throws InputError for a missing --profile, a bad log or profile, or an output file that exists without --force
 */
export function replayAction(run: CliRun, file: string, options: ReplayFlags): void {
  if (options.profile === undefined)
    throw new InputError({
      code: "bad-option",
      file,
      line: 0,
      field: "--profile",
      expected: "a duty profile file (--profile FILE) whose parts, circuit and limits replay this log",
      found: "nothing",
    });
  if (options.csv !== undefined && !options.force && run.io.exists(options.csv)) writeOutputFile(run.io, options.csv, "", false, "--csv");
  const log = parseEventLog(readTextFile(run.io, file, "event log"), file);
  const profileFile = options.profile;
  const folder = dirname(profileFile);
  const located = (path: string): string => (isAbsolute(path) ? path : join(folder, path));
  const readNamed = Object.assign((path: string): string => readTextFile(run.io, located(path), "file named in the profile"), { displayName: located });
  const profile = loadProfile(readTextFile(run.io, profileFile, "duty profile"), profileFile, readNamed);
  // the text report lists at most terminalAll events in order (else the hottest): only --json needs keepAll
  const digest = new EventDigest(profile.parts.map((p) => p.limitC), options.json ? EVENT_DIGEST_DEFAULTS.keepAll : EVENT_DIGEST_DEFAULTS.terminalAll);
  const envelope = options.json || !options.chart ? undefined : new PeakEnvelope(profile.parts.length);
  const csv = options.csv === undefined ? undefined : new SimulationCsv(profile.parts.map((p) => p.id));
  const replayed = replayProfile(profile, log);
  const stress = new ProfileStress(replayed, { mode: "open" });
  const progress = simulationProgress(run.io, "replaying");
  let replay: ReturnType<typeof replayEventLog>;
  try {
    replay = replayEventLog(profile, log, {
      models: defaultCircuitModels,
      wantSamples: stress.wantsSamples,
      onEvent: (event, temperatures) => {
        digest.add(event, temperatures);
        stress.addEvent(event);
      },
      onPoint: (timeS, temperatureC, kind, eventIndex) => {
        envelope?.add(timeS, temperatureC);
        csv?.add(timeS, eventIndex, kind, temperatureC);
        stress.addPoint(timeS, temperatureC, kind, eventIndex);
      },
      onProgress: progress.onProgress,
    }, replayed);
  } finally {
    progress.done();
  }
  const result = replay.simulation;
  const stressResult = stress.finish(result.endTimeS);
  const summary = replaySummary(log, replay, stressResult);
  if (csv !== undefined) writeOutputFile(run.io, options.csv!, csv.text(), options.force === true, "--csv");
  if (options.json) {
    const json = simulationStressJson(simulationJson(replay.profile, result, digest), stressResult, undefined);
    run.io.out(`${JSON.stringify({ ...json, replay: summary }, null, 2)}\n`);
  } else {
    const stressText = formatProfileStress(replay.profile, stressResult, {
      history: REPLAY_HISTORY_WORDS,
      damageNote: "Damage to date is Miner's rule over the whole log, counted as a one-off history (ASTM E1049 §5.4.4: half cycles from the residue); the cycling life left depends on what the unit did outside the log.",
    });
    const header = formatReplayHeader(
      summary,
      profile.parts.map((p) => p.limitC),
    );
    run.io.out(
      `${formatSimulationText(replay.profile, result, digest, envelope, run.io.columns, stressText, { command: "replay", lines: header })}\n${
        csv === undefined ? "" : `Time series: ${csv.rowCount} rows written to ${options.csv}\n`
      }`,
    );
  }
  run.status = result.verdict === "fail" || stressResult.ratingStatus === "fail" ? EXIT_LIMIT : EXIT_OK;
}
