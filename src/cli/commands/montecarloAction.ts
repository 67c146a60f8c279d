import { existsSync } from "node:fs";
import { availableParallelism } from "node:os";
import { basename, dirname, extname, isAbsolute, join, relative } from "node:path";
import { fileURLToPath } from "node:url";
import { isScalar, parseDocument, visit } from "yaml";
import { describeFound, inputError } from "../../errors/InputError.js";
import { formatMonteCarloText, monteCarloJson } from "../../report/formatMonteCarlo.js";
import type { MonteCarloSample } from "../../study/runMonteCarloSamples.js";
import { parseStudyDistribution } from "../../study/StudyDistribution.js";
import type { StudyProfile } from "../../study/StudyProfile.js";
import { STUDY_DEFAULTS } from "../../study/studyDefaults.js";
import { summarizeMonteCarlo } from "../../study/summarizeMonteCarlo.js";
import { commandProgress } from "../commandProgress.js";
import type { CliRun } from "../main.js";
import { type MonteCarloTask, runMonteCarloTask } from "../monteCarloWorker.js";
import { refuseExistingOutput, writeOutputFile } from "../readInputFile.js";
import { checkPartOption, parseAnswerNames, readStudyProfile } from "../readStudyProfile.js";
import type { MonteCarloFlags } from "./montecarlo.js";

/** Fewest samples per worker asked for with --workers (and the batch size in this thread). */
const SAMPLES_PER_WORKER = 16;
/**
 * Fewest samples per worker by default: a worker thread loads the library and warms up on its own
 * (about a CPU-second on the build machine, `npm run bench -- study`), so short runs stay in one thread.
 */
const DEFAULT_SAMPLES_PER_WORKER = 500;

/** A whole number option ≥ min. */
function wholeOption(text: string | undefined, fallback: number, min: number, option: string, words: string): number {
  if (text === undefined) return fallback;
  const n = Number(text);
  if (!Number.isSafeInteger(n) || n < min) throw inputError("bad-option", option, words, describeFound(text));
  return n;
}

/**
 * The run of `heatledger montecarlo PROFILE` (flags and help in montecarlo.ts): parse the
 * distributions, run the samples (in this thread with one worker, else in a pool of worker
 * threads running the compiled dist/cli/monteCarloWorker.js in batches), summarise, print, and
 * write the worst sample as a profile with --worst.
 * @throws InputError for a bad profile, path, distribution, sample count (N = 0), seed, worker count, answer or part; a --worst file that exists without --force
 */
export async function monteCarloAction(run: CliRun, file: string, options: MonteCarloFlags): Promise<void> {
  refuseExistingOutput(run.io, options.worst, options.force === true, "--worst");
  refuseExistingOutput(run.io, options.report, options.force === true, "--report");
  const samples = wholeOption(options.samples, STUDY_DEFAULTS.samples, 1, "--samples", "a whole number of samples ≥ 1");
  const seed = wholeOption(options.seed, STUDY_DEFAULTS.seed, 0, "--seed", "a whole number ≥ 0");
  const fallback = Math.max(1, Math.min(availableParallelism(), Math.floor(samples / DEFAULT_SAMPLES_PER_WORKER)));
  const workers = Math.min(wholeOption(options.workers, fallback, 1, "--workers", "a whole number of workers ≥ 1"), Math.max(1, Math.floor(samples / SAMPLES_PER_WORKER)));
  const answers = parseAnswerNames(options.answer, STUDY_DEFAULTS.monteCarloAnswers);
  if (!answers.includes("margin")) answers.push("margin");
  const vary = options.vary ?? [];
  if (vary.length === 0) throw inputError("bad-option", "--vary", 'one or more --vary PATH=DISTRIBUTION such as "circuit.capacitance=normal 5 %"', "none");
  const study = readStudyProfile(run.io, file);
  const distributions = vary.map((v) => parseStudyDistribution(study, v, "--vary"));
  checkPartOption(study, options.part);
  const task = (from: number, to: number): MonteCarloTask => ({ profileText: study.text, file, namedFiles: [...study.namedFiles], vary, answers, partId: options.part, seed, from, to });
  let done = 0;
  const progress = commandProgress(run.io, "montecarlo", () => `, ${done} of ${samples} samples`);
  let results: MonteCarloSample[];
  try {
    results = workers === 1 ? runInThread(task, samples, (n) => ((done = n), progress.tick())) : await runInPool(task, samples, workers, (n) => ((done += n), progress.tick()));
    progress.finish();
  } finally {
    progress.done();
  }
  results.sort((a, b) => a.index - b.index);
  const summary = summarizeMonteCarlo(results, answers);
  const report = { profileName: study.nominal.name, distributions, seed, workers, partId: summary.worst?.answers?.partId, linearMosfet: study.nominal.circuit?.topology === "linear-mosfet" };
  let note = "";
  if (options.worst !== undefined && summary.worst !== undefined) {
    const worst = summary.worst;
    const written = worstSampleFiles(study, distributions.map((d, i) => [d.parameter, worst.values[i]!] as const), file, options.worst);
    for (const [path, text] of written) writeOutputFile(run.io, path, text, options.force === true, "--worst");
    note = `Worst sample written to ${written.map(([p]) => p).join(" and ")}\n`;
  }
  if (options.report !== undefined) {
    const [{ writeChartReport }, { monteCarloCharts }, { reportCautions }] = await Promise.all([import("../writeChartReport.js"), import("../../report/monteCarloCharts.js"), import("../../text/cautions.js")]);
    const verdict = summary.worst?.answers?.verdict ?? "pass";
    const page = {
      title: `heatledger montecarlo: ${study.nominal.name}`,
      verdict,
      verdictText: `the worst sample's (${summary.crossings} of ${summary.judged} samples above the limit); the study sets no exit status`,
      cautions: reportCautions(report.linearMosfet),
      text: formatMonteCarloText(summary, report, 100),
    };
    note += await writeChartReport(run.io, { report: options.report, force: options.force === true }, page, monteCarloCharts(results, answers));
  }
  if (options.json) run.io.out(`${JSON.stringify(monteCarloJson(summary, report), null, 2)}\n`);
  else run.io.out(`${formatMonteCarloText(summary, report, run.io.columns)}${note}`);
}

