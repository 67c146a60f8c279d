import type { Command } from "commander";
import { PLAN_DEFAULTS } from "../../retry/planDefaults.js";
import { ATTEMPT_TIMING_DEFAULTS } from "../../profile/attemptTiming.js";
import type { CliRun } from "../main.js";
import { REPORT_OPTION, SVG_OPTION } from "./chartOptions.js";
import { STRICT_OPTION, verdictHelp } from "./verdictHelp.js";

/** Options of `heatledger retries`: one table drives the flags and their help. */
export const RETRIES_OPTIONS = [
  { flags: "--json", help: "print every answer as one JSON object instead of the text report" },
  { flags: "--csv <file>", help: "write the lockout map (attempts x interval: worst peak, verdict, governing corner) to a CSV file" },
  REPORT_OPTION,
  SVG_OPTION,
  { flags: "--force", help: "overwrite the --csv, --report or --svg file if it exists" },
  STRICT_OPTION,
] as const;

/** What the flags of `heatledger retries` parse to. */
export interface RetriesFlags {
  readonly json?: boolean;
  readonly csv?: string;
  readonly report?: string;
  readonly svg?: string;
  readonly force?: boolean;
  readonly strict?: boolean;
}

/** A duration in s written in ms for the help text. */
const ms = (s: number): string => `${Number((s * 1000).toPrecision(6))} ms`;

/** `heatledger retries PROFILE`: flags and help here; the run is loaded from retriesAction.ts when it starts. */
export function registerRetries(program: Command, run: CliRun): void {
  const command = program
    .command("retries")
    .argument("<profile>", "duty profile (YAML or JSON; - for standard input) with a retry block that meets a fault")
    .description("plan retries into a fault: shortest safe interval, attempt count, retry-for-ever interval, fastest schedule, lockout, lockout map")
    .addHelpText(
      "after",
      `
The profile's first retry block with a fault is the scenario; its optional retryPlan section
sets the attempts and interval to ask about, the spacing (start-to-start or end-to-start), the
"near ambient" distance (default ${PLAN_DEFAULTS.ambientReturnK} K), the lockout map and the corner set (busVoltage,
ambient, capacitance, resistance). Safe means at or below the part's limit minus its margin.
The relay that starts each attempt must open and close again between attempts (circuit.relay:
operate, default ${ms(ATTEMPT_TIMING_DEFAULTS.operateS)}; release, default ${ms(ATTEMPT_TIMING_DEFAULTS.releaseS)}), after the main contactor has opened
(circuit.contactor.release): no wait proposed is shorter than the longer release plus the
operate time, and every interval, wait and lockout is a whole number of the firmware's timer steps
(firmware.timerResolution, default ${ms(ATTEMPT_TIMING_DEFAULTS.timerResolutionS)}), rounded up and checked again by simulation.
${verdictHelp("Here the verdict is that of the profile's own retry policy: its burst from a cold part and burst + lockout repeated while the fault persists, in every corner (pass: safe; an attempt that would start before the previous one ends fails).")}
See README, "Reading the retry plan" and "Verdicts and exit status".`,
    );
  for (const option of RETRIES_OPTIONS) command.option(option.flags, option.help);
  command.action(async (file: string, options: RetriesFlags) => {
    const { retriesAction } = await import("./retriesAction.js");
    await retriesAction(run, file, options);
  });
}
