import type { MonteCarloSample } from "../study/runMonteCarloSamples.js";
import { STUDY_ANSWERS, type StudyAnswerName } from "../study/studyDefaults.js";
import { REPORT_CHART_SIZE, type ReportChart, quantitativeField as q } from "./ReportChart.js";
import { answerHeading } from "./formatSweep.js";

/**
 * The histograms of `montecarlo` for the HTML report, one per answer: how many samples fall in
 * each bin of the answer (vega-lite's binning, about 30 bins); for the margin a red rule at 0,
 * the limit. Samples without the answer are left out. Source: the samples (runMonteCarloSamples).
 * Cost O(samples × answers).
 */
export function monteCarloCharts(samples: readonly MonteCarloSample[], answers: readonly StudyAnswerName[]): ReportChart[] {
  return answers.map((answer) => {
    const values = samples.map((s) => s.answers?.values[answer] ?? null).filter((v): v is number => v !== null && Number.isFinite(v)).map((value) => ({ value }));
    const title = answerHeading(answer);
    const bars = { data: { values }, mark: { type: "bar" }, encoding: { x: { ...q("value", title), bin: { maxbins: 30 } }, y: { aggregate: "count", type: "quantitative", title: "samples" } } };
    return {
      id: `montecarlo-${answer}`,
      title: `Spread of ${answer}: ${STUDY_ANSWERS[answer].words}`,
      note: `Bars: samples in each bin of ${title} (${values.length} samples)${answer === "margin" ? "; red line: margin 0, the limit" : ""}.`,
      spec: { ...REPORT_CHART_SIZE, layer: [bars, ...(answer === "margin" ? [{ data: { values: [{ zero: 0 }] }, mark: { type: "rule", color: "#c00000", strokeWidth: 2 }, encoding: { x: q("zero") } }] : [])] },
    };
  });
}
