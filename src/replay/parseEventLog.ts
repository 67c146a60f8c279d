import { lazyCsv } from "../format/lazyCsv.js";
import { InputError, describeFound } from "../errors/InputError.js";
import { nearestKey } from "../errors/nearestKey.js";
import type { EventLog, LogLine } from "./EventLog.js";
import { LOG_COLUMNS, LOG_WORD_LIST, type LogColumn, type LogWord } from "./logWords.js";

const COLUMN_LIST = Object.keys(LOG_COLUMNS) as readonly LogColumn[];
const SECONDS = /^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/;
// date, "T" or a space, hours and minutes, optional seconds with fraction, optional zone
const TIMESTAMP = /^(\d{4})-(\d{2})-(\d{2})[T ](\d{2}):(\d{2})(?::(\d{2})(\.\d+)?)?(Z|[+-]\d{2}:?\d{2})?$/i;
const TIME_EXPECTED = "a time: seconds from the start of the log (a number such as 12.5) or an ISO 8601 timestamp such as 2026-03-02T06:15:00Z";

/**
 * Parse a field event log: a CSV file (RFC 4180, read by csv-parse) whose first line names the
 * columns (`time`, `event`, optionally `note`, in any order; see LOG_COLUMNS), then one line per
 * event. Lines starting with `#` and blank lines are skipped. Times are seconds (any number) or
 * ISO 8601 timestamps (`YYYY-MM-DDTHH:MM[:SS[.fff]]` with `Z` or an offset; no zone is read as UTC),
 * one kind for the whole file; they are counted from the first line (time zero) and must not
 * decrease. Event words are the closed vocabulary LOG_WORDS.
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
  const fail = (line: number, field: string, expected: string, found: string): InputError =>
    new InputError({ code: "bad-file", file, line, field, expected, found });
  let rows: { record: string[]; info: { lines: number } }[];
  try {
    rows = lazyCsv.parse(text, { info: true, comment: "#", skip_empty_lines: true, trim: true, relax_column_count: true, bom: true }) as unknown as typeof rows;
  } catch (error) {
    const e = error as { lines?: number; message?: string };
    throw fail(e.lines ?? 0, "", "a CSV file (comma-separated, RFC 4180)", describeFound(String(e.message ?? error)));
  }
  rows = rows.filter((r) => r.record.some((cell) => cell !== ""));
  const header = rows[0];
  if (header === undefined) throw fail(0, "", `a header line (${COLUMN_LIST.join(",")}) and at least one event line`, "an empty log");

  // the header: known columns, each once, time and event present
  const columnIndex = new Map<LogColumn, number>();
  header.record.forEach((raw, i) => {
    const name = raw.toLowerCase();
    if (!(COLUMN_LIST as readonly string[]).includes(name)) {
      const guess = nearestKey(name, COLUMN_LIST);
      const why = name === "ambient" ? " (a per-line ambient is not supported: each part's ambient comes from the profile)" : "";
      throw fail(header.info.lines, `column ${i + 1}`, `one of the columns ${COLUMN_LIST.join(", ")}${guess === undefined ? "" : ` (did you mean "${guess}"?)`}${why}`, describeFound(raw));
    }
    if (columnIndex.has(name as LogColumn)) throw fail(header.info.lines, `column ${i + 1}`, `each column once`, `a second "${name}" column`);
    columnIndex.set(name as LogColumn, i);
  });
  for (const required of ["time", "event"] as const)
    if (!columnIndex.has(required)) throw fail(header.info.lines, "", `a header line naming the columns ${COLUMN_LIST.join(", ")} (time and event required)`, describeFound(header.record.join(",")));
  if (rows.length < 2) throw fail(header.info.lines, "", "at least one event line after the header", "a header only");

  const lines: LogLine[] = [];
  let timeKind: "seconds" | "timestamp" | undefined;
  let first = 0;
  let startEpochMs: number | undefined;
  for (const row of rows.slice(1)) {
    const line = row.info.lines;
    if (row.record.length > header.record.length)
      throw fail(line, "", `at most ${header.record.length} cells, as the header names`, `${row.record.length} cells`);
    const cell = (column: LogColumn): string => {
      const i = columnIndex.get(column);
      return i === undefined ? "" : (row.record[i] ?? "");
    };
    const timeText = cell("time");
    if (timeText === "") throw fail(line, "time", TIME_EXPECTED, "nothing");
    let kind: "seconds" | "timestamp";
    let value: number;
    if (SECONDS.test(timeText)) {
      kind = "seconds";
      value = Number(timeText);
      if (!Number.isFinite(value)) throw fail(line, "time", TIME_EXPECTED, describeFound(timeText));
    } else {
      const ms = timestampMs(timeText);
      if (ms === undefined) throw fail(line, "time", TIME_EXPECTED, describeFound(timeText));
      kind = "timestamp";
      value = ms;
    }
    if (timeKind === undefined) {
      timeKind = kind;
      first = value;
      if (kind === "timestamp") startEpochMs = value;
    } else if (kind !== timeKind)
      throw fail(line, "time", `${timeKind === "seconds" ? "seconds (a number)" : "an ISO 8601 timestamp"} like the first line (line ${lines[0]!.line})`, describeFound(timeText));
    const timeS = kind === "seconds" ? value - first : (value - first) / 1000;
    const previous = lines[lines.length - 1];
    if (previous !== undefined && timeS < previous.timeS)
      throw fail(line, "time", `a time at or after the previous line's (line ${previous.line}: ${JSON.stringify(previous.timeText)})`, describeFound(timeText));
    const wordText = cell("event");
    const word = wordText.toLowerCase();
    if (!(LOG_WORD_LIST as readonly string[]).includes(word)) {
      const guess = wordText === "" ? undefined : nearestKey(word, LOG_WORD_LIST);
      throw fail(line, "event", `one of the event words ${LOG_WORD_LIST.join(", ")}${guess === undefined ? "" : ` (did you mean "${guess}"?)`}`, wordText === "" ? "nothing" : describeFound(wordText));
    }
    lines.push({ line, timeS, timeText, word: word as LogWord, note: cell("note") });
  }
  return { file, lines, timeKind: timeKind!, ...(startEpochMs === undefined ? {} : { startEpochMs }) };
}

/** Milliseconds since 1970-01-01T00:00:00Z of an ISO 8601 timestamp, or undefined when it is not one (or not a real date). */
function timestampMs(text: string): number | undefined {
  const m = TIMESTAMP.exec(text);
  if (m === null) return undefined;
  const [year, month, day, hour, minute] = [1, 2, 3, 4, 5].map((i) => Number(m[i]));
  const second = m[6] === undefined ? 0 : Number(m[6]);
  const fraction = m[7] === undefined ? 0 : Number(m[7]);
  if (month! < 1 || month! > 12 || day! < 1 || hour! > 23 || minute! > 59 || second > 59) return undefined;
  const base = Date.UTC(year!, month! - 1, day!, hour!, minute!, second);
  // Date.UTC rolls 31 April over into May: refuse a day the month does not have
  if (new Date(base).getUTCDate() !== day) return undefined;
  let offsetMin = 0;
  const zone = m[8];
  if (zone !== undefined && zone.toUpperCase() !== "Z") {
    const digits = zone.replace(":", "");
    const h = Number(digits.slice(1, 3));
    const min = Number(digits.slice(3, 5));
    if (h > 23 || min > 59) return undefined;
    offsetMin = (zone[0] === "-" ? -1 : 1) * (h * 60 + min);
  }
  return base + fraction * 1000 - offsetMin * 60_000;
}
