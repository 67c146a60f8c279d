import type { Command } from "commander";
import { InputError, inputError } from "../../errors/InputError.js";
import { FIT_CRITERIA } from "../../thermal/fitCriterion.js";
import { FIT_DEFAULTS, type FitOptions, resolveFitOptions } from "../../thermal/fitDefaults.js";

/** One flag of the fit: its commander spelling, help line and the FitOptions field it sets. */
interface FitFlag {
  readonly flags: string;
  readonly field: keyof FitOptions;
  readonly help: string;
  readonly integer: boolean;
}

/** The fit flags shared by `network fit` and `network from-rating`: one table drives flags, help and parsing. */
export const FIT_FLAGS: readonly FitFlag[] = [
  { flags: "--stages <n>", field: "stages", integer: true, help: "fit exactly n Foster stages (default: choose the count by the criterion)" },
  { flags: "--max-stages <n>", field: "maxStages", integer: true, help: `most stages the criterion may choose (default ${FIT_DEFAULTS.maxStages})` },
  { flags: "--criterion <name>", field: "criterion", integer: false, help: `${FIT_CRITERIA.join(" or ")}: how the stage count is chosen (default ${FIT_DEFAULTS.criterion})` },
  {
    flags: "--resolution <fraction>",
    field: "dataResolution",
    integer: false,
    help: `relative resolution of the data; smaller residuals are not evidence for more stages (default ${FIT_DEFAULTS.dataResolution})`,
  },
];

/** Add the fit flags to a command. */
export function addFitFlags(command: Command): Command {
  for (const flag of FIT_FLAGS) command.option(flag.flags, flag.help);
  return command;
}

/**
 * FitOptions from parsed flags, validated; problems name the flag.
 * @throws InputError `bad-option`
 */
export function readFitFlags(options: Record<string, unknown>): FitOptions {
  const fit: Record<string, unknown> = {};
  for (const flag of FIT_FLAGS) {
    const key = camel(flag.flags);
    const raw = options[key];
    if (raw === undefined) continue;
    const name = flag.flags.split(" ")[0]!;
    if (flag.field === "criterion") fit[flag.field] = String(raw).toLowerCase();
    else {
      const value = Number(raw);
      if (String(raw).trim() === "" || !Number.isFinite(value)) throw inputError("bad-option", name, flag.integer ? "a whole number" : "a number", JSON.stringify(raw));
      fit[flag.field] = value;
    }
  }
  try {
    resolveFitOptions(fit);
  } catch (error) {
    if (!(error instanceof InputError)) throw error;
    throw new InputError(error.problems.map((p) => ({ ...p, field: flagOf(p.field) })));
  }
  return fit as FitOptions;
}

/** The output flags shared by every network builder. */
export function addOutputFlags(command: Command): Command {
  return command
    .option("--out <file>", "write the network file here (YAML, or JSON when the name ends in .json)")
    .option("--force", "overwrite the --out file if it exists")
    .option("--name <text>", "a name stored in the network file")
    .option("--json", "print one JSON object instead of the text report");
}

/** What the output flags asked for. */
export interface OutputFlags {
  readonly out?: string;
  readonly force?: boolean;
  readonly name?: string;
  readonly json?: boolean;
}

function camel(flags: string): string {
  return flags
    .split(" ")[0]!
    .replace(/^--/, "")
    .replace(/-([a-z])/g, (_, c: string) => c.toUpperCase());
}

function flagOf(field: string): string {
  const flag = FIT_FLAGS.find((f) => f.field === field);
  return flag === undefined ? field : flag.flags.split(" ")[0]!;
}
