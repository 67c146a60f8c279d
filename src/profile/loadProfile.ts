import type * as z from "zod";
import { InputError, type InputProblem, describeFound, inputError, withLocation } from "../errors/InputError.js";
import { unknownKeyExpectation } from "../errors/nearestKey.js";
import { FieldReader, join } from "../format/FieldReader.js";
import { parseStructuredText } from "../format/parseStructuredText.js";
import type { ModalModel } from "../thermal/ModalModel.js";
import { observedIndex, sourceIndex } from "../thermal/ModalModel.js";
import { type ThermalNetwork, networkToModal } from "../thermal/ThermalNetwork.js";
import type { NetworkPart } from "../thermal/NetworkPart.js";
import { parseNetwork } from "../thermal/parseNetwork.js";
import type { BusLoad } from "../circuits/BusLoad.js";
import type { DischargePath } from "../circuits/dischargeVoltage.js";
import type { CircuitRole, DutyProfile, FaultSpec, ProfileCircuit, ProfileEvent, ProfilePart } from "./DutyProfile.js";
import { type CircuitInput, type EventInput, type FaultInput, type LoadInput, type PartInput, ROLE_NAMES, profileSchema } from "./profileSchema.js";
import { pointsToSegments, powerTracePoints } from "./powerTracePoints.js";
import { resolveSupervision } from "./resolveSupervision.js";
import { type StressConfig, resolveStressConfig } from "../stress/resolveStressConfig.js";
import { stressPartKind } from "./stressPartKind.js";
import { ATTEMPT_TIMING_DEFAULTS, type AttemptTiming, shortestAttemptWaitS } from "./attemptTiming.js";

/** Defaults of the profile format, declared once (code, docs and help read them here). */
export const PROFILE_DEFAULTS = {
  /** warning band below a part's maximum temperature when `limits.margin` is absent [K] (common practice: 10 K) */
  marginK: 10,
  /** retry back-off factor when absent: a fixed interval */
  backoff: 1,
  /** converter-early: the converter stops below this fraction of its start voltage when `disableAt` is absent */
  converterDisableRatio: 0.9,
  /** the longest profile the simulator accepts [s] (about 31,700 years): guards against runaway sums */
  maxProfileTimeS: 1e12,
  /** the most events a profile may expand to: guards against runaway repeat counts */
  maxExpandedEvents: 50_000_000,
} as const;

/**
 * Reads a file named in a profile (a network or a power-trace CSV), path as written. The CLI
 * supplies it. An optional `displayName` gives the name messages should show for such a file
 * (the CLI resolves it against the profile's folder).
 */
export type ReadNamedFile = ((path: string) => string) & { readonly displayName?: (path: string) => string };

/** Topology → roles its model reports a power trace for. */
const TOPOLOGY_ROLES: Record<CircuitInput["topology"], readonly CircuitRole[]> = {
  "series-resistor": ["resistor"],
  "linear-mosfet": ["mosfet", "sourceResistor"],
  converter: ["switch"],
};

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
 */
export function loadProfile(text: string, file: string, readFile?: ReadNamedFile): DutyProfile {
  const source = parseStructuredText(text, file);
  const parsed = profileSchema.safeParse(source.data, { reportInput: true });
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
  const parts = input.parts.map((part, i) => resolvePart(reader, part, `parts[${i}]`, input.ambient, input.circuit?.topology, file, source.lineOf, readFile, networks));
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
  };
  const context: EventContext = { reader, circuit, partIds: input.parts.map((p) => p.id), readFile, timing };
  const events = input.events.map((e, i) => resolveEvent(context, e, `events[${i}]`));
  const supervision =
    input.supervision === undefined ? undefined : resolveSupervision(reader, input.supervision, "supervision", circuit, (l, f, busV) => resolveLoad(reader, l, f, busV));
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

// ---------------------------------------------------------------------------------------------
// zod issues → our problems

