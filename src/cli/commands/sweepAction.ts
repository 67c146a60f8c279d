import { inputError } from "../../errors/InputError.js";
import { defaultCircuitModels } from "../../profile/defaultCircuitModels.js";
import { formatSweepCsv, formatSweepText, sweepJson } from "../../report/formatSweep.js";
import { runSweep } from "../../study/runSweep.js";
import { STUDY_DEFAULTS } from "../../study/studyDefaults.js";
import { parseSweepAxis } from "../../study/sweepAxis.js";
import { commandProgress } from "../commandProgress.js";
import type { CliRun } from "../main.js";
import { refuseExistingOutput, refuseSharedOutputs, writeOutputFile } from "../readInputFile.js";
import { worstVerdict } from "../../stress/Verdict.js";
import { checkPartOption, parseAnswerNames, readStudyProfile } from "../readStudyProfile.js";
import type { SweepFlags } from "./sweep.js";

/**
 * The run of `heatledger sweep PROFILE` (flags and help in sweep.ts): parse the axes against the
 * profile, run every point, write the --csv file and print the table or the JSON.
 * @throws InputError for a bad profile, path, value, answer name or part, or a --csv file that exists without --force
 */
export async function sweepAction(run: CliRun, file: string, options: SweepFlags): Promise<void> {
  refuseSharedOutputs([["--csv", options.csv], ["--report", options.report]]);
  refuseExistingOutput(run.io, options.csv, options.force === true, "--csv");
  refuseExistingOutput(run.io, options.report, options.force === true, "--report");
  const answers = parseAnswerNames(options.answer, STUDY_DEFAULTS.sweepAnswers);
  const vary = options.vary ?? [];
  if (vary.length < 1 || vary.length > 2) throw inputError("bad-option", "--vary", "one or two --vary PATH=VALUES", `${vary.length}`);
  const study = readStudyProfile(run.io, file);
  checkPartOption(study, options.part);
  const axes = vary.map((v) => parseSweepAxis(study, v, "--vary"));
  const points = axes.reduce((n, a) => n * a.values.length, 1);
  if (points > STUDY_DEFAULTS.maxPoints) throw inputError("bad-option", "--vary", `at most ${STUDY_DEFAULTS.maxPoints} points in all`, `${points} points`);
  let done = 0;
  const progress = commandProgress(run.io, "sweep", () => `, point ${done} of ${points}`);
  let result;
  try {
    result = runSweep(study, axes, answers, { models: defaultCircuitModels, ...(options.part === undefined ? {} : { partId: options.part }) }, (n) => {
      done = n;
      progress.tick();
    });
    progress.finish();
  } finally {
    progress.done();
  }
  const linearMosfet = study.nominal.circuit?.topology === "linear-mosfet";
  if (options.csv !== undefined) writeOutputFile(run.io, options.csv, formatSweepCsv(result), options.force === true, "--csv");
  let chartNote = "";
  if (options.report !== undefined) {
    const [{ writeChartReport }, { sweepCharts }, { reportCautions }] = await Promise.all([import("../writeChartReport.js"), import("../../report/sweepCharts.js"), import("../../text/cautions.js")]);
    const verdicts = result.points.map((p) => p.answers?.verdict ?? "pass");
    const verdict = worstVerdict(verdicts);
    const count = verdicts.filter((v) => v === verdict).length;
    const page = {
      title: `heatledger sweep: ${study.nominal.name}`,
      verdict,
      verdictText: `the worst point of the sweep (${count} of ${result.points.length} points ${verdict}); the sweep explores and sets no exit status`,
      cautions: reportCautions(linearMosfet),
      text: formatSweepText(result, study.nominal.name, 100, linearMosfet),
    };
    chartNote = await writeChartReport(run.io, { report: options.report, force: options.force === true }, page, sweepCharts(result));
  }
  if (options.json) run.io.out(`${JSON.stringify(sweepJson(result, study.nominal.name, linearMosfet), null, 2)}\n`);
  else run.io.out(`${formatSweepText(result, study.nominal.name, run.io.columns, linearMosfet)}${options.csv === undefined ? "" : `Points written to ${options.csv}\n`}${chartNote}`);
}
