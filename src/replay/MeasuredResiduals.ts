/** The residuals of one part: replayed temperature minus measured temperature, over the lines that measured it. */
export interface PartResiduals {
  readonly id: string;
  /** log lines with a measured temperature of this part */
  readonly count: number;
  /** mean of replayed − measured [K]; null without a measurement */
  readonly meanK: number | null;
  /** root mean square of replayed − measured [K] */
  readonly rmsK: number | null;
  /** the residual of largest magnitude, with its sign [K] */
  readonly maxAbsK: number | null;
  /** where it was: the file line, seconds from the first line, replayed and measured temperature [°C] */
  readonly maxAt: { readonly line: number; readonly timeS: number; readonly replayedC: number; readonly measuredC: number } | null;
}

/** What the measured columns of a log said, against the replay. */
export interface MeasuredComparison {
  /**
   * the ambient the replayed temperatures are compared on: "measured" (the log's ambient column,
   * held from the line that gave it until the next one; the profile's ambient before the first)
   * or "profile" (no ambient column). The replay itself (peaks, limits, damage) always runs on the
   * profile's ambient.
   */
  readonly ambient: "measured" | "profile";
  /** the measured ambient column: lines, mean, least and greatest [°C]; null without one */
  readonly measuredAmbient: { readonly count: number; readonly meanC: number; readonly minC: number; readonly maxC: number } | null;
  readonly parts: readonly PartResiduals[];
}

/**
 * Running tally of a replay against a log's measured temperatures, in constant memory: per part
 * the count, the sum and the sum of squares of the residual r = replayed − measured, and the
 * largest |r| with its line. Mean = Σr/n, RMS = √(Σr²/n) (the usual definitions; a fit is good
 * when the mean is near 0 and the RMS near the sensor's own error).
 * Source: the usual definitions of mean and root mean square (common practice).
 * Cost O(1) per measurement.
 */
export class MeasuredResiduals {
  private readonly ids: readonly string[];
  private readonly count: Float64Array;
  private readonly sum: Float64Array;
  private readonly squares: Float64Array;
  private readonly worst: ({ line: number; timeS: number; replayedC: number; measuredC: number; residualK: number } | undefined)[];
  private readonly hasAmbient: boolean;
  private ambientCount = 0;
  private ambientSum = 0;
  private ambientMin = Number.POSITIVE_INFINITY;
  private ambientMax = Number.NEGATIVE_INFINITY;

  /** @param ids the parts that have a measured column, in column order */
  constructor(ids: readonly string[], hasAmbient: boolean) {
    this.ids = ids;
    this.count = new Float64Array(ids.length);
    this.sum = new Float64Array(ids.length);
    this.squares = new Float64Array(ids.length);
    this.worst = ids.map(() => undefined);
    this.hasAmbient = hasAmbient;
  }

  /** A measured ambient [°C] of a line. */
  addAmbient(ambientC: number): void {
    this.ambientCount++;
    this.ambientSum += ambientC;
    if (ambientC < this.ambientMin) this.ambientMin = ambientC;
    if (ambientC > this.ambientMax) this.ambientMax = ambientC;
  }

  /** One measurement of column k on a file line at a time: the replayed and the measured temperature [°C]. */
  add(k: number, line: number, timeS: number, replayedC: number, measuredC: number): void {
    const r = replayedC - measuredC;
    this.count[k]!++;
    this.sum[k] = this.sum[k]! + r;
    this.squares[k] = this.squares[k]! + r * r;
    const worst = this.worst[k];
    if (worst === undefined || Math.abs(r) > Math.abs(worst.residualK)) this.worst[k] = { line, timeS, replayedC, measuredC, residualK: r };
  }

  /** The statistics so far. */
  result(): MeasuredComparison {
    return {
      ambient: this.hasAmbient ? "measured" : "profile",
      measuredAmbient:
        this.ambientCount === 0 ? null : { count: this.ambientCount, meanC: this.ambientSum / this.ambientCount, minC: this.ambientMin, maxC: this.ambientMax },
      parts: this.ids.map((id, k) => {
        const n = this.count[k]!;
        const worst = this.worst[k];
        return {
          id,
          count: n,
          meanK: n === 0 ? null : this.sum[k]! / n,
          rmsK: n === 0 ? null : Math.sqrt(this.squares[k]! / n),
          maxAbsK: worst === undefined ? null : worst.residualK,
          maxAt: worst === undefined ? null : { line: worst.line, timeS: worst.timeS, replayedC: worst.replayedC, measuredC: worst.measuredC },
        };
      }),
    };
  }
}
