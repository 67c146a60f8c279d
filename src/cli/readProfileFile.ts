import type { DutyProfile } from "../profile/DutyProfile.js";
import { loadProfile } from "../profile/loadProfile.js";
import type { CliIo } from "./CliIo.js";
import { readProfileSource } from "./readProfileSource.js";

// A file of its own, not in readInputFile.ts: the network commands import that file and must not
// load the profile schema (test/cli/commandLoading.test.ts).

/**
 * Read and load a duty profile, from a file or from standard input for `-` (readProfileSource):
 * the networks and power-trace files it names are read relative to the profile's folder (an
 * absolute path as written), and messages about them show that resolved path, so the user can
 * open the file the message names.
 * @throws InputError for an unreadable or invalid profile, or a file it names
 */
export function readProfileFile(io: CliIo, file: string): DutyProfile {
  const source = readProfileSource(io, file);
  return loadProfile(source.text, source.name, source.readNamed);
}