function issueToProblems(issue: z.core.$ZodIssue, file: string, lineOf: (field: string) => number): InputProblem[] {
  const field = issue.path.reduce<string>((f, key) => join(f, typeof key === "number" ? key : String(key)), "");
  const input = (issue as { input?: unknown }).input;
  const at = (f: string, expected: string, found: string, code: InputProblem["code"] = "bad-profile"): InputProblem => ({ code, file, line: lineOf(f), field: f, expected, found });
  switch (issue.code) {
    case "unrecognized_keys": {
      const valid = keysAt(issue.path);
      return issue.keys.map((key) => at(join(field, key), unknownKeyExpectation(key, valid), "an unknown key"));
    }
    case "custom": {
      const params = issue.params as { expected?: string; found?: string } | undefined;
      const code = issue.message === "quantity" ? "bad-quantity" : issue.message === "range" ? "out-of-range" : "bad-profile";
      return [at(field, params?.expected ?? issue.message, params?.found ?? describeFound(input), code)];
    }
    case "invalid_type":
      if (input === undefined) return [at(field, `${typeWords(issue.expected)} (required)`, "nothing")];
      return [at(field, typeWords(issue.expected), describeFound(input))];
    case "invalid_value": {
      const values = issue.values.map(String);
      const guess = typeof input === "string" ? unknownKeyExpectation(input, values).replace(/^one of the keys /, "one of ") : `one of ${values.join(", ")}`;
      return [at(field, guess, describeFound(input))];
    }
    case "too_small":
      return [at(field, issue.origin === "array" ? `at least ${String(issue.minimum)} item${issue.minimum === 1 ? "" : "s"}` : "a non-empty text", describeFound(input))];
    case "invalid_union": {
      // a union that names what it wants (the stress keys' quantities and lifetime models do) says so
      const named = issue.message !== "" && !issue.message.startsWith("Invalid input") ? issue.message : "a valid value";
      return [at(field, field.endsWith("network") ? "a network mapping (form: foster | cauer | graph) or a network file path" : named, describeFound(input))];
    }
    default:
      return [at(field, "a valid value", describeFound(input))];
  }
}

function typeWords(type: string): string {
  switch (type) {
    case "string":
      return "text";
    case "number":
      return "a number";
    case "array":
      return "a list";
    case "object":
      return "a mapping";
    case "tuple":
      return "a [time, power] pair";
    default:
      return type;
  }
}

/** The valid keys of the object schema at a path of the profile schema. */
function keysAt(path: readonly PropertyKey[]): string[] {
  let schema: unknown = profileSchema;
  const unwrap = (s: unknown): unknown => {
    for (;;) {
      const def = (s as { _zod: { def: Record<string, unknown> } })._zod.def;
      if (def.type === "optional" || def.type === "nullable") s = def.innerType;
      else if (def.type === "lazy") s = (def.getter as () => unknown)();
      else if (def.type === "pipe") s = def.in;
      else return s;
    }
  };
  for (const key of path) {
    const def = (unwrap(schema) as { _zod: { def: Record<string, unknown> } })._zod.def;
    if (def.type === "object") schema = (def.shape as Record<string, unknown>)[String(key)];
    else if (def.type === "array") schema = def.element;
    else if (def.type === "tuple") schema = (def.items as unknown[])[Number(key)];
    else return [];
    if (schema === undefined) return [];
  }
  const def = (unwrap(schema) as { _zod: { def: Record<string, unknown> } })._zod.def;
  return def.type === "object" ? Object.keys(def.shape as Record<string, unknown>) : [];
}

// ---------------------------------------------------------------------------------------------
// parts

function resolvePart(
  reader: FieldReader,
  part: PartInput,
  field: string,
  ambientC: number,
  topology: CircuitInput["topology"] | undefined,
  file: string,
  lineOf: (field: string) => number,
  readFile: ReadNamedFile | undefined,
  networks: Map<string, ResolvedNetwork | undefined>,
): ProfilePart | undefined {
  const role = part.role === undefined ? undefined : ROLE_NAMES[part.role];
  if (role !== undefined) {
    if (topology === undefined) reader.fail("bad-profile", join(field, "role"), "a `circuit` section for the part's role to refer to (or no role)", describeFound(part.role));
    else if (!TOPOLOGY_ROLES[topology].includes(role)) {
      const names = Object.entries(ROLE_NAMES).filter(([, r]) => TOPOLOGY_ROLES[topology].includes(r)).map(([n]) => n);
      reader.fail("bad-profile", join(field, "role"), `a role of a ${topology} circuit (${names.join(", ")})`, describeFound(part.role));
    }
  }
  const margin = part.limits.margin ?? PROFILE_DEFAULTS.marginK;
  if (part.limits.maxTemperature <= (part.ambient ?? ambientC))
    reader.fail("out-of-range", join(field, "limits.maxTemperature"), `a limit above the ambient (${part.ambient ?? ambientC} °C)`, `${part.limits.maxTemperature} °C`);
  const networkKey = typeof part.network === "string" ? part.network : join(field, "network");
  const resolved = networks.has(networkKey) ? networks.get(networkKey) : resolveNetwork(reader, part, role, field, file, lineOf, readFile);
  networks.set(networkKey, resolved);
  let stress: StressConfig | undefined;
  try {
    stress = resolveStressConfig(part, { field, partKind: stressPartKind(role), limitC: part.limits.maxTemperature });
  } catch (error) {
    reader.absorb(error);
  }
  if (resolved === undefined) return undefined;
  const { model, network } = resolved;
  try {
    const sourceAt = part.source === undefined ? 0 : sourceIndex(model, part.source, join(field, "source"));
    const observedAt = part.observe === undefined ? 0 : observedIndex(model, part.observe, join(field, "observe"));
    return {
      id: part.id,
      ...(role === undefined ? {} : { role }),
      model,
      networkKey,
      network,
      sourceIndex: sourceAt,
      observedIndex: observedAt,
      ambientC: part.ambient ?? ambientC,
      limitC: part.limits.maxTemperature,
      marginK: margin,
      ...(stress === undefined ? {} : { stress }),
    };
  } catch (error) {
    reader.absorb(error);
    return undefined;
  }
}

