import { dirname, isAbsolute, join } from "node:path";
import type { DutyProfile } from "../profile/DutyProfile.js";
import { loadProfile } from "../profile/loadProfile.js";
import type { ReadNamedFile } from "../profile/ReadNamedFile.js";
import type { CliIo } from "./CliIo.js";
import { readTextFile } from "./readInputFile.js";

// A file of its own, not in readInputFile.ts: the network commands import that file and must not
// load the profile schema (test/cli/commandLoading.test.ts).

/**
 * Read and load a duty profile: the networks and power-trace files it names are read relative to
 * the profile's folder (an absolute path as written), and messages about them show that resolved
 * path, so the user can open the file the message names.
 * @throws InputError for an unreadable or invalid profile, or a file it names
 */
export function readProfileFile(io: CliIo, file: string): DutyProfile {
  const folder = dirname(file);
  const located = (path: string): string => (isAbsolute(path) ? path : join(folder, path));
  const readNamed: ReadNamedFile = Object.assign((path: string): string => readTextFile(io, located(path), "file named in the profile"), { displayName: located });
  return loadProfile(readTextFile(io, file, "duty profile"), file, readNamed);
}
