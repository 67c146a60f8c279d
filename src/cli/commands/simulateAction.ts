import { dirname, isAbsolute, join } from "node:path";
import { defaultCircuitModels } from "../../profile/defaultCircuitModels.js";
import { loadProfile } from "../../profile/loadProfile.js";
import { ProfileStress } from "../../profile/ProfileStress.js";
import { simulateProfile } from "../../profile/simulateProfile.js";
import { EVENT_DIGEST_DEFAULTS, EventDigest } from "../../report/EventDigest.js";
import { formatProfileStress } from "../../report/formatProfileStress.js";
import { formatSimulationText } from "../../report/formatSimulationText.js";
import { PeakEnvelope } from "../../report/PeakEnvelope.js";
import { SimulationCsv } from "../../report/SimulationCsv.js";
import { simulationJson } from "../../report/simulationJson.js";
import { simulationStressJson } from "../../report/simulationStressJson.js";
import { formatCyclesCsv } from "../../stress/formatCyclesCsv.js";
import { EXIT_LIMIT, EXIT_OK } from "../CliIo.js";
import type { CliRun } from "../main.js";
import { readTextFile, writeOutputFile } from "../readInputFile.js";
import { simulationProgress } from "../simulationProgress.js";
import type { SimulateFlags } from "./simulate.js";

/**
 * The run of `heatledger simulate PROFILE` (flags and help are in simulate.ts, which loads this
 * module only when the command runs): load the profile, simulate it with the stress checks, write
 * the --csv / --cycles files and print the report; sets the exit status from the verdict.
 * @throws InputError for a bad profile, a file it names, or an output file that exists without --force
 */
export function simulateAction(run: CliRun, file: string, options: SimulateFlags): void {
  if (options.csv !== undefined && !options.force && run.io.exists(options.csv)) writeOutputFile(run.io, options.csv, "", false, "--csv");
  if (options.cycles !== undefined && !options.force && run.io.exists(options.cycles)) writeOutputFile(run.io, options.cycles, "", false, "--cycles");
  const folder = dirname(file);
  const located = (path: string): string => (isAbsolute(path) ? path : join(folder, path));
  const readNamed = Object.assign((path: string): string => readTextFile(run.io, located(path), "file named in the profile"), { displayName: located });
  const profile = loadProfile(readTextFile(run.io, file, "duty profile"), file, readNamed);
  // the text report lists at most terminalAll events in order (else the hottest): only --json needs keepAll
  const digest = new EventDigest(profile.parts.map((p) => p.limitC), options.json ? EVENT_DIGEST_DEFAULTS.keepAll : EVENT_DIGEST_DEFAULTS.terminalAll);
  const envelope = options.json || !options.chart ? undefined : new PeakEnvelope(profile.parts.length);
  const csv = options.csv === undefined ? undefined : new SimulationCsv(profile.parts.map((p) => p.id));
  const stress = new ProfileStress(profile, { keepCycles: options.cycles !== undefined });
  const progress = simulationProgress(run.io, "simulating");
  let result: ReturnType<typeof simulateProfile>;
  try {
    result = simulateProfile(profile, {
      models: defaultCircuitModels,
      wantSamples: stress.wantsSamples,
      onEvent: (event, temperatures) => {
        digest.add(event, temperatures);
        stress.addEvent(event);
      },
      onPoint: (timeS: number, temperatureC: readonly number[], kind: "step-end" | "peak", eventIndex: number) => {
        envelope?.add(timeS, temperatureC);
        csv?.add(timeS, eventIndex, kind, temperatureC);
        stress.addPoint(timeS, temperatureC, kind, eventIndex);
      },
      onProgress: progress.onProgress,
    });
  } finally {
    progress.done();
  }
  const stressResult = stress.finish(result.endTimeS);
  if (csv !== undefined) writeOutputFile(run.io, options.csv!, csv.text(), options.force === true, "--csv");
  let cyclesNote = "";
  if (options.cycles !== undefined) {
    const parts = stressResult.parts.map((p) => ({ id: p.id, cycles: p.report.cycles, damage: p.report.damage === undefined ? undefined : p.report.cycleDamage }));
    writeOutputFile(run.io, options.cycles, formatCyclesCsv(parts), options.force === true, "--cycles");
    cyclesNote = `Cycles: ${parts.reduce((n, p) => n + p.cycles.length, 0)} rows written to ${options.cycles}\n`;
  }
  if (options.json) run.io.out(`${JSON.stringify(simulationStressJson(simulationJson(profile, result, digest), stressResult, profile.occursPerYear), null, 2)}\n`);
  else
    run.io.out(
      `${formatSimulationText(profile, result, digest, envelope, run.io.columns, formatProfileStress(profile, stressResult))}\n${csv === undefined ? "" : `Time series: ${csv.rowCount} rows written to ${options.csv}\n`}${cyclesNote}`,
    );
  run.status = result.verdict === "fail" || stressResult.ratingStatus === "fail" ? EXIT_LIMIT : EXIT_OK;
}
