import { type ContactorSummary, ContactorTally } from "./ContactorTally.js";
import { InputError, withLocation } from "../errors/InputError.js";
import type { ModalModel } from "../thermal/ModalModel.js";
import { type SourcePowers, modalRise } from "../thermal/modalStep.js";
import { type HistorySampling, ThermalRun } from "../thermal/runThermalHistory.js";
import { type TimedStep, traceSteps } from "../thermal/traceSteps.js";
import { SurroundingsDrive } from "./SurroundingsDrive.js";
import { type Verdict, peakVerdict, worstVerdict } from "../stress/Verdict.js";
import type { CircuitModels } from "./CircuitModels.js";
import type { DutyProfile, ProfileEvent, ProfilePart } from "./DutyProfile.js";
import { type TimelineEvent, expandTimeline } from "./expandTimeline.js";
import { memoizeCircuitModels } from "./memoizeCircuitModels.js";
import { circuitReadsTemperature } from "./circuitReadsTemperature.js";
import { thermalContextSource } from "./thermalContextSource.js";

/** A part's verdict: within the limit less its margin, inside the margin, or past the limit (src/stress/Verdict.ts). */
export type PartVerdict = Verdict;

/** Temperatures of one event's window (from its start to the next event's start). */
export interface EventTemperatures {
  /** highest temperature of each part in the window [°C] */
  readonly peakTemperatureC: readonly number[];
  /** when [s] */
  readonly peakTimeS: readonly number[];
}

/** What a simulation found for one part. */
export interface PartResult {
  readonly id: string;
  readonly peakTemperatureC: number;
  readonly peakTimeS: number;
  readonly limitC: number;
  /** limit − peak [K]; negative past the limit */
  readonly marginK: number;
  /** the warning band below the limit the profile asked for [K] */
  readonly requiredMarginK: number;
  readonly verdict: PartVerdict;
  /** first time the temperature went above the limit [s], found exactly inside its step; undefined if never */
  readonly firstExceedanceS?: number;
  /** energy put into the part over the whole profile [J] */
  readonly energyJ: number;
  /** temperature at the end of the profile [°C] */
  readonly endTemperatureC: number;
}

/** The result of a whole profile. */
export interface SimulationResult {
  /** "fail" if any part passed its limit, else "warn" if any is inside its margin, else "pass" */
  readonly verdict: PartVerdict;
  readonly parts: readonly PartResult[];
  readonly eventCount: number;
  readonly stepCount: number;
  readonly endTimeS: number;
  /** charging events by outcome (tripped: ended by a protection), and how many of the timed-out ones had the bus stalled below the threshold */
  readonly outcomes: Readonly<Record<"completed" | "timed-out" | "tripped" | "busStalled", number>>;
  /** the main contactor's closings after completed charges, when the circuit gives `contactor` */
  readonly contactor?: ContactorSummary;
}

/** Options of {@link simulateProfile}. */
export interface SimulateOptions {
  /** the electrical models (src/circuits by default in the CLI) */
  readonly models: CircuitModels;
  /** called once per event when its window closes, in time order */
  readonly onEvent?: (event: TimelineEvent, temperatures: EventTemperatures) => void;
  /**
   * called for every step end and interior peak with each part's temperature [°C]; the array is
   * refilled at every point (copy what you keep)
   */
  readonly onPoint?: (timeS: number, temperatureC: readonly number[], kind: "step-end" | "peak", eventIndex: number) => void;
  /** extra samples between step ends for plots and the --csv file (default none); they reach only onSample, never the peaks or verdicts */
  readonly sampling?: HistorySampling;
  /** called for every extra sample with each part's temperature [°C] (refilled array: copy what you keep), in time order with onPoint's points */
  readonly onSample?: (timeS: number, temperatureC: readonly number[], eventIndex: number) => void;
  /** carry the circuit samples on each charging event handed to onEvent (for the SOA check); default false */
  readonly wantSamples?: boolean;
  /** called every {@link PROGRESS_EVENTS} events with the events opened so far and the profile time reached [s] */
  readonly onProgress?: (events: number, timeS: number) => void;
  /** the top-level events, pulled one at a time in place of `profile.events` (a log replayed as it is read; ExpandOptions.events) */
  readonly events?: Iterable<ProfileEvent>;
  /** called once per part when it first goes above its limit, with the exact time [s] (PartResult.firstExceedanceS), as the run finds it */
  readonly onExceedance?: (partIndex: number, timeS: number) => void;
}

