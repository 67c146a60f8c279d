import { closeSync, openSync, readSync, statSync } from "node:fs";
import { InputError } from "../errors/InputError.js";
import type { TextSource } from "../replay/EventLogScanner.js";
import { fileErrorReason } from "./fileSystemIo.js";

/** Bytes read from a file at a time by fileTextSource. */
export const FILE_BLOCK_BYTES = 1 << 16;

/**
 * A text file read in blocks of FILE_BLOCK_BYTES as a TextSource, so a log of any length is
 * replayed in the memory of one block and one line (the limit on whole files, maxInputMiB, does
 * not apply). A regular file or a pipe (`/dev/stdin` fed by `zcat`) is read; a folder or a device
 * is refused. Bytes that are not UTF-8 are refused with the line they are on (WHATWG TextDecoder
 * in fatal, streaming mode: a character cut between blocks is joined, never replaced). The file is
 * closed at its end, at the first error, or by `close()` (a reader that stops early).
 * Source: Unicode 15.0 §3.9 (UTF-8 well-formedness).
 * Cost O(size of the file) time, O(FILE_BLOCK_BYTES) memory.
 * @throws InputError (code bad-file) naming the file: missing, unreadable, not a file, not UTF-8
 */
export function fileTextSource(path: string, what: string): TextSource & { readonly close: () => void } {
  const fail = (found: string, line = 0): InputError => new InputError({ code: "bad-file", file: path, line, field: "", expected: `a readable ${what} (UTF-8 text)`, found });
  let fd: number;
  try {
    const stats = statSync(path); // before open: opening a pipe waits for a writer
    if (stats.isDirectory()) throw fail("a folder");
    if (!stats.isFile() && !stats.isFIFO()) throw fail("a device, not a file");
    fd = openSync(path, "r");
  } catch (error) {
    if (error instanceof InputError) throw error;
    throw fail((error as NodeJS.ErrnoException).code === "ENOENT" ? "no such file" : fileErrorReason(error));
  }
  const block = Buffer.alloc(FILE_BLOCK_BYTES);
  const decoder = new TextDecoder("utf-8", { fatal: true });
  let open = true;
  let lines = 1;
  const close = (): void => {
    if (open) closeSync(fd);
    open = false;
  };
  const source = (): string | undefined => {
    if (!open) return undefined;
    let n: number;
    try {
      n = readSync(fd, block, 0, FILE_BLOCK_BYTES, null);
    } catch (error) {
      close();
      throw fail(fileErrorReason(error));
    }
    let text: string;
    try {
      text = n === 0 ? decoder.decode() : decoder.decode(block.subarray(0, n), { stream: true });
    } catch {
      close();
      // the line of the first malformed byte: the lines before this block, then this block's
      const loose = new TextDecoder("utf-8").decode(block.subarray(0, n));
      const at = loose.indexOf("\uFFFD");
      const line = lines + (at < 0 ? 0 : loose.slice(0, at).split("\n").length - 1);
      throw fail(`bytes that are not UTF-8 on line ${line}`, line);
    }
    if (n === 0) {
      close();
      return text === "" ? undefined : text;
    }
    for (let at = text.indexOf("\n"); at >= 0; at = text.indexOf("\n", at + 1)) lines++;
    return text;
  };
  return Object.assign(source, { close });
}
