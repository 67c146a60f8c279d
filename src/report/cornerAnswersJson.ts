import type { CornerAnswers } from "../profile/CornerAnswers.js";
import { type Verdict, worstVerdict } from "../stress/Verdict.js";

/** The JSON form of a command's answers over its corners (`"corners"` of --json). */
export interface CornerAnswersJson {
  readonly source: string;
  readonly names: readonly string[];
  /** the worst verdict over the corners */
  readonly verdict: Verdict;
  readonly verdicts: Readonly<Record<string, Verdict>>;
  readonly answers: readonly {
    readonly subject: string;
    readonly answer: string;
    readonly unit: string;
    /** the value that holds over every corner (the governing corner's); null: none */
    readonly value: number | null;
    readonly governing: string;
    readonly values: Readonly<Record<string, number | null>>;
  }[];
}

/**
 * A command's answers over its corners as a plain object for --json: each corner's verdict, and
 * per answer its value at every corner keyed by the corner's name, the governing corner and the
 * value that holds over them all (null where none exists, never NaN). Cost O(corners × answers).
 */
export function cornerAnswersJson(answers: CornerAnswers): CornerAnswersJson {
  const byName = <T>(values: readonly T[]): Record<string, T> => Object.fromEntries(answers.corners.map((name, c) => [name, values[c]!]));
  return {
    source: answers.source,
    names: answers.corners,
    verdict: worstVerdict(answers.verdicts),
    verdicts: byName(answers.verdicts),
    answers: answers.answers.map((a) => ({ subject: a.subject, answer: a.answer, unit: a.unit, value: a.value, governing: a.governing, values: byName(a.values) })),
  };
}
