import { dirname, isAbsolute, join } from "node:path";
import type { Command } from "commander";
import {
  EVENT_DIGEST_DEFAULTS,
  EventDigest,
  PeakEnvelope,
  ProfileStress,
  SimulationCsv,
  defaultCircuitModels,
  formatCyclesCsv,
  formatProfileStress,
  formatSimulationText,
  loadProfile,
  simulateProfile,
  simulationJson,
  simulationStressJson,
} from "../../index.js";
import { EXIT_LIMIT, EXIT_OK } from "../CliIo.js";
import type { CliRun } from "../main.js";
import { readTextFile, writeOutputFile } from "../readInputFile.js";

/** Options of `heatledger simulate`: one table drives the flags and their help. */
export const SIMULATE_OPTIONS = [
  { flags: "--json", help: "print one JSON object (verdict, parts, events) instead of the text report" },
  { flags: "--csv <file>", help: "write the time series (every step end and local peak, °C per part) to a CSV file" },
  { flags: "--cycles <file>", help: "write the rainflow-counted temperature cycles of every part (with their damage) to a CSV file" },
  { flags: "--force", help: "overwrite the --csv or --cycles file if it exists" },
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
1 a part passes its maximum temperature, or an event fails a part's rating table (pulse energy
or SOA: secondary checks reported beside the temperature verdict; an event outside a table is a
warning only), 2 bad input. Network and CSV files named in the profile are read relative to the
profile's folder. See DEVELOPERS.md, "Profile format" and "Stress: ratings, cycles and damage".`,
    );
  for (const option of SIMULATE_OPTIONS) command.option(option.flags, option.help);
  command.action((file: string, options: { json?: boolean; csv?: string; cycles?: string; force?: boolean; chart: boolean }) => {
    if (options.csv !== undefined && !options.force && run.io.exists(options.csv)) writeOutputFile(run.io, options.csv, "", false, "--csv");
    if (options.cycles !== undefined && !options.force && run.io.exists(options.cycles)) writeOutputFile(run.io, options.cycles, "", false, "--cycles");
    const folder = dirname(file);
    const located = (path: string): string => (isAbsolute(path) ? path : join(folder, path));
    const readNamed = Object.assign((path: string): string => readTextFile(run.io, located(path), "file named in the profile"), { displayName: located });
    const profile = loadProfile(readTextFile(run.io, file, "duty profile"), file, readNamed);
    // the text report lists at most terminalAll events in order (else the hottest): only --json needs keepAll
    const digest = new EventDigest(profile.parts.map((p) => p.limitC), options.json ? EVENT_DIGEST_DEFAULTS.keepAll : EVENT_DIGEST_DEFAULTS.terminalAll);
    const envelope = options.json || !options.chart ? undefined : new PeakEnvelope(profile.parts.length);
    const csv = options.csv === undefined ? undefined : new SimulationCsv(profile.parts.map((p) => p.id));
    const stress = new ProfileStress(profile, { keepCycles: options.cycles !== undefined });
    const result = simulateProfile(profile, {
      models: defaultCircuitModels,
      wantSamples: stress.wantsSamples,
      onEvent: (event, temperatures) => {
        digest.add(event, temperatures);
        stress.addEvent(event);
      },
      onPoint: (timeS: number, temperatureC: readonly number[], kind: "step-end" | "peak", eventIndex: number) => {
        envelope?.add(timeS, temperatureC);
        csv?.add(timeS, eventIndex, kind, temperatureC);
        stress.addPoint(timeS, temperatureC, kind, eventIndex);
      },
    });
    const stressResult = stress.finish(result.endTimeS);
    if (csv !== undefined) writeOutputFile(run.io, options.csv!, csv.text(), options.force === true, "--csv");
    let cyclesNote = "";
    if (options.cycles !== undefined) {
      const parts = stressResult.parts.map((p) => ({ id: p.id, cycles: p.report.cycles, damage: p.report.damage === undefined ? undefined : p.report.cycleDamage }));
      writeOutputFile(run.io, options.cycles, formatCyclesCsv(parts), options.force === true, "--cycles");
      cyclesNote = `Cycles: ${parts.reduce((n, p) => n + p.cycles.length, 0)} rows written to ${options.cycles}\n`;
    }
    if (options.json) run.io.out(`${JSON.stringify(simulationStressJson(simulationJson(profile, result, digest), stressResult, profile.occursPerYear), null, 2)}\n`);
    else
      run.io.out(
        `${formatSimulationText(profile, result, digest, envelope, run.io.columns, formatProfileStress(profile, stressResult))}\n${csv === undefined ? "" : `Time series: ${csv.rowCount} rows written to ${options.csv}\n`}${cyclesNote}`,
      );
    run.status = result.verdict === "fail" || stressResult.ratingStatus === "fail" ? EXIT_LIMIT : EXIT_OK;
  });
}
