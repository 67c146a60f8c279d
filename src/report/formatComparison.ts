import type { ProfileComparison } from "../study/compareProfiles.js";
import { STUDY_ANSWERS } from "../study/studyDefaults.js";
import { formatCautions, reportCautions } from "../text/cautions.js";
import { formatNumber } from "../text/formatTable.js";
import { answerCell, answerHeading } from "./formatSweep.js";
import { studyTable } from "./studyTable.js";

/**
 * The text report of `heatledger compare`: the two designs' names and verdicts, one row per
 * answer with both values, the difference B − A and its share of A, the notes, and the cautions.
 * Cost O(answers).
 */
export function formatComparisonText(c: ProfileComparison, names: readonly [string, string], width: number, linearMosfet = false): string {
  const w = Math.min(width, 100);
  const rows = [
    ["part", c.a.partId, c.b.partId, "", ""],
    ["verdict", c.a.verdict, c.b.verdict, c.a.verdict === c.b.verdict ? "same" : "changed", ""],
    ...c.rows.map((r) => [
      answerHeading(r.answer),
      answerCell(r.a),
      answerCell(r.b),
      r.difference === null ? "" : `${r.difference > 0 ? "+" : ""}${formatNumber(r.difference)}`,
      r.difference === null || r.a === null || r.a === 0 ? "" : `${r.difference > 0 ? "+" : ""}${formatNumber((100 * r.difference) / Math.abs(r.a), 3)} %`,
    ]),
  ];
  return [
    `A: ${names[0]}\nB: ${names[1]}\n`,
    studyTable(["answer", "A", "B", "B − A", "change"].map((h, i) => ({ heading: h, ...(i === 0 ? {} : { align: "right" as const }) })), rows, 1, w),
    ...(c.notes.length > 0 ? [`${c.notes.join("\n")}\n`] : []),
    `Answers:\n${c.rows.map((r) => `  ${r.answer}: ${STUDY_ANSWERS[r.answer].words} (from ${STUDY_ANSWERS[r.answer].command})`).join("\n")}\n`,
    formatCautions(linearMosfet, w),
  ].join("\n");
}

/** The `compare --json` object: both designs (name, part, verdict, answers), the differences, notes and cautions. */
export function comparisonJson(c: ProfileComparison, names: readonly [string, string], linearMosfet = false): object {
  return {
    a: { name: names[0], part: c.a.partId, verdict: c.a.verdict, answers: c.a.values },
    b: { name: names[1], part: c.b.partId, verdict: c.b.verdict, answers: c.b.values },
    differences: c.rows.map((r) => ({ answer: r.answer, unit: STUDY_ANSWERS[r.answer].unit, a: r.a, b: r.b, difference: r.difference })),
    notes: c.notes,
    cautions: reportCautions(linearMosfet),
  };
}
