import { readFileSync, readdirSync } from "node:fs";
import { setFlagsFromString } from "node:v8";
import { runInNewContext } from "node:vm";
import { describe, expect, test } from "vitest";
import { InputError } from "../../src/errors/InputError.js";
import { lazyCsv } from "../../src/format/lazyCsv.js";
import type { DutyProfile } from "../../src/profile/DutyProfile.js";
import { defaultCircuitModels } from "../../src/profile/defaultCircuitModels.js";
import { loadProfile } from "../../src/profile/loadProfile.js";
import { ProfileStress } from "../../src/profile/ProfileStress.js";
import { type SimulateOptions, simulateProfile } from "../../src/profile/simulateProfile.js";
import { logLineAt } from "../../src/replay/EventLog.js";
import { EventLogScanner, type TextSource } from "../../src/replay/EventLogScanner.js";
import { parseEventLog } from "../../src/replay/parseEventLog.js";
import { replayProfile } from "../../src/replay/replayEventLog.js";
import { replayLog, replayShell } from "../../src/replay/replayLog.js";
import { textPieces } from "../../src/replay/textPieces.js";
import { expectClose } from "../helpers/expectClose.js";
import { CART_PARTS } from "../helpers/cartParts.js";

const PROFILES = new URL("../../profiles/", import.meta.url);
const LOGS = new URL("logs/", PROFILES);
const pump = (): DutyProfile => loadProfile(readFileSync(new URL("irrigation-pump-decade.yaml", PROFILES), "utf8"), "profiles/irrigation-pump-decade.yaml");

/** An invented one-part 48 V cart (the same kind of circuit as the other replay tests). */
const CART = `name: invented 48 V cart
ambient: 30 degC
${CART_PARTS}events:
  - power-up: {}
  - fault: { type: overloaded-bus, load: { kind: resistive, resistance: 10 ohm } }
`;

/** Everything a run hands its visitors and returns, for a bit-for-bit comparison. */
function recorded(profile: DutyProfile, stressOn: DutyProfile, run: (options: SimulateOptions) => { endTimeS: number }) {
  const stress = new ProfileStress(stressOn, { mode: "open" });
  const points: number[] = [];
  const events: string[] = [];
  const result = run({
    models: defaultCircuitModels,
    onEvent: (event, temperatures) => {
      stress.addEvent(event);
      events.push(`${event.index} ${event.kind} ${event.label} ${event.startS} ${event.durationS} ${event.outcome} ${temperatures.peakTemperatureC.join(" ")}`);
    },
    onPoint: (t, temperatureC, kind, index) => {
      stress.addPoint(t, temperatureC, kind, index);
      points.push(t, index, ...temperatureC);
    },
  });
  void profile;
  return { result, points, events, stress: stress.finish(result.endTimeS) };
}

/** A log of `count` lines made as it is read (never held whole): a start, a status line, a switch-off and a long pause, over and over. */
function generatedLog(count: number): TextSource {
  let i = -1;
  let t = 0;
  const words = ["power-up", "note", "power-down", "note"];
  const gaps = [90, 30, 60, 600];
  return () => {
    if (i >= count) return undefined;
    if (i++ < 0) return "time,event,note\n";
    let text = "";
    for (let k = 0; k < 64 && i <= count; k++, i++) {
      text += `${t},${words[(i - 1) % 4]},\n`;
      t += gaps[(i - 1) % 4]!;
    }
    i--;
    return text;
  };
}

/** The message of the InputError a streamed replay throws ("" when it runs). */
function replayMessage(profile: DutyProfile, text: string, pieceChars = 4096): string {
  try {
    replayLog(profile, textPieces(text, pieceChars), "logs/unit9.csv", { models: defaultCircuitModels });
    return "";
  } catch (error) {
    if (error instanceof InputError) return error.message;
    throw error;
  }
}

