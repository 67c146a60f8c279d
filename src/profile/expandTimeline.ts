import type { ProtectionFiring } from "../circuits/AttemptProtection.js";
import { type ContactorClosing, contactorClosing } from "../circuits/contactorClosing.js";
import type { CircuitOutcome, CircuitResult, CircuitSample } from "../circuits/CircuitResult.js";
import type { ChargeThermalContext } from "../circuits/ChargeThermalContext.js";
import type { ElectroThermalSummary } from "../circuits/ElectroThermalSummary.js";
import { inputError } from "../errors/InputError.js";
import { type PowerTrace, segmentEnergy } from "../thermal/powerTrace.js";
import type { CircuitModels } from "./CircuitModels.js";
import type { BusLoad } from "../circuits/BusLoad.js";
import type { DutyProfile, FaultSpec, ProfileEvent } from "./DutyProfile.js";
import { PROFILE_DEFAULTS } from "./profileDefaults.js";
import { loadProblemsAt } from "./loadProblemsAt.js";
import { ATTEMPT_TIMING_DEFAULTS, shortestAttemptWaitS } from "./attemptTiming.js";

/** The kinds of events a timeline holds. */
export type TimelineKind = "power-up" | FaultSpec["type"] | "run" | "wait" | "power-down" | "lockout" | "power-trace";

/** One event of the flat timeline, with the circuit state it leaves and the power it puts into each part. */
export interface TimelineEvent {
  readonly type: "event";
  /** 0-based position in the timeline */
  readonly index: number;
  readonly kind: TimelineKind;
  /** a readable description: the user's label, or e.g. "retry attempt 3 of 5" */
  readonly label: string;
  /** the profile field it came from */
  readonly field: string;
  /** start time [s] */
  readonly startS: number;
  /** how long the event lasts [s]; a gap may follow before the next event */
  readonly durationS: number;
  /** circuit outcome for charging events; "none" for the others */
  readonly outcome: CircuitOutcome | "none";
  /** a charging event the timer ended with the bus stalled below the threshold (CircuitResult.busStalled) */
  readonly busStalled: boolean;
  /** why it ended, in words */
  readonly reason: string;
  /** capacitor voltage at the start and at the end [V] (0 when the profile has no circuit) */
  readonly startVoltageV: number;
  readonly endVoltageV: number;
  /** power per part (profile part order) in absolute time; undefined: no power in that part */
  readonly traces: readonly (PowerTrace | undefined)[];
  /** energy into each part [J] */
  readonly energyJ: readonly number[];
  /** the protection that ended a charging event (outcome "tripped") */
  readonly trippedBy?: ProtectionFiring["kind"];
  /** the main contactor closing after a completed charge (when the circuit gives `contactor`) */
  readonly closing?: ContactorClosing;
  /** circuit samples of a charging event in absolute time, when ExpandOptions.wantSamples asked for them */
  readonly samples?: readonly CircuitSample[];
  /** a charging event's highest element current (inrush peak) [A], when its model reports it */
  readonly peakCurrentA?: number;
  /** the electro-thermal margin of a charge solved together with its parts' temperatures */
  readonly electroThermal?: ElectroThermalSummary;
}

/** Time between events (a retry interval, the rest of a repeat period): no power, the bus as it was left. */
export interface TimelineGap {
  readonly type: "gap";
  readonly startS: number;
  readonly durationS: number;
  /** capacitor voltage at the end of the gap [V] */
  readonly endVoltageV: number;
}

/** An item of the expanded timeline. */
export type TimelineItem = TimelineEvent | TimelineGap;

/** Options of {@link expandTimeline}. */
export interface ExpandOptions {
  /** each part's temperature now [°C] (profile part order), read at the start of every charge; default: ambient */
  readonly temperatureOf?: () => readonly number[];
  /** also carry each charging event's circuit samples (bus voltage, inrush current; for the SOA check); default false */
  readonly wantSamples?: boolean;
  /** the parts' thermal context now, read at the start of every charge of a circuit whose values follow temperature */
  readonly thermalOf?: () => ChargeThermalContext;
  /** the top-level events, pulled one at a time in place of `profile.events` (a log replayed as it is read) */
  readonly events?: Iterator<ProfileEvent>;
}

