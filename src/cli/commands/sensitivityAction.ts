import { InputError, describeFound, inputError } from "../../errors/InputError.js";
import { defaultCircuitModels } from "../../profile/defaultCircuitModels.js";
import { formatSensitivityText, sensitivityJson } from "../../report/formatSensitivities.js";
import { computeSensitivities } from "../../study/computeSensitivities.js";
import { evaluateStudyAnswers } from "../../study/evaluateStudyAnswers.js";
import type { StudyParameter, StudyProfile } from "../../study/StudyProfile.js";
import { STUDY_DEFAULTS, type StudyAnswerName } from "../../study/studyDefaults.js";
import { commandProgress } from "../commandProgress.js";
import type { CliRun } from "../main.js";
import { refuseExistingOutput } from "../readInputFile.js";
import { checkPartOption, parseAnswerNames, readStudyProfile } from "../readStudyProfile.js";
import type { SensitivityFlags } from "./sensitivity.js";

/** Keys of the circuit a sensitivity run takes when no --vary is given. */
const DEFAULT_CIRCUIT_KEYS = ["busVoltage", "capacitance", "resistance", "sourceResistance"] as const;

/**
 * The run of `heatledger sensitivity PROFILE` (flags and help in sensitivity.ts): resolve the
 * parameters, work out every answer at p(1 ± h) and print the ranked tables or the JSON.
 * @throws InputError for a bad profile, path, answer, part or step
 */
export async function sensitivityAction(run: CliRun, file: string, options: SensitivityFlags): Promise<void> {
  refuseExistingOutput(run.io, options.report, options.force === true, "--report");
  const step = options.step === undefined ? STUDY_DEFAULTS.sensitivityStep : Number(options.step);
  if (!(step > 0 && step <= 0.5)) throw inputError("bad-option", "--step", "a relative step above 0 and at most 0.5 such as 0.01", describeFound(options.step));
  const study = readStudyProfile(run.io, file);
  checkPartOption(study, options.part);
  const parameters = options.vary?.map((v) => study.parameter(v, "--vary")) ?? defaultParameters(study);
  if (parameters.length === 0) throw inputError("bad-option", "--vary", "one or more quantities to study (the profile has no circuit to take them from)", "none");
  const answers = options.answer === undefined ? defaultAnswers(study) : parseAnswerNames(options.answer, STUDY_DEFAULTS.sensitivityAnswers);
  let done = 0;
  const models = { charge: defaultCircuitModels.charge, discharge: defaultCircuitModels.discharge };
  const progress = commandProgress(run.io, "sensitivity", () => `, ${done} charges`);
  let result;
  try {
    result = computeSensitivities(study, parameters, answers, {
      models: {
        charge: (...a) => {
          done++;
          progress.tick();
          return models.charge(...a);
        },
        discharge: models.discharge,
      },
      step,
      ...(options.part === undefined ? {} : { partId: options.part }),
    });
    progress.finish();
  } finally {
    progress.done();
  }
  const linearMosfet = study.nominal.circuit?.topology === "linear-mosfet";
  let chartNote = "";
  if (options.report !== undefined) {
    const [{ writeChartReport }, { sensitivityCharts }, { reportCautions }] = await Promise.all([import("../writeChartReport.js"), import("../../report/sensitivityCharts.js"), import("../../text/cautions.js")]);
    const verdict = evaluateStudyAnswers(study.nominal, ["peak"], { models: defaultCircuitModels, ...(options.part === undefined ? {} : { partId: options.part }) }).verdict;
    const page = {
      title: `heatledger sensitivity: ${study.nominal.name}`,
      verdict,
      verdictText: "the profile as written (simulate's temperature verdict); the sensitivities set no exit status",
      cautions: reportCautions(linearMosfet),
      text: formatSensitivityText(result, answers, step, study.nominal.name, 100, linearMosfet),
    };
    chartNote = await writeChartReport(run.io, { report: options.report, force: options.force === true }, page, sensitivityCharts(result, answers));
  }
  if (options.json) run.io.out(`${JSON.stringify(sensitivityJson(result, answers, step, study.nominal.name, linearMosfet), null, 2)}\n`);
  else run.io.out(`${formatSensitivityText(result, answers, step, study.nominal.name, run.io.columns, linearMosfet)}${chartNote}`);
}

/** The circuit's own quantities the profile writes. */
function defaultParameters(study: StudyProfile): StudyParameter[] {
  const out: StudyParameter[] = [];
  for (const key of DEFAULT_CIRCUIT_KEYS) {
    try {
      const p = study.parameter(`circuit.${key}`, "--vary");
      if (p.nominal !== undefined && p.nominal !== 0) out.push(p);
    } catch (error) {
      if (!(error instanceof InputError)) throw error;
    }
  }
  return out;
}

/** rise, and forever when the retry planner has a question to answer in the profile. */
function defaultAnswers(study: StudyProfile): StudyAnswerName[] {
  try {
    evaluateStudyAnswers(study.nominal, ["forever"], { models: defaultCircuitModels });
    return [...STUDY_DEFAULTS.sensitivityAnswers];
  } catch (error) {
    if (!(error instanceof InputError)) throw error;
    return STUDY_DEFAULTS.sensitivityAnswers.filter((a) => a !== "forever");
  }
}
