import type { SweepResult } from "../study/runSweep.js";
import { STUDY_ANSWERS, type StudyAnswerName } from "../study/studyDefaults.js";
import { DIMENSIONS } from "../units/dimensions.js";
import { formatCautions, reportCautions } from "../text/cautions.js";
import { formatNumber } from "../text/formatTable.js";
import { lazyCsv } from "../format/lazyCsv.js";
import { studyTable } from "./studyTable.js";

/** "[ohm]" after a heading, nothing for a plain number. */
export function unitSuffix(unit: string): string {
  return unit === "" ? "" : ` [${unit}]`;
}

/** A parameter's heading: its path and SI unit. */
function axisHeading(result: SweepResult, i: number): string {
  const p = result.axes[i]!.parameter;
  return `${p.path}${unitSuffix(DIMENSIONS[p.dimension].si === "degC" ? "°C" : DIMENSIONS[p.dimension].si)}`;
}

/** An answer's heading with its unit. */
export function answerHeading(name: StudyAnswerName): string {
  return `${name}${unitSuffix(STUDY_ANSWERS[name].unit)}`;
}

/** An answer's value for a table: "none" for an answer the command does not have (no safe interval, no lifetime model, ...). */
export function answerCell(value: number | null | undefined): string {
  return value === null || value === undefined ? "none" : formatNumber(value);
}

/**
 * The text report of `heatledger sweep`: the parameters and their values, one row per point
 * with every answer and the verdict (split into several tables to stay within the width), the
 * points the profile refused with the reason, what each answer is, and the cautions.
 * Cost O(points × answers).
 */
export function formatSweepText(result: SweepResult, profileName: string, width: number, linearMosfet = false): string {
  const w = Math.min(width, 100);
  const lines: string[] = [`Sweep of ${profileName}`];
  result.axes.forEach((a, i) => lines.push(`  ${axisHeading(result, i)}: ${a.values.length} values (${a.spacing}); profile value ${a.parameter.written}`));
  const part = result.points.find((p) => p.answers !== null)?.answers?.partId;
  if (part !== undefined) lines.push(`  part followed: ${part}`);
  const columns = [
    ...result.axes.map((_, i) => ({ heading: axisHeading(result, i), align: "right" as const })),
    ...result.answers.map((a) => ({ heading: answerHeading(a), align: "right" as const })),
    { heading: "verdict" },
  ];
  const rows = result.points.map((p) => [
    ...p.values.map((v) => formatNumber(v)),
    ...result.answers.map((a) => (p.answers === null ? "refused" : answerCell(p.answers.values[a]))),
    p.answers?.verdict ?? "-",
  ]);
  const refused = result.points.filter((p) => p.problem !== null);
  const notes = refused.slice(0, 5).map((p) => `  at ${p.values.map((v) => formatNumber(v)).join(", ")}: ${p.problem}`);
  if (refused.length > 5) notes.push(`  ... and ${refused.length - 5} more`);
  const legend = result.answers.map((a) => `  ${a}: ${STUDY_ANSWERS[a].words} (from ${STUDY_ANSWERS[a].command})`);
  return [
    lines.join("\n"),
    "",
    studyTable(columns, rows, result.axes.length, w),
    ...(notes.length > 0 ? [`Points the profile refused:\n${notes.join("\n")}\n`] : []),
    `Answers:\n${legend.join("\n")}\n${rows.some((r) => r.includes("none")) ? `  none: the command has no such answer at that point (no safe interval, a corner that never\n  completes, no lifetime model)\n` : ""}`,
    formatCautions(linearMosfet, w),
  ].join("\n");
}

/** The sweep as CSV: one header row (paths and answers with units), one row per point; empty cells for answers a point does not have. */
export function formatSweepCsv(result: SweepResult): string {
  const header = [...result.axes.map((_, i) => axisHeading(result, i)), ...result.answers.map(answerHeading), "verdict", "problem"];
  const rows = result.points.map((p) => [
    ...p.values.map(String),
    ...result.answers.map((a) => String(p.answers?.values[a] ?? "")),
    p.answers?.verdict ?? "",
    p.problem ?? "",
  ]);
  return lazyCsv.stringify([header, ...rows]);
}

/** The `sweep --json` object: parameters (path, dimension, SI unit, profile value, values), answers, points, cautions. */
export function sweepJson(result: SweepResult, profileName: string, linearMosfet = false): object {
  return {
    profile: profileName,
    parameters: result.axes.map((a) => ({
      path: a.parameter.path,
      file: a.parameter.file === "" ? null : a.parameter.file,
      dimension: a.parameter.dimension,
      unit: DIMENSIONS[a.parameter.dimension].si,
      profileValue: a.parameter.nominal ?? null,
      spacing: a.spacing,
      values: a.values,
    })),
    answers: result.answers.map((a) => ({ name: a, unit: STUDY_ANSWERS[a].unit, command: STUDY_ANSWERS[a].command })),
    points: result.points.map((p) => ({ values: p.values, part: p.answers?.partId ?? null, verdict: p.answers?.verdict ?? null, answers: p.answers?.values ?? null, problem: p.problem })),
    cautions: reportCautions(linearMosfet),
  };
}
