import type { ProfileComparison } from "../study/compareProfiles.js";
import type { EventEnergy } from "../study/EventEnergyTally.js";
import { VERDICTS, verdictLine } from "../stress/Verdict.js";
import { STUDY_ANSWERS } from "../study/studyDefaults.js";
import { formatCautions, reportCautions, wrapText } from "../text/cautions.js";
import { formatNumber } from "../text/formatTable.js";
import { answerCell, answerHeading } from "./formatSweep.js";
import { studyTable } from "./studyTable.js";

/**
 * The text report of `heatledger compare`: the two designs' names and verdicts, one row per
 * answer with both values, the difference B − A and its share of A, the energy per event of each
 * profile entry that heats the part, the notes, the verdict (the worse of the two) and the cautions.
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
  const energy = (e: EventEnergy | null): string => (e === null ? "none" : `${formatNumber(e.perEventJ)} ×${e.count}`);
  const eventRows = c.events.map((r) => [
    r.field,
    energy(r.a),
    energy(r.b),
    r.differenceJ === null ? "" : `${r.differenceJ > 0 ? "+" : ""}${formatNumber(r.differenceJ)}`,
    r.differenceJ === null || r.a === null || r.a.perEventJ === 0 ? "" : `${r.differenceJ > 0 ? "+" : ""}${formatNumber((100 * r.differenceJ) / r.a.perEventJ, 3)} %`,
  ]);
  const eventTable =
    eventRows.length === 0
      ? "Energy per event: no event heats the part.\n"
      : `Energy per event into the part [J] (× how many events the entry runs):\n${studyTable(["event", "A", "B", "B − A", "change"].map((h, i) => ({ heading: h, ...(i === 0 ? {} : { align: "right" as const }) })), eventRows, 1, w)}`;
  return [
    `A: ${names[0]}\nB: ${names[1]}\n`,
    studyTable(["answer", "A", "B", "B − A", "change"].map((h, i) => ({ heading: h, ...(i === 0 ? {} : { align: "right" as const }) })), rows, 1, w),
    eventTable,
    ...(c.notes.length > 0 ? [`${c.notes.join("\n")}\n`] : []),
    `Answers:\n${c.rows.map((r) => `  ${r.answer}: ${STUDY_ANSWERS[r.answer].words} (from ${STUDY_ANSWERS[r.answer].command})`).join("\n")}\n`,
    `${wrapText(verdictLine(c.verdict, `the worse of A (${c.a.verdict}) and B (${c.b.verdict}); ${VERDICTS[c.verdict].meaning}`), w)}\n`,
    formatCautions(linearMosfet, w),
  ].join("\n");
}

/** The `compare --json` object: the verdict, both designs (name, part, verdict, answers), the differences, the energy per event, notes and cautions. */
export function comparisonJson(c: ProfileComparison, names: readonly [string, string], linearMosfet = false): object {
  return {
    verdict: c.verdict,
    a: { name: names[0], part: c.a.partId, verdict: c.a.verdict, answers: c.a.values },
    b: { name: names[1], part: c.b.partId, verdict: c.b.verdict, answers: c.b.values },
    differences: c.rows.map((r) => ({ answer: r.answer, unit: STUDY_ANSWERS[r.answer].unit, a: r.a, b: r.b, difference: r.difference })),
    events: c.events.map((r) => ({ field: r.field, label: r.label, unit: "J", a: r.a, b: r.b, differenceJ: r.differenceJ })),
    notes: c.notes,
    cautions: reportCautions(linearMosfet),
  };
}
