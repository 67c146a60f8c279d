import { dirname, isAbsolute, join } from "node:path";
import { InputError, type InputProblem, withLocation } from "../../errors/InputError.js";
import { parseStructuredText } from "../../format/parseStructuredText.js";
import { type StudySpec, type StudySpecItem, readStudySpec } from "../../study/readStudySpec.js";
import type { CliRun } from "../main.js";
import { readTextFile } from "../readInputFile.js";
import type { StudyFlags } from "./study.js";

/** The option of a study command and the spec key it comes from. */
const OPTION_KEYS: Readonly<Record<string, string>> = { "--answer": "answers", "--part": "part", "--samples": "samples", "--seed": "seed", "--workers": "workers", "--step": "step" };

/**
 * The run of `heatledger study FILE` (flags and help in study.ts): read the spec (every bad key
 * named with file and line), turn it into the options of its command and run that command's own
 * action, so a study file means exactly what the same command line means. A problem the command
 * finds in an option is reported at the spec's key and line (a --vary problem at its `vary[i]`).
 * @throws InputError for a bad spec, profile, path or value, or an output file that exists without --force
 */
export async function studyAction(run: CliRun, file: string, options: StudyFlags): Promise<void> {
  const text = parseStructuredText(readTextFile(run.io, file, "study file"), file);
  let spec: StudySpec;
  try {
    spec = readStudySpec(text.data);
  } catch (error) {
    if (error instanceof InputError) throw withLocation(error, file, "", text.lineOf);
    throw error;
  }
  const folder = dirname(file);
  const located = (path: string): string => (isAbsolute(path) ? path : join(folder, path));
  const common = { ...(spec.part === undefined ? {} : { part: spec.part }), ...(options.json === true ? { json: true } : {}), ...(options.force === true ? { force: true } : {}) };
  const answer = spec.answers === undefined ? {} : { answer: spec.answers.join(",") };
  try {
    switch (spec.command) {
      case "sweep": {
        const { sweepAction } = await import("./sweepAction.js");
        await sweepAction(run, located(spec.profile), { ...common, ...answer, vary: spec.vary.map((v) => v.option), ...(options.csv === undefined ? {} : { csv: options.csv }), ...(options.report === undefined ? {} : { report: options.report }) });
        break;
      }
      case "sensitivity": {
        const { sensitivityAction } = await import("./sensitivityAction.js");
        await sensitivityAction(run, located(spec.profile), { ...common, ...answer, ...(options.report === undefined ? {} : { report: options.report }), ...(spec.vary.length === 0 ? {} : { vary: spec.vary.map((v) => v.option) }), ...(spec.step === undefined ? {} : { step: String(spec.step) }) });
        break;
      }
      case "montecarlo": {
        const { monteCarloAction } = await import("./montecarloAction.js");
        const numbers = { samples: spec.samples, seed: spec.seed, workers: spec.workers };
        const given = Object.fromEntries(Object.entries(numbers).filter(([, v]) => v !== undefined).map(([k, v]) => [k, String(v)]));
        await monteCarloAction(run, located(spec.profile), { ...common, ...answer, ...given, vary: spec.vary.map((v) => v.option), ...(options.worst === undefined ? {} : { worst: options.worst }), ...(options.report === undefined ? {} : { report: options.report }) });
        break;
      }
      case "compare": {
        const { compareAction } = await import("./compareAction.js");
        compareAction(run, located(spec.profile), spec.against === undefined ? undefined : located(spec.against), { ...common, set: spec.set.map((s) => s.option), ...(options.strict === true ? { strict: true } : {}) });
        break;
      }
    }
  } catch (error) {
    if (error instanceof InputError) throw new InputError(error.problems.map((p) => atSpecKey(p, spec, file, text.lineOf)));
    throw error;
  }
}

/** A problem the command found in an option given by the spec, moved to the spec's key and line. */
function atSpecKey(problem: InputProblem, spec: StudySpec, file: string, lineOf: (field: string) => number): InputProblem {
  if (problem.file !== "" || !problem.field.startsWith("--")) return problem;
  const option = problem.field.split(" ")[0]!;
  let field: string | undefined = OPTION_KEYS[option];
  if (option === "--vary" || option === "--set") {
    const items: readonly StudySpecItem[] = option === "--vary" ? spec.vary : spec.set;
    const named = (item: StudySpecItem): boolean => problem.found.includes(item.option) || problem.found.includes(JSON.stringify(item.path)) || problem.field.includes(item.path);
    field = items.find(named)?.field ?? (option === "--vary" ? "vary" : "set");
  }
  if (field === undefined) return problem;
  return { ...problem, file, field, line: lineOf(field) };
}
