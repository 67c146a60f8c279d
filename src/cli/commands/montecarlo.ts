import type { Command } from "commander";
import { STUDY_DEFAULTS } from "../../study/studyDefaults.js";
import type { CliRun } from "../main.js";
import { REPORT_OPTION } from "./chartOptions.js";
import { PATH_HELP, answerHelp, collect } from "./sweep.js";

/** What the flags of `heatledger montecarlo` parse to. */
export interface MonteCarloFlags {
  readonly vary?: string[];
  readonly samples?: string;
  readonly seed?: string;
  readonly workers?: string;
  readonly answer?: string;
  readonly part?: string;
  readonly worst?: string;
  readonly force?: boolean;
  readonly json?: boolean;
  /** --report FILE.html: the page with a histogram per answer */
  readonly report?: string;
}

/** `heatledger montecarlo PROFILE`: flags and help here; the run is loaded from montecarloAction.ts. */
export function registerMonteCarlo(program: Command, run: CliRun): void {
  program
    .command("montecarlo")
    .argument("<profile>", "duty profile (YAML or JSON), or - for standard input")
    .description("Monte Carlo over part tolerances: distribution of peak and margin, probability of crossing the limit, worst unit")
    .option("--vary <path=distribution>", 'a quantity and its spread: "normal 5 %", "normal 0.1 mF within 10 %", "uniform A..B", "tolerance 10 %" (repeat)', collect)
    .option("--samples <n>", `number of samples (default ${STUDY_DEFAULTS.samples})`)
    .option("--seed <n>", `random seed: the same seed gives the same numbers on any number of workers (default ${STUDY_DEFAULTS.seed})`)
    .option("--workers <n>", "worker threads (default: the CPU cores, one per 500 samples at most; never more than one per 16)")
    .option("--answer <names>", `answers, comma separated (default ${STUDY_DEFAULTS.monteCarloAnswers.join(",")}; margin is always worked out)`)
    .option("--part <id>", "the part whose peak, margin and damage the answers report (default: the part with the least margin)")
    .option("--worst <file>", "write the worst sample as a profile that reproduces it (an edited network file beside it)")
    .option(REPORT_OPTION.flags, `${REPORT_OPTION.help}: a histogram per answer`)
    .option("--force", "overwrite the --worst or --report file if it exists")
    .option("--json", "print one JSON object instead of the text report")
    .addHelpText(
      "after",
      `
Each sample draws every quantity from its distribution (a stream of its own, from the seed and
the sample's number), sets them in the profile and runs the commands its answers need. The
probability of crossing the limit (margin < 0) comes with a ${STUDY_DEFAULTS.confidence * 100} % Wilson score interval.
Answers:
${answerHelp()}
${PATH_HELP}
Example:
  heatledger montecarlo profiles/warehouse-robot-48v.yaml --samples 400 --seed 7 \\
    --vary "circuit.resistance=tolerance 5 %" --vary "circuit.busVoltage=normal 1 %" \\
    --vary "parts[0].network.stages[0].r=normal 10 % within 25 %" --worst worst-unit.yaml`,
    )
    .action(async (file: string, options: MonteCarloFlags) => {
      const { monteCarloAction } = await import("./montecarloAction.js");
      await monteCarloAction(run, file, options);
    });
}
