import type { ElectroThermalSummary } from "../circuits/ElectroThermalSummary.js";
import type { TimelineEvent } from "./expandTimeline.js";

/** One charge's electro-thermal margin, with the event it belongs to. */
export interface LoopGainEvent {
  readonly index: number;
  readonly label: string;
  readonly startS: number;
  readonly summary: ElectroThermalSummary;
}

/** How many runaway events a tally keeps (the count goes on), declared once. */
export const LOOP_GAIN_TALLY_KEEP = 10;

/**
 * The electro-thermal margins of a run's charges (those solved with their parts' temperatures):
 * how many there were, how many passed the warning level, the charge with the largest loop gain
 * that did not run away, the first runaways, and the largest inrush current of the charges that
 * report one. Memory O(LOOP_GAIN_TALLY_KEEP).
 */
export class LoopGainTally {
  coupled = 0;
  warnings = 0;
  runawayCount = 0;
  worst: LoopGainEvent | undefined;
  readonly runaways: LoopGainEvent[] = [];
  /** the charge with the largest inrush current, among those that report it */
  inrush: { readonly index: number; readonly label: string; readonly peakCurrentA: number } | undefined;

  /** Count one event (events with neither a margin nor an inrush peak are ignored). */
  add(event: TimelineEvent): void {
    const peak = event.peakCurrentA;
    if (peak !== undefined && (this.inrush === undefined || peak > this.inrush.peakCurrentA)) this.inrush = { index: event.index, label: event.label, peakCurrentA: peak };
    const summary = event.electroThermal;
    if (summary === undefined) return;
    this.coupled++;
    const record = { index: event.index, label: event.label, startS: event.startS, summary };
    if (summary.runaway !== undefined) {
      this.runawayCount++;
      if (this.runaways.length < LOOP_GAIN_TALLY_KEEP) this.runaways.push(record);
      return;
    }
    if (summary.maxLoopGain > summary.warningLoopGain) this.warnings++;
    if (this.worst === undefined || summary.maxLoopGain > this.worst.summary.maxLoopGain) this.worst = record;
  }
}
