import { describeFound, inputError } from "../../errors/InputError.js";
import { sizeProfile } from "../../size/sizeProfile.js";
import { SIZE_SCALE_SCOPES, type SizeScaleScope } from "../../size/sizeDefaults.js";
import { defaultCircuitModels } from "../../profile/defaultCircuitModels.js";
import { formatSizingText } from "../../report/formatSizingText.js";
import { sizingJson } from "../../report/sizingJson.js";
import { materialPreset } from "../../thermal/materials.js";
import { parseQuantity } from "../../units/parseQuantity.js";
import { verdictExitStatus } from "../../stress/Verdict.js";
import { commandProgress } from "../commandProgress.js";
import type { CliRun } from "../main.js";
import { readProfileFile } from "../readProfileFile.js";
import { refuseExistingOutput } from "../readInputFile.js";
import type { SizeFlags } from "./size.js";
import type { CircuitModels } from "../../profile/CircuitModels.js";
import type { DutyProfile } from "../../profile/DutyProfile.js";
import { type ProfileCorner, profileCorners } from "../../profile/profileCorners.js";
import type { SizingReport } from "../../size/sizeProfile.js";
import { cornerAnswersJson } from "../../report/cornerAnswersJson.js";
import { formatCornerAnswers } from "../../report/formatCornerAnswers.js";
import { sizingCornerAnswers } from "../../report/sizingCornerAnswers.js";
import { worstVerdict } from "../../stress/Verdict.js";
import { runCorners } from "../runCorners.js";
import { type CornerReport, cornerNames, cornerNote } from "../simulationCorners.js";

/**
 * The run of `heatledger size PROFILE` (flags and help are in size.ts, which loads this module
 * only when the command runs): size every part (or the --part ones) and the charging element and
 * print the report; the exit status follows the verdict (verdictExitStatus: 1 when no feasible
 * size exists).
 * @throws InputError for a bad profile, a file it names, --material, --margin or --scale
 */
export async function sizeAction(run: CliRun, file: string, options: SizeFlags): Promise<void> {
  refuseExistingOutput(run.io, options.report, options.force === true, "--report");
  refuseExistingOutput(run.io, options.svg, options.force === true, "--svg");
  const material = options.material === undefined ? undefined : materialPreset(options.material, "--material");
  const marginK = options.margin === undefined ? undefined : parseQuantity(/^\s*[-+]?[\d.]+(e[-+]?\d+)?\s*$/i.test(options.margin) ? Number(options.margin) : options.margin, "temperatureDifference", "--margin");
  const scope = options.scale === undefined ? undefined : scaleScope(options.scale);
  const profile = readProfileFile(run.io, file);
  const progress = commandProgress(run.io, "size");
  let report;
  try {
    report = sizeProfile(profile, {
      models: progress.watch(defaultCircuitModels),
      ...(material === undefined ? {} : { material }),
      ...(marginK === undefined ? {} : { marginK }),
      ...(options.part === undefined ? {} : { partIds: options.part }),
      ...(scope === undefined ? {} : { scope }),
    });
    progress.finish();
  } finally {
    progress.done();
  }
  const corners = sizingCorners(run, profile, options, report, (corner, models) =>
    sizeProfile(corner.profile, {
      models,
      ...(material === undefined ? {} : { material }),
      ...(marginK === undefined ? {} : { marginK }),
      ...(options.part === undefined ? {} : { partIds: options.part }),
      ...(scope === undefined ? {} : { scope }),
    }),
  );
  let chartNote = "";
  if (options.report !== undefined || options.svg !== undefined) {
    const [{ writeChartReport }, { sizingCharts }, { reportCautions }] = await Promise.all([import("../writeChartReport.js"), import("../../report/sizingCharts.js"), import("../../text/cautions.js")]);
    const page = { title: `heatledger size: ${profile.name}`, verdict: report.verdict, verdictText: report.infeasibleReasons.join(" "), cautions: reportCautions(report.linearMosfet), text: formatSizingText(report, 100) };
    chartNote = await writeChartReport(run.io, options, page, sizingCharts(profile, report));
  }
  if (options.json) run.io.out(`${JSON.stringify(corners.json === undefined ? sizingJson(report) : { ...sizingJson(report), corners: corners.json }, null, 2)}\n`);
  else run.io.out(`${formatSizingText(report, Math.min(run.io.columns, 120))}${chartNote}${corners.text}`);
  run.status = verdictExitStatus(corners.verdict ?? report.verdict, options.strict === true);
}

/** The --corners part of `size`: each corner sized as the profile was, the section, JSON and verdict over them all. */
function sizingCorners(run: CliRun, profile: DutyProfile, options: SizeFlags, nominal: SizingReport, sizeAt: (corner: ProfileCorner, models: CircuitModels) => SizingReport): CornerReport {
  if (options.corners !== true) return { text: cornerNote(profile, run.io.columns, "size") };
  const corners = profileCorners(profile);
  const answers = sizingCornerAnswers(cornerNames(corners), [nominal, ...runCorners(run.io, corners, "corners", sizeAt)]);
  return { text: `\n${formatCornerAnswers(answers, run.io.columns)}`, json: cornerAnswersJson(answers), verdict: worstVerdict(answers.verdicts) };
}

/** The value of --scale, checked. */
function scaleScope(value: string): SizeScaleScope {
  const scope = SIZE_SCALE_SCOPES.find((s) => s === value.trim().toLowerCase());
  if (scope === undefined) throw inputError("bad-option", "--scale", SIZE_SCALE_SCOPES.join(" or "), describeFound(value));
  return scope;
}
