/**
 * A flat-memory envelope of a time series for charts: the time axis is cut into a fixed number of
 * bins and each bin keeps the maximum of every series seen in it; when a point falls past the
 * last bin, neighbouring bins are merged pairwise (the bin width doubles), so any number of points
 * fits in O(bins) memory and no peak is ever dropped.
 * Source: max-preserving decimation, as used for min/max envelopes of oscilloscope displays
 * (common practice).
 * Cost O(series) per point, amortised; memory O(bins × series).
 * @example
 * const envelope = new PeakEnvelope(1);
 * [[0, 40], [0.5, 90], [2, 60]].forEach(([t, c]) => envelope.add(t, [c]));
 * Math.max(...envelope.points(0).map((p) => p.y)) // => 90
 */
export class PeakEnvelope {
  private widthS: number;
  private readonly bins: number;
  private readonly maxima: Float64Array[];
  private readonly startS: number;
  private used = 0;

  /**
   * @param series number of series
   * @param bins bins kept (the chart resamples them to its width)
   * @param firstWidthS initial bin width [s]
   */
  constructor(series: number, bins = 512, firstWidthS = 1e-3, startS = 0) {
    this.bins = bins;
    this.widthS = firstWidthS;
    this.startS = startS;
    this.maxima = Array.from({ length: series }, () => new Float64Array(bins).fill(Number.NaN));
  }

  /** Add a point: values per series at a time ≥ the previous point's. */
  add(timeS: number, values: readonly number[]): void {
    let bin = Math.floor((timeS - this.startS) / this.widthS);
    while (bin >= this.bins) {
      this.merge();
      bin = Math.floor((timeS - this.startS) / this.widthS);
    }
    if (bin < 0) bin = 0;
    this.used = Math.max(this.used, bin + 1);
    for (let s = 0; s < this.maxima.length; s++) {
      const m = this.maxima[s]!;
      const v = values[s]!;
      if (Number.isNaN(m[bin]!) || v > m[bin]!) m[bin] = v;
    }
  }

  private merge(): void {
    const half = this.bins / 2;
    for (const m of this.maxima) {
      for (let i = 0; i < half; i++) {
        const a = m[2 * i]!;
        const b = m[2 * i + 1]!;
        m[i] = Number.isNaN(a) ? b : Number.isNaN(b) ? a : Math.max(a, b);
      }
      m.fill(Number.NaN, half);
    }
    this.used = Math.ceil(this.used / 2);
    this.widthS *= 2;
  }

  /** The envelope of one series as (bin centre time, max) points, bins without data skipped. */
  points(series: number): { x: number; y: number }[] {
    const out: { x: number; y: number }[] = [];
    const m = this.maxima[series]!;
    for (let i = 0; i < this.used; i++) if (!Number.isNaN(m[i]!)) out.push({ x: this.startS + (i + 0.5) * this.widthS, y: m[i]! });
    return out;
  }
}