/** The part a network of a circuit role describes: its nodes are named after it (src/thermal/NetworkPart.ts). */
const ROLE_NETWORK_PARTS: Readonly<Record<CircuitRole, NetworkPart>> = { resistor: "resistor", sourceResistor: "resistor", mosfet: "semiconductor", switch: "semiconductor" };

/**
 * A ladder network named after the role of the part it heats: its `part` set from the role when
 * the network does not say; refused when it says another part. Graphs name their own nodes.
 * @throws InputError `bad-network` for a ladder whose `part` contradicts the role
 */
function namedForRole(network: ThermalNetwork, role: CircuitRole | undefined, field: string): ThermalNetwork {
  if (network.kind === "graph" || role === undefined) return network;
  const part = ROLE_NETWORK_PARTS[role];
  if (network.part === undefined) return { ...network, part };
  const roleWord = Object.entries(ROLE_NAMES).find(([, r]) => r === role)![0];
  if (network.part !== part) throw inputError("bad-network", join(field, "part"), `part: ${part} (the network of a part whose role is ${roleWord}), or no part key`, describeFound(network.part));
  return network;
}

/** A part's network as written and its modal form. */
interface ResolvedNetwork {
  readonly model: ModalModel;
  readonly network: ThermalNetwork;
}

function resolveNetwork(
  reader: FieldReader,
  part: PartInput,
  role: CircuitRole | undefined,
  field: string,
  file: string,
  lineOf: (field: string) => number,
  readFile: ReadNamedFile | undefined,
): ResolvedNetwork | undefined {
  const at = join(field, "network");
  let network: ThermalNetwork;
  let model: ModalModel;
  try {
    if (typeof part.network === "string") {
      if (readFile === undefined) {
        reader.fail("bad-file", at, "an inline network (this caller cannot read files)", describeFound(part.network));
        return undefined;
      }
      let text: string;
      try {
        text = readFile(part.network);
      } catch (error) {
        reader.fail("bad-file", at, "a readable network file", `${describeFound(part.network)} (${whyUnreadable(error, readFile.displayName?.(part.network))})`);
        return undefined;
      }
      let doc: ReturnType<typeof parseStructuredText> | undefined;
      try {
        doc = parseStructuredText(text, readFile.displayName?.(part.network) ?? part.network);
        network = namedForRole(parseNetwork(doc.data, ""), role, "");
        model = networkToModal(network, "");
      } catch (error) {
        if (!(error instanceof InputError)) throw error;
        reader.absorb(withLocation(error, readFile.displayName?.(part.network) ?? part.network, "", doc?.lineOf));
        return undefined;
      }
    } else {
      network = namedForRole(parseNetwork(part.network, at), role, at);
      model = networkToModal(network, at);
    }
  } catch (error) {
    if (error instanceof InputError) {
      const located = withLocation(error, file, "", lineOf);
      for (const p of located.problems) reader.fail(p.code, p.field, p.expected, p.found);
      return undefined;
    }
    throw error;
  }
  return { model, network };
}

