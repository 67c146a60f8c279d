import type { DutyProfile } from "../profile/DutyProfile.js";
import { defaultCircuitModels } from "../profile/defaultCircuitModels.js";
import type { ProfileStress } from "../profile/ProfileStress.js";
import type { SimulateOptions } from "../profile/simulateProfile.js";
import { EVENT_DIGEST_DEFAULTS, EventDigest } from "../profile/EventDigest.js";
import { PeakEnvelope } from "../report/PeakEnvelope.js";
import { SimulationCsv } from "../report/SimulationCsv.js";
import { describeFound, inputError } from "../errors/InputError.js";
import type { HistorySampling } from "../thermal/runThermalHistory.js";
import { parseQuantity } from "../units/parseQuantity.js";
import { ChartTrace } from "../report/ChartTrace.js";
import { TIME_SERIES_DEFAULTS } from "../report/timeSeriesDefaults.js";
import type { CliIo } from "./CliIo.js";
import { writeOutputFile } from "./readInputFile.js";
import { simulationProgress } from "./simulationProgress.js";

/** The flags of `simulate` and `replay` that choose what a run records. */
export interface RecordFlags {
  readonly json?: boolean;
  readonly chart: boolean;
  readonly csv?: string;
  /** --sample-step: evenly spaced samples for --csv and the report, as the user wrote it */
  readonly sampleStep?: string;
  /** --sample-ratio: geometric samples inside every step (default TIME_SERIES_DEFAULTS.sampleRatio; 0: none) */
  readonly sampleRatio?: string;
  /** --report FILE.html / --svg FILE: record the chart trace */
  readonly report?: string;
  readonly svg?: string;
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
  /** what --report and --svg draw; undefined without them */
  readonly trace: ChartTrace | undefined;
}

/**
 * The samples a run takes between step ends for --csv, --report and --svg (none without them):
 * `--sample-ratio` geometric ones (default TIME_SERIES_DEFAULTS.sampleRatio, HistorySampling.ratio)
 * with TIME_SERIES_DEFAULTS.sampleDivisions even ones per step (none with --sample-ratio 0) and,
 * with `--sample-step`, one at every multiple of that time.
 * @throws InputError for a --sample-step that is not a positive time or a --sample-ratio that is neither 0 nor from 1.1 to 10
 */
export function recordSampling(flags: RecordFlags): HistorySampling {
  const ratioText = flags.sampleRatio;
  const ratio = ratioText === undefined ? TIME_SERIES_DEFAULTS.sampleRatio : Number(ratioText);
  if (!(ratio === 0 || (ratio >= 1.1 && ratio <= 10))) throw inputError("bad-option", "--sample-ratio", "0 (no geometric samples) or a ratio from 1.1 to 10", describeFound(ratioText));
  const divisions = ratio === 0 ? 0 : TIME_SERIES_DEFAULTS.sampleDivisions;
  if (flags.sampleStep === undefined) return { ratio, divisions };
  const text = flags.sampleStep.trim();
  const everyS = parseQuantity(/^[-+]?[\d.]+(e[-+]?\d+)?$/i.test(text) ? Number(text) : text, "time", "--sample-step");
  if (!(everyS > 0) || !Number.isFinite(everyS)) throw inputError("bad-option", "--sample-step", "a positive time, e.g. 10 ms or 0.5", describeFound(flags.sampleStep));
  return { ratio, divisions, everyS };
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
  const digest = new EventDigest(profile.parts.map((p) => p.limitC), flags.json || flags.report !== undefined ? EVENT_DIGEST_DEFAULTS.keepAll : EVENT_DIGEST_DEFAULTS.terminalAll);
  const envelope = flags.json || !flags.chart ? undefined : new PeakEnvelope(profile.parts.length);
  const csv = flags.csv === undefined ? undefined : new SimulationCsv(profile.parts.map((p) => p.id));
  const trace = flags.report === undefined && flags.svg === undefined ? undefined : new ChartTrace(profile.parts.map((p) => p.limitC));
  const sampled = csv !== undefined || trace !== undefined;
  const sampling = sampled ? recordSampling(flags) : undefined;
  const progress = simulationProgress(io, verb);
  try {
    const result = simulate({
      models: defaultCircuitModels,
      wantSamples: stress.wantsSamples,
      onEvent: (event, temperatures) => {
        digest.add(event, temperatures);
        stress.addEvent(event);
        trace?.closeEvent(event, temperatures);
      },
      onPoint: (timeS, temperatureC, kind, eventIndex) => {
        envelope?.add(timeS, temperatureC);
        csv?.add(timeS, eventIndex, kind, temperatureC);
        trace?.add(timeS, temperatureC, eventIndex);
        stress.addPoint(timeS, temperatureC, kind, eventIndex);
      },
      onProgress: progress.onProgress,
      ...(sampling === undefined
        ? {}
        : {
            sampling,
            onSample: (timeS: number, temperatureC: readonly number[], eventIndex: number) => {
              csv?.add(timeS, eventIndex, "sample", temperatureC);
              trace?.add(timeS, temperatureC, eventIndex);
            },
          }),
    });
    progress.finish();
    return { result, digest, envelope, csv, trace };
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
