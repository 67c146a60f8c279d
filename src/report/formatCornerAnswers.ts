import type { CornerAnswers } from "../profile/CornerAnswers.js";
import { worstVerdict } from "../stress/Verdict.js";
import { wrapText } from "../text/cautions.js";
import { formatNumber } from "../text/formatTable.js";
import { studyTable } from "./studyTable.js";

/** An answer's value for a table cell: 4 significant digits, "none" where the corner has none. */
function cell(value: number | null): string {
  return value === null ? "none" : formatNumber(value, 4);
}

/**
 * The corners section of a report (`--corners`): per subject (a part, the charging element) a
 * table of the profile as written and each corner, one column per answer, a last row naming the
 * governing corner of each answer, then one line per answer with the value that holds over every
 * corner. Ends with the worst verdict over the corners and the corner that sets it. Tables keep
 * within `width` (the answers split over several tables). Cost O(corners × answers).
 * @param answers the command's answers over the corners (simulationCornerAnswers, sizingCornerAnswers)
 * @param width the text width (≤ 100 when piped)
 */
export function formatCornerAnswers(answers: CornerAnswers, width: number): string {
  const out: string[] = [];
  const w = Math.min(width, 100);
  out.push(wrapText(`Corners: the profile as written and each corner of ${answers.source}. The governing corner of an answer is the one where it is worst.`, w));
  const subjects = [...new Set(answers.answers.map((a) => a.subject))];
  for (const subject of subjects) {
    const mine = answers.answers.filter((a) => a.subject === subject);
    const columns = [{ heading: "corner" }, { heading: "verdict" }, ...mine.map((a) => ({ heading: a.unit === "" ? a.answer : `${a.answer} [${a.unit}]`, align: "right" as const }))];
    const rows = answers.corners.map((name, c) => [name, answers.verdicts[c]!, ...mine.map((a) => cell(a.values[c] ?? null))]);
    rows.push(["governing", "", ...mine.map((a) => a.governing)]);
    out.push("", `${subject}:`, studyTable(columns, rows, 2, w).trimEnd());
    for (const a of mine) out.push(`  ${a.answer}: ${cell(a.value)}${a.unit === "" || a.value === null ? "" : ` ${a.unit}`}, governing corner ${a.governing}`);
  }
  const verdict = worstVerdict(answers.verdicts);
  const worst = answers.corners[answers.verdicts.findIndex((v) => v === verdict)] ?? answers.corners[0];
  const where = answers.verdicts.every((v) => v === verdict) ? "the same at every corner" : `set by corner ${worst}`;
  out.push("", wrapText(`Verdict over the corners: ${verdict} (${where}).`, w));
  return `${out.join("\n")}\n`;
}
