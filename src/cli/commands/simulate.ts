import type { Command } from "commander";
import type { CliRun } from "../main.js";
import { REPORT_OPTION, SAMPLE_RATIO_OPTION, SAMPLE_STEP_OPTION, SVG_OPTION } from "./chartOptions.js";
import { STRICT_OPTION, verdictHelp } from "./verdictHelp.js";

/** The time-series flag, shared by the commands that simulate a history (simulate, replay). */
export const CSV_OPTION = { flags: "--csv <file>", help: "write the time series (every step end and local peak, °C per part) to a CSV file" } as const;
/** The flag that drops the charts, shared as CSV_OPTION. */
export const NO_CHART_OPTION = { flags: "--no-chart", help: "leave the temperature charts out of the text report" } as const;

/** Options of `heatledger simulate`: one table drives the flags and their help. */
export const SIMULATE_OPTIONS = [
  { flags: "--json", help: "print one JSON object (verdict, parts, events) instead of the text report" },
  CSV_OPTION,
  SAMPLE_STEP_OPTION,
  SAMPLE_RATIO_OPTION,
  REPORT_OPTION,
  SVG_OPTION,
  { flags: "--cycles <file>", help: "write the rainflow-counted temperature cycles of every part (with their damage) to a CSV file" },
  { flags: "--force", help: "overwrite the --csv, --cycles, --report or --svg file if it exists" },
  NO_CHART_OPTION,
  STRICT_OPTION,
] as const;

/** What the flags of `heatledger simulate` parse to. */
export interface SimulateFlags {
  readonly json?: boolean;
  readonly csv?: string;
  readonly cycles?: string;
  readonly sampleStep?: string;
  readonly sampleRatio?: string;
  readonly report?: string;
  readonly svg?: string;
  readonly force?: boolean;
  readonly chart: boolean;
  readonly strict?: boolean;
}

/** What simulate's and replay's verdict judges, for their --help. */
export const SIMULATION_VERDICT_COVERS =
  "Here the verdict is the worst part's peak over the whole history, and an event that exceeds a " +
  "part's rating table (pulse energy or SOA, secondary checks reported beside the temperature " +
  "verdict) fails too; an event outside a rating table was not checked and warns.";

/** `heatledger simulate PROFILE`: flags and help here; the run is loaded from simulateAction.ts when it starts. */
export function registerSimulate(program: Command, run: CliRun): void {
  const command = program
    .command("simulate")
    .argument("<profile>", "duty profile (YAML or JSON), or - for standard input")
    .description("run a duty profile: every part's temperature history, peaks, margins and a pass/warn/fail verdict")
    .addHelpText(
      "after",
      `
${verdictHelp(SIMULATION_VERDICT_COVERS)}
Network and CSV files named in the profile are read relative to the profile's folder. Every
key is in docs/profile-reference.md, the rules in docs/profile-format.md and docs/stress.md
(shipped in the package: node_modules/heatledger/docs/); README, "Verdicts and exit status".
\`heatledger init\` writes a starting profile.`,
    );
  for (const option of SIMULATE_OPTIONS) command.option(option.flags, option.help);
  command.action(async (file: string, options: SimulateFlags) => {
    const { simulateAction } = await import("./simulateAction.js");
    await simulateAction(run, file, options);
  });
}
