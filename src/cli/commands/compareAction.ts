import { describeFound, inputError } from "../../errors/InputError.js";
import { defaultCircuitModels } from "../../profile/defaultCircuitModels.js";
import { comparisonJson, formatComparisonText } from "../../report/formatComparison.js";
import { compareProfiles } from "../../study/compareProfiles.js";
import { parseSweepAxis } from "../../study/sweepAxis.js";
import { commandProgress } from "../commandProgress.js";
import type { CliRun } from "../main.js";
import { readStudyProfile } from "../readStudyProfile.js";
import type { CompareFlags } from "./compare.js";
import { verdictExitStatus } from "../../stress/Verdict.js";

/**
 * The run of `heatledger compare A [B]` (flags and help in compare.ts): load A, and B (or A with
 * the --set values), compare them and print the table or the JSON; the exit status follows the
 * worse of the two verdicts (verdictExitStatus; --strict makes warn exit 1).
 * @throws InputError for a bad profile, path, value or part, or neither B nor --set
 */
export function compareAction(run: CliRun, fileA: string, fileB: string | undefined, options: CompareFlags): void {
  const sets = options.set ?? [];
  if (fileB === undefined && sets.length === 0) throw inputError("bad-option", "compare", 'a second profile or one or more --set PATH=VALUE such as "circuit.resistance=47 ohm"', "neither");
  const studyA = readStudyProfile(run.io, fileA);
  const studyB = fileB === undefined ? studyA : readStudyProfile(run.io, fileB);
  const assignments = sets.map((s) => {
    const axis = parseSweepAxis(studyB, s, "--set");
    if (axis.values.length !== 1) throw inputError("bad-option", `--set ${axis.parameter.path}`, "one value", describeFound(s));
    return [axis.parameter, axis.values[0]!] as const;
  });
  const a = studyA.nominal;
  const b = assignments.length === 0 ? studyB.nominal : studyB.load(assignments);
  if (options.part !== undefined && !a.parts.some((p) => p.id === options.part))
    throw inputError("bad-option", "--part", `a part id of profile A (${a.parts.map((p) => p.id).join(", ")})`, describeFound(options.part));
  const progress = commandProgress(run.io, "compare");
  let result;
  try {
    result = compareProfiles(a, b, { models: progress.watch(defaultCircuitModels), ...(options.part === undefined ? {} : { partId: options.part }) });
    progress.finish();
  } finally {
    progress.done();
  }
  const nameB = fileB === undefined ? `${a.name}, with ${sets.join(", ")}` : b.name;
  const linearMosfet = [a, b].some((p) => p.circuit?.topology === "linear-mosfet");
  if (options.json) run.io.out(`${JSON.stringify(comparisonJson(result, [a.name, nameB], linearMosfet), null, 2)}\n`);
  else run.io.out(formatComparisonText(result, [a.name, nameB], run.io.columns, linearMosfet));
  run.status = verdictExitStatus(result.verdict, options.strict === true);
}
