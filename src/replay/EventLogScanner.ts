import { InputError, describeFound } from "../errors/InputError.js";
import { nearestKey } from "../errors/nearestKey.js";
import { LOG_COLUMNS, LOG_WORD_LIST, MEASURED_PREFIX, type LogWord } from "./logWords.js";

/**
 * A source of a log's text, piece by piece in file order: each call returns the next piece (any
 * length, cut anywhere, even inside a line) or undefined at the end. The CLI reads the file in
 * blocks (`src/cli/fileTextSource.ts`); `textPieces` serves a string already in memory.
 */
export type TextSource = () => string | undefined;

/** Longest line the scanner holds [characters]: a longer one is refused, so a file with no line breaks is never read whole. */
export const MAX_LOG_LINE_CHARS = 1 << 20;

const SECONDS = /^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/;
// date, "T" or a space, hours and minutes, optional seconds with fraction, optional zone
const TIMESTAMP = /^(\d{4})-(\d{2})-(\d{2})[T ](\d{2}):(\d{2})(?::(\d{2})(\.\d+)?)?(Z|[+-]\d{2}:?\d{2})?$/i;
const TIME_EXPECTED = "a time: seconds from the start of the log (a number such as 12.5) or an ISO 8601 timestamp such as 2026-03-02T06:15:00Z";
const NUMBER = /^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/;
const FIXED_COLUMNS = Object.keys(LOG_COLUMNS).filter((c) => !c.startsWith(MEASURED_PREFIX));
const COLUMN_WORDS = `${FIXED_COLUMNS.join(", ")}, ${MEASURED_PREFIX}<part id>`;
const WORDS: ReadonlyMap<string, LogWord> = new Map(LOG_WORD_LIST.map((w) => [w, w]));

/**
 * Reads a field event log line by line from a TextSource, as the replay consumes it, in memory
 * that does not grow with the log: one line of text and one row of cells are held at a time, and
 * each line's values are left in this object's fields (`line`, `timeS`, `word`, ...), overwritten
 * by the next call of `next()` (copy what you keep).
 *
 * The format (docs/field-logs.md): CSV as RFC 4180 states it (comma-separated, double-quoted
 * cells with `""` for a quote, a quoted cell may span lines), with the first line naming the
 * columns (LOG_COLUMNS, any order, case-insensitive except the part id of a measured column);
 * a `#` outside quotes starts a comment to the end of the line; blank lines and lines of empty
 * cells are skipped; cells are trimmed; a leading byte-order mark is dropped. `line` is the file
 * line the record ends on (1-based, comments and blank lines counted). Times are seconds or
 * ISO 8601 timestamps, one kind per file, counted from the first line and never decreasing;
 * measured columns hold plain numbers in °C, an empty cell meaning "not measured on this line".
 * Source: RFC 4180 (CSV), ISO 8601 (times); the rest is a format of our own.
 * Cost O(characters) time, O(longest line + columns) memory.
 * @throws InputError naming the file, the line and the column, what was expected and what was
 *   found: an empty log, an unknown or repeated column (with the nearest valid one), an unknown
 *   event word (with the nearest one), a bad or backward time, a time of the other kind, a
 *   measured value that is not a number, a malformed quote, a line over MAX_LOG_LINE_CHARS
 */
export class EventLogScanner {
  /** the file, for messages */
  readonly file: string;
  /** the file line of the header */
  readonly headerLine: number;
  /** how many cells the header names */
  readonly columnCount: number;
  /** the part ids of the `measured:<part id>` columns, in header order */
  readonly measuredParts: readonly string[];
  /** whether the log has an `ambient` column */
  readonly hasAmbient: boolean;
  /** how the times are written (set by the first event line) */
  timeKind: "seconds" | "timestamp" | undefined;
  /** for timestamps: the first line's time in ms since 1970-01-01T00:00:00Z */
  startEpochMs: number | undefined;
  /** event lines read so far */
  count = 0;

  // the current event line (overwritten by next())
  /** 1-based file line the record ends on */
  line = 0;
  /** seconds from the first event line [s] */
  timeS = 0;
  /** the time as written */
  timeText = "";
  word: LogWord = "note";
  /** the note column ("" when absent) */
  note = "";
  /** measured temperature per measured column [°C]; NaN where the cell is empty */
  readonly measuredC: Float64Array;
  /** measured ambient [°C]; NaN where the cell is empty or there is no ambient column */
  ambientC = Number.NaN;