/** Why a named file could not be read, in a few words ("no such file: /a/b.yaml"). */
function whyUnreadable(error: unknown, shownAs: string | undefined): string {
  const reason = error instanceof InputError ? (error.problems[0]?.found ?? "unreadable") : error instanceof Error ? error.message.split("\n")[0]! : "unreadable";
  return shownAs === undefined ? reason : `${reason}: ${shownAs}`;
}

// ---------------------------------------------------------------------------------------------
// circuit

function resolveCircuit(reader: FieldReader, c: CircuitInput, field: string): ProfileCircuit | undefined {
  const forbid = (keys: readonly (keyof CircuitInput)[]): void => {
    for (const key of keys) if (c[key] !== undefined) reader.fail("bad-profile", join(field, key), `no "${key}" in a ${c.topology} circuit`, "a value");
  };
  const completion = c.completion;
  if (completion.fraction === undefined && completion.within === undefined && completion.dwell === undefined)
    reader.fail("bad-profile", join(field, "completion"), "at least one of fraction, within or dwell (when the charge counts as done)", "only a timeout");
  const load = resolveLoad(reader, c.load ?? { kind: "none" }, join(field, "load"), c.busVoltage);
  const discharge = resolveDischarge(reader, c.discharge, join(field, "discharge"));
  const common = {
    busVoltageV: c.busVoltage,
    capacitanceF: c.capacitance,
    load: load ?? { kind: "none" as const },
    completion: {
      timeoutS: completion.timeout,
      ...(completion.fraction === undefined ? {} : { fraction: completion.fraction }),
      ...(completion.within === undefined ? {} : { withinV: completion.within }),
      ...(completion.dwell === undefined ? {} : { dwellS: completion.dwell }),
    },
    discharge: discharge ?? { kind: "none" as const },
  };
  switch (c.topology) {
    case "series-resistor":
      forbid(["mosfet", "converter"]);
      if (c.resistance === undefined) {
        reader.fail("bad-profile", join(field, "resistance"), 'the pre-charge resistance, such as "10 ohm" (required for series-resistor)', "nothing");
        return undefined;
      }
      return { ...common, topology: "series-resistor", resistanceOhm: c.resistance, ...(c.sourceResistance === undefined ? {} : { sourceResistanceOhm: c.sourceResistance }) };
    case "linear-mosfet": {
      forbid(["resistance", "converter", "sourceResistance"]);
      const m = c.mosfet;
      if (m === undefined) {
        reader.fail("bad-profile", join(field, "mosfet"), "a mosfet section (gateVoltage, thresholdVoltage, sourceResistor or saturationCurrent, rdsOn)", "nothing");
        return undefined;
      }
      if (m.sourceResistor === undefined && m.saturationCurrent === undefined)
        reader.fail("bad-profile", join(field, "mosfet"), "a sourceResistor or a saturationCurrent (what limits the current)", "neither");
      if (m.gateVoltage <= m.thresholdVoltage)
        reader.fail("out-of-range", join(field, "mosfet.gateVoltage"), `a gate voltage above the threshold (${m.thresholdVoltage} V)`, `${m.gateVoltage} V`);
      return {
        ...common,
        topology: "linear-mosfet",
        gateVoltageV: m.gateVoltage,
        thresholdVoltageV: m.thresholdVoltage,
        rdsOnOhm: m.rdsOn,
        ...(m.sourceResistor === undefined ? {} : { sourceResistorOhm: m.sourceResistor }),
        ...(m.saturationCurrent === undefined ? {} : { saturationCurrentA: m.saturationCurrent }),
        ...(m.thresholdTempco === undefined ? {} : { thresholdTempcoVPerK: m.thresholdTempco }),
      };
    }
    case "converter": {
      forbid(["resistance", "mosfet", "sourceResistance"]);
      const v = c.converter;
      if (v === undefined) {
        reader.fail("bad-profile", join(field, "converter"), "a converter section (mode, current or power, efficiency)", "nothing");
        return undefined;
      }
      if (v.mode === "constant-current" && v.current === undefined) reader.fail("bad-profile", join(field, "converter.current"), 'a charging current such as "2 A" (required for constant-current)', "nothing");
      if (v.mode === "constant-power" && v.power === undefined) reader.fail("bad-profile", join(field, "converter.power"), 'a charging power such as "200 W" (required for constant-power)', "nothing");
      return {
        ...common,
        topology: "converter",
        mode: v.mode,
        efficiency: v.efficiency,
        ...(v.current === undefined ? {} : { currentA: v.current }),
        ...(v.power === undefined ? {} : { powerW: v.power }),
        ...(v.currentLimit === undefined ? {} : { currentLimitA: v.currentLimit }),
      };
    }
  }
}