/** Every sample in this thread, in batches so the progress line moves. */
function runInThread(task: (from: number, to: number) => MonteCarloTask, samples: number, onDone: (n: number) => void): MonteCarloSample[] {
  const out: MonteCarloSample[] = [];
  for (let from = 0; from < samples; from += SAMPLES_PER_WORKER) {
    out.push(...runMonteCarloTask(task(from, Math.min(samples, from + SAMPLES_PER_WORKER))));
    onDone(out.length);
  }
  return out;
}

/** The compiled worker module: beside this one in dist/, or dist/ of the package when running from src/. */
function workerFile(): string {
  const here = fileURLToPath(new URL("../monteCarloWorker.js", import.meta.url));
  return existsSync(here) ? here : join(dirname(here), "..", "..", "dist", "cli", "monteCarloWorker.js");
}

/** The samples in batches over a pool of worker threads (piscina). */
async function runInPool(task: (from: number, to: number) => MonteCarloTask, samples: number, workers: number, onBatch: (n: number) => void): Promise<MonteCarloSample[]> {
  const { Piscina } = await import("piscina");
  const pool = new Piscina({ filename: workerFile(), minThreads: workers, maxThreads: workers, idleTimeout: 100 });
  try {
    const batch = Math.max(1, Math.min(64, Math.ceil(samples / (workers * 4))));
    const jobs: Promise<MonteCarloSample[]>[] = [];
    for (let from = 0; from < samples; from += batch) {
      const to = Math.min(samples, from + batch);
      jobs.push(
        (pool.run(task(from, to)) as Promise<MonteCarloSample[]>).then((r) => {
          onBatch(r.length);
          return r;
        }),
      );
    }
    return (await Promise.all(jobs)).flat();
  } finally {
    await pool.destroy();
  }
}

/**
 * The files of the worst sample: the profile with its values, and each network file it edited
 * written beside it (`<profile stem>-<network file name>`); every other file the profile names
 * is named relative to the new profile's folder, so the written profile loads as it stands.
 */
function worstSampleFiles(study: StudyProfile, assignments: readonly (readonly [Parameters<StudyProfile["texts"]>[0][number][0], number])[], profileFile: string, out: string): [string, string][] {
  const { profile, files } = study.texts(assignments);
  const outDir = dirname(out);
  const stem = basename(out, extname(out));
  const doc = parseDocument(profile);
  const written: [string, string][] = [];
  const renamed = new Map<string, string>();
  for (const [name, text] of files) {
    const path = join(outDir, `${stem}-${basename(name)}`);
    written.push([path, text]);
    renamed.set(name, basename(path));
  }
  visit(doc, {
    Pair(_key, pair) {
      if (!isScalar(pair.key) || !isScalar(pair.value) || typeof pair.value.value !== "string") return;
      const key = String(pair.key.value);
      const ref = pair.value.value;
      if ((key !== "network" && key !== "file") || !study.namedFiles.has(ref)) return;
      pair.value.value = renamed.get(ref) ?? (isAbsolute(ref) ? ref : relative(outDir, join(dirname(profileFile), ref)) || ref);
    },
  });
  return [[out, String(doc)], ...written];
}
