import type { DutyProfile } from "../profile/DutyProfile.js";
import type { SimulateOptions, SimulationResult } from "../profile/simulateProfile.js";
import type { EventLog } from "./EventLog.js";
import { eventLogToEvents } from "./eventLogToEvents.js";
import { eventLogCursor, replayLogCursor } from "./replayLog.js";

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
 * simulated exactly as `simulate` runs it (through replayLogCursor, the streamed replay, over the
 * parsed lines) (simulateProfile: the capacitor's charge carried from
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
  const replay = replayLogCursor(profile, eventLogCursor(log), options);
  return { profile: replayed, simulation: replay.simulation, ignoredProfileEvents: replay.ignoredProfileEvents };
}
