import { InputError } from "../errors/InputError.js";
import type { DutyProfile, ProfileEvent } from "../profile/DutyProfile.js";
import { type SimulateOptions, type SimulationResult, simulateProfile } from "../profile/simulateProfile.js";
import type { EventLog } from "./EventLog.js";
import { EventLogScanner, type TextSource } from "./EventLogScanner.js";
import { LOG_LINE_FIELD, countProfileEvents, logEventMaker } from "./eventLogToEvents.js";
import type { LogWord } from "./logWords.js";
import { MEASURED_PREFIX } from "./logWords.js";
import { type MeasuredComparison, MeasuredResiduals } from "./MeasuredResiduals.js";

/**
 * The lines of a log as a replay reads them, one at a time: EventLogScanner over a file, or
 * eventLogCursor over a parsed EventLog. The fields hold the current line (see EventLogScanner).
 */
export interface LogCursor {
  readonly file: string;
  readonly headerLine: number;
  readonly measuredParts: readonly string[];
  readonly hasAmbient: boolean;
  readonly timeKind: "seconds" | "timestamp" | undefined;
  readonly startEpochMs: number | undefined;
  readonly count: number;
  readonly line: number;
  readonly timeS: number;
  readonly timeText: string;
  readonly word: LogWord;
  readonly note: string;
  readonly measuredC: Float64Array;
  readonly ambientC: number;
  next(): boolean;
}

/** The log line in effect at a part's first exceedance (the last line at or before it). */
export interface ExceedanceLine {
  readonly line: number;
  readonly event: LogWord;
  readonly note: string;
}

/** What one replay of one log found: everything a report or a fleet summary row needs. */
export interface LogReplay {
  /** the profile that was run: the duty profile's parts, circuit and limits, no events of its own, no occursPerYear (see replayShell) */
  readonly profile: DutyProfile;
  readonly simulation: SimulationResult;
  /** how many events the duty profile itself states (ignored by the replay) */
  readonly ignoredProfileEvents: number;
  readonly log: {
    readonly file: string;
    /** event lines */
    readonly lines: number;
    /** seconds from the first event line to the last */
    readonly spanS: number;
    readonly timeKind: "seconds" | "timestamp";
    /** for timestamps: the first line's time in ms since 1970-01-01T00:00:00Z */
    readonly startEpochMs?: number;
  };
  /** per part (profile order): the log line in effect when it first went above its limit; null if never */
  readonly exceedanceLines: readonly (ExceedanceLine | null)[];
  /** the measured columns against the replay; null when the log has none */
  readonly measured: MeasuredComparison | null;
}

/** How many recent lines a replay keeps to place a first exceedance (the lines around the step it happened in). */
const RECENT_LINES = 8;

/**
 * The profile a streamed replay runs and its stress layer is built on: the duty profile's name,
 * parts, circuit and limits, with no events (the log's are pulled as they are read) and without
 * `occursPerYear` (it describes the profile's own events, not the log).
 * Cost O(1).
 * @example
 * replayShell(profile("irrigation-pump-decade.yaml")).events.length // => 0
 */
export function replayShell(profile: DutyProfile): DutyProfile {
  const { occursPerYear: _dropped, ...rest } = profile;
  return { ...rest, events: [] };
}

/**
 * Replay a field log read piece by piece (a TextSource: the CLI reads the file in blocks) on a
 * duty profile's parts, circuit and limits, in memory that does not grow with the log: each line
 * is scanned (EventLogScanner), turned into its profile event (logEventMaker) and pulled into the
 * running simulation (simulateProfile with `events`) once the next line's time is known, so no
 * list of lines or events is ever built. What replayEventLog finds on a parsed log, this finds on
 * the stream, the same numbers bit for bit (the same event objects reach the same simulator).
 * Build the stress layer (ProfileStress, `mode: "open"`) on `replayShell(profile)` and pass its
 * visitors in `options`, as `simulate` does.
 * Source: wiring of our own over the profile simulator (docs/field-logs.md).
 * Cost that of simulateProfile on the log's events; memory O(parts × modes + longest line).
 * @throws InputError naming the file and line: a bad line (EventLogScanner), a line the profile
 *   cannot replay (logEventMaker), a line that comes before the attempt above it has ended (on its
 *   `time`), a measured column naming no part of the profile, a circuit value the models reject
 * @example
 * const pump = profile("irrigation-pump-decade.yaml");
 * const text = bundled("logs/irrigation-pump-returned-unit.csv");
 * replayLog(pump, textPieces(text), "returned-unit.csv", { models: defaultCircuitModels }).exceedanceLines[0].line // => 80
 */
export function replayLog(profile: DutyProfile, source: TextSource, file: string, options: SimulateOptions): LogReplay {
  return replayLogCursor(profile, new EventLogScanner(source, file), options);
}

/**
 * replayLog over any LogCursor (EventLogScanner, or eventLogCursor over a parsed log).
 * Cost and errors as replayLog.
 */
