import { InputError, describeFound, withLocation } from "../errors/InputError.js";
import { FieldReader, join } from "../format/FieldReader.js";
import { parseStructuredText } from "../format/parseStructuredText.js";
import { sourceIndex } from "../thermal/ModalModel.js";
import type { CircuitRole, DutyProfile, ProfileEvent, ProfilePart } from "./DutyProfile.js";
import { type CircuitInput, profileSchema } from "./profileSchema.js";
import { resolveSupervision } from "./resolveSupervision.js";
import { ATTEMPT_TIMING_DEFAULTS, type AttemptTiming } from "./attemptTiming.js";
import { issueToProblems } from "./profileSchemaProblems.js";
import { type ResolvedNetwork, resolvePart } from "./resolveProfilePart.js";
import { TOPOLOGY_ROLES, resolveCircuit, resolveLoad } from "./resolveProfileCircuit.js";
import { PROFILE_DEFAULTS } from "./profileDefaults.js";
import type { ReadNamedFile } from "./ReadNamedFile.js";
import { type EventContext, resolveEvent } from "./resolveProfileEvents.js";
import type { ProfileSurroundings } from "./ProfileSurroundings.js";
import { resolveAmbientProfile, resolveHeatSources } from "./resolveSurroundings.js";
import { seriesValueAt } from "../thermal/PiecewiseLinearSeries.js";




/**
 * Load a duty profile from YAML or JSON text: parse (with line numbers), validate against the
 * schema (unknown keys rejected with the nearest valid key suggested), check the relations
 * between fields (roles match the topology, each load and fault has its values, retry intervals
 * outlast an attempt, power traces name a part), and resolve thermal networks and power-trace
 * CSV files through `readFile` (the core never touches the file system itself). Every problem
 * is reported at once, each with file, line, field path, what was expected and what was found.
 * Source: profile format of our own, described in docs/profile-format.md.
 * Cost O(size of the profile and the files it names) + O(nodes³) per graph or Cauer network.
 * @param text the profile's text
 * @param file its name, for messages
 * @param readFile reads a named network or CSV file (path as written in the profile)
 * @throws InputError with every problem found
 * @example
 * loadProfile(bundled("warehouse-robot-48v.yaml"), "profiles/warehouse-robot-48v.yaml", bundled).circuit.resistanceOhm // => 22
 */