/**
 * Expand a duty profile into a flat, time-ordered stream of events and gaps, lazily: nested
 * repeats, retry blocks with back-off and lockouts are walked as the consumer pulls, so memory
 * does not grow with the number of events. The capacitor voltage is carried from event to event
 * (charged by a completed power-up, left part-charged by an aborted one, drained by the discharge
 * path whenever the bus is disconnected), and the circuit outcome decides what follows: a retry
 * block stops at its first completed attempt; a block whose attempts are all exhausted is followed
 * by its lockout. Retry intervals and repeat periods are start to start; the k-th retry interval
 * is min(interval·backoff^(k−1), maxInterval).
 * Because the stream is lazy, `temperatureOf` sees the parts' temperatures after every earlier
 * item has been integrated, so temperature-dependent circuit models read the true state.
 * Source: event semantics of our own (docs/profile-format.md); capacitor charge
 * bookkeeping per docs/design.md ("Circuit bookkeeping").
 * Cost O(events × (circuit model + parts)); memory O(nesting depth + parts).
 * @throws InputError when a repetition overruns its period or the profile exceeds the longest time
 * @example
 * [...expandTimeline(profile("warehouse-robot-48v.yaml"), defaultCircuitModels)][0].kind // => "power-up"
 */
export function* expandTimeline(profile: DutyProfile, models: CircuitModels, options: ExpandOptions = {}): Generator<TimelineItem> {
  const circuit = profile.circuit;
  const partCount = profile.parts.length;
  const ambient = profile.parts.map((p) => p.ambientC);
  const temperatureOf = options.temperatureOf ?? (() => ambient);
  const wantSamples = options.wantSamples === true;
  const state = { timeS: 0, voltageV: 0, busOn: false, index: 0 };

  const advance = (durationS: number, field: string): void => {
    if (circuit !== undefined) {
      if (state.busOn) state.voltageV = circuit.busVoltageV;
      else if (durationS > 0) state.voltageV = models.discharge(circuit.discharge, circuit.capacitanceF, state.voltageV, durationS);
    }
    state.timeS += durationS;
    if (!(state.timeS <= PROFILE_DEFAULTS.maxProfileTimeS))
      throw inputError("out-of-range", field, `a profile shorter than ${PROFILE_DEFAULTS.maxProfileTimeS} s`, `a time of ${state.timeS} s`);
  };

  const noPower = (): (PowerTrace | undefined)[] => new Array<PowerTrace | undefined>(partCount).fill(undefined);
  const zeros = (): number[] => new Array<number>(partCount).fill(0);
  // shared by every event without power (never modified), so long idle stretches allocate nothing
  const NO_POWER: readonly (PowerTrace | undefined)[] = Object.freeze(noPower());
  const NO_ENERGY: readonly number[] = Object.freeze(zeros());

  const plain = (
    kind: TimelineKind,
    field: string,
    label: string,
    durationS: number,
    traces: readonly (PowerTrace | undefined)[] = NO_POWER,
    energyJ: readonly number[] = NO_ENERGY,
  ): TimelineEvent => {
    const startS = state.timeS;
    const startVoltageV = state.voltageV;
    advance(durationS, field);
    return { type: "event", index: state.index++, kind, label, field, startS, durationS, outcome: "none", busStalled: false, reason: "", startVoltageV, endVoltageV: state.voltageV, traces, energyJ };
  };

  const gap = (durationS: number, field: string): TimelineGap => {
    const startS = state.timeS;
    advance(durationS, field);
    return { type: "gap", startS, durationS, endVoltageV: state.voltageV };
  };

  const roleTrace = (result: CircuitResult, i: number): PowerTrace | undefined => {
    const role = profile.parts[i]!.role;
    const trace = role === undefined ? undefined : result.traces[role];
    return trace === undefined || trace.length === 0 ? undefined : trace;
  };
  // energy per part of a circuit result, computed once per result object (a memoized charge
  // returns the same object event after event); shared, never modified
  const energies = new WeakMap<CircuitResult, readonly number[]>();
  const energyOf = (result: CircuitResult): readonly number[] => {
    let energyJ = energies.get(result);
    if (energyJ === undefined) {
      energyJ = Object.freeze(profile.parts.map((_, i) => roleTrace(result, i)?.reduce((sum, s) => sum + segmentEnergy(s.terms, s.durationS), 0) ?? 0));
      energies.set(result, energyJ);
    }
    return energyJ;
  };

  // tripAfterS: the system trips that long after the contactor closes on a completed charge (0:
  // at the moment it closes); undefined: no trip, the bus stays on
  // loadField: where the load's keys are written, so a circuit model's complaint about them names
  // that key (undefined: the circuit's own load)
  const contactorOperateS = profile.timing?.contactorOperateS ?? 0;
  const waitS = shortestAttemptWaitS(profile.timing ?? ATTEMPT_TIMING_DEFAULTS);
  const charge = (kind: TimelineKind, field: string, label: string, load: BusLoad, tripAfterS: number | undefined, loadField?: string): TimelineEvent => {
    const c = circuit!;
    const temps = temperatureOf();
    const partTemperatureC: Record<string, number> = {};
    for (let i = 0; i < partCount; i++) {
      const role = profile.parts[i]!.role;
      if (role !== undefined) partTemperatureC[role] = temps[i]!;
    }
    const startS = state.timeS;
    const startVoltageV = state.voltageV;
    const thermal = options.thermalOf?.();
    let result: CircuitResult;
    try {
      result = models.charge(c, load, {
        sourceVoltageV: c.busVoltageV,
        initialVoltageV: state.voltageV,
        completion: c.completion,
        partTemperatureC,
        wantSamples,
        ...(thermal === undefined ? {} : { thermal }),
      });
    } catch (error) {
      throw loadProblemsAt(error, loadField);
    }
    const traces = noPower();
    const energyJ = energyOf(result);
    for (let i = 0; i < partCount; i++) {
      const trace = roleTrace(result, i);
      if (trace !== undefined) traces[i] = trace.map((s) => ({ startS: s.startS + startS, durationS: s.durationS, terms: s.terms }));
    }
    const r = result;
    let reason = r.reason;
    state.timeS += r.durationS;
    let durationS = r.durationS;
    if (r.outcome === "completed") {
      state.busOn = true;
      state.voltageV = c.busVoltageV;
      if (tripAfterS !== undefined) {
        // the contactor's contacts close its operate time after the charge completes; the trip
        // counts from there
        const closedAfterS = contactorOperateS + tripAfterS;
        advance(closedAfterS, field);
        durationS += closedAfterS;
        state.busOn = false;
        reason = `${reason}; the system tripped ${tripAfterS} s after the contactor closed${contactorOperateS > 0 ? ` (its operate time ${contactorOperateS} s later)` : ""}`;
      }
    } else {
      state.busOn = false;
      state.voltageV = r.endVoltageV;
    }
    const samples = r.samples === undefined ? {} : { samples: r.samples.map((x) => ({ ...x, timeS: x.timeS + startS })) };
    const closing = r.outcome === "completed" && c.contactor !== undefined ? { closing: contactorClosing(c.contactor, c.capacitanceF, c.busVoltageV - r.endVoltageV) } : {};
    const tripped = r.trippedBy === undefined ? {} : { trippedBy: r.trippedBy.kind };
    const extra = {
      ...(r.peakCurrentA === undefined ? {} : { peakCurrentA: r.peakCurrentA }),
      ...(r.electroThermal === undefined ? {} : { electroThermal: r.electroThermal }),
    };
    return {
      type: "event", index: state.index++, kind, label, field, startS, durationS, outcome: r.outcome, busStalled: r.busStalled, reason, startVoltageV,
      endVoltageV: state.voltageV, traces, energyJ, ...tripped, ...closing, ...samples, ...extra,
    };
  };

  // One generator walks the whole nest of repeats with an explicit stack of frames (one per
  // repeat body being walked), so every item is yielded once, not passed up through a generator
  // per nesting level.
  const top: WalkFrame = { events: profile.events, index: 0, repeat: undefined, iteration: 0, startS: 0 };
  const stack: WalkFrame[] = [options.events === undefined ? top : { ...top, events: [], source: options.events }];
  while (stack.length > 0) {
    const frame = stack[stack.length - 1]!;
    let pulled: ProfileEvent | undefined;
    if (frame.source !== undefined) {
      const next = frame.source.next();
      if (next.done === true) {
        stack.pop();
        continue;
      }
      pulled = next.value;
    } else if (frame.index >= frame.events.length) {
      const r = frame.repeat;
      if (r === undefined) {
        stack.pop();
        continue;
      }
      // the end of one repetition: wait out its period, then the next repetition or the end
      if (r.periodS !== undefined) {
        const rest = frame.startS + r.periodS - state.timeS;
        if (rest < -1e-9 * Math.max(1, r.periodS))
          throw inputError(
            "out-of-range",
            `${r.field}.period`,
            `a period at least as long as one repetition (repetition ${frame.iteration + 1} took ${state.timeS - frame.startS} s)`,
            `${r.periodS} s`,
          );
        if (rest > 0) yield gap(rest, r.field);
      }
      frame.iteration++;
      if (frame.iteration < r.count) {
        frame.index = 0;
        frame.startS = state.timeS;
      } else stack.pop();
      continue;
    }
    const e = pulled ?? frame.events[frame.index++]!;
    switch (e.kind) {
      case "power-up":
        yield charge("power-up", e.field, e.label ?? "power-up", e.load ?? circuit!.load, undefined, e.loadField);
        break;
      case "fault":
        yield charge(e.fault.type, e.field, e.label ?? `fault: ${e.fault.type}`, e.fault.load, e.fault.tripAfterS, e.fault.loadField);
        break;
      case "run":
        yield plain("run", e.field, e.label ?? "run", e.durationS);
        break;
      case "wait":
        yield plain("wait", e.field, e.label ?? "wait", e.durationS);
        break;
      case "lockout":
        state.busOn = false;
        yield plain("lockout", e.field, e.label ?? "lockout", e.durationS);
        break;
      case "power-down":
        state.busOn = false;
        yield plain("power-down", e.field, e.label ?? "power-down", e.offS);
        break;
      case "power-trace": {
        const traces = noPower();
        const energyJ = zeros();
        const startS = state.timeS;
        traces[e.partIndex] = e.segments.map((s) => ({ startS: s.startS + startS, durationS: s.durationS, terms: s.terms }));
        energyJ[e.partIndex] = e.segments.reduce((sum, s) => sum + segmentEnergy(s.terms, s.durationS), 0);
        yield plain("power-trace", e.field, e.label ?? `power trace into ${profile.parts[e.partIndex]!.id}`, e.durationS, traces, energyJ);
        break;
      }
      case "retry": {
        const name = e.label ?? "retry";
        let interval = e.intervalS;
        let done = false;
        for (let k = 1; k <= e.attempts; k++) {
          const startS = state.timeS;
          const faulty = e.fault !== undefined && k <= e.faultyAttempts;
          const label = `${name}: attempt ${k} of ${e.attempts}${faulty ? ` (${e.fault!.type})` : ""}`;
          const event = faulty ? charge(e.fault!.type, e.field, label, e.fault!.load, e.fault!.tripAfterS, e.fault!.loadField) : charge("power-up", e.field, label, circuit!.load, undefined);
          yield event;
          if (event.outcome === "completed" && !(faulty && e.fault!.tripAfterS !== undefined)) {
            done = true;
            break;
          }
          if (k < e.attempts) {
            const rest = startS + interval - state.timeS;
            // the interval (start to start) must hold this attempt as it ran (protection may have
            // ended it before its timeout) and the switches' dead time
            if (rest < waitS - 1e-9 * Math.max(1, interval))
              throw inputError(
                "out-of-range",
                `${e.field}.interval`,
                `an interval (start to start) at least as long as attempt ${k} lasted plus the relay's and contactor's dead time (${Number((state.timeS - startS + waitS).toPrecision(9))} s: ${Number((state.timeS - startS).toPrecision(9))} s, ${event.reason}, and ${Number(waitS.toPrecision(9))} s)`,
                `${interval} s`,
              );
            if (rest > 0) yield gap(rest, e.field);
            interval = Math.min(interval * e.backoff, e.maxIntervalS);
          }
        }
        if (!done) {
          state.busOn = false;
          yield plain("lockout", e.field, `${name}: lockout after ${e.attempts} failed attempt${e.attempts === 1 ? "" : "s"}`, e.lockoutS);
        }
        break;
      }
      case "repeat":
        if (e.count > 0) stack.push({ events: e.events, index: 0, repeat: e, iteration: 0, startS: state.timeS });
        break;
    }
  }
}

/** A list of events being walked by expandTimeline: the profile's own, or a repeat's body. */
interface WalkFrame {
  readonly events: readonly ProfileEvent[];
  /** the next event to walk */
  index: number;
  /** the repeat whose body this is (undefined for the profile's top level) */
  readonly repeat: Extract<ProfileEvent, { kind: "repeat" }> | undefined;
  /** 0-based repetition being walked */
  iteration: number;
  /** start of this repetition [s] */
  startS: number;
  /** the top level's events pulled from an iterator (ExpandOptions.events) instead of `events` */
  readonly source?: Iterator<ProfileEvent>;
}