export function replayLogCursor(profile: DutyProfile, cursor: LogCursor, options: SimulateOptions): LogReplay {
  const file = cursor.file;
  const parts = profile.parts;
  // the measured columns must name the profile's parts
  const columnPart = cursor.measuredParts.map((id) => {
    const i = parts.findIndex((p) => p.id === id);
    if (i < 0)
      throw new InputError({
        code: "bad-file",
        file,
        line: cursor.headerLine,
        field: `${MEASURED_PREFIX}${id}`,
        expected: `a measured column of a part of ${profile.file} (${parts.map((p) => `${MEASURED_PREFIX}${p.id}`).join(", ")})`,
        found: JSON.stringify(`${MEASURED_PREFIX}${id}`),
      });
    return i;
  });
  const comparing = columnPart.length > 0 || cursor.hasAmbient;
  const residuals = comparing ? new MeasuredResiduals(cursor.measuredParts, cursor.hasAmbient) : undefined;

  // recent lines, oldest first (a ring of RECENT_LINES), to place a first exceedance and re-home an overrun
  const recent = Array.from({ length: RECENT_LINES }, () => ({ ordinal: -1, line: 0, timeS: 0, timeText: "", word: "note" as LogWord, note: "" }));
  let newest = -1;
  const remember = (): void => {
    newest++;
    const r = recent[newest % RECENT_LINES]!;
    r.ordinal = newest;
    r.line = cursor.line;
    r.timeS = cursor.timeS;
    r.timeText = cursor.timeText;
    r.word = cursor.word;
    r.note = cursor.note;
  };
  const recentByOrdinal = (ordinal: number): (typeof recent)[number] | undefined => {
    const r = recent[ordinal % RECENT_LINES];
    return r !== undefined && r.ordinal === ordinal ? r : undefined;
  };

  // first exceedances: the line in effect is the last line at or before the exact time; later
  // lines at that same time are read after it is found, so a placement stays open until a line
  // after that time (or the end of the log) closes it
  const exceedance: (ExceedanceLine | null)[] = parts.map(() => null);
  const openAt: (number | undefined)[] = parts.map(() => undefined);
  let open = 0;
  const onExceedance = (i: number, timeS: number): void => {
    for (let k = newest; k >= 0 && k > newest - RECENT_LINES; k--) {
      const r = recentByOrdinal(k)!;
      if (r.timeS <= timeS) {
        exceedance[i] = { line: r.line, event: r.word, note: r.note };
        break;
      }
    }
    // before every kept line (a crossing at the start): the first line, once read, is in effect
    if (exceedance[i] === null && newest >= 0) {
      const oldest = recentByOrdinal(Math.max(0, newest - RECENT_LINES + 1))!;
      exceedance[i] = { line: oldest.line, event: oldest.word, note: oldest.note };
    }
    openAt[i] = timeS;
    open++;
    options.onExceedance?.(i, timeS);
  };
  const placeLine = (): void => {
    for (let i = 0; i < parts.length; i++) {
      const t = openAt[i];
      if (t === undefined) continue;
      if (cursor.timeS <= t || exceedance[i] === null) exceedance[i] = { line: cursor.line, event: cursor.word, note: cursor.note };
      else {
        openAt[i] = undefined;
        open--;
      }
    }
  };

  // measurements wait until the replay reaches their line: the temperature at a line's time is
  // the last step end before its event's first point
  const pending: { ordinal: number; line: number; timeS: number; values: Float64Array; ambientC: number }[] = [];
  const spare: (typeof pending)[number][] = [];
  const ambientOf = parts.map((p) => p.ambientC);
  const lastStepEndC = Float64Array.from(ambientOf);
  let heldAmbientC = Number.NaN;
  const settle = (throughOrdinal: number): void => {
    while (pending.length > 0 && pending[0]!.ordinal <= throughOrdinal) {
      const m = pending.shift()!;
      if (!Number.isNaN(m.ambientC)) heldAmbientC = m.ambientC;
      for (let k = 0; k < columnPart.length; k++) {
        const measuredC = m.values[k]!;
        if (Number.isNaN(measuredC)) continue;
        const i = columnPart[k]!;
        const replayedC = Number.isNaN(heldAmbientC) ? lastStepEndC[i]! : heldAmbientC + (lastStepEndC[i]! - ambientOf[i]!);
        residuals!.add(k, m.line, m.timeS, replayedC, measuredC);
      }
      spare.push(m);
    }
  };
  const queueMeasurement = (ordinal: number): void => {
    let any = !Number.isNaN(cursor.ambientC);
    for (let k = 0; k < cursor.measuredC.length && !any; k++) any = !Number.isNaN(cursor.measuredC[k]!);
    if (!any) return;
    if (!Number.isNaN(cursor.ambientC)) residuals!.addAmbient(cursor.ambientC);
    const m = spare.pop() ?? { ordinal: 0, line: 0, timeS: 0, values: new Float64Array(cursor.measuredC.length), ambientC: Number.NaN };
    m.ordinal = ordinal;
    m.line = cursor.line;
    m.timeS = cursor.timeS;
    m.values.set(cursor.measuredC);
    m.ambientC = cursor.ambientC;
    pending.push(m);
  };

  const eventOf = logEventMaker(profile, file);
  // the event of line i is made once line i + 1 is read (its time closes line i's window)
  function* events(): Generator<ProfileEvent> {
    if (!cursor.next()) return;
    remember();
    if (open > 0) placeLine();
    if (comparing) queueMeasurement(newest);
    for (;;) {
      const current = recentByOrdinal(newest)!;
      const { line, word, note, timeS } = current;
      const more = cursor.next();
      if (more) {
        remember();
        if (open > 0) placeLine();
        if (comparing) queueMeasurement(newest);
      }
      yield eventOf(line, word, note, more ? cursor.timeS - timeS : undefined);
      if (!more) return;
    }
  }

  let lastStepEndS = 0;
  let lastEvent = -1;
  const userPoint = options.onPoint;
  const onPoint: SimulateOptions["onPoint"] = (timeS, temperatureC, kind, eventIndex) => {
    if (comparing && eventIndex !== lastEvent) {
      settle(eventIndex);
      lastEvent = eventIndex;
    }
    if (kind === "step-end") {
      lastStepEndS = timeS;
      if (comparing) for (let i = 0; i < temperatureC.length; i++) lastStepEndC[i] = temperatureC[i]!;
    }
    userPoint?.(timeS, temperatureC, kind, eventIndex);
  };

  let simulation: SimulationResult;
  const shell = replayShell(profile);
  try {
    simulation = simulateProfile(shell, { ...options, onPoint, onExceedance, events: { [Symbol.iterator]: events } });
  } catch (error) {
    if (!(error instanceof InputError)) throw error;
    throw overrunError(error, file, recentByOrdinal, newest, lastStepEndS);
  }
  if (comparing) settle(Number.POSITIVE_INFINITY);
  const last = recentByOrdinal(newest)!;
  return {
    profile: shell,
    simulation,
    ignoredProfileEvents: countProfileEvents(profile.events),
    log: { file, lines: cursor.count, spanS: last.timeS, timeKind: cursor.timeKind!, ...(cursor.startEpochMs === undefined ? {} : { startEpochMs: cursor.startEpochMs }) },
    exceedanceLines: exceedance,
    measured: residuals?.result() ?? null,
  };
}

