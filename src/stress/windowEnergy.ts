import { type PowerTrace, segmentEnergy } from "../thermal/powerTrace.js";

/**
 * The most energy a power trace puts in within any window of `windowS` seconds: the windows that
 * start at a segment start and those that end at a segment end are tried (power within a
 * segment of the circuit models is monotonic or has one interior maximum near a segment start, so
 * the worst window touches a segment boundary; for a trace of one decaying pulse it is the window
 * from its start). Energies are exact integrals (segmentEnergy) from cumulative sums.
 * A window longer than the trace gives its whole energy. Cost O(segments · log segments).
 * @example
 * maxWindowEnergyJ([{ startS: 0, durationS: 1, terms: [{ a: 10, b: 0, lambda: 0 }] }], 0.25) // => 2.5
 */
export function maxWindowEnergyJ(trace: PowerTrace, windowS: number): number {
  const n = trace.length;
  if (n === 0 || !(windowS > 0)) return 0;
  // cumulative energy at each segment start (gaps between segments carry nothing)
  const cumulative = new Float64Array(n + 1);
  for (let i = 0; i < n; i++) cumulative[i + 1] = cumulative[i]! + segmentEnergy(trace[i]!.terms, trace[i]!.durationS);
  const energyTo = (t: number): number => {
    if (t <= trace[0]!.startS) return 0;
    let lo = 0;
    let hi = n - 1;
    while (lo < hi) {
      const mid = (lo + hi + 1) >> 1;
      if (trace[mid]!.startS <= t) lo = mid;
      else hi = mid - 1;
    }
    const seg = trace[lo]!;
    const into = Math.min(seg.durationS, t - seg.startS);
    return cumulative[lo]! + (into > 0 ? segmentEnergy(seg.terms, into) : 0);
  };
  let best = 0;
  for (const seg of trace) {
    const fromStart = energyTo(seg.startS + windowS) - energyTo(seg.startS);
    const end = seg.startS + seg.durationS;
    const toEnd = energyTo(end) - energyTo(end - windowS);
    best = Math.max(best, fromStart, toEnd);
  }
  return best;
}
