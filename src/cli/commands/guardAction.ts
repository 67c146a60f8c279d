import { basename } from "node:path";
import { describeFound, inputError } from "../../errors/InputError.js";
import { guardCSource } from "../../guard/guardCSource.js";
import { GUARD_DEFAULTS, GUARD_NUMERICS, type GuardNumeric } from "../../guard/guardDefaults.js";
import { guardModelJson } from "../../guard/guardModelJson.js";
import { guardVectorsJson } from "../../guard/guardVectorsJson.js";
import { planGuard } from "../../guard/planGuard.js";
import { defaultCircuitModels } from "../../profile/defaultCircuitModels.js";
import { formatGuardText } from "../../report/formatGuardText.js";
import { guardJson } from "../../report/guardJson.js";
import { surroundingsBoundNote as boundNote, surroundingsOf } from "../../report/surroundingsSummary.js";
import { verdictExitStatus } from "../../stress/Verdict.js";
import { parseQuantity } from "../../units/parseQuantity.js";
import { commandProgress } from "../commandProgress.js";
import type { CliRun } from "../main.js";
import { refuseExistingOutput, writeOutputFile } from "../readInputFile.js";
import { readProfileFile } from "../readProfileFile.js";
import type { GuardFlags } from "./guard.js";

/**
 * The run of `heatledger guard PROFILE` (flags and help in guard.ts): build the guard, run it
 * against the fastest safe schedule, write the C export, the model JSON and the test vectors when
 * asked (refusing to overwrite without --force, before the run), print the report. The exit
 * status follows the verdict.
 * @throws InputError for a bad profile or flag, or an output file that exists without --force
 */
export function guardAction(run: CliRun, file: string, options: GuardFlags): void {
  const force = options.force === true;
  const numeric = numericOf(options.numeric);
  const name = options.name ?? GUARD_DEFAULTS.cName;
  if (!/^[A-Za-z_][A-Za-z0-9_]{0,40}$/.test(name)) throw inputError("bad-option", "--name", "a C identifier (letters, digits, _; not starting with a digit)", describeFound(name));
  const tickS = options.tick === undefined ? undefined : parseQuantity(/^\s*[-+]?[\d.]+(e[-+]?\d+)?\s*$/i.test(options.tick) ? Number(options.tick) : options.tick, "time", "--tick");
  const fractionBits = wholeNumber(options.q, "--q");
  const energyFractionBits = wholeNumber(options.energyQ, "--energy-q");
  const attempts = wholeNumber(options.attempts, "--attempts");
  if (attempts !== undefined && attempts < 1) throw inputError("out-of-range", "--attempts", "a whole number ≥ 1", describeFound(attempts));
  const cPaths = options.c === undefined ? [] : [`${options.c}.h`, `${options.c}.c`];
  for (const [path, flag] of [...cPaths.map((p) => [p, "--c"] as const), [options.modelJson, "--model-json"] as const, [options.vectors, "--vectors"] as const]) refuseExistingOutput(run.io, path, force, flag);
  const profile = readProfileFile(run.io, file);
  const progress = commandProgress(run.io, "guard");
  let report;
  try {
    report = planGuard(profile, progress.watch(defaultCircuitModels), {
      numeric,
      ...(tickS === undefined ? {} : { tickS }),
      ...(fractionBits === undefined ? {} : { fractionBits }),
      ...(energyFractionBits === undefined ? {} : { energyFractionBits }),
      ...(attempts === undefined ? {} : { attempts }),
      vectors: options.vectors !== undefined,
    });
    progress.finish();
  } finally {
    progress.done();
  }
  const written: string[] = [];
  if (options.c !== undefined) {
    const files = guardCSource(report.guard, report.fixed !== null ? { kind: "fixed", q: report.fixed } : { kind: "float", f: report.float }, { profile: file, name, headerFile: basename(cPaths[0]!) });
    writeOutputFile(run.io, cPaths[0]!, files.header, force, "--c");
    writeOutputFile(run.io, cPaths[1]!, files.source, force, "--c");
    written.push(...cPaths);
  }
  if (options.modelJson !== undefined) {
    writeOutputFile(run.io, options.modelJson, `${JSON.stringify(guardModelJson(report.guard, report.float, report.fixed, file), null, 2)}\n`, force, "--model-json");
    written.push(options.modelJson);
  }
  if (options.vectors !== undefined) {
    writeOutputFile(run.io, options.vectors, `${JSON.stringify(guardVectorsJson(report, file))}\n`, force, "--vectors");
    written.push(options.vectors);
  }
  if (options.json) run.io.out(`${JSON.stringify({ ...guardJson(report, file, written), ...surroundingsOf(profile) }, null, 2)}\n`);
  else run.io.out(`${boundNote(profile, Math.min(run.io.columns, 100))}${formatGuardText(report, file, { paths: written }, Math.min(run.io.columns, 100))}`);
  run.status = verdictExitStatus(report.verdict, options.strict === true);
}

function numericOf(value: string | undefined): GuardNumeric {
  if (value === undefined) return "fixed";
  const found = GUARD_NUMERICS.find((n) => n === value.trim().toLowerCase());
  if (found === undefined) throw inputError("bad-option", "--numeric", GUARD_NUMERICS.join(" or "), describeFound(value));
  return found;
}

function wholeNumber(value: string | undefined, flag: string): number | undefined {
  if (value === undefined) return undefined;
  const n = Number(value);
  if (!/^\s*\d+\s*$/.test(value) || !Number.isSafeInteger(n)) throw inputError("bad-option", flag, "a whole number", describeFound(value));
  return n;
}
