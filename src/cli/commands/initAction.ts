import { describeFound, inputError } from "../../errors/InputError.js";
import { STARTER_CIRCUITS, type StarterCircuit, starterProfileText } from "../../profile/starterProfile.js";
import { formatCautions, reportCautions } from "../../text/cautions.js";
import type { CliRun } from "../main.js";
import { writeOutputFile } from "../readInputFile.js";
import type { InitFlags } from "./init.js";

/**
 * Run `heatledger init`: write the starter profile of the chosen circuit to `file` (refused if
 * it exists, unless --force), or to standard output for `-`, and say how to run it.
 * @throws InputError (bad-option) for an unknown --circuit or a file that exists without --force
 */
export function initAction(run: CliRun, file: string, flags: InitFlags): void {
  if (!(STARTER_CIRCUITS as readonly string[]).includes(flags.circuit))
    throw inputError("bad-option", "--circuit", `one of ${STARTER_CIRCUITS.join(", ")}`, describeFound(flags.circuit));
  const circuit = flags.circuit as StarterCircuit;
  const text = starterProfileText(circuit);
  if (file === "-") {
    run.io.out(text);
    return;
  }
  writeOutputFile(run.io, file, text, flags.force === true, "--force");
  const mosfet = circuit === "linear-mosfet";
  if (flags.json === true) {
    run.io.out(`${JSON.stringify({ file, circuit, bytes: Buffer.byteLength(text), cautions: reportCautions(mosfet) }, null, 2)}\n`);
    return;
  }
  run.io.out(`wrote ${file}: a starting profile for a ${circuit} pre-charge (invented, typical values)\n`);
  run.io.out(`next: edit it with your parts' data (keys: docs/profile-reference.md), then run\n  heatledger simulate ${file}\n\n`);
  run.io.out(formatCautions(mosfet, Math.min(run.io.columns, 100)));
}
