import { dirname, isAbsolute, join } from "node:path";
import type { Command } from "commander";
import { PLAN_DEFAULTS, defaultCircuitModels, formatRetryPlanText, loadProfile, lockoutMapCsv, planRetries, retryPlanJson } from "../../index.js";
import { EXIT_LIMIT, EXIT_OK } from "../CliIo.js";
import type { CliRun } from "../main.js";
import { readTextFile, writeOutputFile } from "../readInputFile.js";

/** Options of `heatledger retries`: one table drives the flags and their help. */
export const RETRIES_OPTIONS = [
  { flags: "--json", help: "print every answer as one JSON object instead of the text report" },
  { flags: "--csv <file>", help: "write the lockout map (attempts x interval: worst peak, verdict, governing corner) to a CSV file" },
  { flags: "--force", help: "overwrite the --csv file if it exists" },
] as const;

/** `heatledger retries PROFILE`. */
export function registerRetries(program: Command, run: CliRun): void {
  const command = program
    .command("retries")
    .argument("<profile>", "duty profile (YAML or JSON) with a retry block that meets a fault")
    .description("plan retries into a fault: shortest safe interval, attempt count, retry-for-ever interval, fastest schedule, lockout, lockout map")
    .addHelpText(
      "after",
      `
The profile's first retry block with a fault is the scenario; its optional retryPlan section
sets the attempts and interval to ask about, the spacing (start-to-start or end-to-start), the
"near ambient" distance (default ${PLAN_DEFAULTS.ambientReturnK} K), the lockout map and the corner set (busVoltage,
ambient, capacitance, resistance). Safe means at or below the part's limit minus its margin.
Exit status: 0 the profile's own retry policy is safe, 1 it is not (in some corner, a burst or
burst + lockout repeated while the fault persists passes limit - margin), 2 bad input.
See README, "Reading the retry plan".`,
    );
  for (const option of RETRIES_OPTIONS) command.option(option.flags, option.help);
  command.action((file: string, options: { json?: boolean; csv?: string; force?: boolean }) => {
    if (options.csv !== undefined && !options.force && run.io.exists(options.csv)) writeOutputFile(run.io, options.csv, "", false, "--csv");
    const folder = dirname(file);
    const readNamed = (path: string): string => readTextFile(run.io, isAbsolute(path) ? path : join(folder, path), "file named in the profile");
    const profile = loadProfile(readTextFile(run.io, file, "duty profile"), file, readNamed);
    const report = planRetries(profile, defaultCircuitModels);
    if (options.csv !== undefined) writeOutputFile(run.io, options.csv, lockoutMapCsv(report.map), options.force === true, "--csv");
    if (options.json) run.io.out(`${JSON.stringify(retryPlanJson(report), null, 2)}\n`);
    else run.io.out(`${formatRetryPlanText(report, Math.min(run.io.columns, 100))}${options.csv === undefined ? "" : `Lockout map written to ${options.csv}\n`}`);
    run.status = report.policy.verdict === "unsafe" ? EXIT_LIMIT : EXIT_OK;
  });
}