  private readonly source: TextSource;
  private buffer = "";
  private position = 0;
  private ended = false;
  /** file lines consumed up to `position` */
  private physical = 0;
  private readonly cells: string[] = [];
  private cellCount = 0;
  private readonly timeAt: number;
  private readonly eventAt: number;
  private readonly noteAt: number;
  private readonly ambientAt: number;
  private readonly measuredAt: readonly number[];
  private first = 0;
  private firstLine = 0;
  private previousLine = 0;
  private previousTimeText = "";

  /**
   * Read the header (the first line that is not a comment or blank).
   * @throws InputError for an empty log, a header only, or a bad header (see the class)
   */
  constructor(source: TextSource, file: string) {
    this.source = source;
    this.file = file;
    if (!this.readRecord()) throw this.fail(0, "", `a header line (time,event,note) and at least one event line`, "an empty log");
    this.headerLine = this.line;
    const header = this.cells.slice(0, this.cellCount);
    this.columnCount = header.length;
    const index = new Map<string, number>();
    const measuredParts: string[] = [];
    const measuredAt: number[] = [];
    header.forEach((raw, i) => {
      const lower = raw.toLowerCase();
      const isMeasured = lower.startsWith(MEASURED_PREFIX) && raw.length > MEASURED_PREFIX.length;
      const name = isMeasured ? `${MEASURED_PREFIX}${raw.slice(MEASURED_PREFIX.length).trim()}` : lower;
      if (!isMeasured && !FIXED_COLUMNS.includes(name)) {
        const guess = nearestKey(name, [...FIXED_COLUMNS, MEASURED_PREFIX.slice(0, -1)]);
        throw this.fail(this.headerLine, `column ${i + 1}`, `one of the columns ${COLUMN_WORDS}${guess === undefined ? "" : ` (did you mean "${guess}"?)`}`, describeCell(raw));
      }
      if (index.has(name)) throw this.fail(this.headerLine, `column ${i + 1}`, "each column once", `a second "${name}" column`);
      index.set(name, i);
      if (isMeasured) {
        measuredParts.push(name.slice(MEASURED_PREFIX.length));
        measuredAt.push(i);
      }
    });
    if (!index.has("time") || !index.has("event"))
      throw this.fail(this.headerLine, "", `a header line naming the columns ${COLUMN_WORDS} (time and event required)`, describeCell(header.join(",")));
    this.timeAt = index.get("time")!;
    this.eventAt = index.get("event")!;
    this.noteAt = index.get("note") ?? -1;
    this.ambientAt = index.get("ambient") ?? -1;
    this.hasAmbient = this.ambientAt >= 0;
    this.measuredParts = measuredParts;
    this.measuredAt = measuredAt;
    this.measuredC = new Float64Array(measuredAt.length);
  }

  /**
   * Move to the next event line; false at the end of the log.
   * @throws InputError for a bad line (see the class), or a log with a header and no event line
   */
  next(): boolean {
    if (!this.readRecord()) {
      if (this.count === 0) throw this.fail(this.headerLine, "", "at least one event line after the header", "a header only");
      return false;
    }
    const line = this.line;
    if (this.cellCount > this.columnCount) throw this.fail(line, "", `at most ${this.columnCount} cells, as the header names`, `${this.cellCount} cells`);
    const timeText = this.cell(this.timeAt);
    if (timeText === "") throw this.fail(line, "time", TIME_EXPECTED, "nothing");
    let kind: "seconds" | "timestamp";
    let value: number;
    if (SECONDS.test(timeText)) {
      kind = "seconds";
      value = Number(timeText);
      if (!Number.isFinite(value)) throw this.fail(line, "time", TIME_EXPECTED, describeCell(timeText));
    } else {
      const ms = timestampMs(timeText);
      if (ms === undefined) throw this.fail(line, "time", TIME_EXPECTED, describeCell(timeText));
      kind = "timestamp";
      value = ms;
    }
    if (this.timeKind === undefined) {
      this.timeKind = kind;
      this.first = value;
      this.firstLine = line;
      if (kind === "timestamp") this.startEpochMs = value;
    } else if (kind !== this.timeKind)
      throw this.fail(line, "time", `${this.timeKind === "seconds" ? "seconds (a number)" : "an ISO 8601 timestamp"} like the first line (line ${this.firstLine})`, describeCell(timeText));
    const timeS = kind === "seconds" ? value - this.first : (value - this.first) / 1000;
    if (this.count > 0 && timeS < this.timeS)
      throw this.fail(line, "time", `a time at or after the previous line's (line ${this.previousLine}: ${JSON.stringify(this.previousTimeText)})`, describeCell(timeText));
    const wordText = this.cell(this.eventAt);
    const word = WORDS.get(wordText) ?? WORDS.get(wordText.toLowerCase());
    if (word === undefined) {
      const guess = wordText === "" ? undefined : nearestKey(wordText.toLowerCase(), LOG_WORD_LIST);
      throw this.fail(line, "event", `one of the event words ${LOG_WORD_LIST.join(", ")}${guess === undefined ? "" : ` (did you mean "${guess}"?)`}`, wordText === "" ? "nothing" : describeCell(wordText));
    }
    for (let k = 0; k < this.measuredAt.length; k++) this.measuredC[k] = this.number(this.measuredAt[k]!, header(this.measuredParts[k]!));
    if (this.ambientAt >= 0) this.ambientC = this.number(this.ambientAt, "ambient");
    this.timeS = timeS;
    this.timeText = timeText;
    this.word = word;
    this.note = this.noteAt < 0 ? "" : this.cell(this.noteAt);
    this.previousLine = line;
    this.previousTimeText = timeText;
    this.count++;
    return true;
  }

