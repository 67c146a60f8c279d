import { ProfileStress } from "../../profile/ProfileStress.js";
import { simulateProfile } from "../../profile/simulateProfile.js";
import { formatProfileStress } from "../../report/formatProfileStress.js";
import { formatSimulationText } from "../../report/formatSimulationText.js";
import { simulationJson } from "../../report/simulationJson.js";
import { simulationStressJson } from "../../report/simulationStressJson.js";
import { simulationVerdict } from "../../report/simulationVerdict.js";
import { verdictExitStatus } from "../../stress/Verdict.js";
import type { CliRun } from "../main.js";
import { readProfileFile } from "../readProfileFile.js";
import { refuseExistingOutput, refuseSharedOutputs } from "../readInputFile.js";
import { writeCyclesFile } from "../writeCyclesFile.js";
import { recordSimulation, writeTimeSeries } from "../recordSimulation.js";
import type { SimulateFlags } from "./simulate.js";
import { simulateCorner } from "../../profile/simulateCorner.js";
import { simulationCorners } from "../simulationCorners.js";

/**
 * The run of `heatledger simulate PROFILE` (flags and help are in simulate.ts, which loads this
 * module only when the command runs): load the profile, simulate it with the stress checks, write
 * the --csv / --cycles files and print the report; sets the exit status from the verdict (verdictExitStatus; --strict makes warn exit 1).
 * @throws InputError for a bad profile, a file it names, or an output file that exists without --force
 */
export async function simulateAction(run: CliRun, file: string, options: SimulateFlags): Promise<void> {
  refuseSharedOutputs([["--csv", options.csv], ["--cycles", options.cycles], ["--report", options.report], ["--svg", options.svg]]);
  refuseExistingOutput(run.io, options.csv, options.force === true, "--csv");
  refuseExistingOutput(run.io, options.cycles, options.force === true, "--cycles");
  refuseExistingOutput(run.io, options.report, options.force === true, "--report");
  refuseExistingOutput(run.io, options.svg, options.force === true, "--svg");
  const profile = readProfileFile(run.io, file);
  const stress = new ProfileStress(profile, { keepCycles: options.cycles !== undefined || options.report !== undefined });
  const { result, digest, envelope, csv, trace } = recordSimulation(run.io, profile, options, stress, "simulating", (simulate) => simulateProfile(profile, simulate));
  const stressResult = stress.finish(result.endTimeS);
  const csvNote = writeTimeSeries(run.io, csv, options.csv, options.force === true);
  const cyclesNote = writeCyclesFile(run.io, options.cycles, stressResult, options.force === true);
  let chartNote = "";
  if (trace !== undefined) {
    const { writeSimulationReport } = await import("../simulationReport.js");
    const text = formatSimulationText(profile, result, digest, undefined, 100, formatProfileStress(profile, stressResult), {}, stressResult.ratingStatus);
    chartNote = await writeSimulationReport(run.io, options, { command: "simulate", profile, result, digest, trace, stress: stressResult, text });
  }
  const corners = simulationCorners(run, profile, options.corners === true, { result, stress: stressResult }, (corner, models) => simulateCorner(corner.profile, models));
  if (options.json) {
    const json = simulationStressJson(simulationJson(profile, result, digest), stressResult, profile.occursPerYear);
    run.io.out(`${JSON.stringify(corners.json === undefined ? json : { ...json, corners: corners.json }, null, 2)}\n`);
  } else
    run.io.out(
      `${formatSimulationText(profile, result, digest, envelope, run.io.columns, formatProfileStress(profile, stressResult), {}, stressResult.ratingStatus)}\n${csvNote}${cyclesNote}${chartNote}${corners.text}`,
    );
  run.status = verdictExitStatus(corners.verdict ?? simulationVerdict(result.verdict, stressResult.ratingStatus, result.contactor?.verdict).verdict, options.strict === true);
}
