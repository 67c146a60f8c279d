/**
 * How densely `--csv`, `--report` and `--svg` sample a simulated history between step ends,
 * declared once (help, docs and code read it). Light module: the command definitions print it.
 * Each sample is exact (closed-form modal advance); samples never change peaks or verdicts.
 */
export const TIME_SERIES_DEFAULTS = {
  /**
   * geometric samples inside every step, from a quarter of the fastest time constant after its
   * start, each this many times later than the one before (HistorySampling.ratio): 2 gives one
   * per octave, about 3.3 per decade, enough for an exponential to read as a curve (common practice
   * for log-spaced plots)
   */
  sampleRatio: 2,
  /**
   * and at the inner cuts of every step divided into this many equal parts
   * (HistorySampling.divisions), so a plot on a linear time axis shows the tail of a long step as a curve
   */
  sampleDivisions: 8,
  /** the most rows a --csv file may take before the run stops with advice to sample less densely */
  maxCsvRows: 2_000_000,
  /** points the report keeps around its worst event (the inset), beyond which it stops recording */
  maxInsetPoints: 40_000,
} as const;
