import { defaultCircuitModels } from "../profile/defaultCircuitModels.js";
import { type MonteCarloSample, runMonteCarloSamples } from "../study/runMonteCarloSamples.js";
import { type StudyDistribution, parseStudyDistribution } from "../study/StudyDistribution.js";
import { StudyProfile } from "../study/StudyProfile.js";
import type { StudyAnswerName } from "../study/studyDefaults.js";

/** One batch of Monte Carlo samples for a worker thread: everything it needs, as plain data. */
export interface MonteCarloTask {
  readonly profileText: string;
  readonly file: string;
  /** the files the profile names, by name as written, as the main thread read them */
  readonly namedFiles: readonly (readonly [string, string])[];
  /** the --vary texts, parsed again here (cheap and deterministic) */
  readonly vary: readonly string[];
  readonly answers: readonly StudyAnswerName[];
  readonly partId: string | undefined;
  readonly seed: number;
  readonly from: number;
  readonly to: number;
}

/**
 * Run one batch of samples (runMonteCarloSamples) from plain data: what a worker thread of
 * `heatledger montecarlo` runs (it loads this module compiled, from dist/), and what the main
 * thread runs itself with one worker. It reads no file: the main thread passes the texts.
 */
export function runMonteCarloTask(task: MonteCarloTask): MonteCarloSample[] {
  const key = JSON.stringify([task.profileText, task.file, task.namedFiles, task.vary]);
  if (prepared?.key !== key) {
    const files = new Map(task.namedFiles);
    const read = (path: string): string => {
      const text = files.get(path);
      if (text === undefined) throw new Error(`file ${path} was not read before the samples started`);
      return text;
    };
    const study = new StudyProfile(task.profileText, task.file, read);
    prepared = { key, study, distributions: task.vary.map((v) => parseStudyDistribution(study, v, "--vary")) };
  }
  const { study, distributions } = prepared;
  return runMonteCarloSamples(study, distributions, task.answers, { models: defaultCircuitModels, ...(task.partId === undefined ? {} : { partId: task.partId }) }, task.seed, task.from, task.to);
}

/** The study of the last task, kept for the next batch of the same run (a thread runs many). */
let prepared: { readonly key: string; readonly study: StudyProfile; readonly distributions: readonly StudyDistribution[] } | undefined;

/** The worker pool's entry point. */
export default function monteCarloWorker(task: MonteCarloTask): MonteCarloSample[] {
  return runMonteCarloTask(task);
}
