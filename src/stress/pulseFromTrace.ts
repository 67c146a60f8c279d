import { type PowerTerm, type PowerTrace, powerAt, segmentEnergy } from "../thermal/powerTrace.js";

/** Grid points per multi-term segment used to bracket the peak power before golden-section refinement. */
export const PEAK_POWER_GRID_POINTS = 64;

/** What a rating check needs to know of one part's power in one event. */
export interface PulseSummary {
  /** energy [J] */
  readonly energyJ: number;
  /** highest instantaneous power [W] (0 for no power) */
  readonly peakPowerW: number;
  /** when [s, absolute] */
  readonly peakTimeS: number;
  /** start of the first segment with power [s]; NaN for no power */
  readonly startS: number;
  /** from that start to the end of the last segment with power [s] (the conduction time) */
  readonly durationS: number;
}

const GOLDEN = (Math.sqrt(5) - 1) / 2;

/** Largest power on one segment: [s, P]. */
function segmentPeak(terms: readonly PowerTerm[], h: number): [number, number] {
  let bestS = 0;
  let bestP = powerAt(terms, 0);
  const consider = (s: number) => {
    if (!(s >= 0 && s <= h)) return;
    const p = powerAt(terms, s);
    if (p > bestP) {
      bestP = p;
      bestS = s;
    }
  };
  consider(h);
  // d/ds[(a + b·s)·e^(−λs)] = (b − λ(a + b·s))·e^(−λs) = 0 at s* = 1/λ − a/b
  for (const t of terms) if (t.b !== 0 && t.lambda > 0) consider(1 / t.lambda - t.a / t.b);
  if (terms.length > 1 && h > 0) {
    const n = PEAK_POWER_GRID_POINTS;
    let gridBest = 0;
    let gridP = Number.NEGATIVE_INFINITY;
    for (let i = 0; i <= n; i++) {
      const p = powerAt(terms, (h * i) / n);
      if (p > gridP) {
        gridP = p;
        gridBest = i;
      }
    }
    let lo = (h * Math.max(0, gridBest - 1)) / n;
    let hi = (h * Math.min(n, gridBest + 1)) / n;
    for (let k = 0; k < 80 && hi - lo > 1e-15 * Math.max(1, h); k++) {
      const m1 = hi - GOLDEN * (hi - lo);
      const m2 = lo + GOLDEN * (hi - lo);
      if (powerAt(terms, m1) < powerAt(terms, m2)) lo = m1;
      else hi = m2;
    }
    consider((lo + hi) / 2);
    consider((h * gridBest) / n);
  }
  return [bestS, bestP];
}

/**
 * Energy, peak power and conduction time of one part's power trace in one event, for the
 * rating checks (E and P_peak give the equivalent duration E/P_peak; the conduction time is the
 * pulse duration the SOA is read at).
 *
 * Energy is exact (segmentEnergy). The peak of a segment is exact for single-term segments (the
 * ends and the stationary point s* = 1/λ − a/b of (a + b·s)·e^(−λs)); for a sum of terms it is
 * bracketed on a {@link PEAK_POWER_GRID_POINTS}-point grid and refined by golden-section search
 * (a unimodal bracket is assumed around the best grid point; power traces of the circuit
 * models are sums of at most a few smooth terms). Source: golden-section search, Press et al.,
 * Numerical Recipes, 3rd ed. (2007), §10.2.
 * Cost O(segments × terms × grid).
 */
export function pulseFromTrace(trace: PowerTrace): PulseSummary {
  let energyJ = 0;
  let peakPowerW = 0;
  let peakTimeS = Number.NaN;
  let startS = Number.NaN;
  let endS = Number.NaN;
  for (const seg of trace) {
    if (seg.terms.length === 0 || seg.terms.every((t) => t.a === 0 && t.b === 0)) continue;
    energyJ += segmentEnergy(seg.terms, seg.durationS);
    if (Number.isNaN(startS)) startS = seg.startS;
    endS = seg.startS + seg.durationS;
    const [s, p] = segmentPeak(seg.terms, seg.durationS);
    if (p > peakPowerW) {
      peakPowerW = p;
      peakTimeS = seg.startS + s;
    }
  }
  return { energyJ, peakPowerW, peakTimeS, startS, durationS: Number.isNaN(startS) ? 0 : endS - startS };
}
