import { describeFound } from "../errors/InputError.js";
import { unknownKeyExpectation } from "../errors/nearestKey.js";
import { FieldReader, join } from "../format/FieldReader.js";
import type { BusLoad } from "../circuits/BusLoad.js";
import type { FaultSpec, ProfileCircuit, ProfileEvent } from "./DutyProfile.js";
import { type EventInput, type FaultInput } from "./profileSchema.js";
import { pointsToSegments, powerTracePoints } from "./powerTracePoints.js";
import { type AttemptTiming, shortestAttemptWaitS } from "./attemptTiming.js";
import { whyUnreadable } from "./resolveProfilePart.js";
import { resolveLoad } from "./resolveProfileCircuit.js";
import { PROFILE_DEFAULTS } from "./profileDefaults.js";
import type { ReadNamedFile } from "./ReadNamedFile.js";

/*
 * A profile's events resolved: faults, retry blocks (their timing checked against the circuit's
 * attempt length and the relay), repeats, power traces, waits and runs.
 * Part of loading a profile (loadProfile.ts orchestrates).
 */
export interface EventContext {
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
      return load === undefined ? undefined : { type: f.type, load, loadField: join(field, "load") };
    }
    case "converter-early": {
      forbid(["load", "after"]);
      if (f.power === undefined || f.enableAt === undefined) {
        ctx.reader.fail("bad-profile", join(field, f.power === undefined ? "power" : "enableAt"), "the converter's power and the bus voltage it starts at (power, enableAt)", "nothing");
        return undefined;
      }
      const load = resolveLoad(ctx.reader, { kind: "constant-power", power: f.power, enableAt: f.enableAt, disableAt: f.disableAt }, field, busV);
      return load === undefined ? undefined : { type: f.type, load, loadField: field };
    }
    case "trip-after-close":
      forbid(["power", "enableAt", "disableAt"]);
      if (f.after === undefined) {
        ctx.reader.fail("bad-profile", join(field, "after"), 'the time from contactor closing to the trip, such as "200 ms"', "nothing");
        return undefined;
      }
      if (f.load === undefined) return { type: f.type, load: ctx.circuit?.load ?? NO_LOAD, tripAfterS: f.after };
      return { type: f.type, load: resolveLoad(ctx.reader, f.load, join(field, "load"), busV) ?? NO_LOAD, loadField: join(field, "load"), tripAfterS: f.after };
  }
}

/**
 * One event of the profile's list (recursively for repeats), with its field path for later
 * messages; problems are recorded on the context's reader.
 */
export function resolveEvent(ctx: EventContext, e: EventInput, field: string): ProfileEvent {
  const label = (v: { label?: string | undefined }) => (v.label === undefined ? {} : { label: v.label });
  if ("power-up" in e) {
    const at = join(field, "power-up");
    needCircuit(ctx, at, "power-up");
    const v = e["power-up"];
    const load = v.load === undefined ? undefined : resolveLoad(ctx.reader, v.load, join(at, "load"), ctx.circuit?.busVoltageV ?? Infinity);
    return { kind: "power-up", field: at, ...label(v), ...(load === undefined ? {} : { load, loadField: join(at, "load") }) };
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
    // start to start, an interval must hold the longest attempt and the relay's opening and closing
    // again. Without protection that ends an attempt at a level the bus reaches (checks, current,
    // I²t), the longest attempt is known now: the timeout (or a shorter maximum on-time), plus the
    // contactor's operate time and the trip delay of a fault that trips after closing. With such
    // protection only a run knows how long each attempt lasts: expandTimeline checks each one.
    const circuit = ctx.circuit;
    const guard = circuit?.completion.protection;
    const levelProtected = guard !== undefined && ((guard.busChecks?.length ?? 0) > 0 || (guard.riseChecks?.length ?? 0) > 0 || guard.overCurrent !== undefined || (guard.i2t?.length ?? 0) > 0);
    const onS = Math.min(circuit?.completion.timeoutS ?? 0, guard?.maxOnTimeS ?? Infinity);
    const closedS = fault?.tripAfterS === undefined ? 0 : (ctx.timing.contactorOperateS ?? 0) + fault.tripAfterS;
    const shortestS = onS + closedS + shortestAttemptWaitS(ctx.timing);
    if (circuit !== undefined && !levelProtected && r.interval < shortestS * (1 - 1e-12))
      ctx.reader.fail(
        "out-of-range",
        join(at, "interval"),
        `an interval (start to start) at least as long as an attempt can last plus the relay's release and operate times (${Number(shortestS.toPrecision(12))} s: the ${onS < circuit.completion.timeoutS ? "maximum on-time" : "completion timeout"}${fault?.tripAfterS === undefined ? "" : (ctx.timing.contactorOperateS ?? 0) > 0 ? ", the contactor's operate time, the trip delay" : ", the trip delay"} and ${Number(shortestAttemptWaitS(ctx.timing).toPrecision(12))} s for the relay)`,
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
