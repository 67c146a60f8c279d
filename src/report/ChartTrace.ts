import type { TimelineEvent } from "../profile/expandTimeline.js";
import type { EventTemperatures } from "../profile/simulateProfile.js";
import { PeakEnvelope } from "./PeakEnvelope.js";
import { TIME_SERIES_DEFAULTS } from "./timeSeriesDefaults.js";

/** A recorded point: time [s] and each part's temperature [°C]. */
export interface TracePoint {
  readonly timeS: number;
  readonly temperatureC: readonly number[];
}

/** The event closest to a limit and every point of its window, for the report's inset. */
export interface WorstEventTrace {
  readonly index: number;
  readonly label: string;
  readonly startS: number;
  /** per part [°C] and when [s] */
  readonly peakTemperatureC: readonly number[];
  readonly peakTimeS: readonly number[];
  /** the window's points in time order (step ends, peaks, samples) */
  readonly points: readonly TracePoint[];
  /** true when the window had more than TIME_SERIES_DEFAULTS.maxInsetPoints points (the rest were not kept) */
  readonly truncated: boolean;
}

/**
 * What the HTML report and the --svg chart draw of a simulation, recorded as it streams: a
 * high and a low envelope of every part's temperature (PeakEnvelope on the values and on their
 * negatives, so the band between them holds the whole curve, cooling included, in O(bins)
 * memory), and the points of the event closest to a limit (largest peak − limit over the parts;
 * the first such event on a tie), kept by buffering each event's window and dropping it when the
 * event closes unless it is the worst so far.
 * Source: min/max decimation (common practice for oscilloscope displays).
 * Cost O(parts) per point; memory O(bins × parts + points of one event window).
 */
export class ChartTrace {
  readonly highs: PeakEnvelope;
  private readonly negatedLows: PeakEnvelope;
  private readonly negated: number[];
  private readonly limitsC: readonly number[];
  private buffer: TracePoint[] = [];
  private bufferTruncated = false;
  private worstCloseness = -Infinity;
  worst: WorstEventTrace | undefined;

  /** @param limitsC each part's limit [°C], profile order */
  constructor(limitsC: readonly number[]) {
    this.limitsC = limitsC;
    this.highs = new PeakEnvelope(limitsC.length);
    this.negatedLows = new PeakEnvelope(limitsC.length);
    this.negated = new Array<number>(limitsC.length).fill(0);
  }

  /** A point of the history (step end, peak or sample), in time order; `eventIndex` −1 before the first event. */
  add(timeS: number, temperatureC: readonly number[], eventIndex: number): void {
    this.highs.add(timeS, temperatureC);
    for (let i = 0; i < temperatureC.length; i++) this.negated[i] = -temperatureC[i]!;
    this.negatedLows.add(timeS, this.negated);
    if (eventIndex < 0) return;
    if (this.buffer.length < TIME_SERIES_DEFAULTS.maxInsetPoints) this.buffer.push({ timeS, temperatureC: temperatureC.slice() });
    else this.bufferTruncated = true;
  }

  /** An event's window has closed (after all its points): keep its points if it is the closest to a limit so far. */
  closeEvent(event: TimelineEvent, temperatures: EventTemperatures): void {
    const closeness = Math.max(...temperatures.peakTemperatureC.map((t, i) => t - this.limitsC[i]!));
    if (closeness > this.worstCloseness) {
      this.worstCloseness = closeness;
      this.worst = {
        index: event.index,
        label: event.label,
        startS: event.startS,
        peakTemperatureC: temperatures.peakTemperatureC,
        peakTimeS: temperatures.peakTimeS,
        points: this.buffer,
        truncated: this.bufferTruncated,
      };
    }
    this.buffer = [];
    this.bufferTruncated = false;
  }

  /** The low envelope of part `series` as (bin centre time [s], lowest temperature [°C]) points. */
  lows(series: number): { x: number; y: number }[] {
    return this.negatedLows.points(series).map((p) => ({ x: p.x, y: -p.y }));
  }
}
