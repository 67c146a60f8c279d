import type { ParameterSensitivity } from "../study/computeSensitivities.js";
import { STUDY_ANSWERS, type StudyAnswerName } from "../study/studyDefaults.js";
import { DIMENSIONS } from "../units/dimensions.js";
import { formatCautions, reportCautions } from "../text/cautions.js";
import { formatNumber } from "../text/formatTable.js";
import { answerCell, answerHeading } from "./formatSweep.js";
import { studyTable } from "./studyTable.js";

/** Width of the longest tornado bar, in characters. */
const BAR_WIDTH = 20;

/** The parameters ranked by |S| of one answer, largest first; those without a value last. */
function ranked(result: readonly ParameterSensitivity[], answer: StudyAnswerName): { p: ParameterSensitivity; s: number | null }[] {
  return result
    .map((p) => ({ p, s: p.sensitivities.find((x) => x.answer === answer)?.normalised ?? null }))
    .sort((a, b) => (b.s === null ? -1 : a.s === null ? 1 : Math.abs(b.s) - Math.abs(a.s)));
}

/**
 * The text report of `heatledger sensitivity`: per answer, a ranked table (a tornado: one bar
 * per parameter, as long as |S| relative to the largest, drawn left of the axis for a negative
 * S and right of it for a positive one), the answer at both steps, the reasons for missing
 * values, and the cautions. Cost O(parameters × answers).
 */
export function formatSensitivityText(result: readonly ParameterSensitivity[], answers: readonly StudyAnswerName[], stepFraction: number, profileName: string, width: number, linearMosfet = false): string {
  const w = Math.min(width, 100);
  const out: string[] = [
    `Sensitivities of ${profileName}`,
    `  S = d ln(answer) / d ln(p), central difference at p·(1 ± ${formatNumber(stepFraction * 100, 3)} %)`,
    "",
  ];
  for (const answer of answers) {
    const rows = ranked(result, answer);
    const largest = Math.max(1e-300, ...rows.map((r) => Math.abs(r.s ?? 0)));
    const half = BAR_WIDTH / 2;
    const bar = (s: number | null): string => {
      if (s === null) return "";
      const n = Math.round((Math.abs(s) / largest) * half);
      return s < 0 ? `${" ".repeat(half - n)}${"#".repeat(n)}|` : `${" ".repeat(half)}|${"#".repeat(n)}`;
    };
    const nominal = rows[0]?.p.sensitivities.find((x) => x.answer === answer)?.nominal;
    out.push(`${answerHeading(answer)}: ${STUDY_ANSWERS[answer].words}; at the profile's values ${answerCell(nominal)}`);
    const table = rows.map(({ p, s }, i) => {
      const x = p.sensitivities.find((y) => y.answer === answer)!;
      const unit = DIMENSIONS[p.parameter.dimension].si;
      return [String(i + 1), p.parameter.path, `${formatNumber(p.parameter.nominal ?? 0)}${unit === "" ? "" : ` ${unit}`}`, s === null ? "none" : formatNumber(s, 3), bar(s), answerCell(x.below), answerCell(x.above)];
    });
    out.push(
      studyTable(
        [{ heading: "#", align: "right" }, { heading: "parameter" }, { heading: "value", align: "right" }, { heading: "S", align: "right" }, { heading: "tornado" }, { heading: "at p(1-h)", align: "right" }, { heading: "at p(1+h)", align: "right" }],
        table,
        2,
        w,
      ),
    );
    const why = rows.flatMap(({ p }) => p.sensitivities.filter((x) => x.answer === answer && x.why !== null).map((x) => `  ${p.parameter.path}: ${x.why}`));
    if (why.length > 0) out.push(`No sensitivity:\n${why.join("\n")}\n`);
  }
  out.push(formatCautions(linearMosfet, w));
  return out.join("\n");
}

/** The `sensitivity --json` object: step, and per answer the parameters ranked with S and the answers at both steps; cautions. */
export function sensitivityJson(result: readonly ParameterSensitivity[], answers: readonly StudyAnswerName[], stepFraction: number, profileName: string, linearMosfet = false): object {
  return {
    profile: profileName,
    step: stepFraction,
    method: "central difference in ln p: S = (ln y(p(1+h)) - ln y(p(1-h))) / (ln(1+h) - ln(1-h))",
    answers: answers.map((answer) => ({
      name: answer,
      unit: STUDY_ANSWERS[answer].unit,
      ranked: ranked(result, answer).map(({ p }) => {
        const x = p.sensitivities.find((y) => y.answer === answer)!;
        return { path: p.parameter.path, dimension: p.parameter.dimension, unit: DIMENSIONS[p.parameter.dimension].si, value: p.parameter.nominal ?? null, normalised: x.normalised, below: x.below, nominal: x.nominal, above: x.above, why: x.why };
      }),
    })),
    cautions: reportCautions(linearMosfet),
  };
}
