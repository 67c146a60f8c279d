import type { Command } from "commander";
import { SUPERVISE_DEFAULTS } from "../../supervise/superviseDefaults.js";
import { ATTEMPT_TIMING_DEFAULTS } from "../../profile/attemptTiming.js";
import type { CliRun } from "../main.js";
import { REPORT_OPTION, SVG_OPTION } from "./chartOptions.js";
import { STRICT_OPTION, verdictHelp } from "./verdictHelp.js";

/** Options of `heatledger supervise`: one table drives the flags and their help. */
export const SUPERVISE_OPTIONS = [
  { flags: "--json", help: "print one JSON object (window, checks, retry storms, envelope) instead of the text report" },
  { flags: "--no-chart", help: "leave the envelope and energy charts out of the text report" },
  { flags: "--checks <file>", help: "write the recommended checks as a circuit.protection fragment (YAML) to paste into the profile" },
  REPORT_OPTION,
  SVG_OPTION,
  { flags: "--force", help: "overwrite the --checks, --report or --svg file if it exists" },
  STRICT_OPTION,
] as const;

/** What the flags of `heatledger supervise` parse to. */
export interface SuperviseFlags {
  readonly json?: boolean;
  readonly chart: boolean;
  readonly report?: string;
  readonly svg?: string;
  readonly force?: boolean;
  readonly strict?: boolean;
  readonly checks?: string;
}

/** `heatledger supervise PROFILE`: flags and help here; the run is loaded from superviseAction.ts when it starts. */
export function registerSupervise(program: Command, run: CliRun): void {
  const command = program
    .command("supervise")
    .argument("<profile>", "duty profile (YAML or JSON; - for standard input) with a circuit and a supervision section")
    .description("pre-charge supervision numbers: timeout window, early-abort and rise-too-fast checks, attempts before lockout")
    .addHelpText(
      "after",
      `
The profile's supervision section gives the healthy corner set (capacitance range required;
bus voltage, completion fraction and loads optional) and check times (default:
${SUPERVISE_DEFAULTS.autoCheckFractions.join(", ")} of the slowest healthy completion time). Check thresholds keep a
margin of ${SUPERVISE_DEFAULTS.checkMarginFraction * 100} % (checkMargin) and are usable down to ${SUPERVISE_DEFAULTS.minCheckVoltageFraction * 100} % of the lowest bus voltage
(minCheckVoltage).
Attempts "back to back" are as close as the relay allows: its release plus operate time
(circuit.relay, defaults ${ATTEMPT_TIMING_DEFAULTS.releaseS * 1000} ms and ${ATTEMPT_TIMING_DEFAULTS.operateS * 1000} ms; the main contactor's release,
circuit.contactor.release, when longer than the relay's), rounded up to the firmware's timer
(firmware.timerResolution, default ${ATTEMPT_TIMING_DEFAULTS.timerResolutionS * 1000} ms).
${verdictHelp("Here the verdict judges the profile's own timeout: attempts into a short at that timeout, through the profile's retry policy (burst and burst + lockout repeated), worst part and bus voltage; pass when it is inside the window. A timeout shorter than the slowest healthy charge fails (healthy units would be stopped).")}
Example: heatledger supervise profiles/electric-boat-72v-supervision.yaml --checks checks.yaml
writes the recommended early-abort and rise-too-fast checks, and a firmware I²t limit and a
maximum on-time when they help, as circuit.protection keys; pasted
under circuit:, simulate, retries, replay and size end each attempt where a check fires.
See README, "Reading the supervision answers" and "Verdicts and exit status".`,
    );
  for (const option of SUPERVISE_OPTIONS) command.option(option.flags, option.help);
  command.action(async (file: string, options: SuperviseFlags) => {
    const { superviseAction } = await import("./superviseAction.js");
    await superviseAction(run, file, options);
  });
}
