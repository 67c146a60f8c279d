import { supervisePrecharge } from "../../supervise/supervisePrecharge.js";
import { surroundingsBoundNote as boundNote, surroundingsOf } from "../../report/surroundingsSummary.js";
import { defaultCircuitModels } from "../../profile/defaultCircuitModels.js";
import { formatSupervisionText } from "../../report/formatSupervisionText.js";
import { supervisionJson } from "../../report/supervisionJson.js";
import { verdictExitStatus } from "../../stress/Verdict.js";
import { attemptsProgress } from "../attemptsProgress.js";
import type { CliRun } from "../main.js";
import { readProfileFile } from "../readProfileFile.js";
import { refuseExistingOutput, writeOutputFile } from "../readInputFile.js";
import { protectionFragment } from "../../report/protectionFragment.js";
import { InputError } from "../../errors/InputError.js";
import type { SuperviseFlags } from "./supervise.js";

/**
 * The run of `heatledger supervise PROFILE` (flags and help are in supervise.ts, which loads this
 * module only when the command runs): work out the supervision numbers and print the report; the
 * exit status follows the verdict on the profile's timeout (verdictExitStatus).
 * @throws InputError for a bad profile or a file it names
 */
export async function superviseAction(run: CliRun, file: string, options: SuperviseFlags): Promise<void> {
  refuseExistingOutput(run.io, options.checks, options.force === true, "--checks");
  refuseExistingOutput(run.io, options.report, options.force === true, "--report");
  refuseExistingOutput(run.io, options.svg, options.force === true, "--svg");
  const profile = readProfileFile(run.io, file);
  const progress = attemptsProgress(run.io, "supervise");
  let report;
  try {
    report = supervisePrecharge(profile, progress.watch(defaultCircuitModels));
    progress.finish();
  } finally {
    progress.done();
  }
  if (options.checks !== undefined) {
    if (report.protection === null)
      throw new InputError({ code: "bad-option", file: "", line: 0, field: "--checks", expected: "a usable early-abort or rise-too-fast check to write", found: "none at the profile's check times" });
    writeOutputFile(run.io, options.checks, protectionFragment(report.protection.protection, `heatledger supervise: recommended checks of "${report.profile}"`), options.force === true, "--checks");
  }
  let chartNote = "";
  if (options.report !== undefined || options.svg !== undefined) {
    const [{ writeChartReport }, { supervisionCharts }, { reportCautions }] = await Promise.all([import("../writeChartReport.js"), import("../../report/supervisionCharts.js"), import("../../text/cautions.js")]);
    const page = { title: `heatledger supervise: ${profile.name}`, verdict: report.verdict, verdictText: report.problems.join(" "), cautions: reportCautions(report.linearMosfet), text: formatSupervisionText(report, 100, false) };
    chartNote = await writeChartReport(run.io, options, page, supervisionCharts(profile, report));
  }
  if (options.json) run.io.out(`${JSON.stringify({ ...(supervisionJson(report) as object), ...surroundingsOf(profile) }, null, 2)}\n`);
  else run.io.out(`${boundNote(profile, Math.min(run.io.columns, 100))}${formatSupervisionText(report, run.io.columns, options.chart)}${chartNote}`);
  run.status = verdictExitStatus(report.verdict, options.strict === true);
}
