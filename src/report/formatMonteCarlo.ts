import type { StudyDistribution } from "../study/StudyDistribution.js";
import type { MonteCarloSummary } from "../study/summarizeMonteCarlo.js";
import { STUDY_ANSWERS } from "../study/studyDefaults.js";
import { DIMENSIONS } from "../units/dimensions.js";
import { formatCautions, reportCautions } from "../text/cautions.js";
import { formatNumber } from "../text/formatTable.js";
import { answerCell, answerHeading } from "./formatSweep.js";
import { studyTable } from "./studyTable.js";

/** What a Monte Carlo report needs beside the summary. */
export interface MonteCarloRun {
  readonly profileName: string;
  readonly distributions: readonly StudyDistribution[];
  readonly seed: number;
  readonly workers: number;
  readonly partId: string | undefined;
  readonly linearMosfet: boolean;
}

const pct = (x: number): string => `${formatNumber(x * 100, 3)} %`;
const unitOf = (d: StudyDistribution): string => DIMENSIONS[d.parameter.dimension].si;

/**
 * The text report of `heatledger montecarlo`: the distributions, the distribution of every
 * answer (mean, standard deviation, 5 %, 50 %, 95 % quantiles, range), the probability of
 * crossing the limit with its Wilson interval, the worst sample's values, and the cautions.
 * Cost O(answers + parameters).
 */
export function formatMonteCarloText(summary: MonteCarloSummary, run: MonteCarloRun, width: number): string {
  const w = Math.min(width, 100);
  const out = [`Monte Carlo of ${run.profileName}: ${summary.samples} samples, seed ${run.seed}, ${run.workers} worker(s)`];
  for (const d of run.distributions) out.push(`  ${d.parameter.path} = ${d.text} (profile value ${d.parameter.written})`);
  if (run.partId !== undefined) out.push(`  part followed: ${run.partId}`);
  out.push("");
  out.push(
    studyTable(
      ["answer", "mean", "std dev", "5 %", "median", "95 %", "min", "max", "n"].map((h, i) => ({ heading: h, ...(i === 0 ? {} : { align: "right" as const }) })),
      summary.distributions.map((d) => [answerHeading(d.answer), ...[d.mean, d.standardDeviation, d.p05, d.median, d.p95, d.min, d.max].map((x) => answerCell(Number.isFinite(x) ? x : null)), String(d.count)]),
      1,
      w,
    ),
  );
  if (summary.judged > 0)
    out.push(
      `Above the limit: ${summary.crossings} of ${summary.judged} samples, ${pct(summary.crossingProbability)}; ` +
        `${formatNumber(summary.confidence * 100, 2)} % interval (Wilson score) ${pct(summary.interval.low)} to ${pct(summary.interval.high)}`,
    );
  if (summary.refused > 0) out.push(`Refused by the profile (a drawn value out of its range): ${summary.refused} samples, left out above`);
  const worst = summary.worst;
  if (worst !== undefined) {
    out.push(`Worst sample: #${worst.index}, ${Object.entries(worst.answers?.values ?? {}).map(([k, v]) => `${k} ${answerCell(v)}${STUDY_ANSWERS[k as keyof typeof STUDY_ANSWERS].unit === "" ? "" : ` ${STUDY_ANSWERS[k as keyof typeof STUDY_ANSWERS].unit}`}`).join(", ")}`);
    run.distributions.forEach((d, i) => out.push(`  ${d.parameter.path} = ${formatNumber(worst.values[i]!)}${unitOf(d) === "" ? "" : ` ${unitOf(d)}`}`));
  }
  out.push("", formatCautions(run.linearMosfet, w));
  return out.join("\n");
}

/** The `montecarlo --json` object: run, distributions, per answer its statistics, the crossing probability and interval, the worst sample, cautions. */
export function monteCarloJson(summary: MonteCarloSummary, run: MonteCarloRun): object {
  const num = (x: number): number | null => (Number.isFinite(x) ? x : null);
  return {
    profile: run.profileName,
    samples: summary.samples,
    seed: run.seed,
    workers: run.workers,
    part: run.partId ?? null,
    distributions: run.distributions.map((d) => ({ path: d.parameter.path, unit: unitOf(d), profileValue: d.parameter.nominal ?? null, kind: d.kind, spread: d.spread, low: num(d.low), high: num(d.high), text: d.text })),
    answers: summary.distributions.map((d) => ({
      name: d.answer,
      unit: STUDY_ANSWERS[d.answer].unit,
      count: d.count,
      mean: num(d.mean),
      standardDeviation: num(d.standardDeviation),
      p05: num(d.p05),
      median: num(d.median),
      p95: num(d.p95),
      min: num(d.min),
      max: num(d.max),
    })),
    refused: summary.refused,
    crossing: { count: summary.crossings, of: summary.judged, probability: summary.crossingProbability, confidence: summary.confidence, method: "Wilson score", low: summary.interval.low, high: summary.interval.high },
    worst: summary.worst === undefined ? null : { index: summary.worst.index, values: summary.worst.values, answers: summary.worst.answers?.values ?? null },
    cautions: reportCautions(run.linearMosfet),
  };
}
