import type { DutyProfile } from "../profile/DutyProfile.js";
import { defaultCircuitModels } from "../profile/defaultCircuitModels.js";
import type { ProfileStress } from "../profile/ProfileStress.js";
import type { SimulateOptions } from "../profile/simulateProfile.js";
import { EVENT_DIGEST_DEFAULTS, EventDigest } from "../profile/EventDigest.js";
import { PeakEnvelope } from "../report/PeakEnvelope.js";
import { SimulationCsv } from "../report/SimulationCsv.js";
import type { CliIo } from "./CliIo.js";
import { writeOutputFile } from "./readInputFile.js";
import { simulationProgress } from "./simulationProgress.js";

/** The flags of `simulate` and `replay` that choose what a run records. */
export interface RecordFlags {
  readonly json?: boolean;
  readonly chart: boolean;
  readonly csv?: string;
}

/** What a run recorded for the report, beside the simulator's own result. */
export interface Recorded<T> {
  /** what the simulator returned */
  readonly result: T;
  /** the events the report lists */
  readonly digest: EventDigest;
  /** the chart's peak envelope; undefined for --json or --no-chart */
  readonly envelope: PeakEnvelope | undefined;
  /** the --csv time series; undefined without --csv */
  readonly csv: SimulationCsv | undefined;
}

/**
 * Run a simulation (`simulate` or `replay`) with the recorders the CLI wires into it: the event
 * digest, the chart's peak envelope, the --csv time series and the stress checks see every event
 * and point; the progress line (terminal only) runs until the simulation ends, also on an error.
 * @param profile the profile whose parts the digest and CSV columns follow
 * @param stress the stress checks, fed events and points as they come
 * @param verb the progress line's word ("simulating", "replaying")
 * @param simulate runs the simulator with the options it is given
 */
export function recordSimulation<T>(
  io: CliIo,
  profile: DutyProfile,
  flags: RecordFlags,
  stress: ProfileStress,
  verb: string,
  simulate: (options: SimulateOptions) => T,
): Recorded<T> {
  // the text report lists at most terminalAll events in order (else the hottest): only --json needs keepAll
  const digest = new EventDigest(profile.parts.map((p) => p.limitC), flags.json ? EVENT_DIGEST_DEFAULTS.keepAll : EVENT_DIGEST_DEFAULTS.terminalAll);
  const envelope = flags.json || !flags.chart ? undefined : new PeakEnvelope(profile.parts.length);
  const csv = flags.csv === undefined ? undefined : new SimulationCsv(profile.parts.map((p) => p.id));
  const progress = simulationProgress(io, verb);
  try {
    const result = simulate({
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
    });
    progress.finish();
    return { result, digest, envelope, csv };
  } finally {
    progress.done();
  }
}

/**
 * Write the --csv time series when one was recorded and return the report's line saying so
 * ("" without --csv).
 * @throws InputError when the file exists and force is not set
 */
export function writeTimeSeries(io: CliIo, csv: SimulationCsv | undefined, path: string | undefined, force: boolean): string {
  if (csv === undefined || path === undefined) return "";
  writeOutputFile(io, path, csv.text(), force, "--csv");
  return `Time series: ${csv.rowCount} rows written to ${path}\n`;
}