export function loadProfile(text: string, file: string, readFile?: ReadNamedFile): DutyProfile {
  const source = parseStructuredText(text, file);
  // jitless: zod's compiled fast path (new Function per object schema) costs more to build than
  // it saves on the one parse a run makes (the first parse took 2 to 4 times as long with it)
  const parsed = profileSchema.safeParse(source.data, { reportInput: true, jitless: true });
  if (!parsed.success) {
    const unknownAt = new Set(parsed.error.issues.filter((i) => i.code === "unrecognized_keys").map((i) => i.path.join(".")));
    const issues = parsed.error.issues.filter((i) => !(i.code === "custom" && i.message === "one-key" && unknownAt.has(i.path.join("."))));
    const problems = issues.flatMap((issue) => issueToProblems(issue, file, source.lineOf));
    throw new InputError(problems);
  }
  const reader = new FieldReader();
  const input = parsed.data;
  const circuit = input.circuit === undefined ? undefined : resolveCircuit(reader, input.circuit, "circuit");
  const networks = new Map<string, ResolvedNetwork | undefined>();
  const ambientSeries = input.ambientProfile === undefined ? undefined : resolveAmbientProfile(reader, input.ambientProfile, readFile);
  if ((input.ambient === undefined) === (input.ambientProfile === undefined))
    reader.fail("bad-profile", "ambient", "exactly one of ambient (a constant such as \"40 degC\") or ambientProfile (a daily profile or a trace)", input.ambient === undefined ? "neither" : "both");
  input.parts.forEach((p, i) => {
    if (input.ambientProfile !== undefined && p.ambient !== undefined)
      reader.fail("bad-profile", `parts[${i}].ambient`, "no part ambient when the profile's ambient is an ambientProfile", describeFound(p.ambient));
  });
  // without either (already an error) 0 °C only lets the parts be checked
  const ambientC = input.ambient ?? (ambientSeries === undefined ? 0 : seriesValueAt(ambientSeries.series, 0));
  const parts = input.parts.map((part, i) => resolvePart(reader, part, `parts[${i}]`, ambientC, input.circuit?.topology, file, source.lineOf, readFile, networks));
  const heatSources = input.heatSources === undefined ? [] : resolveHeatSources(reader, input.heatSources, parts, input.parts.map((p) => p.id), readFile);
  const surroundings: ProfileSurroundings | undefined =
    ambientSeries === undefined && heatSources.length === 0
      ? undefined
      : { ...(ambientSeries === undefined ? {} : { ambientC: ambientSeries.series, ambientWords: ambientSeries.words }), heatSources };
  const used = new Set<string>();
  parts.forEach((p, i) => {
    if (p === undefined) return;
    const key = `${p.networkKey}#${p.sourceIndex}`;
    if (used.has(key)) reader.fail("bad-profile", `parts[${i}].source`, "a heat source node no other part of the same network uses", describeFound(p.model.sources[p.sourceIndex]));
    used.add(key);
  });
  const seen = new Map<string, number>();
  input.parts.forEach((p, i) => {
    const first = seen.get(p.id);
    if (first !== undefined) reader.fail("bad-profile", `parts[${i}].id`, `a part id not used before (parts[${first}] is "${p.id}")`, describeFound(p.id));
    else seen.set(p.id, i);
  });
  const timing: AttemptTiming = {
    operateS: input.circuit?.relay?.operate ?? ATTEMPT_TIMING_DEFAULTS.operateS,
    releaseS: input.circuit?.relay?.release ?? ATTEMPT_TIMING_DEFAULTS.releaseS,
    timerResolutionS: input.firmware?.timerResolution ?? ATTEMPT_TIMING_DEFAULTS.timerResolutionS,
    ...(input.circuit?.contactor?.operate === undefined ? {} : { contactorOperateS: input.circuit.contactor.operate }),
    ...(input.circuit?.contactor?.release === undefined ? {} : { contactorReleaseS: input.circuit.contactor.release }),
  };
  const context: EventContext = { reader, circuit, partIds: input.parts.map((p) => p.id), readFile, timing };
  const events = input.events.map((e, i) => resolveEvent(context, e, `events[${i}]`));
  const supervision =
    input.supervision === undefined ? undefined : resolveSupervision(reader, input.supervision, "supervision", circuit, (l, f, busV) => resolveLoad(reader, l, f, busV));
  const map = input.retryPlan?.map;
  if (map?.from !== undefined && map.to !== undefined && !(map.to > map.from))
    reader.fail("out-of-range", "retryPlan.map.to", `a longest interval above the shortest (retryPlan.map.from = ${map.from} s)`, `${map.to} s`);
  if (!reader.failed) {
    const bound = expandedEventBound(events);
    if (bound > PROFILE_DEFAULTS.maxExpandedEvents)
      reader.fail("out-of-range", "events", `a profile that expands to at most ${PROFILE_DEFAULTS.maxExpandedEvents} events`, `up to ${bound.toPrecision(3)} events`);
  }
  try {
    reader.done();
  } catch (error) {
    if (!(error instanceof InputError)) throw error;
    throw withLocation(error, file, "", source.lineOf);
  }
  return {
    file,
    name: input.name,
    description: input.description ?? "",
    parts: parts as ProfilePart[],
    ...(circuit === undefined ? {} : { circuit }),
    events,
    timing,
    ...(input.retryPlan === undefined ? {} : { retryPlan: input.retryPlan }),
    ...(supervision === undefined ? {} : { supervision }),
    ...(input.occursPerYear === undefined ? {} : { occursPerYear: input.occursPerYear }),
    ...(surroundings === undefined ? {} : { surroundings }),
  };
}

/** Most events a list can expand to (retries counted at their maximum, plus one lockout). */
export function expandedEventBound(events: readonly ProfileEvent[]): number {
  let sum = 0;
  for (const e of events) {
    if (e.kind === "repeat") sum += e.count * expandedEventBound(e.events);
    else if (e.kind === "retry") sum += e.attempts + 1;
    else sum += 1;
  }
  return sum;
}
