import type { ParameterSensitivity } from "../study/computeSensitivities.js";
import { STUDY_ANSWERS, type StudyAnswerName } from "../study/studyDefaults.js";
import { formatNumber } from "../text/formatTable.js";
import { REPORT_CHART_SIZE, type ReportChart, quantitativeField as q } from "./ReportChart.js";

/**
 * The tornado charts of `sensitivity` for the HTML report, one per answer: a bar per parameter,
 * its normalised sensitivity d ln(answer)/d ln(p), the largest |S| on top; parameters without a
 * value (the answer missing or not positive) are left out. Source: computeSensitivities.
 * Cost O(parameters × answers).
 */
export function sensitivityCharts(result: readonly ParameterSensitivity[], answers: readonly StudyAnswerName[]): ReportChart[] {
  return answers.map((answer) => {
    const bars = result
      .map((r) => ({ parameter: r.parameter.path, s: r.sensitivities.find((x) => x.answer === answer)?.normalised ?? null }))
      .filter((b): b is { parameter: string; s: number } => b.s !== null)
      .map((b) => ({ ...b, size: Math.abs(b.s), label: formatNumber(b.s, 3) }));
    return {
      id: `sensitivity-${answer}`,
      title: `Normalised sensitivity of ${answer}: ${STUDY_ANSWERS[answer].words}`,
      note: "Bar: d ln(answer) / d ln(p) for each parameter p, largest first; 1 means the answer grows in proportion to p, 2 as its square, 0 not at all.",
      spec: {
        width: REPORT_CHART_SIZE.width,
        height: Math.max(80, 30 * bars.length),
        data: { values: bars },
        mark: { type: "bar" },
        encoding: {
          y: { field: "parameter", type: "nominal", sort: { field: "size", order: "descending" }, title: "parameter" },
          x: q("s", `d ln(${answer}) / d ln(p)`),
          color: { condition: { test: "datum.s < 0", value: "#3a6ea5" }, value: "#c05030" },
          tooltip: { field: "label" },
        },
      },
    };
  });
}
