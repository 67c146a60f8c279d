import type { LogWord } from "./logWords.js";

/** One line of a field event log, parsed. */
export interface LogLine {
  /** 1-based line in the file */
  readonly line: number;
  /** seconds from the log's first line [s] */
  readonly timeS: number;
  /** the time as written */
  readonly timeText: string;
  readonly word: LogWord;
  /** the note column ("" when absent) */
  readonly note: string;
}

/** A parsed field event log (`heatledger replay`): lines in file order, times non-decreasing. */
export interface EventLog {
  readonly file: string;
  readonly lines: readonly LogLine[];
  /** how the times were written: seconds, or ISO 8601 timestamps */
  readonly timeKind: "seconds" | "timestamp";
  /** for timestamps: the first line's time in milliseconds since 1970-01-01T00:00:00Z (UTC) */
  readonly startEpochMs?: number;
}

/**
 * The log line in effect at a time: the last line whose time is at or before it (the first line
 * for earlier times). Binary search, O(log lines).
 */
export function logLineAt(log: EventLog, timeS: number): LogLine {
  let lo = 0;
  let hi = log.lines.length - 1;
  while (lo < hi) {
    const mid = (lo + hi + 1) >> 1;
    if (log.lines[mid]!.timeS <= timeS) lo = mid;
    else hi = mid - 1;
  }
  return log.lines[lo]!;
}

/**
 * A time of the log as the unit's clock read it: an ISO 8601 UTC timestamp for a timestamped log
 * (to the millisecond), undefined for a log in seconds.
 */
export function logTimestamp(log: EventLog, timeS: number): string | undefined {
  return log.startEpochMs === undefined ? undefined : new Date(log.startEpochMs + Math.round(timeS * 1000)).toISOString();
}
