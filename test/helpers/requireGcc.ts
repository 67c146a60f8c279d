// One rule for the outside reference gcc (Debian package `gcc`): a test that compiles the exported
// C fails with this message when the compiler is missing, never skips, so the check cannot vanish
// silently. `.ci/run` installs the package.
import type { SpawnSyncReturns } from "node:child_process";

export const GCC_MISSING = "gcc is not installed: the exported-C checks need the Debian package gcc (apt-get install -y gcc; .ci/run installs it)";

/** Throw the one clear message when a spawned gcc could not run, and gcc's own messages when it failed. */
export function requireGccRan(result: SpawnSyncReturns<string>): void {
  const code = (result.error as NodeJS.ErrnoException | undefined)?.code;
  if (code === "ENOENT" || result.status === 127) throw new Error(GCC_MISSING);
  if (result.error !== undefined) throw new Error(`gcc could not be run: ${result.error.message}`);
  if (result.status !== 0) throw new Error(`gcc failed (status ${result.status}):\n${result.stderr}`);
}
