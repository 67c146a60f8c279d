import type { MonteCarloSample } from "./runMonteCarloSamples.js";
import { STUDY_DEFAULTS, type StudyAnswerName } from "./studyDefaults.js";
import { wilsonInterval } from "./wilsonInterval.js";

/** The distribution of one answer over the samples that have it. */
export interface AnswerDistribution {
  readonly answer: StudyAnswerName;
  readonly count: number;
  readonly mean: number;
  /** sample standard deviation (n − 1 in the denominator); 0 for one sample */
  readonly standardDeviation: number;
  readonly min: number;
  readonly p05: number;
  readonly median: number;
  readonly p95: number;
  readonly max: number;
}

/** What a Monte Carlo run found. */
export interface MonteCarloSummary {
  readonly samples: number;
  /** samples the profile refused (a drawn value out of its range) */
  readonly refused: number;
  readonly distributions: readonly AnswerDistribution[];
  /** samples whose part went above its limit (margin < 0), of those with a margin */
  readonly crossings: number;
  readonly judged: number;
  /** crossings / judged and its Wilson score interval at STUDY_DEFAULTS.confidence */
  readonly crossingProbability: number;
  readonly interval: { readonly low: number; readonly high: number };
  readonly confidence: number;
  /** the sample with the least margin (else the highest peak); undefined when no sample ran */
  readonly worst: MonteCarloSample | undefined;
}

/**
 * Quantile q of sorted values, linear between order statistics at (n − 1)·q (common practice:
 * the default of most statistics packages).
 */
function quantile(sorted: readonly number[], q: number): number {
  const at = (sorted.length - 1) * q;
  const lo = Math.floor(at);
  const hi = Math.min(lo + 1, sorted.length - 1);
  return sorted[lo]! + (sorted[hi]! - sorted[lo]!) * (at - lo);
}

/**
 * Summarise a Monte Carlo run: per answer the mean, sample standard deviation, 5 %, 50 % and
 * 95 % quantiles and range; the probability that a unit crosses its limit (margin < 0) with its
 * Wilson score interval (STUDY_DEFAULTS.confidence, z = STUDY_DEFAULTS.confidenceZ); the worst
 * sample. Source: JCGM 101:2008 (GUM Supplement 1) §7.6 (estimate and standard uncertainty
 * from the sample: the mean and the standard deviation with n − 1); Wilson (1927) for the interval.
 * Cost O(samples × log samples × answers).
 */
export function summarizeMonteCarlo(samples: readonly MonteCarloSample[], answers: readonly StudyAnswerName[]): MonteCarloSummary {
  const distributions = answers.map((answer): AnswerDistribution => {
    const xs = samples.flatMap((s) => {
      const v = s.answers?.values[answer];
      return v === null || v === undefined ? [] : [v];
    });
    const sorted = [...xs].sort((a, b) => a - b);
    const n = xs.length;
    const mean = n === 0 ? NaN : xs.reduce((a, b) => a + b, 0) / n;
    const variance = n < 2 ? 0 : xs.reduce((a, b) => a + (b - mean) * (b - mean), 0) / (n - 1);
    return n === 0
      ? { answer, count: 0, mean: NaN, standardDeviation: NaN, min: NaN, p05: NaN, median: NaN, p95: NaN, max: NaN }
      : { answer, count: n, mean, standardDeviation: Math.sqrt(variance), min: sorted[0]!, p05: quantile(sorted, 0.05), median: quantile(sorted, 0.5), p95: quantile(sorted, 0.95), max: sorted[n - 1]! };
  });
  const margins = samples.filter((s) => typeof s.answers?.values.margin === "number");
  const crossings = margins.filter((s) => s.answers!.values.margin! < 0).length;
  const key = (s: MonteCarloSample): number => {
    const v = s.answers?.values;
    return typeof v?.margin === "number" ? v.margin : typeof v?.peak === "number" ? -v.peak : Infinity;
  };
  const ran = samples.filter((s) => s.answers !== null);
  const worst = ran.reduce<MonteCarloSample | undefined>((w, s) => (w === undefined || key(s) < key(w) ? s : w), undefined);
  return {
    samples: samples.length,
    refused: samples.length - ran.length,
    distributions,
    crossings,
    judged: margins.length,
    crossingProbability: margins.length === 0 ? 0 : crossings / margins.length,
    interval: wilsonInterval(crossings, margins.length, STUDY_DEFAULTS.confidenceZ),
    confidence: STUDY_DEFAULTS.confidence,
    worst,
  };
}
