import { EVENT_DIGEST_DEFAULTS } from "./EventDigest.js";
import type { RainflowMode } from "../stress/rainflowCounter.js";
import { type EventRatingCheck, StressAssessment, type StressReport, worseStatus } from "../stress/assessStress.js";
import { checkPulseEnergy, pulseEnergyDeratingFactor } from "../stress/pulseEnergyRating.js";
import type { RatingStatus } from "../stress/pulseEnergyRating.js";
import { pulseFromTrace } from "../stress/pulseFromTrace.js";
import { type StressConfig, resolveStressConfig } from "../stress/resolveStressConfig.js";
import { checkSoa, soaDeratingFactor } from "../stress/soaTable.js";
import { PartLimits } from "../stress/PartLimits.js";
import { partResistance } from "./partResistance.js";
import type { DutyProfile } from "./DutyProfile.js";
import type { TimelineEvent } from "./expandTimeline.js";
import { mosfetOperatingPoints } from "./mosfetOperatingPoints.js";
import { stressPartKind } from "./stressPartKind.js";

/** Options of {@link ProfileStress}; every field has a default. */
export interface ProfileStressOptions {
  /** keep every counted cycle (for `--cycles FILE`); default false, so long profiles run in flat memory */
  readonly keepCycles?: boolean;
  /** rating checks listed per part, declared once (EVENT_DIGEST_DEFAULTS.keepAll); later ones are counted, not kept */
  readonly keepChecks?: number;
  /**
   * how the history is closed for the cycle count: "repeating" (default, `simulate`: one repetition
   * of a profile, ASTM E1049 §5.4.5) or "open" (`replay`: a one-off record such as a field log, half
   * cycles from the residue, §5.4.4)
   */
  readonly mode?: RainflowMode;
}

/** The stress report of one part of a simulated profile. */
export interface PartStress {
  readonly id: string;
  readonly report: StressReport;
  /** events whose rating checks were run but not kept in `report.events` (past `keepChecks`) */
  readonly checksOmitted: number;
}

/** Everything the stress layer found for a profile. */
export interface ProfileStressResult {
  readonly parts: readonly PartStress[];
  /** worst rating status over every part and event */
  readonly ratingStatus: RatingStatus;
}

/** One part's running state. */
interface PartState {
  readonly config: StressConfig;
  readonly assessment: StressAssessment;
  readonly isMosfet: boolean;
  readonly checks: EventRatingCheck[];
  /** the limits beside temperature (voltage, continuous power, adiabatic, repetitive pulses) */
  readonly limits: PartLimits;
  omitted: number;
  status: RatingStatus;
  eventsWithoutPoints: number;
}

/**
 * The stress layer fed by a running simulation, one StressAssessment per part of a profile: the
 * CLI hands it every temperature point of the thermal visitor (`addPoint`: step ends and interior
 * peaks, which hold every turning point of the history) and every event as it closes (`addEvent`),
 * and `finish(endTimeS)` counts the cycles closed on themselves (one repetition of the profile,
 * ASTM E1049 §5.4.5 via the stress layer) and sums Miner damage per repetition, projected over
 * `occursPerYear` when the profile states it.
 *
 * Rating checks run as each event closes (not at the end) so that a profile of a million events
 * keeps only `keepChecks` checks per part in memory: per event with power in the part, the
 * single-pulse energy at its equivalent duration E/P_peak (pulseFromTrace on the part's trace),
 * against the rating derated at the part's temperature at the event start,
 * and for a MOSFET with an SOA table every operating point of the event (see mosfetOperatingPoints),
 * with the SOA derated at the part's temperature at the event start when the profile says how.
 * The per-event rule is the one of StressAssessment.finish, applied as events arrive.
 * Source: wiring of our own (docs/stress.md).
 * Cost O(points × parts + events × (trace segments + samples)); memory O(parts × (residue +
 * keepChecks)) plus the cycles when kept.
 * @throws InputError from the rating checks (a negative energy) or a history out of order
 * @example
 * const robot = profile("warehouse-robot-48v.yaml");
 * const stress = new ProfileStress(robot);
 * const result = simulateProfile(robot, { models: defaultCircuitModels, onEvent: (e) => stress.addEvent(e), onPoint: (t, c, k, i) => stress.addPoint(t, c, k, i) });
 * stress.finish(result.endTimeS).ratingStatus // => "pass"
 */
export class ProfileStress {
  private readonly profile: DutyProfile;
  private readonly parts: PartState[];
  private readonly keepChecks: number;
  private readonly lastStepEndC: number[];
  /** each part's temperature at the start of event `lastPointEvent` (its first point's previous step end) */
  private readonly startTemperatureC: number[];
  private lastPointEvent = -1;

  constructor(profile: DutyProfile, options: ProfileStressOptions = {}) {
    this.profile = profile;
    this.keepChecks = options.keepChecks ?? EVENT_DIGEST_DEFAULTS.keepAll;
    const linearMosfet = profile.circuit?.topology === "linear-mosfet";
    this.parts = profile.parts.map((p) => {
      const config = p.stress ?? resolveStressConfig({}, { partKind: stressPartKind(p.role) });
      const partKind = stressPartKind(p.role);
      const assessment = new StressAssessment(config, {
        partKind,
        linearMode: linearMosfet && partKind === "mosfet",
        mode: options.mode ?? "repeating",
        keepCycles: options.keepCycles === true,
        ...(profile.occursPerYear === undefined ? {} : { repetitionsPerYear: profile.occursPerYear }),
      });
      // the history starts at time 0 with every part at its ambient (the simulator's initial state)
      assessment.addTemperature(0, p.ambientC);
      const limits = new PartLimits(config, { ...partResistance(p, config, profile.circuit), ambientC: p.ambientC });
      return { config, assessment, isMosfet: partKind === "mosfet", checks: [], limits, omitted: 0, status: "pass" as RatingStatus, eventsWithoutPoints: 0 };
    });
    this.lastStepEndC = profile.parts.map((p) => p.ambientC);
    this.startTemperatureC = this.lastStepEndC.slice();
  }

