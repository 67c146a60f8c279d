import type { Command } from "commander";
import type { CliRun } from "../main.js";
import { REPORT_OPTION, SAMPLE_RATIO_OPTION, SAMPLE_STEP_OPTION, SVG_OPTION } from "./chartOptions.js";
import { STRICT_OPTION, verdictHelp } from "./verdictHelp.js";

/** The time-series flag, shared by the commands that simulate a history (simulate, replay). */
export const CSV_OPTION = { flags: "--csv <file>", help: "write the time series (every step end and local peak, °C per part) to a CSV file" } as const;
/** The flag that drops the charts, shared as CSV_OPTION. */
/** The `--cycles <file>` flag of simulate and replay (writeCyclesFile). */
export const CYCLES_OPTION = { flags: "--cycles <file>", help: "write the rainflow-counted temperature cycles of every part (with their damage) to a CSV file" } as const;
export const NO_CHART_OPTION = { flags: "--no-chart", help: "leave the temperature charts out of the text report" } as const;

/** The flag that runs a command at every corner of the profile's corner set (simulate, size, replay). */
export const CORNERS_OPTION = {
  flags: "--corners",
  help: "also run at every corner of the profile's retryPlan.corners: each answer with its governing corner; the verdict is the worst over the corners",
} as const;

/** What --corners does, for the help of simulate, size and replay. */
export const CORNERS_HELP = `Corners (--corners): the profile as written and every corner of its
retryPlan.corners (each changes only the bus voltage, capacitance, series resistance or ambient
it names) are run; the report adds a table per part with each answer at every corner and names
the governing corner of each (the one where the answer is worst), in text and in the JSON
"corners"; the verdict and exit status are the worst over the corners. Without the flag only the
profile as written runs, and a profile with a corner set gets a note saying so.`;

/** Options of `heatledger simulate`: one table drives the flags and their help. */
export const SIMULATE_OPTIONS = [
  { flags: "--json", help: "print one JSON object (verdict, parts, events) instead of the text report" },
  CSV_OPTION,
  SAMPLE_STEP_OPTION,
  SAMPLE_RATIO_OPTION,
  REPORT_OPTION,
  SVG_OPTION,
  CYCLES_OPTION,
  { flags: "--force", help: "overwrite the --csv, --cycles, --report or --svg file if it exists" },
  NO_CHART_OPTION,
  CORNERS_OPTION,
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
  readonly corners?: boolean;
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
${CORNERS_HELP}
Example: heatledger simulate profiles/heat-pump-trip-retries.yaml --corners
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
