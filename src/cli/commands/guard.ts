import type { Command } from "commander";
import { GUARD_DEFAULTS, GUARD_NUMERICS } from "../../guard/guardDefaults.js";
import type { CliRun } from "../main.js";
import { STRICT_OPTION, verdictHelp } from "./verdictHelp.js";

/** Options of `heatledger guard`: one table drives the flags and their help. */
export const GUARD_OPTIONS = [
  { flags: "--tick <s>", help: "the firmware's tick, the guard's time step (default: the profile's firmware.timerResolution)" },
  { flags: "--numeric <type>", help: `number type of the C export: ${GUARD_NUMERICS.join(" or ")} (default fixed)` },
  { flags: "--q <bits>", help: `fractional bits of the fixed-point rises, Q(31-bits).bits in 32 bits (default ${GUARD_DEFAULTS.fractionBits})` },
  { flags: "--energy-q <bits>", help: `fractional bits of the fixed-point energies fed each tick (default ${GUARD_DEFAULTS.energyFractionBits})` },
  { flags: "--attempts <n>", help: `attempts run against the fastest schedule and in the test vectors (default the profile's, at most ${GUARD_DEFAULTS.vectorAttempts})` },
  { flags: "--c <stem>", help: "write the C export: <stem>.h and <stem>.c" },
  { flags: "--name <ident>", help: `C prefix of the exported names (default ${GUARD_DEFAULTS.cName})` },
  { flags: "--model-json <file>", help: "write the guard's model and tables as JSON (for firmware in other languages)" },
  { flags: "--vectors <file>", help: "write the test vectors as JSON: tick-by-tick energies, expected state and estimate, exact rise, may-start answers" },
  { flags: "--force", help: "overwrite output files that exist" },
  { flags: "--json", help: "print the report as one JSON object instead of text" },
  STRICT_OPTION,
] as const;

/** What the flags of `heatledger guard` parse to. */
export interface GuardFlags {
  readonly tick?: string;
  readonly numeric?: string;
  readonly q?: string;
  readonly energyQ?: string;
  readonly attempts?: string;
  readonly c?: string;
  readonly name?: string;
  readonly modelJson?: string;
  readonly vectors?: string;
  readonly force?: boolean;
  readonly json?: boolean;
  readonly strict?: boolean;
}

/** `heatledger guard PROFILE`: flags and help here; the run is loaded from guardAction.ts when it starts. */
export function registerGuard(program: Command, run: CliRun): void {
  const command = program
    .command("guard")
    .argument("<profile>", "duty profile (YAML or JSON; - for standard input) with a retry block that meets a fault")
    .description("export a thermal guard the firmware runs: modal model at the tick, may-start rule, C source, test vectors")
    .addHelpText(
      "after",
      `
The part's network becomes one first-order update per mode at the firmware tick (zero-order
hold: a = e^(-Ts/tau)), fed with the energy each heat source took in the tick, with a gain that
covers any place the energy lands inside the tick: the estimate never falls below the exact rise
at tick instants. The may-start rule adds the worst attempt into the profile's fault (exact
peaks over ${GUARD_DEFAULTS.attemptSpans + GUARD_DEFAULTS.tailSpans + 1} spans after its start, every retryPlan corner) to the decayed state and allows the
attempt only when it stays at or below the limit less the margin. Fixed point rounds every
constant and product to the safe side. The report compares the guard with the retry planner's
fastest safe schedule. See README, "A thermal guard for the firmware", and docs/guard.md.
${verdictHelp("Here the verdict judges the attempts the guard admitted (each simulated exactly), or the first attempt when the guard admits none.")}

Example:
  heatledger guard profiles/warehouse-robot-48v.yaml --c robot_guard --vectors robot_vectors.json`,
    );
  for (const option of GUARD_OPTIONS) command.option(option.flags, option.help);
  command.action(async (file: string, options: GuardFlags) => {
    const { guardAction } = await import("./guardAction.js");
    guardAction(run, file, options);
  });
}