function resolveLoad(reader: FieldReader, l: LoadInput, field: string, busVoltageV: number): BusLoad | undefined {
  const need = { none: [], short: [], resistive: ["resistance"], "constant-current": ["current"], "constant-power": ["power", "enableAt"] } as const;
  const allowed: Record<LoadInput["kind"], readonly string[]> = {
    none: [],
    short: [],
    resistive: ["resistance"],
    "constant-current": ["current", "enableAt", "disableAt"],
    "constant-power": ["power", "enableAt", "disableAt"],
  };
  let ok = true;
  for (const key of ["resistance", "current", "power", "enableAt", "disableAt"] as const) {
    if (l[key] !== undefined && !allowed[l.kind].includes(key)) {
      reader.fail("bad-profile", join(field, key), `no "${key}" for a ${l.kind} load`, "a value");
      ok = false;
    }
  }
  for (const key of need[l.kind]) {
    if (l[key] === undefined) {
      reader.fail("bad-profile", join(field, key), `this value (required for a ${l.kind} load)`, "nothing");
      ok = false;
    }
  }
  if (l.enableAt !== undefined && l.enableAt >= busVoltageV) {
    reader.fail("out-of-range", join(field, "enableAt"), `a voltage below the bus voltage (${busVoltageV} V)`, `${l.enableAt} V`);
    ok = false;
  }
  if (l.enableAt !== undefined && l.disableAt !== undefined && l.disableAt > l.enableAt) {
    reader.fail("out-of-range", join(field, "disableAt"), `a voltage at or below enableAt (${l.enableAt} V)`, `${l.disableAt} V`);
    ok = false;
  }
  if (!ok) return undefined;
  switch (l.kind) {
    case "none":
    case "short":
      return { kind: l.kind };
    case "resistive":
      return { kind: "resistive", resistanceOhm: l.resistance! };
    case "constant-current":
      return { kind: "constant-current", currentA: l.current!, ...(l.enableAt === undefined ? {} : { enableV: l.enableAt }), ...(l.disableAt === undefined ? {} : { disableV: l.disableAt }) };
    case "constant-power":
      return { kind: "constant-power", powerW: l.power!, enableV: l.enableAt!, disableV: l.disableAt ?? l.enableAt! * PROFILE_DEFAULTS.converterDisableRatio };
  }
}

function resolveDischarge(reader: FieldReader, d: CircuitInput["discharge"], field: string): DischargePath | undefined {
  const allowed: Record<typeof d.kind, readonly string[]> = { none: [], bleeder: ["resistance"], "constant-current": ["current", "bleeder"], active: ["resistance", "until", "bleeder"] };
  const required: Record<typeof d.kind, readonly ("resistance" | "current")[]> = { none: [], bleeder: ["resistance"], "constant-current": ["current"], active: ["resistance"] };
  let ok = true;
  for (const key of ["resistance", "current", "until", "bleeder"] as const) {
    if (d[key] !== undefined && !allowed[d.kind].includes(key)) {
      reader.fail("bad-profile", join(field, key), `no "${key}" for a ${d.kind} discharge`, "a value");
      ok = false;
    }
  }
  for (const key of required[d.kind]) {
    if (d[key] === undefined) {
      reader.fail("bad-profile", join(field, key), `this value (required for a ${d.kind} discharge)`, "nothing");
      ok = false;
    }
  }
  if (!ok) return undefined;
  switch (d.kind) {
    case "none":
      return { kind: "none" };
    case "bleeder":
      return { kind: "bleeder", resistanceOhm: d.resistance! };
    case "constant-current":
      return { kind: "constant-current", currentA: d.current!, ...(d.bleeder === undefined ? {} : { bleederOhm: d.bleeder }) };
    case "active":
      return { kind: "active", resistanceOhm: d.resistance!, ...(d.until === undefined ? {} : { untilV: d.until }), ...(d.bleeder === undefined ? {} : { bleederOhm: d.bleeder }) };
  }
}

// ---------------------------------------------------------------------------------------------
// events

interface EventContext {
  readonly reader: FieldReader;
  readonly circuit: ProfileCircuit | undefined;
  readonly partIds: readonly string[];
  readonly readFile: ReadNamedFile | undefined;
  readonly timing: AttemptTiming;
}

