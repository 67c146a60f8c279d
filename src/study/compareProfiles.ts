import { InputError } from "../errors/InputError.js";
import type { DutyProfile } from "../profile/DutyProfile.js";
import { type StudyAnswerOptions, type StudyAnswers, evaluateStudyAnswers } from "./evaluateStudyAnswers.js";
import type { StudyAnswerName } from "./studyDefaults.js";

/** Two designs side by side. */
export interface ProfileComparison {
  readonly a: StudyAnswers;
  readonly b: StudyAnswers;
  /** per answer: both values and b − a (null where either has none) */
  readonly rows: readonly { readonly answer: StudyAnswerName; readonly a: number | null; readonly b: number | null; readonly difference: number | null }[];
  /** answers a command could not give for one of the designs, with the reason */
  readonly notes: readonly string[];
}

/** The answers compare reports: simulate's, then the retry planner's where the profile has a retry question. */
export const COMPARE_ANSWERS: readonly StudyAnswerName[] = ["peak", "rise", "margin", "energy", "damage", "forever", "uniform"];

/**
 * Compare two profiles (two designs, or one profile and the same with some values changed):
 * every answer of COMPARE_ANSWERS on each, worked out as the commands work it out
 * (evaluateStudyAnswers), and the difference b − a. The part followed is `partId`, else the
 * part of `a` with the least margin (the same id in `b`, or b's own least-margin part when `b`
 * has no part of that id). An answer one profile cannot give (no retry block with a fault, no
 * lifetime model) is null there, and the reason is kept.
 * Cost: two simulations and, where there is a retry question, two retry plans.
 */
export function compareProfiles(a: DutyProfile, b: DutyProfile, options: StudyAnswerOptions): ProfileComparison {
  const notes: string[] = [];
  const simulateAnswers = COMPARE_ANSWERS.filter((n) => n !== "forever" && n !== "uniform");
  const evaluate = (profile: DutyProfile, label: string, partId: string | undefined): StudyAnswers => {
    const part = partId !== undefined && profile.parts.some((p) => p.id === partId) ? { partId } : {};
    const base = evaluateStudyAnswers(profile, simulateAnswers, { models: options.models, ...part });
    try {
      const retry = evaluateStudyAnswers(profile, ["forever", "uniform"], { models: options.models, partId: base.partId });
      return { ...base, values: { ...base.values, ...retry.values } };
    } catch (error) {
      if (!(error instanceof InputError)) throw error;
      notes.push(`${label}: no retry answers (${error.problems[0]?.expected ?? "no retry question"})`);
      return { ...base, values: { ...base.values, forever: null, uniform: null } };
    }
  };
  const first = evaluate(a, "A", options.partId);
  const second = evaluate(b, "B", options.partId ?? first.partId);
  const rows = COMPARE_ANSWERS.map((answer) => {
    const x = first.values[answer] ?? null;
    const y = second.values[answer] ?? null;
    return { answer, a: x, b: y, difference: x === null || y === null ? null : y - x };
  });
  return { a: first, b: second, rows, notes };
}
