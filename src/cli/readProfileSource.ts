import { dirname, isAbsolute, join } from "node:path";
import { InputError } from "../errors/InputError.js";
import type { ReadNamedFile } from "../profile/ReadNamedFile.js";
import type { CliIo } from "./CliIo.js";
import { fileErrorReason } from "./fileSystemIo.js";
import { readTextFile } from "./readInputFile.js";

/** The profile argument that means standard input, and the name messages give it. */
export const STDIN_PROFILE = { argument: "-", name: "<stdin>" } as const;

/** A duty profile's text, the name messages give it, and the reader of the files it names. */
export interface ProfileSource {
  readonly text: string;
  /** the path as given, or "<stdin>" */
  readonly name: string;
  /** reads a file the profile names: relative to the profile's folder, or to the working folder for standard input */
  readonly readNamed: ReadNamedFile;
}

/**
 * Read a duty profile's text from a file or, for `-`, from standard input (named "<stdin>" in
 * every message). The files a profile names are read relative to its folder; a profile read
 * from standard input has none, so they are read relative to the working folder. Messages about
 * a named file show the resolved path, so the user can open the file the message names.
 * @throws InputError (bad-file) for an unreadable profile or standard input that cannot be read
 */
export function readProfileSource(io: CliIo, file: string): ProfileSource {
  const fromStdin = file === STDIN_PROFILE.argument;
  const folder = fromStdin ? "" : dirname(file);
  const located = (path: string): string => (isAbsolute(path) || folder === "" ? path : join(folder, path));
  const readNamed: ReadNamedFile = Object.assign((path: string): string => readTextFile(io, located(path), "file named in the profile"), { displayName: located });
  if (!fromStdin) return { text: readTextFile(io, file, "duty profile"), name: file, readNamed };
  const stdinError = (found: string) => new InputError({ code: "bad-file", file: STDIN_PROFILE.name, line: 0, field: "", expected: "a duty profile on standard input", found });
  if (io.readStdin === undefined) throw stdinError("no standard input");
  let text: string;
  try {
    text = io.readStdin();
  } catch (error) {
    throw stdinError(fileErrorReason(error));
  }
  if (text.trim() === "") throw stdinError("nothing");
  return { text: text.includes("\r") ? text.replace(/\r\n?/g, "\n") : text, name: STDIN_PROFILE.name, readNamed };
}
