import type { Command } from "commander";
import type { CliRun } from "../main.js";
import { STARTER_CIRCUITS } from "../../profile/starterProfile.js";

/** What the flags of `heatledger init` parse to. */
export interface InitFlags {
  readonly circuit: string;
  readonly force?: boolean;
  readonly json?: boolean;
}

/** The circuit `heatledger init` writes when --circuit is not given. */
export const INIT_DEFAULT_CIRCUIT = "series-resistor" satisfies (typeof STARTER_CIRCUITS)[number];

/** `heatledger init FILE`: flags and help here; the run is loaded from initAction.ts when it starts. */
export function registerInit(program: Command, run: CliRun): void {
  const command = program
    .command("init")
    .argument("<file>", "the profile to write (YAML), or - for standard output")
    .description("write a commented starting duty profile for a circuit, with typical values that run as written")
    .option("--circuit <topology>", `the pre-charge circuit: ${STARTER_CIRCUITS.join(", ")}`, INIT_DEFAULT_CIRCUIT)
    .option("--force", "overwrite the file if it exists")
    .option("--json", "print what was written as one JSON object (file, circuit, bytes)")
    .addHelpText(
      "after",
      `
The profile holds one part with a typical thermal network, the circuit with typical values (each
key explained beside it) and a day of events: power-ups, a run, a power-down, retries into a
fault and a lockout. Every value is an invented placeholder: replace it with your own parts'
data. Every key is listed in docs/profile-reference.md (shipped in the package).

Examples:
  heatledger init my-precharge.yaml --circuit linear-mosfet
  heatledger simulate my-precharge.yaml`,
    );
  command.action(async (file: string, flags: InitFlags) => {
    const { initAction } = await import("./initAction.js");
    initAction(run, file, flags);
  });
}
