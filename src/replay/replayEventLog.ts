import { InputError } from "../errors/InputError.js";
import type { DutyProfile } from "../profile/DutyProfile.js";
import { type SimulateOptions, type SimulationResult, simulateProfile } from "../profile/simulateProfile.js";
import type { EventLog } from "./EventLog.js";
import { LOG_LINE_FIELD, countProfileEvents, eventLogToEvents } from "./eventLogToEvents.js";

/** What a replay found: the simulation of the log's events and the profile that was run. */
export interface ReplayResult {
  /** the profile that was run: the duty profile with its events replaced by the log's (see replayProfile) */
  readonly profile: DutyProfile;
  readonly simulation: SimulationResult;
  /** how many events the duty profile itself states (ignored by the replay) */
  readonly ignoredProfileEvents: number;
}

/**
 * The profile a replay runs: the duty profile's name, parts, circuit and limits with the log's
 * lines as its events (eventLogToEvents). `occursPerYear` is dropped: it describes the profile's
 * own events, not the log. Build the stress layer (ProfileStress, `mode: "open"`) on this profile.
 * Cost O(lines + profile events).
 * @throws InputError for a log line the profile cannot replay (see eventLogToEvents)
 * @example
 * const log = parseEventLog(bundled("logs/irrigation-pump-returned-unit.csv"), "returned-unit.csv");
 * replayProfile(profile("irrigation-pump-decade.yaml"), log).events.length // => 79
 */
export function replayProfile(profile: DutyProfile, log: EventLog): DutyProfile {
  const { occursPerYear: _dropped, ...rest } = profile;
  return { ...rest, events: eventLogToEvents(profile, log) };
}

/**
 * Replay a field event log on a duty profile's parts, circuit and limits: the log's lines become
 * the profile's events (eventLogToEvents; the profile's own events are ignored) and the profile is
 * simulated exactly as `simulate` runs it (simulateProfile: the capacitor's charge carried from
 * line to line, every part's temperature, peaks and the first time a part goes above its limit,
 * found exactly inside its step). Pass the same visitors as `simulate` (ProfileStress with
 * `mode: "open"`, built on `replayProfile(profile, log)`, for damage to date) through `options`,
 * and that replay profile as `replayed` so it is built once.
 * Source: wiring of our own over the profile simulator (docs/field-logs.md).
 * Cost that of simulateProfile on the log's events: O(lines × steps per event × parts × modes).
 * @throws InputError for a log line the profile cannot replay (see eventLogToEvents), a line that
 *   comes before the attempt of the line above it has ended (named on that line's `time`), or a
 *   circuit value the models reject
 * @example
 * const log = parseEventLog(bundled("logs/irrigation-pump-returned-unit.csv"), "returned-unit.csv");
 * replayEventLog(profile("irrigation-pump-decade.yaml"), log, { models: defaultCircuitModels }).simulation.verdict // => "fail"
 */
export function replayEventLog(profile: DutyProfile, log: EventLog, options: SimulateOptions, replayed: DutyProfile = replayProfile(profile, log)): ReplayResult {
  // the end of the last step seen: when the walk throws because an attempt outlasts its line's
  // period, the attempt's steps have all been pushed, so this is when the attempt ended
  let lastStepEndS = 0;
  const onPoint: SimulateOptions["onPoint"] = (timeS, temperatureC, kind, eventIndex) => {
    if (kind === "step-end") lastStepEndS = timeS;
    options.onPoint?.(timeS, temperatureC, kind, eventIndex);
  };
  try {
    const simulation = simulateProfile(replayed, { ...options, onPoint });
    return { profile: replayed, simulation, ignoredProfileEvents: countProfileEvents(profile.events) };
  } catch (error) {
    if (!(error instanceof InputError)) throw error;
    const overrun = error.problems.map((p) => new RegExp(`^${LOG_LINE_FIELD}(\\d+)\\.period$`).exec(p.field)).find((m) => m !== null);
    if (overrun == null) throw error;
    const at = log.lines.findIndex((l) => l.line === Number(overrun[1]));
    const line = log.lines[at]!;
    const next = log.lines[at + 1]!;
    throw new InputError({
      code: "out-of-range",
      file: log.file,
      line: next.line,
      field: "time",
      expected:
        `a time at least ${formatSeconds(lastStepEndS)} s from the start of the log: the ${line.word} attempt of line ${line.line} ` +
        `(at ${formatSeconds(line.timeS)} s) lasts ${formatSeconds(lastStepEndS - line.timeS)} s in the profile's circuit, and the model cannot end it early`,
      found: JSON.stringify(next.timeText),
    });
  }
}

/** Seconds for a message: up to 6 significant digits, no exponent for ordinary values. */
function formatSeconds(s: number): string {
  return String(Number(s.toPrecision(6)));
}
