import type { Command } from "commander";
import type { CliRun } from "../main.js";
import { LOG_COLUMNS, LOG_WORDS } from "../../replay/logWords.js";
import { CORNERS_HELP, CORNERS_OPTION, CSV_OPTION, CYCLES_OPTION, NO_CHART_OPTION, SIMULATION_VERDICT_COVERS } from "./simulate.js";
import { REPORT_OPTION, SAMPLE_RATIO_OPTION, SAMPLE_STEP_OPTION, SVG_OPTION } from "./chartOptions.js";
import { STRICT_OPTION, verdictHelp } from "./verdictHelp.js";

/** Options of `heatledger replay`: one table drives the flags and their help. */
export const REPLAY_OPTIONS = [
  { flags: "--profile <file>", help: "duty profile (YAML or JSON; - for standard input) giving the parts, circuit and limits (required; its own events are ignored)" },
  { flags: "--json", help: "print one JSON object (verdict, parts, events, replay) instead of the text report" },
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

/** What the flags of `heatledger replay` parse to. */
export interface ReplayFlags {
  readonly profile?: string;
  readonly json?: boolean;
  readonly csv?: string;
  readonly sampleStep?: string;
  readonly sampleRatio?: string;
  readonly report?: string;
  readonly svg?: string;
  readonly cycles?: string;
  readonly force?: boolean;
  readonly chart: boolean;
  readonly corners?: boolean;
  readonly strict?: boolean;
}

/** `heatledger replay LOG --profile FILE`: flags and help here; the run is loaded from replayAction.ts when it starts. */
export function registerReplay(program: Command, run: CliRun): void {
  const columns = Object.entries(LOG_COLUMNS)
    .map(([name, text]) => definition(name, text))
    .join("\n");
  const words = Object.entries(LOG_WORDS)
    .map(([word, text]) => definition(word, text))
    .join("\n");
  const command = program
    .command("replay")
    .argument("<log>", "event log of a unit (CSV: time,event[,note])")
    .description("replay a unit's event log on a profile's parts and circuit: temperatures reached, first time over a limit, damage to date")
    .addHelpText(
      "after",
      `
The log is a CSV file whose first line names its columns (any order; lines starting with # are
skipped):
${columns}
Event words:
${words}
The gap between two lines is idle time with the bus as the line above left it; an attempt must
end before the next line (the profile's completion timeout). The log's last line ends the
replay: add a "note" line later to follow the part as it cools.

Example:
  heatledger replay profiles/logs/irrigation-pump-returned-unit.csv \\
    --profile profiles/irrigation-pump-decade.yaml

${verdictHelp(`${SIMULATION_VERDICT_COVERS} The history is the log's.`)}
${CORNERS_HELP}
Damage to date counts the log as a one-off history (ASTM E1049 §5.4.4). See
docs/field-logs.md (shipped in the package).`,
    );
  for (const option of REPLAY_OPTIONS) command.option(option.flags, option.help);
  command.action(async (file: string, options: ReplayFlags) => {
    const { replayAction } = await import("./replayAction.js");
    await replayAction(run, file, options);
  });
}

/** "  word            text", the text wrapped at 96 columns under itself. */
function definition(term: string, text: string): string {
  const indent = 18;
  const lines: string[] = [];
  let line = "";
  for (const word of text.split(" ")) {
    if (line !== "" && indent + line.length + 1 + word.length > 96) {
      lines.push(line);
      line = word;
    } else line = line === "" ? word : `${line} ${word}`;
  }
  lines.push(line);
  return lines.map((l, i) => (i === 0 ? `  ${term.padEnd(indent - 2)}${l}` : `${" ".repeat(indent)}${l}`)).join("\n");
}
