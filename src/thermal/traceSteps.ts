import type { SourcePowers } from "./modalStep.js";
import { type PowerTerm, type PowerTrace, shiftTerms } from "./powerTrace.js";

/** One step of a thermal run: a time interval on which every source's power is one term sum. */
export interface TimedStep {
  /** start time [s] */
  readonly startS: number;
  /** length [s] */
  readonly durationS: number;
  /** power terms per model source, in step-local time */
  readonly powers: SourcePowers;
}

/**
 * Merge one power trace per model source into a stream of steps on which every source's power
 * is a single term sum: the steps split at every segment boundary of every trace; gaps are
 * zero-power steps; a segment cut at an interior time is re-origined exactly (shiftTerms).
 * Lazy: memory does not grow with the number of segments.
 * Cost O(total segments × sources).
 * @param traces one trace per model source (undefined: that source has no power)
 * @param fromS first step start [s] (default 0: the run starts at ambient at t = 0)
 * @param untilS optional end time [s]; a zero-power step is added up to it after the last segment
 */
export function* traceSteps(traces: readonly (PowerTrace | undefined)[], fromS = 0, untilS?: number): Generator<TimedStep> {
  const cursor = traces.map(() => 0);
  let t = fromS;
  for (;;) {
    let next = Infinity;
    for (let s = 0; s < traces.length; s++) {
      const trace = traces[s];
      if (trace === undefined) continue;
      while (cursor[s]! < trace.length && trace[cursor[s]!]!.startS + trace[cursor[s]!]!.durationS <= t) cursor[s]!++;
      const seg = trace[cursor[s]!];
      if (seg === undefined) continue;
      next = Math.min(next, seg.startS > t ? seg.startS : seg.startS + seg.durationS);
    }
    if (next === Infinity) {
      if (untilS !== undefined && untilS > t) yield { startS: t, durationS: untilS - t, powers: traces.map(() => undefined) };
      return;
    }
    if (untilS !== undefined && next > untilS) next = untilS;
    const powers = new Array<readonly PowerTerm[] | undefined>(traces.length);
    for (let s = 0; s < traces.length; s++) {
      const seg = traces[s]?.[cursor[s]!];
      powers[s] = seg === undefined || seg.startS > t ? undefined : seg.startS === t ? seg.terms : shiftTerms(seg.terms, t - seg.startS);
    }
    if (next > t) yield { startS: t, durationS: next - t, powers };
    t = next;
    if (untilS !== undefined && t >= untilS) return;
  }
}
