import { resolve } from "node:path";
import { InputError, withLocation } from "../errors/InputError.js";
import { type StructuredText, parseStructuredText } from "../format/parseStructuredText.js";
import { inputLimit, limitWords } from "../format/inputLimits.js";
import type { CliIo } from "./CliIo.js";
import { fileErrorReason } from "./fileSystemIo.js";

/**
 * Read a text file for a command, turning "missing" or "unreadable" into one clear InputError
 * naming the file (never a stack trace). The process's reader refuses folders, devices, pipes,
 * files above the size limit and bytes that are not UTF-8 (fileSystemIo.ts); here the text is
 * measured again (for any CliIo) and old Mac line ends (a CR alone) become newlines, so that
 * line numbers count them.
 * @throws InputError (code bad-file) naming the file and the reason
 */
export function readTextFile(io: CliIo, path: string, what: string): string {
  let text: string;
  try {
    text = io.readFile(path);
  } catch (error) {
    const reason = (error as NodeJS.ErrnoException).code === "ENOENT" ? "no such file" : fileErrorReason(error);
    throw new InputError({ code: "bad-file", file: path, line: 0, field: "", expected: `a readable ${what}`, found: reason });
  }
  if (text.length > inputLimit("maxInputMiB") * 1024 * 1024)
    throw new InputError({ code: "bad-file", file: path, line: 0, field: "", expected: `a readable ${what}`, found: `more than ${limitWords("maxInputMiB", "MiB")}` });
  return text.includes("\r") ? text.replace(/\r\n?/g, "\n") : text;
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
 * Refuse an output path that cannot be written or exists unless force is set: commands call
 * this before the work, so a long run does not end in that refusal. Cannot be written: a folder,
 * or a folder that is missing or read-only (CliIo.outputProblem).
 * @throws InputError (code bad-option, field flag) when the path exists and force is not set, or
 *   cannot be written
 */
export function refuseExistingOutput(io: CliIo, path: string | undefined, force: boolean, flag: string): void {
  if (path === undefined) return;
  const problem = io.outputProblem?.(path);
  if (problem !== undefined)
    throw new InputError({ code: "bad-option", file: path, line: 0, field: flag, expected: "a file that can be written", found: problem });
  if (force || !io.exists(path)) return;
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
 * Refuse one path given to two output flags (`--csv out.csv --cycles out.csv`): the second
 * write would replace the first. Paths are compared as resolved from the working folder. Call it
 * with every output flag of a command, before the work.
 * @param outputs [flag, path] pairs; an undefined path (flag not given) is skipped
 * @throws InputError (code bad-option) naming both flags
 */
export function refuseSharedOutputs(outputs: readonly (readonly [flag: string, path: string | undefined])[]): void {
  const seen = new Map<string, string>();
  for (const [flag, path] of outputs) {
    if (path === undefined) continue;
    const key = resolve(path);
    const first = seen.get(key);
    if (first !== undefined)
      throw new InputError({ code: "bad-option", file: path, line: 0, field: flag, expected: `a path other than the one given to ${first}`, found: "the same path" });
    seen.set(key, flag);
  }
}

/**
 * Write an output file, refusing to overwrite an existing one unless force is set (no data is
 * lost without asking). A failed write (no space, no permission, a folder) is bad input naming
 * the path and the reason, never an internal error.
 * @throws InputError (code bad-option, field flag)
 */
export function writeOutputFile(io: CliIo, path: string, text: string, force: boolean, flag: string): void {
  refuseExistingOutput(io, path, force, flag);
  try {
    io.writeFile(path, text);
  } catch (error) {
    throw new InputError({ code: "bad-option", file: path, line: 0, field: flag, expected: "a file that can be written", found: fileErrorReason(error) });
  }
}