const NO_LOAD: BusLoad = { kind: "none" };

function needCircuit(ctx: EventContext, field: string, what: string): boolean {
  if (ctx.circuit !== undefined) return true;
  ctx.reader.fail("bad-profile", field, `a \`circuit\` section (a ${what} runs the pre-charge circuit)`, "a profile without one");
  return false;
}

function resolveFault(ctx: EventContext, f: FaultInput, field: string): FaultSpec | undefined {
  const busV = ctx.circuit?.busVoltageV ?? Infinity;
  const forbid = (keys: readonly (keyof FaultInput)[]): void => {
    for (const key of keys) if (f[key] !== undefined) ctx.reader.fail("bad-profile", join(field, key), `no "${key}" for a ${f.type} fault`, "a value");
  };
  switch (f.type) {
    case "shorted-output":
      forbid(["load", "power", "enableAt", "disableAt", "after"]);
      return { type: f.type, load: { kind: "short" } };
    case "overloaded-bus": {
      forbid(["power", "enableAt", "disableAt", "after"]);
      if (f.load === undefined) {
        ctx.reader.fail("bad-profile", join(field, "load"), "the overload (a load mapping such as { kind: resistive, resistance: 2 ohm })", "nothing");
        return undefined;
      }
      const load = resolveLoad(ctx.reader, f.load, join(field, "load"), busV);
      return load === undefined ? undefined : { type: f.type, load };
    }
    case "converter-early": {
      forbid(["load", "after"]);
      if (f.power === undefined || f.enableAt === undefined) {
        ctx.reader.fail("bad-profile", join(field, f.power === undefined ? "power" : "enableAt"), "the converter's power and the bus voltage it starts at (power, enableAt)", "nothing");
        return undefined;
      }
      const load = resolveLoad(ctx.reader, { kind: "constant-power", power: f.power, enableAt: f.enableAt, disableAt: f.disableAt }, field, busV);
      return load === undefined ? undefined : { type: f.type, load };
    }
    case "trip-after-close":
      forbid(["power", "enableAt", "disableAt"]);
      if (f.after === undefined) {
        ctx.reader.fail("bad-profile", join(field, "after"), 'the time from contactor closing to the trip, such as "200 ms"', "nothing");
        return undefined;
      }
      return { type: f.type, load: f.load === undefined ? (ctx.circuit?.load ?? NO_LOAD) : (resolveLoad(ctx.reader, f.load, join(field, "load"), busV) ?? NO_LOAD), tripAfterS: f.after };
  }
}