  private cell(i: number): string {
    return i < this.cellCount ? this.cells[i]! : "";
  }

  /** A measured cell in °C: NaN when empty. */
  private number(i: number, field: string): number {
    const text = this.cell(i);
    if (text === "") return Number.NaN;
    const value = NUMBER.test(text) ? Number(text) : Number.NaN;
    if (!Number.isFinite(value)) throw this.fail(this.line, field, "a temperature in °C (a plain number such as 41.5), or nothing when not measured", describeCell(text));
    return value;
  }

  private fail(line: number, field: string, expected: string, found: string): InputError {
    return new InputError({ code: "bad-file", file: this.file, line, field, expected, found });
  }

  /** Make sure the buffer holds a whole line from `position` (or the rest of the file); false at the end of the file. */
  private fill(): boolean {
    if (this.ended || this.buffer.indexOf("\n", this.position) >= 0) return this.position < this.buffer.length;
    // pieces without a line break are collected and joined once (no growing string copied per piece)
    const parts = [this.position < this.buffer.length ? this.buffer.slice(this.position) : ""];
    let length = parts[0]!.length;
    for (;;) {
      let piece = this.source();
      if (piece === undefined) {
        this.ended = true;
        break;
      }
      // a byte-order mark at the very start is dropped
      if (this.physical === 0 && length === 0 && piece.charCodeAt(0) === 0xfeff) piece = piece.slice(1);
      parts.push(piece);
      length += piece.length;
      if (piece.includes("\n")) break;
      if (length > MAX_LOG_LINE_CHARS) throw this.fail(this.physical + 1, "", `lines of at most ${MAX_LOG_LINE_CHARS} characters (a CSV text file)`, "a longer line");
    }
    this.buffer = parts.join("");
    this.position = 0;
    return this.position < this.buffer.length;
  }

  /**
   * Read the next record with at least one non-empty cell into `cells`/`cellCount` and set `line`
   * to the file line it ends on; false at the end of the file.
   */
  private readRecord(): boolean {
    for (;;) {
      if (!this.fill()) return false;
      const buffer = this.buffer;
      const start = this.position;
      let end = buffer.indexOf("\n", start);
      if (end < 0) end = buffer.length;
      const stop = end > start && buffer.charCodeAt(end - 1) === 13 ? end - 1 : end;
      // one pass over the line: cells split at commas and trimmed, up to a "#" (a comment); a
      // quote before any "#" sends the record to the slow path
      let count = 0;
      let from = start;
      let any = false;
      let quoted = false;
      for (let i = start; ; i++) {
        const c = i < stop ? buffer.charCodeAt(i) : -1;
        if (c === 34) {
          quoted = true;
          break;
        }
        if (c === 44 || c === 35 || c === -1) {
          const cell = from === i ? "" : trimmed(buffer, from, i);
          if (cell !== "") any = true;
          this.cells[count++] = cell;
          if (c !== 44) break;
          from = i + 1;
        }
      }
      if (quoted) {
        if (this.readQuoted()) return true;
        continue;
      }
      this.position = end + 1;
      this.physical++;
      this.cellCount = count;
      this.line = this.physical;
      if (any) return true;
    }
  }