/** How many events pass between two calls of SimulateOptions.onProgress (a power of two). */
export const PROGRESS_EVENTS = 65_536;

/** The powers of a step that heats no part (read only). */
const NO_POWERS: SourcePowers = Object.freeze([]);

/**
 * One modal model for all parts: its sources and observed nodes are the parts (profile order).
 * The modes of every distinct network are laid side by side; the gain from part s to part o is
 * the network's gain from s's source node to o's observed node when both parts share a network,
 * and zero otherwise (separate networks exchange no heat).
 * Cost O(parts² × modes).
 */
export function combinedModel(parts: readonly ProfilePart[]): ModalModel {
  const offsets = new Map<string, number>();
  const tauS: number[] = [];
  for (const p of parts) {
    if (offsets.has(p.networkKey)) continue;
    offsets.set(p.networkKey, tauS.length);
    tauS.push(...p.model.tauS);
  }
  const gainKPerW = parts.map((o) =>
    parts.map((s) => {
      const row = new Array<number>(tauS.length).fill(0);
      if (s.networkKey === o.networkKey) {
        const base = offsets.get(s.networkKey)!;
        s.model.gainKPerW[o.observedIndex]![s.sourceIndex]!.forEach((g, m) => (row[base + m] = g));
      }
      return row;
    }),
  );
  const ids = parts.map((p) => p.id);
  return { tauS, sources: ids, observed: ids, gainKPerW };
}

/**
 * Simulate a duty profile: expand it lazily (expandTimeline), turn every event's power into exact
 * thermal steps (traceSteps) and integrate all parts in one streaming pass (ThermalRun,
 * closed-form modal updates plus interior peak search), so the thermal state of every part is
 * carried from event to event and memory stays flat however many events the profile holds.
 * Temperatures are ambient + rise; each part's verdict compares its peak with its limit
 * (peakVerdict): fail when peak > limit, warn when limit − margin < peak ≤ limit, else pass; the
 * run's verdict is the worst part's.
 * Source: superposition of exact modal responses (docs/design.md, "Exact integration"); verdict
 * rule of our own (docs/design.md, "Verdicts"; src/stress/Verdict.ts).
 * Cost O(events × steps per event × parts × modes); memory O(parts × modes).
 * @throws InputError for a circuit value the models reject or a repeat that overruns its period
 * @example
 * simulateProfile(profile("warehouse-robot-48v.yaml"), { models: defaultCircuitModels }).parts[0].peakTemperatureC // => 132.19
 */