  /** Whether the simulation should carry circuit samples (a MOSFET part has an SOA table). */
  get wantsSamples(): boolean {
    return this.parts.some((p) => p.isMosfet && p.config.soa !== undefined);
  }

  /** A point of the thermal history (the simulator's onPoint): each part's temperature [°C]. */
  addPoint(timeS: number, temperatureC: readonly number[], kind: "step-end" | "peak", eventIndex: number): void {
    if (eventIndex !== this.lastPointEvent) {
      // the first point of a new event: the last step end before it is the temperature at its
      // start (events close in order, each before the next one's first point, so one slot holds it)
      for (let i = 0; i < this.lastStepEndC.length; i++) this.startTemperatureC[i] = this.lastStepEndC[i]!;
      this.lastPointEvent = eventIndex;
    }
    for (let i = 0; i < this.parts.length; i++) this.parts[i]!.assessment.addTemperature(timeS, temperatureC[i]!);
    if (kind === "step-end") for (let i = 0; i < temperatureC.length; i++) this.lastStepEndC[i] = temperatureC[i]!;
  }

  /** An event whose window has closed (the simulator's onEvent): run its rating checks per part. */
  addEvent(event: TimelineEvent): void {
    // an event without points of its own (none reached the visitor) started where the last step ended
    const start = event.index === this.lastPointEvent ? this.startTemperatureC : this.lastStepEndC;
    this.parts.forEach((part, i) => {
      const trace = event.traces[i];
      if (trace === undefined || !(event.energyJ[i]! > 0)) return;
      const { pulseEnergy, pulseEnergyDerating, soa, soaDerating } = part.config;
      // an SOA table is only read for the circuit's MOSFET (the note in finish says so for other parts)
      if (pulseEnergy === undefined && (soa === undefined || !part.isMosfet) && !part.limits.wantsEvents) return;
      const pulse = pulseFromTrace(trace);
      const field = `events[${event.index}]`;
      const startC = start[i]!;
      const deratingFactor = pulseEnergyDerating === undefined ? 1 : pulseEnergyDeratingFactor(pulseEnergyDerating, startC);
      part.limits.addEvent({ index: event.index, startS: event.startS, energyJ: pulse.energyJ, peakPowerW: pulse.peakPowerW, startTemperatureC: startC, deratingFactor, trace });
      if (pulseEnergy === undefined && (soa === undefined || !part.isMosfet)) return;
      const energy = pulseEnergy === undefined ? undefined : checkPulseEnergy(pulseEnergy, pulse.energyJ, pulse.peakPowerW, field, deratingFactor);
      let soaCheck: EventRatingCheck["soa"];
      if (soa !== undefined && part.isMosfet) {
        const points = event.samples === undefined ? [] : mosfetOperatingPoints(event.samples, trace, this.profile.circuit?.busVoltageV ?? 0);
        if (points.length === 0 || !(pulse.durationS > 0)) part.eventsWithoutPoints++;
        else soaCheck = checkSoa(soa, points, pulse.durationS, field, soaDerating === undefined ? 1 : soaDeratingFactor(soaDerating, startC));
      }
      const status = worseStatus(energy?.status ?? "pass", soaCheck?.status ?? "pass");
      part.status = worseStatus(part.status, status);
      if (part.checks.length < this.keepChecks) part.checks.push({ index: event.index, startS: event.startS, startTemperatureC: startC, pulseEnergy: energy, soa: soaCheck, status });
      else part.omitted++;
    });
  }

  /** Close every part's history (one repetition of the profile, `endTimeS` long) and report. */
  finish(endTimeS: number): ProfileStressResult {
    const parts = this.profile.parts.map((p, i): PartStress => {
      const state = this.parts[i]!;
      // the end of the profile is a point of the history too (the last step end is at endTimeS already)
      const base = state.assessment.finish([]);
      const notes = [...base.notes];
      if (state.eventsWithoutPoints > 0)
        notes.push(`${state.eventsWithoutPoints} event(s) carried no operating points (no circuit samples): they were not checked against the SOA.`);
      if (state.config.soa !== undefined && !state.isMosfet)
        notes.push("An SOA table was given for a part that is not the circuit's linear-mode MOSFET (role mosfet): it was not checked.");
      if (state.omitted > 0) notes.push(`Rating checks of ${state.omitted} later event(s) are counted in the status but not listed.`);
      if (!(endTimeS > 0)) notes.push("The profile takes no time: no temperature cycles.");
      const limits = state.limits.finish(endTimeS);
      notes.push(...state.limits.notes);
      state.status = limits.reduce<RatingStatus>((s, l) => worseStatus(s, l.status), state.status);
      return { id: p.id, report: { ...base, ratingStatus: state.status, events: state.checks, limits, notes }, checksOmitted: state.omitted };
    });
    return { parts, ratingStatus: this.parts.reduce<RatingStatus>((s, p) => worseStatus(s, p.status), "pass") };
  }
}