function resolveEvent(ctx: EventContext, e: EventInput, field: string): ProfileEvent {
  const label = (v: { label?: string | undefined }) => (v.label === undefined ? {} : { label: v.label });
  if ("power-up" in e) {
    const at = join(field, "power-up");
    needCircuit(ctx, at, "power-up");
    const v = e["power-up"];
    const load = v.load === undefined ? undefined : resolveLoad(ctx.reader, v.load, join(at, "load"), ctx.circuit?.busVoltageV ?? Infinity);
    return { kind: "power-up", field: at, ...label(v), ...(load === undefined ? {} : { load }) };
  }
  if ("fault" in e) {
    const at = join(field, "fault");
    needCircuit(ctx, at, "fault");
    const fault = resolveFault(ctx, e.fault, at);
    return { kind: "fault", field: at, ...label(e.fault), fault: fault ?? { type: "shorted-output", load: { kind: "short" } } };
  }
  if ("run" in e) return { kind: "run", field: join(field, "run"), durationS: e.run };
  if ("wait" in e) return { kind: "wait", field: join(field, "wait"), durationS: e.wait };
  if ("lockout" in e) return { kind: "lockout", field: join(field, "lockout"), durationS: e.lockout };
  if ("power-down" in e) return { kind: "power-down", field: join(field, "power-down"), ...label(e["power-down"]), offS: e["power-down"].off ?? 0 };
  if ("retry" in e) {
    const at = join(field, "retry");
    const r = e.retry;
    needCircuit(ctx, at, "retry block");
    const fault = r.fault === undefined ? undefined : resolveFault(ctx, r.fault, join(at, "fault"));
    // start to start, an interval must hold the longest attempt and the relay's opening and closing again
    const attemptS = (ctx.circuit?.completion.timeoutS ?? 0) + (fault?.tripAfterS ?? 0);
    const shortestS = attemptS + shortestAttemptWaitS(ctx.timing);
    if (ctx.circuit !== undefined && r.interval < shortestS * (1 - 1e-12))
      ctx.reader.fail(
        "out-of-range",
        join(at, "interval"),
        `an interval (start to start) at least as long as an attempt can last plus the relay's release and operate times (${Number(shortestS.toPrecision(12))} s: the completion timeout${fault?.tripAfterS === undefined ? "" : ", the trip delay"} and ${Number(shortestAttemptWaitS(ctx.timing).toPrecision(12))} s for the relay)`,
        `${r.interval} s`,
      );
    const maxIntervalS = r.maxInterval ?? Infinity;
    if (maxIntervalS < r.interval) ctx.reader.fail("out-of-range", join(at, "maxInterval"), `a longest interval at least the first interval (${r.interval} s)`, `${maxIntervalS} s`);
    const faultyAttempts = r.faultyAttempts ?? (r.fault === undefined ? 0 : r.attempts);
    if (faultyAttempts > r.attempts) ctx.reader.fail("out-of-range", join(at, "faultyAttempts"), `at most the number of attempts (${r.attempts})`, `${faultyAttempts}`);
    if (r.faultyAttempts !== undefined && r.fault === undefined) ctx.reader.fail("bad-profile", join(at, "faultyAttempts"), "a `fault` for the faulty attempts to meet", "faultyAttempts without a fault");
    return {
      kind: "retry",
      field: at,
      ...label(r),
      attempts: r.attempts,
      intervalS: r.interval,
      backoff: r.backoff ?? PROFILE_DEFAULTS.backoff,
      maxIntervalS,
      ...(fault === undefined ? {} : { fault }),
      faultyAttempts,
      lockoutS: r.lockout,
    };
  }
  if ("repeat" in e) {
    const at = join(field, "repeat");
    const r = e.repeat;
    const events = r.events.map((child, i) => resolveEvent(ctx, child, join(join(at, "events"), i)));
    return { kind: "repeat", field: at, count: r.count, ...(r.period === undefined ? {} : { periodS: r.period }), events };
  }
  const at = join(field, "power-trace");
  const t = e["power-trace"];
  const partIndex = ctx.partIds.indexOf(t.part);
  if (partIndex < 0) ctx.reader.fail("bad-profile", join(at, "part"), unknownKeyExpectation(t.part, ctx.partIds).replace("one of the keys", "the id of a part:"), describeFound(t.part));
  let segments: ReturnType<typeof pointsToSegments> = [];
  if ((t.file === undefined) === (t.points === undefined)) {
    ctx.reader.fail("bad-profile", at, "exactly one of file (a CSV of time, power) or points", t.file === undefined ? "neither" : "both");
  } else if (t.points !== undefined) {
    const timeS = t.points.map((p) => p[0]);
    const powerW = t.points.map((p) => p[1]);
    const bad = timeS.findIndex((v, i) => i > 0 && !(v > timeS[i - 1]!));
    if (t.points.length < 2) ctx.reader.fail("bad-trace", join(at, "points"), "at least two [time, power] points", `${t.points.length}`);
    else if (bad > 0) ctx.reader.fail("bad-trace", join(join(at, "points"), bad), `a time after the previous point's ${timeS[bad - 1]} s`, `${timeS[bad]} s`);
    else segments = pointsToSegments({ timeS, powerW }, t.scale ?? 1);
  } else if (ctx.readFile === undefined) {
    ctx.reader.fail("bad-file", join(at, "file"), "inline points (this caller cannot read files)", describeFound(t.file));
  } else {
    let text: string | undefined;
    try {
      text = ctx.readFile(t.file!);
    } catch (error) {
      ctx.reader.fail("bad-file", join(at, "file"), "a readable CSV file of time, power", `${describeFound(t.file)} (${whyUnreadable(error, ctx.readFile.displayName?.(t.file!))})`);
    }
    if (text !== undefined) {
      try {
        segments = pointsToSegments(powerTracePoints(text, ctx.readFile.displayName?.(t.file!) ?? t.file!, join(at, "file")), t.scale ?? 1);
      } catch (error) {
        ctx.reader.absorb(error);
      }
    }
  }
  const last = segments[segments.length - 1];
  return { kind: "power-trace", field: at, ...label(t), partIndex, segments, durationS: last === undefined ? 0 : last.startS + last.durationS };
}
