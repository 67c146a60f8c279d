import { InputError } from "../errors/InputError.js";
import type { DutyProfile, FaultSpec, ProfileEvent } from "../profile/DutyProfile.js";
import type { EventLog, LogLine } from "./EventLog.js";
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
  const fail = (line: LogLine, expected: string): InputError =>
    new InputError({ code: "bad-file", file: log.file, line: line.line, field: "event", expected, found: JSON.stringify(line.word) });
  const events: ProfileEvent[] = [];
  log.lines.forEach((line, i) => {
    const next = log.lines[i + 1];
    const gapS = next === undefined ? 0 : next.timeS - line.timeS;
    const label = `line ${line.line}: ${line.word}${line.note === "" ? "" : ` (${line.note})`}`;
    const field = `${LOG_LINE_FIELD}${line.line}`;
    if (CHARGING.has(line.word)) {
      if (profile.circuit === undefined) throw fail(line, `a profile with a circuit for a pre-charge attempt (${profile.file} has none)`);
      let attempt: ProfileEvent;
      if (line.word === "power-up") attempt = { kind: "power-up", field, label };
      else if (line.word === "short") attempt = { kind: "fault", field, label, fault: { type: "shorted-output", load: { kind: "short" } } };
      else {
        const type = BORROWED[line.word]!;
        const fault = firstFault(profile.events, type);
        if (fault === undefined) throw fail(line, `a profile whose events include a fault of type ${type}, to take the "${line.word}" values from (${profile.file} has none)`);
        attempt = { kind: "fault", field, label, fault };
      }
      events.push(next === undefined ? attempt : { kind: "repeat", field, count: 1, periodS: gapS, events: [attempt] });
    } else if (line.word === "power-down" || line.word === "trip") events.push({ kind: "power-down", field, label, offS: gapS });
    else if (line.word === "lockout") events.push({ kind: "lockout", field, label, durationS: gapS });
    else events.push({ kind: "wait", field, label, durationS: gapS });
  });
  return events;
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