describe("the log scanner reads CSV as csv-parse does", () => {
  // Outside check: csv-parse (a general-purpose RFC 4180 reader) with the options the replay used
  // before it streamed gives the records and their end lines; the scanner must find the same cells
  // on the same lines, whatever size the pieces of text come in.
  const logs: [string, string][] = [
    ...readdirSync(LOGS).filter((f) => f.endsWith(".csv")).map((f): [string, string] => [f, readFileSync(new URL(f, LOGS), "utf8")]),
    ["CRLF line ends", readFileSync(new URL("irrigation-pump-returned-unit.csv", LOGS), "utf8").replace(/\n/g, "\r\n")],
    [
      "quotes, comments, blanks, a byte-order mark",
      '\uFEFF# exported\ntime , event,note\n\n0,power-up, "a, b" \n5,"note","say ""hi"""\n,,\n  # indented comment\n7,short,"two\nlines"\n9,note,cut # here\n12 ,  POWER-DOWN ,\n20,note,no newline at the end',
    ],
  ];
  test.each(logs)("%s", (_name, text) => {
    const rows = (lazyCsv.parse(text, { info: true, comment: "#", skip_empty_lines: true, trim: true, relax_column_count: true, bom: true }) as unknown as { record: string[]; info: { lines: number } }[]).filter((r) =>
      r.record.some((c) => c !== ""),
    );
    const header = rows[0]!.record.map((c) => c.toLowerCase());
    const expected = rows.slice(1).map((r) => ({ line: r.info.lines, timeText: r.record[header.indexOf("time")], word: r.record[header.indexOf("event")]!.toLowerCase(), note: r.record[header.indexOf("note")] ?? "" }));
    for (const pieceChars of [1, 3, 7, 65_536]) {
      const scanner = new EventLogScanner(textPieces(text, pieceChars), "x.csv");
      const scanned: (typeof expected)[number][] = [];
      while (scanner.next()) scanned.push({ line: scanner.line, timeText: scanner.timeText, word: scanner.word, note: scanner.note });
      expect(scanned).toEqual(expected);
      // the same through the streamed replay's own pieces
      const lines: number[] = [];
      replayLog(pump(), textPieces(text, pieceChars), "x.csv", { models: defaultCircuitModels, onEvent: (e) => lines.push(Number(/^line (\d+)/.exec(e.label)![1])) });
      expect(lines).toEqual(expected.map((e) => e.line));
    }
  });
});

describe("replayLog streams a log into the simulation", () => {
  // Consistency of the plumbing: the streamed replay and the earlier whole-log path (every line's
  // event in one array, simulateProfile on it) hand the visitors the same events and points and
  // return the same results, bit for bit (toEqual on the numbers, no tolerance).
  const cases: [string, () => DutyProfile, string][] = [
    ["the bundled returned-unit log", pump, readFileSync(new URL("irrigation-pump-returned-unit.csv", LOGS), "utf8")],
    [
      "a log of every word in seconds",
      () => loadProfile(CART, "cart.yaml"),
      "time,event,note\n0,power-up,a\n40,note,\n70,power-down,\n100,short,\n103,overload,\n104.5,trip,\n200,lockout,\n290,power-up,\n290.9,note,\n400,note,end\n",
    ],
  ];
  test.each(cases)("%s: the same results as the whole-log path", (_name, load, text) => {
    const profile = load();
    const log = parseEventLog(text, "u.csv");
    const whole = replayProfile(profile, log);
    const before = recorded(profile, whole, (options) => simulateProfile(whole, options));
    let streamed: ReturnType<typeof replayLog> | undefined;
    const after = recorded(profile, replayShell(profile), (options) => {
      streamed = replayLog(profile, textPieces(text, 13), "u.csv", options);
      return streamed.simulation;
    });
    expect(after.result).toEqual(before.result);
    expect(after.events).toEqual(before.events);
    expect(after.points).toEqual(before.points);
    expect(after.stress).toEqual(before.stress);
    // the first exceedance's line: the last line at or before it, as the whole log says
    streamed!.simulation.parts.forEach((p, i) => {
      const line = p.firstExceedanceS === undefined ? null : logLineAt(log, p.firstExceedanceS);
      expect(streamed!.exceedanceLines[i]?.line ?? null).toBe(line?.line ?? null);
    });
    expect(streamed!.log).toEqual({ file: "u.csv", lines: log.lines.length, spanS: log.lines.at(-1)!.timeS, timeKind: log.timeKind, ...(log.startEpochMs === undefined ? {} : { startEpochMs: log.startEpochMs }) });
  });

  test("a first exceedance at the end of a line's window belongs to the last line at that time", () => {
    // the short heats the part past its limit only in the last instants of its 800 ms; two notes
    // share the time the window ends at
    const profile = loadProfile(CART.replace("maxTemperature: 150 degC", "maxTemperature: 62 degC"), "cart.yaml");
    const text = "time,event\n0,short\n0.8,note\n0.8,note\n5,note\n";
    const replay = replayLog(profile, textPieces(text), "u.csv", { models: defaultCircuitModels });
    const t = replay.simulation.parts[0]!.firstExceedanceS!;
    expect(replay.exceedanceLines[0]!.line).toBe(logLineAt(parseEventLog(text, "u.csv"), t).line);
  });

  // Memory: a log made line by line as it is read is replayed with the stress layer; the heap after
  // a full collection at the 5,000th and at the 45,000th event differs by far less than the 40,000
  // lines would take if they were held (about 1.2 kB each as records and events before streaming:
  // 48 MB). Memory is counted, not timed.
  test("the heap stays flat however long the log", () => {
    setFlagsFromString("--expose-gc");
    const gc = runInNewContext("gc") as () => void;
    const profile = loadProfile(CART, "cart.yaml");
    const stress = new ProfileStress(replayShell(profile), { mode: "open" });
    const heapAt: number[] = [];
    const replay = replayLog(profile, generatedLog(50_000), "long.csv", {
      models: defaultCircuitModels,
      onEvent: (event) => {
        stress.addEvent(event);
        if (event.index === 5_000 || event.index === 45_000) {
          gc();
          heapAt.push(process.memoryUsage().heapUsed);
        }
      },
      onPoint: (t, c, k, i) => stress.addPoint(t, c, k, i),
    });
    expect(replay.log.lines).toBe(50_000);
    expect(heapAt).toHaveLength(2);
    expect(heapAt[1]! - heapAt[0]!).toBeLessThan(4 * 2 ** 20);
  });
});

