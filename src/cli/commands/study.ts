import type { Command } from "commander";
import type { CliRun } from "../main.js";
import { STRICT_OPTION } from "./verdictHelp.js";

/** What the flags of `heatledger study` parse to. */
export interface StudyFlags {
  readonly json?: boolean;
  readonly csv?: string;
  readonly worst?: string;
  readonly report?: string;
  readonly force?: boolean;
  readonly strict?: boolean;
}

/** `heatledger study FILE`: flags and help here; the run is loaded from studyAction.ts. */
export function registerStudy(program: Command, run: CliRun): void {
  program
    .command("study")
    .argument("<file>", "study file (YAML or JSON): the command, the profile and the quantities, to keep with the design")
    .description("run a sweep, sensitivity, montecarlo or compare study written in a file, so it can be versioned and run again")
    .option("--json", "print one JSON object instead of the text report")
    .option("--csv <file>", "sweep: write the points to a CSV file")
    .option("--worst <file>", "montecarlo: write the worst sample as a profile that reproduces it")
    .option("--report <file>", "sweep, sensitivity, montecarlo: write the HTML report with the study's charts")
    .option("--force", "overwrite the --csv, --worst or --report file if it exists")
    .option(STRICT_OPTION.flags, `compare: ${STRICT_OPTION.help}`)
    .addHelpText(
      "after",
      `
The file names the command and says what the command line would: a study that lives beside the
design, in version control, and runs again to the same numbers. The profile (and compare's
"against") is named relative to the study file's folder. Keys:
  study        sweep, sensitivity, montecarlo or compare (required)
  profile      the duty profile (required)
  description  words of your own (not read)
  answers      list of answer names (see "heatledger sweep --help")
  part         the part whose peak, margin and damage the answers report
  vary         list of { path, ... }: sweep { values: [...] } or { from, to, points, scale: log };
               montecarlo { distribution: "normal 5 %" }; sensitivity { path } alone
  samples, seed, workers   montecarlo;  step   sensitivity
  against      compare: the second profile;  set   compare: list of { path, value }
A bad key or value is reported with the study file, its line and the key. See docs/studies.md.
Example:
  heatledger study profiles/studies/robot-resistance-sweep.yaml --report sweep.html`,
    )
    .action(async (file: string, options: StudyFlags) => {
      const { studyAction } = await import("./studyAction.js");
      await studyAction(run, file, options);
    });
}