  /**
   * The slow path for a record with a quote: scan character by character (RFC 4180 §2: a quoted
   * cell may hold commas, line breaks and doubled quotes), taking more text while a quote is open.
   * The messages of a malformed quote follow csv-parse's wording. False when the record has no
   * non-empty cell (the caller reads on).
   */
  private readQuoted(): boolean {
    const startLine = this.physical + 1;
    for (;;) {
      const buffer = this.buffer;
      let i = this.position;
      let lines = 0;
      let count = 0;
      let any = false;
      let incomplete = false;
      for (;;) {
        // one cell: skip leading blanks
        while (i < buffer.length && (buffer[i] === " " || buffer[i] === "\t")) i++;
        let cell: string;
        let quotedEnd = -1;
        if (buffer[i] === '"') {
          let text = "";
          let j = i + 1;
          for (;;) {
            const q = buffer.indexOf('"', j);
            if (q < 0) {
              incomplete = true;
              break;
            }
            text += buffer.slice(j, q);
            if (buffer[q + 1] === '"') {
              text += '"';
              j = q + 2;
              continue;
            }
            if (q + 1 >= buffer.length && !this.ended) {
              incomplete = true;
              break;
            }
            quotedEnd = q + 1;
            break;
          }
          if (incomplete) break;
          for (let k = i; k < quotedEnd; k++) if (buffer.charCodeAt(k) === 10) lines++;
          cell = text;
          i = quotedEnd;
          while (i < buffer.length && (buffer[i] === " " || buffer[i] === "\t" || buffer[i] === "\r")) i++;
          const c = buffer[i];
          if (c !== undefined && c !== "," && c !== "\n" && c !== "#")
            throw this.fail(startLine + lines, "", "a CSV file (comma-separated, RFC 4180)", describeFound(`Invalid Closing Quote: got "${c}" at line ${startLine + lines} instead of delimiter, record delimiter, trimable character (if activated) or comment`));
        } else {
          let j = i;
          while (j < buffer.length && buffer[j] !== "," && buffer[j] !== "\n" && buffer[j] !== "#") {
            if (buffer[j] === '"')
              throw this.fail(startLine + lines, "", "a CSV file (comma-separated, RFC 4180)", describeFound(`Invalid Opening Quote: a quote is found on field ${count} at line ${startLine + lines}, value is ${JSON.stringify(buffer.slice(i, j).trim())}`));
            j++;
          }
          cell = buffer.slice(i, j).trim();
          i = j;
        }
        if (cell !== "") any = true;
        this.cells[count++] = cell;
        const c = buffer[i];
        if (c === ",") {
          i++;
          continue;
        }
        if (c === "#") {
          const nl = buffer.indexOf("\n", i);
          i = nl < 0 ? buffer.length : nl;
        }
        break;
      }
      if (incomplete) {
        if (this.ended) throw this.fail(startLine, "", "a CSV file (comma-separated, RFC 4180)", describeFound(`Quote Not Closed: the parsing is finished with an opening quote at line ${startLine}`));
        if (buffer.length - this.position > MAX_LOG_LINE_CHARS)
          throw this.fail(startLine, "", `records of at most ${MAX_LOG_LINE_CHARS} characters (a quote left open?)`, "a longer record");
        const piece = this.source();
        if (piece === undefined) this.ended = true;
        else this.buffer = buffer.slice(this.position) + piece;
        if (piece !== undefined) this.position = 0;
        continue;
      }
      // the record ends at a line break or the end of the text
      this.position = i < buffer.length ? i + 1 : buffer.length;
      this.physical += lines + 1;
      this.cellCount = count;
      this.line = this.physical;
      return any;
    }
  }
}

/** Longest cell quoted whole in a message [characters]: a longer one (a line of garbage) is cut. */
const QUOTED_CELL_CHARS = 60;

/** A cell as a message's "found": quoted, cut after QUOTED_CELL_CHARS with its length given. */
function describeCell(text: string): string {
  return text.length <= QUOTED_CELL_CHARS ? describeFound(text) : `${describeFound(text.slice(0, QUOTED_CELL_CHARS - 3))}... (${text.length} characters)`;
}

/** The field name of a measured column in messages. */
function header(part: string): string {
  return `${MEASURED_PREFIX}${part}`;
}

/** buffer[from, to) without blanks at either end. */
function trimmed(buffer: string, from: number, to: number): string {
  let a = from;
  let b = to;
  while (a < b && isBlank(buffer.charCodeAt(a))) a++;
  while (b > a && isBlank(buffer.charCodeAt(b - 1))) b--;
  return buffer.slice(a, b);
}

function isBlank(c: number): boolean {
  return c === 32 || c === 9 || c === 13 || c === 12 || c === 11 || c === 0xa0 || c === 0xfeff;
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
