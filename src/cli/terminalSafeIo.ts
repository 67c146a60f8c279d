import type { CliIo } from "./CliIo.js";

/**
 * Control characters that can act on a terminal or reorder what it shows: C0 controls but tab
 * and newline, DEL, C1 controls (U+009B is a one-byte CSI), and the bidirectional overrides and
 * isolates of Unicode.
 * Source: ECMA-48, 5th ed. (1991), §5.2-5.3 (C0 and C1 control sets); Unicode Standard Annex #9
 * (bidirectional algorithm), §2 (explicit directional formatting characters).
 */
const CONTROL = /[\u0000-\u0008\u000b-\u001f\u007f-\u009f\u202a-\u202e\u2066-\u2069]/g;

/**
 * Text with every control character written out as a `\uXXXX` escape, so that a profile name, a
 * log note or a file name holding an escape sequence is shown, never obeyed. JSON output keeps
 * its meaning: JSON.stringify already escapes C0 controls, and `\u007f` and the others are valid
 * JSON escapes of the same characters.
 */
export function escapeControlCharacters(text: string): string {
  return text.replace(CONTROL, (c) => `\\u${c.charCodeAt(0).toString(16).padStart(4, "0")}`);
}

/**
 * The same io with stdout and stderr escaped (escapeControlCharacters): runCli wraps every run in
 * it, so no user text reaches the terminal raw. The progress line, which writes its own
 * carriage returns and erase sequences, is left as it is.
 */
export function terminalSafeIo(io: CliIo): CliIo {
  return { ...io, out: (text) => io.out(escapeControlCharacters(text)), err: (text) => io.err(escapeControlCharacters(text)) };
}
