import { InputError } from "../errors/InputError.js";
import type { DutyProfile } from "../profile/DutyProfile.js";
import { type StudyAnswerOptions, type StudyAnswers, evaluateStudyAnswers } from "./evaluateStudyAnswers.js";
import type { StudyAnswerName } from "./studyDefaults.js";
import { type EventEnergy, EventEnergyTally } from "./EventEnergyTally.js";
import { type Verdict, worstVerdict } from "../stress/Verdict.js";

/** One profile entry's energy per event in both designs (matched by field), null where a design has none. */
export interface EventEnergyRow {
  readonly field: string;
  readonly label: string;
  readonly a: EventEnergy | null;
  readonly b: EventEnergy | null;
  /** b − a of the energy per event [J]; null where either is missing */
  readonly differenceJ: number | null;
}

/** Two designs side by side. */
export interface ProfileComparison {
  readonly a: StudyAnswers;
  readonly b: StudyAnswers;
  /** per answer: both values and b − a (null where either has none) */
  readonly rows: readonly { readonly answer: StudyAnswerName; readonly a: number | null; readonly b: number | null; readonly difference: number | null }[];
  /** energy into the followed part per event, per profile entry that heats it */
  readonly events: readonly EventEnergyRow[];
  /** the worse of the two designs' verdicts (compare's exit status follows it) */
  readonly verdict: Verdict;
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
 * lifetime model) is null there, and the reason is kept. Energy per event: the followed part's
 * energy per event of every profile entry that heats it (EventEnergyTally), entries matched by
 * their field. The verdict is the worse of the two (simulate's temperature verdict of each).
 * Cost: two simulations and, where there is a retry question, two retry plans.
 */
export function compareProfiles(a: DutyProfile, b: DutyProfile, options: StudyAnswerOptions): ProfileComparison {
  const notes: string[] = [];
  const simulateAnswers = COMPARE_ANSWERS.filter((n) => n !== "forever" && n !== "uniform");
  const tallies: EventEnergyTally[] = [];
  const evaluate = (profile: DutyProfile, label: string, partId: string | undefined): StudyAnswers => {
    const part = partId !== undefined && profile.parts.some((p) => p.id === partId) ? { partId } : {};
    const tally = new EventEnergyTally();
    tallies.push(tally);
    const base = evaluateStudyAnswers(profile, simulateAnswers, { models: options.models, ...part, onEvent: (event) => tally.add(event) });
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
  const energies = [a, b].map((profile, i) => tallies[i]!.forPart(profile.parts.findIndex((p) => p.id === (i === 0 ? first : second).partId)));
  const fields = [...new Set([...energies[0]!, ...energies[1]!].map((e) => e.field))];
  const events = fields.map((field): EventEnergyRow => {
    const x = energies[0]!.find((e) => e.field === field) ?? null;
    const y = energies[1]!.find((e) => e.field === field) ?? null;
    return { field, label: (x ?? y)!.label, a: x, b: y, differenceJ: x === null || y === null ? null : y.perEventJ - x.perEventJ };
  });
  return { a: first, b: second, rows, events, verdict: worstVerdict([first.verdict, second.verdict]), notes };
}
