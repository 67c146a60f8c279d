import type { Command } from "commander";
import { STUDY_ANSWERS, STUDY_ANSWER_NAMES, STUDY_DEFAULTS } from "../../study/studyDefaults.js";
import type { CliRun } from "../main.js";
import { REPORT_OPTION } from "./chartOptions.js";

/** Collects a repeated option into a list. */
export function collect(value: string, previous: string[] | undefined): string[] {
  return [...(previous ?? []), value];
}

/** The list of study answers for --help: name, unit, command. */
export function answerHelp(): string {
  return STUDY_ANSWER_NAMES.map((n) => `  ${n.padEnd(15)}${STUDY_ANSWERS[n].words}${STUDY_ANSWERS[n].unit === "" ? "" : ` [${STUDY_ANSWERS[n].unit}]`} (${STUDY_ANSWERS[n].command})`).join("\n");
}

/** The parameter-path part of the study commands' help. */
export const PATH_HELP = `Parameter paths: keys joined by dots, list items by [index], a part also by its id:
circuit.resistance, parts.precharge-resistor.limits.margin, events[1].retry.interval.
A path through a network file goes on inside it (parts[0].network.stages[1].r edits the
named file in memory; every part naming it sees the edit). See docs/studies.md.`;

/** What the flags of `heatledger sweep` parse to. */
export interface SweepFlags {
  readonly vary?: string[];
  readonly answer?: string;
  readonly part?: string;
  readonly json?: boolean;
  readonly csv?: string;
  /** --report FILE.html: the page with a chart per answer */
  readonly report?: string;
  readonly force?: boolean;
}

/** `heatledger sweep PROFILE --vary PATH=VALUES`: flags and help here; the run is loaded from sweepAction.ts. */
export function registerSweep(program: Command, run: CliRun): void {
  program
    .command("sweep")
    .argument("<profile>", "duty profile (YAML or JSON), or - for standard input")
    .description("sweep one or two quantities of a profile and tabulate the answers of simulate, retries, supervise or size")
    .option("--vary <path=values>", "a quantity and its values: PATH=v1,v2,... or PATH=A..B:N (linear) or PATH=A..B:N:log; once or twice (grid)", collect)
    .option("--answer <names>", `answers to report, comma separated (default ${STUDY_DEFAULTS.sweepAnswers.join(",")})`)
    .option("--part <id>", "the part whose peak, margin and damage the answers report (default: the part with the least margin)")
    .option("--json", "print one JSON object (parameters, answers, points) instead of the table")
    .option("--csv <file>", "also write the points to a CSV file")
    .option(REPORT_OPTION.flags, `${REPORT_OPTION.help}: a line chart per answer (1-D), a heat map (2-D)`)
    .option("--force", "overwrite the --csv or --report file if it exists")
    .addHelpText(
      "after",
      `
Each point is the profile with the values set, loaded and run exactly as the named command runs
it: the answers are what that command prints on the edited profile.
Answers:
${answerHelp()}
${PATH_HELP}
Example:
  heatledger sweep profiles/warehouse-robot-48v.yaml \\
    --vary "circuit.resistance=10 ohm..100 ohm:7:log" \\
    --vary "circuit.capacitance=2.2 mF,3.3 mF,4.7 mF" --answer peak,margin,energy`,
    )
    .action(async (file: string, options: SweepFlags) => {
      const { sweepAction } = await import("./sweepAction.js");
      await sweepAction(run, file, options);
    });
}
