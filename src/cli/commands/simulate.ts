import { dirname, isAbsolute, join } from "node:path";
import type { Command } from "commander";
import {
  EventDigest,
  PeakEnvelope,
  SimulationCsv,
  defaultCircuitModels,
  formatSimulationText,
  loadProfile,
  simulateProfile,
  simulationJson,
} from "../../index.js";
import { EXIT_LIMIT, EXIT_OK } from "../CliIo.js";
import type { CliRun } from "../main.js";
import { readTextFile, writeOutputFile } from "../readInputFile.js";

/** Options of `heatledger simulate`: one table drives the flags and their help. */
export const SIMULATE_OPTIONS = [
  { flags: "--json", help: "print one JSON object (verdict, parts, events) instead of the text report" },
  { flags: "--csv <file>", help: "write the time series (every step end and local peak, °C per part) to a CSV file" },
  { flags: "--force", help: "overwrite the --csv file if it exists" },
  { flags: "--no-chart", help: "leave the temperature charts out of the text report" },
] as const;

/** `heatledger simulate PROFILE`. */
export function registerSimulate(program: Command, run: CliRun): void {
  const command = program
    .command("simulate")
    .argument("<profile>", "duty profile (YAML or JSON)")
    .description("run a duty profile: every part's temperature history, peaks, margins and a pass/fail verdict")
    .addHelpText(
      "after",
      `
Exit status: 0 every limit met (a part inside its margin still passes, with a warning),
1 a part passes its maximum temperature, 2 bad input. Network and CSV files named in the
profile are read relative to the profile's folder. See DEVELOPERS.md, "Profile format".`,
    );
  for (const option of SIMULATE_OPTIONS) command.option(option.flags, option.help);
  command.action((file: string, options: { json?: boolean; csv?: string; force?: boolean; chart: boolean }) => {
    if (options.csv !== undefined && !options.force && run.io.exists(options.csv)) writeOutputFile(run.io, options.csv, "", false, "--csv");
    const folder = dirname(file);
    const located = (path: string): string => (isAbsolute(path) ? path : join(folder, path));
    const readNamed = Object.assign((path: string): string => readTextFile(run.io, located(path), "file named in the profile"), { displayName: located });
    const profile = loadProfile(readTextFile(run.io, file, "duty profile"), file, readNamed);
    const digest = new EventDigest(profile.parts.map((p) => p.limitC));
    const envelope = options.json || !options.chart ? undefined : new PeakEnvelope(profile.parts.length);
    const csv = options.csv === undefined ? undefined : new SimulationCsv(profile.parts.map((p) => p.id));
    const result = simulateProfile(profile, {
      models: defaultCircuitModels,
      onEvent: (event, temperatures) => digest.add(event, temperatures),
      ...(envelope === undefined && csv === undefined
        ? {}
        : {
            onPoint: (timeS: number, temperatureC: readonly number[], kind: "step-end" | "peak", eventIndex: number) => {
              envelope?.add(timeS, temperatureC);
              csv?.add(timeS, eventIndex, kind, temperatureC);
            },
          }),
    });
    if (csv !== undefined) writeOutputFile(run.io, options.csv!, csv.text(), options.force === true, "--csv");
    if (options.json) run.io.out(`${JSON.stringify(simulationJson(profile, result, digest), null, 2)}\n`);
    else run.io.out(`${formatSimulationText(profile, result, digest, envelope, run.io.columns)}\n${csv === undefined ? "" : `Time series: ${csv.rowCount} rows written to ${options.csv}\n`}`);
    run.status = result.verdict === "fail" ? EXIT_LIMIT : EXIT_OK;
  });
}
