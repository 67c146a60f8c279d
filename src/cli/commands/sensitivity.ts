import type { Command } from "commander";
import { STUDY_DEFAULTS } from "../../study/studyDefaults.js";
import type { CliRun } from "../main.js";
import { REPORT_OPTION } from "./chartOptions.js";
import { PATH_HELP, answerHelp, collect } from "./sweep.js";

/** What the flags of `heatledger sensitivity` parse to. */
export interface SensitivityFlags {
  readonly vary?: string[];
  readonly answer?: string;
  readonly part?: string;
  readonly step?: string;
  readonly json?: boolean;
  /** --report FILE.html: the page with a tornado chart per answer */
  readonly report?: string;
  readonly force?: boolean;
}

/** `heatledger sensitivity PROFILE`: flags and help here; the run is loaded from sensitivityAction.ts. */
export function registerSensitivity(program: Command, run: CliRun): void {
  program
    .command("sensitivity")
    .argument("<profile>", "duty profile (YAML or JSON), or - for standard input")
    .description("normalised sensitivities d ln(answer)/d ln(p) of the peak rise and the retry-for-ever interval, ranked (tornado)")
    .option("--vary <path>", "a quantity to study (repeat; default every quantity the profile's circuit writes)", collect)
    .option("--answer <names>", `answers, comma separated (default ${STUDY_DEFAULTS.sensitivityAnswers.join(",")}; forever only when the profile has a retry block with a fault)`)
    .option("--part <id>", "the part whose peak, margin and damage the answers report (default: the part with the least margin)")
    .option("--step <fraction>", `relative step h of the central difference (default ${STUDY_DEFAULTS.sensitivityStep})`)
    .option("--json", "print one JSON object instead of the tables")
    .option(REPORT_OPTION.flags, `${REPORT_OPTION.help}: a tornado chart per answer`)
    .option("--force", "overwrite the --report file if it exists")
    .addHelpText(
      "after",
      `
S = [ln y(p(1+h)) - ln y(p(1-h))] / [ln(1+h) - ln(1-h)]: 1 means the answer grows in proportion
to p, 2 as its square, 0 not at all, -1 in inverse proportion. Each y is the named command's
answer on the profile with p set. Absolute temperatures (°C) have no natural zero: sweep them.
Answers:
${answerHelp()}
${PATH_HELP}
Example:
  heatledger sensitivity profiles/warehouse-robot-48v.yaml --vary circuit.capacitance \\
    --vary circuit.busVoltage --vary circuit.resistance --vary "parts[0].network.stages[0].r"`,
    )
    .action(async (file: string, options: SensitivityFlags) => {
      const { sensitivityAction } = await import("./sensitivityAction.js");
      await sensitivityAction(run, file, options);
    });
}