/**
 * An attempt that lasts past the next line makes its one-count repeat overrun its period: the
 * message is re-homed onto the next line's `time`, with the attempt's length (the model cannot end
 * an attempt early). Other errors pass unchanged.
 */
function overrunError(
  error: InputError,
  file: string,
  recentByOrdinal: (ordinal: number) => { ordinal: number; line: number; timeS: number; timeText: string; word: LogWord } | undefined,
  newest: number,
  lastStepEndS: number,
): InputError {
  const overrun = error.problems.map((p) => new RegExp(`^${LOG_LINE_FIELD}(\\d+)\\.period$`).exec(p.field)).find((m) => m !== null);
  if (overrun == null) return error;
  let at: ReturnType<typeof recentByOrdinal>;
  for (let k = newest; k >= 0 && k > newest - RECENT_LINES && at === undefined; k--) if (recentByOrdinal(k)?.line === Number(overrun[1])) at = recentByOrdinal(k);
  const next = at === undefined ? undefined : recentByOrdinal(at.ordinal + 1);
  if (at === undefined || next === undefined) return error;
  return new InputError({
    code: "out-of-range",
    file,
    line: next.line,
    field: "time",
    expected:
      `a time at least ${formatSeconds(lastStepEndS)} s from the start of the log: the ${at.word} attempt of line ${at.line} ` +
      `(at ${formatSeconds(at.timeS)} s) lasts ${formatSeconds(lastStepEndS - at.timeS)} s in the profile's circuit, and the model cannot end it early`,
    found: JSON.stringify(next.timeText),
  });
}

/** Seconds for a message: up to 6 significant digits, no exponent for ordinary values. */
function formatSeconds(s: number): string {
  return String(Number(s.toPrecision(6)));
}

/**
 * A LogCursor over a log parsed whole (parseEventLog), so replayEventLog runs the same streamed
 * replay. A parsed log keeps no measured columns.
 * Cost O(1) per line.
 */
export function eventLogCursor(log: EventLog): LogCursor {
  let at = -1;
  const cursor = {
    file: log.file,
    headerLine: 0,
    measuredParts: [] as readonly string[],
    hasAmbient: false,
    timeKind: log.timeKind,
    startEpochMs: log.startEpochMs,
    count: 0,
    line: 0,
    timeS: 0,
    timeText: "",
    word: "note" as LogWord,
    note: "",
    measuredC: new Float64Array(0),
    ambientC: Number.NaN,
    next(): boolean {
      const l = log.lines[at + 1];
      if (l === undefined) return false;
      at++;
      cursor.count = at + 1;
      cursor.line = l.line;
      cursor.timeS = l.timeS;
      cursor.timeText = l.timeText;
      cursor.word = l.word;
      cursor.note = l.note;
      return true;
    },
  };
  return cursor;
}
