import type { ContactorClosing } from "../circuits/contactorClosing.js";
import type { Verdict } from "../stress/Verdict.js";

/**
 * The share of the contactor's making-current rating above which its verdict is warn, declared
 * once: common practice leaves headroom under a switching rating for contact wear and a loop
 * resistance lower than estimated (a margin of our own; the maker's rating governs).
 */
export const CONTACTOR_DEFAULTS = { warnRatio: 0.8 } as const;

/** Every contactor closing of a run, summed up: the count, the worst one and its verdict. */
export interface ContactorSummary {
  /** completed charges the contactor closed after */
  readonly closes: number;
  /** the closing with the highest peak current */
  readonly worst: ContactorClosing;
  /** index of the event it followed */
  readonly worstEventIndex: number;
  /** the rating it was compared with [A] */
  readonly makingCurrentA: number;
  /** fail above the rating, warn above CONTACTOR_DEFAULTS.warnRatio of it, else pass */
  readonly verdict: Verdict;
}

/**
 * Collects the contactor closings of a run (one `add` per completed charge) and keeps the
 * worst. Cost O(1) per closing, O(1) memory.
 */
export class ContactorTally {
  private closes = 0;
  private worst: ContactorClosing | undefined;
  private worstIndex = -1;

  constructor(private readonly makingCurrentA: number) {}

  add(closing: ContactorClosing, eventIndex: number): void {
    this.closes++;
    if (this.worst === undefined || closing.peakCurrentA > this.worst.peakCurrentA) {
      this.worst = closing;
      this.worstIndex = eventIndex;
    }
  }

  /** The summary, or undefined when the contactor never closed. */
  summary(): ContactorSummary | undefined {
    if (this.worst === undefined) return undefined;
    const r = this.worst.ratingRatio;
    return {
      closes: this.closes,
      worst: this.worst,
      worstEventIndex: this.worstIndex,
      makingCurrentA: this.makingCurrentA,
      verdict: r > 1 ? "fail" : r > CONTACTOR_DEFAULTS.warnRatio ? "warn" : "pass",
    };
  }
}
