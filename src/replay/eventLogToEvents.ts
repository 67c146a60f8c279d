import { InputError } from "../errors/InputError.js";
import type { DutyProfile, FaultSpec, ProfileEvent } from "../profile/DutyProfile.js";
import type { EventLog } from "./EventLog.js";
import type { LogWord } from "./logWords.js";

/** The field of the one-line repeat that pads a charging line out to the next line: `log-line:<n>`. */
export const LOG_LINE_FIELD = "log-line:";

/** Words that start a pre-charge attempt. */
const CHARGING: ReadonlySet<LogWord> = new Set(["power-up", "short", "overload", "converter-early"]);

/** The fault type a fault word borrows its values from. */
const BORROWED: Partial<Record<LogWord, FaultSpec["type"]>> = { overload: "overloaded-bus", "converter-early": "converter-early" };

/**
 * Turn a field event log into the duty-profile events that say the same thing, resolved (SI), so
 * the profile machinery (expandTimeline, simulateProfile) replays it unchanged. Line i at time t_i
 * with the next line at t_(i+1) becomes:
 * - a charging word (power-up, short, overload, converter-early): the attempt, inside a repeat of
 *   count 1 whose period is t_(i+1) − t_i, so the time left after the attempt is the profile's gap
 *   (the bus stays as the attempt left it: on after a completed attempt, draining after an aborted
 *   one). An attempt that lasts past the next line makes the walk throw; replayEventLog turns that
 *   into a message on the next line's time. On the last line the attempt runs its course.
 * - power-down and trip: `power-down` off for t_(i+1) − t_i (the discharge path drains the bus);
 *   lockout: `lockout` for that long; note: `wait` for that long (the bus as it was).
 * `short` is the profile format's shorted-output fault; `overload` and `converter-early` take the
 * values (the load, the converter's power) of the first fault of that type in the profile's own
 * events, retry blocks and repeats included, found in file order.
 * Source: event mapping of our own (docs/field-logs.md).
 * Cost O(lines + profile events).
 * @throws InputError (on the log's line and `event` column) for a charging word when the profile
 *   has no circuit, or a borrowed fault word when the profile has no such fault
 * @example
 * const log = parseEventLog(bundled("logs/irrigation-pump-returned-unit.csv"), "returned-unit.csv");
 * eventLogToEvents(profile("irrigation-pump-decade.yaml"), log).length // => 79
 */
export function eventLogToEvents(profile: DutyProfile, log: EventLog): ProfileEvent[] {
  const eventOf = logEventMaker(profile, log.file);
  return log.lines.map((line, i) => {
    const next = log.lines[i + 1];
    return eventOf(line.line, line.word, line.note, next === undefined ? undefined : next.timeS - line.timeS);
  });
}

/**
 * The mapping of eventLogToEvents for one line at a time, as a replay reads the log: the returned
 * function turns a line (its file line, word, note, and the time to the next line, undefined on
 * the last line) into its profile event. The profile's borrowed faults are looked up once.
 * Cost O(1) per line after the first lookup of each borrowed fault.
 * @throws InputError (from the returned function, on the line's `event` column) as eventLogToEvents
 */
export function logEventMaker(profile: DutyProfile, file: string): (line: number, word: LogWord, note: string, gapS: number | undefined) => ProfileEvent {
  const borrowed = new Map<FaultSpec["type"], FaultSpec | undefined>();
  return (line, word, note, gapS) => {
    const fail = (expected: string): InputError => new InputError({ code: "bad-file", file, line, field: "event", expected, found: JSON.stringify(word) });
    const label = `line ${line}: ${word}${note === "" ? "" : ` (${note})`}`;
    const field = `${LOG_LINE_FIELD}${line}`;
    const span = gapS ?? 0;
    if (CHARGING.has(word)) {
      if (profile.circuit === undefined) throw fail(`a profile with a circuit for a pre-charge attempt (${profile.file} has none)`);
      let attempt: ProfileEvent;
      if (word === "power-up") attempt = { kind: "power-up", field, label };
      else if (word === "short") attempt = { kind: "fault", field, label, fault: { type: "shorted-output", load: { kind: "short" } } };
      else {
        const type = BORROWED[word]!;
        if (!borrowed.has(type)) borrowed.set(type, firstFault(profile.events, type));
        const fault = borrowed.get(type);
        if (fault === undefined) throw fail(`a profile whose events include a fault of type ${type}, to take the "${word}" values from (${profile.file} has none)`);
        attempt = { kind: "fault", field, label, fault };
      }
      return gapS === undefined ? attempt : { kind: "repeat", field, count: 1, periodS: span, events: [attempt] };
    }
    if (word === "power-down" || word === "trip") return { kind: "power-down", field, label, offS: span };
    if (word === "lockout") return { kind: "lockout", field, label, durationS: span };
    return { kind: "wait", field, label, durationS: span };
  };
}

/** The first fault of a type among profile events (depth first, file order), or undefined. */
function firstFault(events: readonly ProfileEvent[], type: FaultSpec["type"]): FaultSpec | undefined {
  for (const e of events) {
    if (e.kind === "fault" && e.fault.type === type) return e.fault;
    if (e.kind === "retry" && e.fault?.type === type) return e.fault;
    if (e.kind === "repeat") {
      const inner = firstFault(e.events, type);
      if (inner !== undefined) return inner;
    }
  }
  return undefined;
}

/** Count the events a profile states at its top level and in nested repeats (what a replay ignores). */
export function countProfileEvents(events: readonly ProfileEvent[]): number {
  return events.reduce((n, e) => n + 1 + (e.kind === "repeat" ? countProfileEvents(e.events) : 0), 0);
}
