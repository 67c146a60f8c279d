import { accessSync, closeSync, constants, fstatSync, openSync, readSync, renameSync, statSync, unlinkSync, writeFileSync } from "node:fs";
import { basename, dirname, join } from "node:path";
import { inputLimit, limitWords } from "../format/inputLimits.js";

// The file-system half of processIo (CliIo.ts): bounded reads, checks of an output path before a
// run, and atomic writes. Errors are Node errors with a `code` (ENOENT, EISDIR, ...) or one of the
// codes below; fileErrorReason turns either into the words a message shows.

/** A refusal of the reader (not a system error): the reason is the message. */
const REFUSED = "EREFUSED";

function refused(message: string): Error {
  return Object.assign(new Error(message), { code: REFUSED });
}

function kindOf(stats: { isDirectory(): boolean; isCharacterDevice(): boolean; isFIFO(): boolean; isSocket(): boolean }): string {
  if (stats.isDirectory()) return "a folder";
  if (stats.isCharacterDevice()) return "a device";
  if (stats.isFIFO()) return "a pipe";
  if (stats.isSocket()) return "a socket";
  return "not a regular file";
}

/**
 * Read a UTF-8 text file, measured before it is read: a folder, a device (`/dev/zero`), a pipe
 * or a socket is refused (none has a size to check), a file larger than
 * INPUT_LIMITS.maxInputMiB is refused naming the limit, and bytes that are not UTF-8 are refused
 * with the line they are on (never replaced silently). A byte-order mark is dropped.
 * Source: Unicode 15.0 §3.9 (UTF-8 well-formedness: WHATWG TextDecoder in fatal mode).
 * Cost O(size of the file).
 * @throws Error with code ENOENT, EACCES, ... or EREFUSED (see fileErrorReason)
 */
export function readBoundedTextFile(path: string): string {
  const before = statSync(path); // before open: opening a pipe would wait for a writer
  if (!before.isFile()) throw refused(kindOf(before));
  const fd = openSync(path, "r");
  try {
    const stats = fstatSync(fd);
    if (!stats.isFile()) throw refused(kindOf(stats));
    const maxBytes = inputLimit("maxInputMiB") * 1024 * 1024;
    if (stats.size > maxBytes) throw refused(`a file of ${(stats.size / 1024 / 1024).toFixed(1)} MiB, above the limit of ${limitWords("maxInputMiB", "MiB")}`);
    const buffer = Buffer.alloc(stats.size);
    let read = 0;
    while (read < stats.size) {
      const n = readSync(fd, buffer, read, stats.size - read, read);
      if (n === 0) break;
      read += n;
    }
    return decodeUtf8(buffer.subarray(0, read));
  } finally {
    closeSync(fd);
  }
}

/**
 * Read standard input to its end as UTF-8 text, with the same bounds as a file: more than
 * INPUT_LIMITS.maxInputMiB is refused naming the limit, bytes that are not UTF-8 with their
 * line. A terminal is refused (a profile is piped or redirected, never typed), so a run never
 * waits for input nobody gives. A non-blocking pipe that has no data yet is waited for.
 * Cost O(size of the input).
 * @throws Error with code EREFUSED (see fileErrorReason) or a system code
 */
export function readBoundedStdin(): string {
  if (process.stdin.isTTY === true) throw refused("a terminal (pipe a profile in, or redirect a file with <)");
  const maxBytes = inputLimit("maxInputMiB") * 1024 * 1024;
  const chunks: Buffer[] = [];
  let total = 0;
  const chunk = Buffer.alloc(1 << 16);
  for (;;) {
    let n: number;
    try {
      n = readSync(0, chunk, 0, chunk.length, null);
    } catch (error) {
      if ((error as NodeJS.ErrnoException).code === "EAGAIN") {
        Atomics.wait(new Int32Array(new SharedArrayBuffer(4)), 0, 0, 5); // no data yet: wait 5 ms
        continue;
      }
      if ((error as NodeJS.ErrnoException).code === "EOF") break;
      throw error;
    }
    if (n === 0) break;
    total += n;
    if (total > maxBytes) throw refused(`more than ${limitWords("maxInputMiB", "MiB")}`);
    chunks.push(Buffer.from(chunk.subarray(0, n)));
  }
  return decodeUtf8(Buffer.concat(chunks));
}