describe("replayLog refuses a bad log on its line", () => {
  const good = (n: number): string => Array.from({ length: n }, (_, i) => `${i * 100},${i % 2 === 0 ? "power-up" : "power-down"},`).join("\n");
  test.each([
    ["a time going backwards deep in the log", `time,event,note\n${good(5000)}\n10,note,\n`, 'logs/unit9.csv:5002: time: expected a time at or after the previous line\'s (line 5001: "499900"), found "10"'],
    [
      "an unknown event deep in the log",
      `time,event,note\n${good(3000)}\n300000,reboot,\n`,
      'logs/unit9.csv:3002: event: expected one of the event words power-up, short, overload, converter-early, trip, power-down, lockout, note, found "reboot"',
    ],
    ["mixed time formats", `time,event,note\n${good(10)}\n2026-06-01T06:00:00Z,note\n`, 'logs/unit9.csv:12: time: expected seconds (a number) like the first line (line 2), found "2026-06-01T06:00:00Z"'],
    ["garbage with no line break", "x".repeat(3_000_000), "logs/unit9.csv:1: expected lines of at most 1048576 characters (a CSV text file), found a longer line"],
    [
      "a long line of garbage: the message quotes its start",
      `time,event\n${"z".repeat(5000)}\n`,
      `logs/unit9.csv:2: time: expected a time: seconds from the start of the log (a number such as 12.5) or an ISO 8601 timestamp such as 2026-03-02T06:15:00Z, found "${"z".repeat(57)}"... (5000 characters)`,
    ],
    ["binary garbage", `\u0001\u0002zz\u00ff,\u0000q\n${"\u0003".repeat(100)}\n`, 'logs/unit9.csv:1: column 1: expected one of the columns time, event, note, ambient, measured:<part id>, found "\\u0001\\u0002zz\u00ff"'],
    [
      "a measured column of no part",
      "time,event,measured:R9\n0,power-up,30\n",
      'logs/unit9.csv:1: measured:R9: expected a measured column of a part of cart.yaml (measured:R1), found "measured:R9"',
    ],
    [
      "a line before the attempt above it has ended",
      `time,event,note\n${good(40)}\n4000,short,\n4000.5,note,\n`,
      'logs/unit9.csv:43: time: expected a time at least 4000.8 s from the start of the log: the short attempt of line 42 (at 4000 s) lasts 0.8 s in the profile\'s circuit, and the model cannot end it early, found "4000.5"',
    ],
  ])("%s", (_name, text, message) => {
    expect(replayMessage(loadProfile(CART, "cart.yaml"), text)).toBe(message);
  });
});

