import { existsSync } from "node:fs";
import { fileTextSource } from "./fileTextSource.js";
import { InputError } from "../errors/InputError.js";
import type { FleetUnitRow } from "../fleet/FleetUnitRow.js";
import { replayFleetUnit } from "../fleet/replayFleetUnit.js";
import type { DutyProfile } from "../profile/DutyProfile.js";
import { defaultCircuitModels } from "../profile/defaultCircuitModels.js";
import type { CliIo } from "./CliIo.js";
import type { FleetLogRef } from "./collectFleetLogs.js";
import { readBoundedTextFile } from "./fileSystemIo.js";
import { readTextFile } from "./readInputFile.js";
import { readProfileFile } from "./readProfileFile.js";

/** One batch of a fleet's units for a worker thread: everything it needs, as plain data. */
export interface FleetTask {
  readonly profileFile: string;
  /** the profile's text and the files it names, by path as the main thread read them */
  readonly profileTexts: readonly (readonly [string, string])[];
  readonly logsPerYear: number | undefined;
  readonly logs: readonly FleetLogRef[];
}

/**
 * Replay units one after the other (replayFleetUnit), each log read through `io` when its turn
 * comes: an unreadable log (missing, a folder, too large, not UTF-8) is a broken row like a log
 * the replay refuses. What the main thread runs with one worker and each worker thread runs per task.
 * Cost: the units' replays.
 * @param onUnit called after each unit
 */
export function replayFleetLogs(io: CliIo, profile: DutyProfile, logs: readonly FleetLogRef[], logsPerYear: number | undefined, onUnit?: () => void): FleetUnitRow[] {
  const options = { models: defaultCircuitModels, ...(logsPerYear === undefined ? {} : { logsPerYear }) };
  return logs.map((log) => {
    let row: FleetUnitRow;
    try {
      // the log streamed from its file in blocks (whole through readFile where the io cannot stream)
      const source = io.openText?.(log.file, "event log");
      try {
        row = replayFleetUnit(profile, source === undefined ? { unit: log.unit, file: log.file, text: readTextFile(io, log.file, "event log") } : { unit: log.unit, file: log.file, source }, options);
      } finally {
        source?.close();
      }
    } catch (error) {
      if (!(error instanceof InputError)) throw error;
      row = { unit: log.unit, file: log.file, verdict: "error", error: error.problems[0]! };
    }
    onUnit?.();
    return row;
  });
}

/** The io of a worker thread: the profile's texts from the task, the logs from the file system; it writes nothing. */
function workerIo(texts: ReadonlyMap<string, string>): CliIo {
  return {
    out: () => {},
    err: () => {},
    readFile: (path) => texts.get(path) ?? readBoundedTextFile(path),
    openText: fileTextSource,
    writeFile: () => {
      throw new Error("a fleet worker writes no file");
    },
    exists: (path) => texts.has(path) || existsSync(path),
    columns: 100,
  };
}

/** The profile of the last task, kept for the next batch of the same run (a thread runs many). */
let prepared: { readonly key: string; readonly io: CliIo; readonly profile: DutyProfile } | undefined;

/**
 * Run one batch of a fleet (replayFleetLogs) from plain data: what a worker thread of
 * `heatledger fleet` runs (it loads this module compiled, from dist/). The profile is loaded
 * again from the texts the main thread read, so every thread replays the same profile.
 */
export function runFleetTask(task: FleetTask): FleetUnitRow[] {
  const key = JSON.stringify([task.profileFile, task.profileTexts]);
  if (prepared?.key !== key) {
    const io = workerIo(new Map(task.profileTexts));
    prepared = { key, io, profile: readProfileFile(io, task.profileFile) };
  }
  return replayFleetLogs(prepared.io, prepared.profile, task.logs, task.logsPerYear);
}

/** The worker pool's entry point. */
export default function fleetWorker(task: FleetTask): FleetUnitRow[] {
  return runFleetTask(task);
}