/** Decode UTF-8 strictly; name the line of the first malformed byte. */
function decodeUtf8(bytes: Uint8Array): string {
  try {
    return new TextDecoder("utf-8", { fatal: true }).decode(bytes);
  } catch {
    const loose = new TextDecoder("utf-8").decode(bytes);
    const at = loose.indexOf("\uFFFD");
    const line = at < 0 ? 0 : loose.slice(0, at).split(/\r\n|\r|\n/).length;
    throw refused(`bytes that are not UTF-8${line > 0 ? ` on line ${line}` : ""}`);
  }
}

/**
 * Why an output path cannot be written, checked before a run so that a long computation does not
 * end in that refusal: a folder, or a parent folder that is missing, not a folder or not
 * writable. Undefined when the path looks writable (an existing regular file or device is left
 * to the --force check).
 */
export function outputPathProblem(path: string): string | undefined {
  try {
    if (statSync(path).isDirectory()) return "a folder";
  } catch {
    // does not exist yet: the parent decides
  }
  const folder = dirname(path);
  let stats;
  try {
    stats = statSync(folder);
  } catch {
    return `the folder ${folder} does not exist`;
  }
  if (!stats.isDirectory()) return `${folder} is not a folder`;
  try {
    accessSync(folder, constants.W_OK);
  } catch {
    return `the folder ${folder} is not writable`;
  }
  return undefined;
}

/**
 * Write a text file atomically: the text goes to a temporary file in the same folder, which is
 * then renamed over the target, so an interrupted run (a kill, a full disk) never leaves a
 * truncated file under the name asked for; the temporary file is removed on failure. A target
 * that exists and is not a regular file (`/dev/stdout`) is written in place.
 * Source: POSIX.1-2017, rename() (atomic replacement within one file system).
 * @throws the Node error of the write (ENOSPC, EACCES, EISDIR, ...)
 */
export function writeFileAtomically(path: string, text: string): void {
  let special = false;
  try {
    special = !statSync(path).isFile() && !statSync(path).isDirectory();
  } catch {
    // a new file
  }
  if (special) {
    writeFileSync(path, text, "utf8");
    return;
  }
  const temporary = join(dirname(path), `.${basename(path)}.${process.pid}.${Date.now().toString(36)}.tmp`);
  try {
    writeFileSync(temporary, text, "utf8");
    renameSync(temporary, path);
  } catch (error) {
    try {
      unlinkSync(temporary);
    } catch {
      // nothing was left
    }
    throw error;
  }
}

/** System error codes of a read or write, in words. */
const REASONS: Readonly<Record<string, string>> = {
  ENOENT: "no such file or folder",
  EACCES: "permission denied",
  EPERM: "permission denied",
  EISDIR: "a folder",
  ENOTDIR: "a path through something that is not a folder",
  ENOSPC: "no space left on the device",
  EDQUOT: "the disk quota is used up",
  EROFS: "a read-only file system",
  EFBIG: "a file too large for the file system",
  ENAMETOOLONG: "a name too long",
  ELOOP: "a loop of symbolic links",
  EMFILE: "too many open files",
  EBUSY: "a busy file",
  EIO: "an input/output error",
};

/** The words for why a read or write failed: the refusal itself, or the system error's meaning and code. */
export function fileErrorReason(error: unknown): string {
  const e = error as NodeJS.ErrnoException;
  if (e?.code === REFUSED) return e.message;
  if (e?.code !== undefined && REASONS[e.code] !== undefined) return `${REASONS[e.code]} (${e.code})`;
  return e?.code ?? (error instanceof Error ? error.message : String(error));
}
