import { InputError } from "../errors/InputError.js";
import type { StudyAnswerOptions, StudyAnswers } from "./evaluateStudyAnswers.js";
import { evaluateStudyAnswers } from "./evaluateStudyAnswers.js";
import type { StudyProfile } from "./StudyProfile.js";
import type { StudyAnswerName } from "./studyDefaults.js";
import type { SweepAxis } from "./sweepAxis.js";

/** One point of a sweep: the axis values and the answers there (or why the profile refused them). */
export interface SweepPoint {
  /** one value per axis, SI */
  readonly values: readonly number[];
  readonly answers: StudyAnswers | null;
  /** the loader's or a command's complaint when the point could not be run */
  readonly problem: string | null;
}

/** A whole sweep. */
export interface SweepResult {
  readonly axes: readonly SweepAxis[];
  readonly answers: readonly StudyAnswerName[];
  /** first axis outer, second inner */
  readonly points: readonly SweepPoint[];
}

/**
 * Run a sweep of one or two parameters: for every point of the grid (the first axis outer), set
 * the values in the profile text, load it through loadProfile and work out the answers with the
 * commands that hold them (evaluateStudyAnswers). A point the profile format or a model refuses
 * (a value out of its range) keeps the message and the sweep goes on.
 * Cost: points × (one profile load + the commands the answers need).
 * @param onPoint called after each point with the number done
 */
export function runSweep(study: StudyProfile, axes: readonly SweepAxis[], answers: readonly StudyAnswerName[], options: StudyAnswerOptions, onPoint?: (done: number, total: number) => void): SweepResult {
  const grid: number[][] = [[]];
  for (const axis of axes) {
    const next: number[][] = [];
    for (const head of grid) for (const v of axis.values) next.push([...head, v]);
    grid.splice(0, grid.length, ...next);
  }
  const points = grid.map((values, k): SweepPoint => {
    let point: SweepPoint;
    try {
      const profile = study.load(values.map((v, i) => [axes[i]!.parameter, v] as const));
      point = { values, answers: evaluateStudyAnswers(profile, answers, options), problem: null };
    } catch (error) {
      if (!(error instanceof InputError)) throw error;
      point = { values, answers: null, problem: error.message.split("\n")[0]! };
    }
    onPoint?.(k + 1, grid.length);
    return point;
  });
  return { axes, answers, points };
}
