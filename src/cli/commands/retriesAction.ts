import { formatRetryPlanText } from "../../report/formatRetryPlanText.js";
import { surroundingsBoundNote as boundNote, surroundingsOf } from "../../report/surroundingsSummary.js";
import { lockoutMapCsv } from "../../report/formatLockoutMap.js";
import { planRetries } from "../../retry/planRetries.js";
import { retryPlanJson } from "../../report/retryPlanJson.js";
import { defaultCircuitModels } from "../../profile/defaultCircuitModels.js";
import { verdictExitStatus } from "../../stress/Verdict.js";
import { attemptsProgress } from "../attemptsProgress.js";
import type { CliRun } from "../main.js";
import { readProfileFile } from "../readProfileFile.js";
import { refuseExistingOutput, writeOutputFile } from "../readInputFile.js";
import type { RetriesFlags } from "./retries.js";

/**
 * The run of `heatledger retries PROFILE` (flags and help are in retries.ts, which loads this
 * module only when the command runs): plan the retries of the profile's first retry block with a
 * fault, write the --csv lockout map and print the report; the exit status follows the verdict of
 * the profile's own policy (verdictExitStatus).
 * @throws InputError for a bad profile, a file it names, or a --csv file that exists without --force
 */
export async function retriesAction(run: CliRun, file: string, options: RetriesFlags): Promise<void> {
  refuseExistingOutput(run.io, options.csv, options.force === true, "--csv");
  refuseExistingOutput(run.io, options.report, options.force === true, "--report");
  refuseExistingOutput(run.io, options.svg, options.force === true, "--svg");
  const profile = readProfileFile(run.io, file);
  const progress = attemptsProgress(run.io, "retries");
  let report;
  try {
    report = planRetries(profile, progress.watch(defaultCircuitModels));
    progress.finish();
  } finally {
    progress.done();
  }
  if (options.csv !== undefined) writeOutputFile(run.io, options.csv, lockoutMapCsv(report.map), options.force === true, "--csv");
  let chartNote = "";
  if (options.report !== undefined || options.svg !== undefined) {
    const [{ writeChartReport }, { retryCharts }, { reportCautions }] = await Promise.all([import("../writeChartReport.js"), import("../../report/retryCharts.js"), import("../../text/cautions.js")]);
    const page = { title: `heatledger retries: ${profile.name}`, verdict: report.policy.verdict, verdictText: report.policy.reasons.join("; "), cautions: reportCautions(report.setup.linearMosfet), text: formatRetryPlanText(report, 100) };
    chartNote = await writeChartReport(run.io, options, page, retryCharts(profile, report));
  }
  if (options.json) run.io.out(`${JSON.stringify({ ...(retryPlanJson(report) as object), ...surroundingsOf(profile) }, null, 2)}\n`);
  else run.io.out(`${boundNote(profile, Math.min(run.io.columns, 100))}${formatRetryPlanText(report, Math.min(run.io.columns, 100))}${options.csv === undefined ? "" : `Lockout map written to ${options.csv}\n`}${chartNote}`);
  run.status = verdictExitStatus(report.policy.verdict, options.strict === true);
}
