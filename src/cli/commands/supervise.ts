import { dirname, isAbsolute, join } from "node:path";
import type { Command } from "commander";
import { SUPERVISE_DEFAULTS, defaultCircuitModels, formatSupervisionText, loadProfile, supervisePrecharge, supervisionJson } from "../../index.js";
import { EXIT_LIMIT, EXIT_OK } from "../CliIo.js";
import type { CliRun } from "../main.js";
import { readTextFile } from "../readInputFile.js";

/** Options of `heatledger supervise`: one table drives the flags and their help. */
export const SUPERVISE_OPTIONS = [
  { flags: "--json", help: "print one JSON object (window, checks, retry storms, envelope) instead of the text report" },
  { flags: "--no-chart", help: "leave the envelope and energy charts out of the text report" },
] as const;

/** `heatledger supervise PROFILE`. */
export function registerSupervise(program: Command, run: CliRun): void {
  const command = program
    .command("supervise")
    .argument("<profile>", "duty profile (YAML or JSON) with a circuit and a supervision section")
    .description("pre-charge supervision numbers: timeout window, early-abort and rise-too-fast checks, attempts before lockout")
    .addHelpText(
      "after",
      `
The profile's supervision section gives the healthy corner set (capacitance range required;
bus voltage, completion fraction and loads optional) and check times (default: ${SUPERVISE_DEFAULTS.autoCheckFractions.join(", ")}
of the slowest healthy completion time). Check thresholds keep a margin of ${SUPERVISE_DEFAULTS.checkMarginFraction * 100} % (checkMargin)
and are usable down to ${SUPERVISE_DEFAULTS.minCheckVoltageFraction * 100} % of the lowest bus voltage (minCheckVoltage).
Exit status: 0 a safe timeout exists and the profile's timeout is inside it, 1 no safe timeout
exists or the profile's timeout is outside the window, 2 bad input. See README, "Reading the
supervision answers".`,
    );
  for (const option of SUPERVISE_OPTIONS) command.option(option.flags, option.help);
  command.action((file: string, options: { json?: boolean; chart: boolean }) => {
    const folder = dirname(file);
    const readNamed = (path: string): string => readTextFile(run.io, isAbsolute(path) ? path : join(folder, path), "file named in the profile");
    const profile = loadProfile(readTextFile(run.io, file, "duty profile"), file, readNamed);
    const report = supervisePrecharge(profile, defaultCircuitModels);
    if (options.json) run.io.out(`${JSON.stringify(supervisionJson(report), null, 2)}\n`);
    else run.io.out(formatSupervisionText(report, run.io.columns, options.chart));
    run.status = report.verdict === "fail" ? EXIT_LIMIT : EXIT_OK;
  });
}
