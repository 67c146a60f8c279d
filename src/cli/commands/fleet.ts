import type { Command } from "commander";
import { FLEET_DEFAULTS } from "../../fleet/fleetDefaults.js";
import type { CliRun } from "../main.js";
import { REPORT_OPTION } from "./chartOptions.js";
import { STRICT_OPTION, verdictHelp } from "./verdictHelp.js";
import { collect } from "./sweep.js";

/** The output flags `fleet` and `fleet merge` share: one table drives the flags and their help. */
export const FLEET_OUTPUT_OPTIONS = [
  { flags: "--json", help: "print one JSON object (header, counts, every unit in rank order, cautions) instead of the table" },
  { flags: "--ndjson [file]", help: "write the units as NDJSON (a header line, then one line per unit in rank order): the partition output that `fleet merge` reads; without FILE, print it instead of the table" },
  { flags: "--csv <file>", help: "write one CSV row per unit (rank, unit, log, verdict, and per part peak, margin, first exceedance, damage, life left)" },
  REPORT_OPTION,
  { flags: "--top <n>", help: `units in the text table (default ${FLEET_DEFAULTS.tableRows}; every unit goes to --csv, --ndjson and --json)` },
  { flags: "--force", help: "overwrite the --csv, --ndjson or --report file if it exists" },
  STRICT_OPTION,
] as const;

/** What the output flags of `fleet` and `fleet merge` parse to. */
export interface FleetOutputFlags {
  readonly json?: boolean;
  readonly ndjson?: string | boolean;
  readonly csv?: string;
  readonly report?: string;
  readonly top?: string;
  readonly force?: boolean;
  readonly strict?: boolean;
}

/** What the flags of `heatledger fleet` parse to. */
export interface FleetFlags extends FleetOutputFlags {
  readonly list?: string[];
  readonly workers?: string;
  readonly logsPerYear?: string;
}

const STATUS_HELP = verdictHelp(
  "Here the verdict is the worst of the units' (each as replay judges it); when a log could not be replayed the run still reports every other unit and exits with status 2.",
);

/** `heatledger fleet PROFILE LOGS...` and `heatledger fleet merge PARTS...`: flags and help here; the runs load from fleetAction.ts and fleetMergeAction.ts. */
export function registerFleet(program: Command, run: CliRun): void {
  const fleet = program
    .command("fleet")
    .argument("<profile>", "duty profile (YAML or JSON) giving the parts, circuit and limits")
    .argument("[logs...]", "event logs of the units: files, folders (every .csv below them) or quoted glob patterns")
    .description("replay many units' event logs in parallel: one row per unit ranked by risk (peak, first exceedance, damage, life left)")
    .option("--list <file>", "a file naming one log per line, PATH or PATH,UNIT (the unit id; default: the file name) (repeat)", collect)
    .option("--workers <n>", `worker threads (default: the CPU cores, at most one per ${FLEET_DEFAULTS.unitsPerWorker} units)`)
    .option("--logs-per-year <n>", "the stated rate of remaining life: logs like each unit's per year (default: each log's own span, one log per span)")
    .addHelpText(
      "after",
      `
Each log is replayed as \`heatledger replay LOG --profile PROFILE\` replays it (see its --help for the
log format); a unit whose log cannot be replayed is reported with its problem (file, line) and the
others go on. The unit id is the log's file name without extension, or the second column of a
--list file. Units are ranked: fail, warn, pass, then least margin to a limit, most damage, unit id.

Split a large fleet: run each share of the logs with --ndjson PART.ndjson (on any machine), then
\`heatledger fleet merge PART.ndjson...\` prints exactly what one run over all the logs prints.

Example:
  heatledger fleet profiles/irrigation-pump-decade.yaml profiles/logs/fleet-irrigation/

${STATUS_HELP}
See docs/fleet.md (shipped in the package).`,
    );
  for (const option of FLEET_OUTPUT_OPTIONS) fleet.option(option.flags, option.help);
  // list the subcommand by its name alone, so its arguments do not widen the help's columns
  fleet.configureHelp({ subcommandTerm: (sub) => sub.name() });
  fleet.action(async (profile: string, logs: string[], options: FleetFlags) => {
    const { fleetAction } = await import("./fleetAction.js");
    await fleetAction(run, profile, logs, options);
  });

  const merge = fleet
    .command("merge")
    .argument("<partitions...>", "NDJSON files written by `heatledger fleet ... --ndjson FILE` (or by an earlier merge)")
    .description("merge fleet partitions into the summary one run over all their logs gives")
    .addHelpText(
      "after",
      `
The partitions must come from the same profile and options (their header lines must agree) and
name each unit once. The result does not depend on the order or grouping of the partitions.

Example:
  heatledger fleet profiles/irrigation-pump-decade.yaml profiles/logs/fleet-irrigation/unit-0[1-6].csv --ndjson a.ndjson
  heatledger fleet profiles/irrigation-pump-decade.yaml profiles/logs/fleet-irrigation/unit-[01][7-9].csv \\
    profiles/logs/fleet-irrigation/unit-1*.csv --ndjson b.ndjson
  heatledger fleet merge a.ndjson b.ndjson`,
    );
  for (const option of FLEET_OUTPUT_OPTIONS) merge.option(option.flags, option.help);
  merge.action(async (partitions: string[], options: FleetOutputFlags) => {
    // commander reads an option known to `fleet` wherever it stands, so the shared output flags
    // written after `merge` land on `fleet`: take both
    const { fleetMergeAction } = await import("./fleetMergeAction.js");
    await fleetMergeAction(run, partitions, { ...fleet.opts<FleetFlags>(), ...options });
  });
}