describe("measured columns are compared with the replay", () => {
  // Outside check. One "short" line into a 10 ohm series resistor on a 48 V bus with no source
  // resistance: P = V²/R = 230.4 W for the whole 30 s timeout (Joule heating; Hayt, Kemmerly &
  // Durbin, Engineering Circuit Analysis, 8th ed. (2012), §2.2 (from memory)); the single RC stage
  // (2 K/W, 5 s) rises as P·R_th·(1 − e^(−t/τ)) and then cools as e^(−(t−30)/τ) (first-order step
  // response; lumped capacitance, Incropera et al., Fundamentals of Heat and Mass Transfer, 7th ed.
  // (2011), §5.1 and §5.3). Measurements written from that formula leave residuals at rounding
  // level; measurements 2 K lower leave a mean and RMS of 2 K.
  const SHORT = `name: one short
ambient: 25 degC
parts:
  - id: R
    role: resistor
    network: { form: foster, stages: [{ r: 2 K/W, tau: 5 s }] }
    limits: { maxTemperature: 600 degC }
circuit:
  topology: series-resistor
  busVoltage: 48 V
  capacitance: 1 mF
  resistance: 10 ohm
  completion: { fraction: 0.9, timeout: 30 s }
  discharge: { kind: none }
events: [{ wait: 1 s }]
`;
  const riseK = (t: number): number => {
    const full = ((48 * 48) / 10) * 2;
    return t <= 30 ? full * (1 - Math.exp(-t / 5)) : full * (1 - Math.exp(-6)) * Math.exp(-(t - 30) / 5);
  };
  const times = [0, 31, 33, 36, 40, 47, 60];
  const logOf = (offsetK: number, ambient?: (t: number) => number): string =>
    `time,event,measured:R${ambient === undefined ? "" : ",ambient"}\n` +
    times
      .map((t, i) => `${t},${i === 0 ? "short" : "note"},${25 + (ambient === undefined ? 0 : ambient(t) - 25) + riseK(t) + offsetK}${ambient === undefined ? "" : `,${ambient(t)}`}`)
      .join("\n");
  const compare = (text: string) => replayLog(loadProfile(SHORT, "short.yaml"), textPieces(text), "m.csv", { models: defaultCircuitModels }).measured!;

  test("measurements from the closed form: residuals at rounding level", () => {
    const m = compare(logOf(0));
    expect(m.ambient).toBe("profile");
    expect(m.measuredAmbient).toBeNull();
    expect(m.parts[0]!.count).toBe(times.length);
    expect(Math.abs(m.parts[0]!.rmsK!)).toBeLessThan(1e-9);
  });

  test("measurements 2 K below: mean +2 K, RMS 2 K, the largest residual on its line", () => {
    const m = compare(logOf(-2)).parts[0]!;
    expectClose(m.meanK!, 2, { rel: 1e-9 });
    expectClose(m.rmsK!, 2, { rel: 1e-9 });
    expectClose(m.maxAbsK!, 2, { rel: 1e-9 });
    expect(m.maxAt!.line).toBeGreaterThanOrEqual(2);
  });

  test("a measured ambient 12 K above the profile's is the base of the comparison, and is summarized", () => {
    const m = compare(logOf(0, (t) => 37 + (t > 35 ? 1 : 0)));
    expect(m.ambient).toBe("measured");
    expect(m.measuredAmbient).toEqual({ count: times.length, meanC: (37 * 3 + 38 * 4) / 7, minC: 37, maxC: 38 });
    expect(Math.abs(m.parts[0]!.rmsK!)).toBeLessThan(1e-9);
    // the same measurements compared on the profile's ambient would be 12-13 K off
    const onProfile = compare(logOf(0, (t) => 37 + (t > 35 ? 1 : 0)).replace(",ambient", ",note"));
    expect(onProfile.ambient).toBe("profile");
    expectClose(onProfile.parts[0]!.meanK!, -(12 * 3 + 13 * 4) / 7, { rel: 1e-9 });
  });

  test("empty cells are lines without a measurement; a log without measured columns compares nothing", () => {
    const m = compare("time,event,measured:R\n0,short,25\n40,note,\n50,note,\n").parts[0]!;
    expect(m.count).toBe(1);
    expect(replayLog(loadProfile(SHORT, "short.yaml"), textPieces("time,event\n0,short\n40,note\n"), "m.csv", { models: defaultCircuitModels }).measured).toBeNull();
  });
});
