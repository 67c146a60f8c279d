import { InputError, describeFound, inputError } from "../errors/InputError.js";
import { type StudyAnswerOptions, evaluateStudyAnswers } from "./evaluateStudyAnswers.js";
import type { StudyParameter, StudyProfile } from "./StudyProfile.js";
import { STUDY_DEFAULTS, type StudyAnswerName } from "./studyDefaults.js";

/** The sensitivity of one answer to one parameter. */
export interface Sensitivity {
  readonly answer: StudyAnswerName;
  /** answer at p·(1 − h), at p, at p·(1 + h); null where the command has none */
  readonly below: number | null;
  readonly nominal: number | null;
  readonly above: number | null;
  /** d ln(answer) / d ln(p), central difference; null when an answer is missing or not positive */
  readonly normalised: number | null;
  /** why normalised is null, else null */
  readonly why: string | null;
}

/** Every answer's sensitivity to one parameter. */
export interface ParameterSensitivity {
  readonly parameter: StudyParameter;
  readonly sensitivities: readonly Sensitivity[];
}

/** Options of {@link computeSensitivities}. */
export interface SensitivityOptions extends StudyAnswerOptions {
  /** relative step h (default STUDY_DEFAULTS.sensitivityStep) */
  readonly step?: number;
}

/**
 * Normalised sensitivities S = d ln(y) / d ln(p) of each answer y (the peak rise over ambient,
 * the retry-for-ever interval, ...) to each parameter p, by a central difference in ln p:
 * S ≈ [ln y(p(1+h)) − ln y(p(1−h))] / [ln(1+h) − ln(1−h)], each y worked out on the profile
 * loaded with the value set (the commands' own answers). S = 1 means the answer grows in
 * proportion to p, 2 as its square, 0 not at all. The truncation error is O(h²).
 * Source: central-difference derivative, Press et al., Numerical Recipes, 3rd ed. (2007), §5.7;
 * normalised (logarithmic) sensitivity as in Saltelli et al., Global Sensitivity Analysis: The
 * Primer (2008), §1.2.
 * Valid for answers that are positive and smooth in p near its value; an answer that is missing
 * or not positive at a step gives null with the reason. Absolute temperatures (°C, no natural
 * zero) and parameters the profile does not write are refused.
 * Cost: 2 × parameters + 1 evaluations of the answers' commands.
 * @throws InputError `bad-option` for such a parameter or a step outside (0, 0.5]; what the loader throws at the nominal values
 */
export function computeSensitivities(study: StudyProfile, parameters: readonly StudyParameter[], answers: readonly StudyAnswerName[], options: SensitivityOptions): ParameterSensitivity[] {
  const h = options.step ?? STUDY_DEFAULTS.sensitivityStep;
  if (!(h > 0 && h <= 0.5)) throw inputError("bad-option", "--step", "a relative step above 0 and at most 0.5 such as 0.01", describeFound(h));
  for (const p of parameters) {
    if (p.nominal === undefined || p.nominal === 0)
      throw inputError("bad-option", "--vary", `a quantity the profile writes with a value other than zero (${p.path} is ${p.written})`, describeFound(p.path));
    if (p.dimension === "temperature")
      throw inputError("bad-option", "--vary", `a quantity with a natural zero (${p.path} is an absolute temperature in °C: sweep it instead)`, describeFound(p.path));
  }
  const base = evaluateStudyAnswers(study.load([]), answers, options);
  const at = (p: StudyParameter, factor: number): Readonly<Partial<Record<StudyAnswerName, number | null>>> | string => {
    try {
      return evaluateStudyAnswers(study.load([[p, p.nominal! * factor]]), answers, { ...options, partId: base.partId }).values;
    } catch (error) {
      if (!(error instanceof InputError)) throw error;
      return error.message.split("\n")[0]!;
    }
  };
  const denominator = Math.log1p(h) - Math.log1p(-h);
  return parameters.map((parameter) => {
    const down = at(parameter, 1 - h);
    const up = at(parameter, 1 + h);
    const sensitivities = answers.map((answer): Sensitivity => {
      const below = typeof down === "string" ? null : (down[answer] ?? null);
      const above = typeof up === "string" ? null : (up[answer] ?? null);
      const nominal = base.values[answer] ?? null;
      let why: string | null = null;
      if (typeof down === "string" || typeof up === "string") why = `the profile refused a step: ${typeof down === "string" ? down : up}`;
      else if (below === null || above === null) why = "the command has no answer at a step";
      else if (!(below > 0 && above > 0)) why = "the answer is not positive, so it has no logarithm";
      const normalised = why === null ? (Math.log(above!) - Math.log(below!)) / denominator : null;
      return { answer, below, nominal, above, normalised, why };
    });
    return { parameter, sensitivities };
  });
}
