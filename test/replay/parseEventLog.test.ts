import { describe, expect, test } from "vitest";
import { InputError } from "../../src/errors/InputError.js";
import { logLineAt, logTimestamp } from "../../src/replay/EventLog.js";
import { parseEventLog } from "../../src/replay/parseEventLog.js";

/** The message parseEventLog throws for a text, or "" when it parses. */
function messageOf(text: string): string {
  try {
    parseEventLog(text, "logs/unit7.csv");
    return "";
  } catch (error) {
    if (error instanceof InputError) return error.message;
    throw error;
  }
}

describe("parseEventLog reads a field event log", () => {
  test("seconds: counted from the first line, comments and blank lines skipped, file line numbers kept", () => {
    const log = parseEventLog("# unit 7, exported by the service tool\ntime,event,note\n\n100,power-up,morning\n130.5,short,cable\n# gap\n200,POWER-DOWN,\n", "u.csv");
    expect(log.timeKind).toBe("seconds");
    expect(log.startEpochMs).toBeUndefined();
    expect(log.lines).toEqual([
      { line: 4, timeS: 0, timeText: "100", word: "power-up", note: "morning" },
      { line: 5, timeS: 30.5, timeText: "130.5", word: "short", note: "cable" },
      { line: 7, timeS: 100, timeText: "200", word: "power-down", note: "" },
    ]);
    expect(logLineAt(log, 0).line).toBe(4);
    expect(logLineAt(log, 30.4).line).toBe(4);
    expect(logLineAt(log, 30.5).line).toBe(5);
    expect(logLineAt(log, 1e6).line).toBe(7);
    expect(logTimestamp(log, 5)).toBeUndefined();
  });

  test("ISO 8601 timestamps: zones and offsets honoured, no zone read as UTC, columns in any order", () => {
    const log = parseEventLog(
      "event,time\npower-up,2026-06-01T06:00:00Z\nshort,2026-06-01T08:00:01.250+02:00\npower-down,2026-06-01 06:10\nnote,2026-06-02T06:00:00-01:30\n",
      "u.csv",
    );
    expect(log.timeKind).toBe("timestamp");
    // 08:00:01.250 at +02:00 is 06:00:01.250 UTC; 06:00 at −01:30 is 07:30 UTC the next day
    expect(log.lines.map((l) => l.timeS)).toEqual([0, 1.25, 600, 86400 + 5400]);
    expect(logTimestamp(log, 1.25)).toBe("2026-06-01T06:00:01.250Z");
  });

  // Each bad input gives one message naming the file, the line and the column, what was expected
  // and what was found.
  test.each([
    ["an empty file", "", "logs/unit7.csv: expected a header line (time,event,note) and at least one event line, found an empty log"],
    ["comments only", "# nothing here\n\n", "logs/unit7.csv: expected a header line (time,event,note) and at least one event line, found an empty log"],
    ["a header only", "time,event\n", "logs/unit7.csv:1: expected at least one event line after the header, found a header only"],
    ["no event column", "time,note\n0,x\n", 'logs/unit7.csv:1: expected a header line naming the columns time, event, note, ambient, measured:<part id> (time and event required), found "time,note"'],
    ["a misspelt column", "time,evnt\n0,short\n", 'logs/unit7.csv:1: column 2: expected one of the columns time, event, note, ambient, measured:<part id> (did you mean "event"?), found "evnt"'],
    [
      "a measured ambient that is not a number",
      "time,event,ambient\n0,short,25\n5,note,warm\n",
      'logs/unit7.csv:3: ambient: expected a temperature in °C (a plain number such as 41.5), or nothing when not measured, found "warm"',
    ],
    [
      "a measured temperature with a unit",
      "time,event,measured:R1\n0,short,25 degC\n",
      'logs/unit7.csv:2: measured:R1: expected a temperature in °C (a plain number such as 41.5), or nothing when not measured, found "25 degC"',
    ],
    ["a measured column twice", "time,event,measured:R1,Measured:R1\n0,short,1,2\n", 'logs/unit7.csv:1: column 4: expected each column once, found a second "measured:R1" column'],
    ["a column twice", "time,event,time\n0,short,0\n", 'logs/unit7.csv:1: column 3: expected each column once, found a second "time" column'],
    [
      "an unknown event word",
      "time,event\n0,power-up\n10,shrot\n",
      'logs/unit7.csv:3: event: expected one of the event words power-up, short, overload, converter-early, trip, power-down, lockout, note (did you mean "short"?), found "shrot"',
    ],
    [
      "an event word nothing like a valid one",
      "time,event\n0,reboot-requested\n",
      'logs/unit7.csv:2: event: expected one of the event words power-up, short, overload, converter-early, trip, power-down, lockout, note, found "reboot-requested"',
    ],
    [
      "an empty event cell",
      "time,event\n0,\n",
      "logs/unit7.csv:2: event: expected one of the event words power-up, short, overload, converter-early, trip, power-down, lockout, note, found nothing",
    ],
    [
      "a time going backwards",
      "time,event\n0,power-up\n10,power-down\n5,power-up\n",
      'logs/unit7.csv:4: time: expected a time at or after the previous line\'s (line 3: "10"), found "5"',
    ],
    [
      "a time that is not a number",
      "time,event\n0,power-up\nten,power-down\n",
      'logs/unit7.csv:3: time: expected a time: seconds from the start of the log (a number such as 12.5) or an ISO 8601 timestamp such as 2026-03-02T06:15:00Z, found "ten"',
    ],
    [
      "a number with a unit",
      "time,event\n0,power-up\n10 s,power-down\n",
      'logs/unit7.csv:3: time: expected a time: seconds from the start of the log (a number such as 12.5) or an ISO 8601 timestamp such as 2026-03-02T06:15:00Z, found "10 s"',
    ],
    [
      "a date the month does not have",
      "time,event\n2026-02-30T06:00:00Z,power-up\n",
      'logs/unit7.csv:2: time: expected a time: seconds from the start of the log (a number such as 12.5) or an ISO 8601 timestamp such as 2026-03-02T06:15:00Z, found "2026-02-30T06:00:00Z"',
    ],
    [
      "a missing time",
      "time,event\n,power-up\n",
      "logs/unit7.csv:2: time: expected a time: seconds from the start of the log (a number such as 12.5) or an ISO 8601 timestamp such as 2026-03-02T06:15:00Z, found nothing",
    ],
    ["seconds after timestamps", "time,event\n2026-06-01T06:00:00Z,power-up\n12,power-down\n", 'logs/unit7.csv:3: time: expected an ISO 8601 timestamp like the first line (line 2), found "12"'],
    ["more cells than columns", "time,event\n0,power-up,x\n", "logs/unit7.csv:2: expected at most 2 cells, as the header names, found 3 cells"],
    [
      "an unclosed quote",
      'time,event\n"0,power-up\n',
      'logs/unit7.csv:2: expected a CSV file (comma-separated, RFC 4180), found "Quote Not Closed: the parsing is finished with an opening quote at line 2"',
    ],
  ])("%s", (_name, text, message) => {
    expect(messageOf(text)).toBe(message);
  });
});
