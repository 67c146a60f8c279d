import type { EventTemperatures } from "./simulateProfile.js";
import type { TimelineEvent } from "./expandTimeline.js";
import type { ElectroThermalSummary } from "../circuits/ElectroThermalSummary.js";
import { LoopGainTally } from "./LoopGainTally.js";

/** What a report keeps of one event. */
export interface EventRecord {
  readonly index: number;
  readonly kind: TimelineEvent["kind"];
  readonly label: string;
  readonly startS: number;
  readonly durationS: number;
  readonly outcome: TimelineEvent["outcome"];
  readonly busStalled: boolean;
  readonly reason: string;
  /** the protection that ended a charging event, and the contactor's closing after a completed one */
  readonly trippedBy?: TimelineEvent["trippedBy"];
  readonly closing?: TimelineEvent["closing"];
  readonly startVoltageV: number;
  readonly endVoltageV: number;
  /** per part, profile order */
  readonly energyJ: readonly number[];
  readonly peakTemperatureC: readonly number[];
  readonly peakTimeS: readonly number[];
  /** the electro-thermal margin of a charge solved with its parts' temperatures */
  readonly electroThermal?: ElectroThermalSummary;
  /** the charging element's highest current in the event (inrush peak) [A], when reported */
  readonly peakCurrentA?: number;
}

/** How many events a digest keeps, declared once. */
export const EVENT_DIGEST_DEFAULTS = {
  /** every event is kept up to this count (the JSON report lists them) */
  keepAll: 100_000,
  /** events listed in the terminal when the profile is short */
  terminalAll: 30,
  /** hottest events listed in the terminal when it is long */
  terminalHottest: 10,
} as const;

/**
 * Bounded memory of a long run's events: all of them up to `keepAll`, and always the `hottest`
 * events by closeness to a limit (max over parts of peak − limit), so a report on a
 * million-event profile keeps what matters without growing without bound.
 * Cost O(log hottest) per event (insertion in a short sorted list); memory O(keepAll + hottest).
 * @example
 * const robot = profile("warehouse-robot-48v.yaml");
 * const digest = new EventDigest(robot.parts.map((p) => p.limitC));
 * simulateProfile(robot, { models: defaultCircuitModels, onEvent: (e, t) => digest.add(e, t) });
 * digest.count // => 24
 */
export class EventDigest {
  readonly all: EventRecord[] = [];
  readonly hottest: EventRecord[] = [];
  count = 0;
  /** the electro-thermal margins of every charge, kept or not */
  readonly loopGain = new LoopGainTally();
  /** closeness of each record of `hottest`, same order */
  private readonly hottestCloseness: number[] = [];
  private readonly limits: readonly number[];
  private readonly keepAll: number;
  private readonly keepHottest: number;

  constructor(limitsC: readonly number[], keepAll: number = EVENT_DIGEST_DEFAULTS.keepAll, keepHottest: number = EVENT_DIGEST_DEFAULTS.terminalHottest) {
    this.limits = limitsC;
    this.keepAll = keepAll;
    this.keepHottest = keepHottest;
  }

  /** Record an event (in time order). */
  add(event: TimelineEvent, temperatures: EventTemperatures): void {
    this.count++;
    this.loopGain.add(event);
    const keep = this.all.length < this.keepAll;
    const c = closenessOf(temperatures.peakTemperatureC, this.limits);
    const ranks = this.hottest.length < this.keepHottest || c > this.hottestCloseness[this.hottestCloseness.length - 1]!;
    // most events of a long run are neither kept nor among the hottest: no record is made for them
    if (!keep && !ranks) return;
    const record: EventRecord = {
      index: event.index,
      kind: event.kind,
      label: event.label,
      startS: event.startS,
      durationS: event.durationS,
      outcome: event.outcome,
      busStalled: event.busStalled,
      reason: event.reason,
      ...(event.trippedBy === undefined ? {} : { trippedBy: event.trippedBy }),
      ...(event.closing === undefined ? {} : { closing: event.closing }),
      startVoltageV: event.startVoltageV,
      endVoltageV: event.endVoltageV,
      energyJ: event.energyJ,
      peakTemperatureC: temperatures.peakTemperatureC,
      peakTimeS: temperatures.peakTimeS,
      ...(event.electroThermal === undefined ? {} : { electroThermal: event.electroThermal }),
      ...(event.peakCurrentA === undefined ? {} : { peakCurrentA: event.peakCurrentA }),
    };
    if (keep) this.all.push(record);
    if (ranks) {
      let at = this.hottestCloseness.findIndex((r) => c > r);
      if (at < 0) at = this.hottest.length;
      this.hottest.splice(at, 0, record);
      this.hottestCloseness.splice(at, 0, c);
      if (this.hottest.length > this.keepHottest) {
        this.hottest.pop();
        this.hottestCloseness.pop();
      }
    }
  }
}

/** Closeness of an event to a limit: max over parts of peak − limit [K]. */
function closenessOf(peaksC: readonly number[], limitsC: readonly number[]): number {
  let worst = -Infinity;
  for (let i = 0; i < peaksC.length; i++) worst = Math.max(worst, peaksC[i]! - limitsC[i]!);
  return worst;
}