export function simulateProfile(profile: DutyProfile, options: SimulateOptions): SimulationResult {
  const parts = profile.parts;
  // an ambient that varies, or extra heat sources, widen the model by their input columns
  const drive = profile.surroundings === undefined ? undefined : new SurroundingsDrive(parts, combinedModel(parts), profile.surroundings);
  const model = drive?.model ?? combinedModel(parts);
  const count = parts.length;
  const ambient = parts.map((p) => p.ambientC);
  const now = new Float64Array(count);
  const energy = new Float64Array(count);
  const eventPeak = new Float64Array(count);
  const eventPeakTime = new Float64Array(count);
  const outcomes = { completed: 0, "timed-out": 0, tripped: 0, busStalled: 0 };
  const contactor = profile.circuit?.contactor === undefined ? undefined : new ContactorTally(profile.circuit.contactor.makingCurrentA);
  let current: TimelineEvent | undefined;
  let events = 0;
  let lastIndex = -1;

  // One array, refilled at every charge: expandTimeline reads it at once and keeps nothing.
  const temperatures = new Array<number>(count).fill(0);
  const temperatureOf = (): number[] => {
    for (let i = 0; i < count; i++) temperatures[i] = ambient[i]! + now[i]!;
    return temperatures;
  };
  const closeEvent = (): void => {
    if (current === undefined) return;
    lastIndex = current.index;
    if (options.onEvent !== undefined) {
      // fresh arrays: the visitor may keep them
      const peakTemperatureC = new Array<number>(count);
      const peakTimeS = new Array<number>(count);
      for (let i = 0; i < count; i++) {
        peakTemperatureC[i] = ambient[i]! + eventPeak[i]!;
        peakTimeS[i] = eventPeakTime[i]!;
      }
      options.onEvent(current, { peakTemperatureC, peakTimeS });
    }
    current = undefined;
  };
  const openEvent = (event: TimelineEvent): void => {
    closeEvent();
    current = event;
    events++;
    if ((events & (PROGRESS_EVENTS - 1)) === 0) options.onProgress?.(events, event.startS);
    for (let i = 0; i < count; i++) {
      eventPeak[i] = now[i]!;
      eventPeakTime[i] = event.startS;
      energy[i] = energy[i]! + event.energyJ[i]!;
    }
    if (event.outcome !== "none") outcomes[event.outcome]++;
    if (event.busStalled) outcomes.busStalled++;
    if (event.closing !== undefined) contactor?.add(event.closing, event.index);
  };

  const pointTemperatures = new Array<number>(count).fill(0);
  const onPoint = (point: { timeS: number; riseK: readonly number[]; kind: "step-end" | "peak" }): void => {
    for (let i = 0; i < count; i++) {
      const rise = point.riseK[i]!;
      if (point.kind === "step-end") now[i] = rise;
      if (rise > eventPeak[i]!) {
        eventPeak[i] = rise;
        eventPeakTime[i] = point.timeS;
      }
    }
    if (options.onPoint !== undefined) {
      for (let i = 0; i < count; i++) pointTemperatures[i] = ambient[i]! + point.riseK[i]!;
      options.onPoint(point.timeS, pointTemperatures, point.kind, current?.index ?? lastIndex);
    }
  };

  const sampleTemperatures = new Array<number>(count).fill(0);
  const userSample = options.onSample;
  const onSample =
    userSample === undefined
      ? undefined
      : (timeS: number, riseK: readonly number[]): void => {
          for (let i = 0; i < count; i++) sampleTemperatures[i] = ambient[i]! + riseK[i]!;
          userSample(timeS, sampleTemperatures, current?.index ?? lastIndex);
        };

  // The walk is pulled item by item and each item's steps are pushed into the run at once, so a
  // charge reads (temperatureOf) the parts' state after every earlier item.
  const run = new ThermalRun(model, { onPoint, freshPoints: false, crossingRiseK: parts.map((p) => p.limitC - p.ambientC),
    ...(options.onExceedance === undefined ? {} : { onCrossing: options.onExceedance }),
    ...(onSample === undefined ? {} : { onSample, ...(options.sampling === undefined ? {} : { sampling: options.sampling }) }),
  });
  const pushRun = (step: TimedStep): void => run.push(step);
  try {
    // a circuit whose values follow temperature is solved with the parts' modal state at each charge
    const contextOf = circuitReadsTemperature(profile.circuit) ? thermalContextSource(parts, model) : undefined;
    const thermalOf = contextOf === undefined ? {} : { thermalOf: () => contextOf(run.summary().endState) };
    const push = drive === undefined ? (step: TimedStep): void => run.push(step) : (step: TimedStep): void => drive.split(step, pushRun);
    for (const item of expandTimeline(profile, memoizeCircuitModels(options.models), { temperatureOf, wantSamples: options.wantSamples === true, ...thermalOf,
      ...(options.events === undefined ? {} : { events: options.events[Symbol.iterator]() }) })) {
      if (item.type === "event") openEvent(item);
      const until = item.startS + item.durationS;
      // most items (runs, waits, power-downs, gaps) put no power into any part: one step, no merge
      if (item.type === "event" && item.traces.some((t) => t !== undefined)) for (const step of traceSteps(item.traces, item.startS, until)) push(step);
      else if (until > item.startS) push({ startS: item.startS, durationS: until - item.startS, powers: NO_POWERS });
    }
    closeEvent();
  } catch (error) {
    if (error instanceof InputError) throw withLocation(error, profile.file);
    throw error;
  }
  const summary = run.summary();
  const results: PartResult[] = parts.map((p, i) => {
    const peakTemperatureC = p.ambientC + summary.peakRiseK[i]!;
    const marginK = p.limitC - peakTemperatureC;
    const verdict = peakVerdict(peakTemperatureC, p.limitC, p.marginK);
    const exceed = summary.firstCrossingS[i];
    return {
      id: p.id,
      peakTemperatureC,
      peakTimeS: summary.peakTimeS[i]!,
      limitC: p.limitC,
      marginK,
      requiredMarginK: p.marginK,
      verdict,
      ...(exceed === undefined ? {} : { firstExceedanceS: exceed }),
      energyJ: energy[i]!,
      endTemperatureC: p.ambientC + modalRise(model, summary.endState, i),
    };
  });
  const closings = contactor?.summary();
  return {
    verdict: worstVerdict(results.map((r) => r.verdict)),
    parts: results,
    eventCount: events,
    stepCount: summary.steps,
    endTimeS: summary.endTimeS,
    outcomes,
    ...(closings === undefined ? {} : { contactor: closings }),
  };
}
