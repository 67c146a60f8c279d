import type { TimelineEvent } from "../profile/expandTimeline.js";

/** The energy into one part of the events of one profile entry (a power-up, a retry block, ...). */
export interface EventEnergy {
  /** the profile field the events come from (`events[1].retry`) */
  readonly field: string;
  /** the first event's label */
  readonly label: string;
  /** how many events the entry expanded to */
  readonly count: number;
  /** energy into the part per event, the entry's total over its count [J] */
  readonly perEventJ: number;
  /** the most any one of them put in [J] */
  readonly maxJ: number;
}

/**
 * Energy per event, gathered as a simulation hands its events over (`onEvent`): the events are
 * grouped by the profile entry they come from (their field: a repeat's power-up, every attempt of
 * a retry block), and per part the sum, count and largest energy are kept. Memory O(entries ×
 * parts), not O(events), so a long profile costs no more than a short one.
 */
export class EventEnergyTally {
  private readonly entries = new Map<string, { label: string; count: number; totalJ: number[]; maxJ: number[] }>();

  /** Count one event. Cost O(parts). */
  add(event: TimelineEvent): void {
    let entry = this.entries.get(event.field);
    if (entry === undefined) {
      entry = { label: event.label, count: 0, totalJ: event.energyJ.map(() => 0), maxJ: event.energyJ.map(() => 0) };
      this.entries.set(event.field, entry);
    }
    entry.count++;
    event.energyJ.forEach((e, i) => {
      entry.totalJ[i] = (entry.totalJ[i] ?? 0) + e;
      entry.maxJ[i] = Math.max(entry.maxJ[i] ?? 0, e);
    });
  }

  /**
   * The entries that put energy into a part, in the order they first occurred. Cost O(entries).
   * @param partIndex the part's index in the profile
   */
  forPart(partIndex: number): EventEnergy[] {
    const out: EventEnergy[] = [];
    for (const [field, e] of this.entries) {
      const total = e.totalJ[partIndex] ?? 0;
      if (total > 0) out.push({ field, label: e.label, count: e.count, perEventJ: total / e.count, maxJ: e.maxJ[partIndex] ?? 0 });
    }
    return out;
  }
}
