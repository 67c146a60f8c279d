import type { Verdict } from "../stress/Verdict.js";

/** One answer of a command (a part's peak, a sized capacity) over the profile and its corners. */
export interface CornerAnswer {
  /** what the answer is about: a part id, or "charging element" */
  readonly subject: string;
  /** the answer's name: "peak", "margin", "energy", "damage", "capacity", ... */
  readonly answer: string;
  /** its unit as reports print it ("°C", "K", "J", "" for a plain number) */
  readonly unit: string;
  /** which end is the worse one: the highest peak, the lowest margin */
  readonly worst: "highest" | "lowest";
  /** one value per corner, in the order of CornerAnswers.corners; null where the corner has no answer */
  readonly values: readonly (number | null)[];
  /** index of the governing corner */
  readonly governingIndex: number;
  /** its name */
  readonly governing: string;
  /** the answer that holds over every corner: the governing corner's value (null: none exists) */
  readonly value: number | null;
}

/** A command's answers over a corner set: the profile as written first, then each corner. */
export interface CornerAnswers {
  /** where the corner set comes from (`retryPlan.corners`) */
  readonly source: string;
  /** the profile as written ("as written"), then the corners' names */
  readonly corners: readonly string[];
  /** each corner's verdict, in the order of corners */
  readonly verdicts: readonly Verdict[];
  readonly answers: readonly CornerAnswer[];
}

/**
 * The answer over a corner set, with its governing corner: the corner whose value is the worst
 * (the highest or the lowest, as `worst` says). A corner with no answer (null: no feasible size,
 * no safe value) governs, since no value covers it; ties go to the earlier corner.
 * Source: rule of our own (docs/profile-format.md, "Corners in every command"). Cost O(corners).
 */
export function cornerAnswer(subject: string, answer: string, unit: string, worst: "highest" | "lowest", corners: readonly string[], values: readonly (number | null)[]): CornerAnswer {
  let index = 0;
  for (let i = 0; i < values.length; i++) {
    const v = values[i]!;
    const best = values[index]!;
    if (best === null) break;
    if (v === null || (worst === "highest" ? v > best : v < best)) index = i;
  }
  return { subject, answer, unit, worst, values, governingIndex: index, governing: corners[index] ?? "", value: values[index] ?? null };
}
