// One rule for the outside reference ngspice (Debian package `ngspice`): a test that needs it
// fails with this message when it is missing, never skips, so the outside check cannot vanish
// silently. `.ci/run` installs the package.
import type { SpawnSyncReturns } from "node:child_process";

export const NGSPICE_MISSING =
  "ngspice is not installed: the outside-reference checks need the Debian package ngspice (apt-get install -y ngspice; .ci/run installs it)";

/** Throw the one clear message when a spawned ngspice (directly or through a shell) could not run. */
export function requireNgspiceRan(result: SpawnSyncReturns<string>): void {
  const code = (result.error as NodeJS.ErrnoException | undefined)?.code;
  if (code === "ENOENT" || result.status === 127) throw new Error(NGSPICE_MISSING);
  if (result.error !== undefined) throw new Error(`ngspice could not be run: ${result.error.message}`);
}
