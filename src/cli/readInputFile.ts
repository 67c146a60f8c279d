import { InputError, withLocation } from "../errors/InputError.js";
import { type StructuredText, parseStructuredText } from "../format/parseStructuredText.js";
import type { CliIo } from "./CliIo.js";

/**
 * Read a text file for a command, turning "missing" or "unreadable" into one clear InputError
 * naming the file (never a stack trace).
 */
export function readTextFile(io: CliIo, path: string, what: string): string {
  try {
    return io.readFile(path);
  } catch (error) {
    const reason = (error as NodeJS.ErrnoException).code === "ENOENT" ? "no such file" : (error as Error).message;
    throw new InputError({ code: "bad-file", file: path, line: 0, field: "", expected: `a readable ${what}`, found: reason });
  }
}

/**
 * Read and parse a YAML/JSON file, then run a parser over its data; any InputError the parser
 * raises is re-homed onto the file with the line of each field.
 */
export function readStructuredFile<T>(io: CliIo, path: string, what: string, parse: (data: unknown, text: StructuredText) => T): T {
  const text = parseStructuredText(readTextFile(io, path, what), path);
  try {
    return parse(text.data, text);
  } catch (error) {
    if (error instanceof InputError) throw withLocation(error, path, "", text.lineOf);
    throw error;
  }
}

/**
 * Refuse an output path that exists unless force is set: commands call this before the work, so
 * a long run does not end in that refusal.
 * @throws InputError (code bad-option, field flag) when the path exists and force is not set
 */
export function refuseExistingOutput(io: CliIo, path: string | undefined, force: boolean, flag: string): void {
  if (path === undefined || force || !io.exists(path)) return;
  throw new InputError({
    code: "bad-option",
    file: path,
    line: 0,
    field: flag,
    expected: "a path that does not exist yet (or add --force to overwrite)",
    found: "an existing file",
  });
}

/**
 * Write an output file, refusing to overwrite an existing one unless force is set (no data is
 * lost without asking).
 */
export function writeOutputFile(io: CliIo, path: string, text: string, force: boolean, flag: string): void {
  refuseExistingOutput(io, path, force, flag);
  io.writeFile(path, text);
}
