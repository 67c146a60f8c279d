import type { EventLog, LogLine } from "./EventLog.js";
import { EventLogScanner } from "./EventLogScanner.js";
import { textPieces } from "./textPieces.js";

/**
 * Parse a whole field event log held in memory into its lines (EventLogScanner reads it: the
 * format, the errors and the line numbers are the scanner's; measured columns are read and
 * checked but not kept here, see replayLog for the comparison). A replay of a long log streams it
 * instead (replayLog): this array costs memory per line.
 * Source: log format of our own (docs/field-logs.md).
 * Cost O(size of the file).
 * @param text the file's contents
 * @param file the path, for messages
 * @throws InputError naming the file, the line and the column, what was expected and what was found
 *   (an empty log, an unknown column or event word with the nearest valid one, a bad time, a time
 *   going backwards, a missing cell)
 * @example
 * parseEventLog(bundled("logs/irrigation-pump-returned-unit.csv"), "returned-unit.csv").lines.length // => 79
 */
export function parseEventLog(text: string, file: string): EventLog {
  const scanner = new EventLogScanner(textPieces(text), file);
  const lines: LogLine[] = [];
  while (scanner.next()) lines.push({ line: scanner.line, timeS: scanner.timeS, timeText: scanner.timeText, word: scanner.word, note: scanner.note });
  return { file, lines, timeKind: scanner.timeKind!, ...(scanner.startEpochMs === undefined ? {} : { startEpochMs: scanner.startEpochMs }) };
}
