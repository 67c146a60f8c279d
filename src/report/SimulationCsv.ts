import { inputError } from "../errors/InputError.js";
import { lazyCsv } from "../format/lazyCsv.js";
import { TIME_SERIES_DEFAULTS } from "./timeSeriesDefaults.js";

/**
 * The `--csv` time series of a simulation, built as it streams: one row per step end, per
 * interior local maximum (so every local peak is in the file) and per sample between them
 * (TIME_SERIES_DEFAULTS, `--sample-step`: the true curve, exact), with time [s], the index of the
 * event whose window holds the point, the point kind ("step-end" | "peak" | "sample") and each
 * part's temperature [°C]. More than `maxRows` rows is an InputError that says how to sample less. Rows are stringified in chunks (csv-stringify) to keep the number of live
 * objects small; the text grows with the run, as a time series must.
 * Source: RFC 4180 (2005) CSV, written by csv-stringify.
 * Cost O(parts) per point.
 * @example
 * const csv = new SimulationCsv(["R1"]);
 * csv.add(0.5, 0, "step-end", [61.25]);
 * csv.text() // => "time_s,event,point,R1_C\n0.5,0,step-end,61.25\n"
 */
export class SimulationCsv {
  private readonly chunks: string[] = [];
  private rows: (string | number)[][] = [];
  rowCount = 0;
  private readonly maxRows: number;

  /**
   * @param partIds the part ids, in profile order (column headings `<id>_C`)
   * @param maxRows the most rows written (TIME_SERIES_DEFAULTS.maxCsvRows)
   */
  constructor(partIds: readonly string[], maxRows: number = TIME_SERIES_DEFAULTS.maxCsvRows) {
    this.maxRows = maxRows;
    this.chunks.push(lazyCsv.stringify([["time_s", "event", "point", ...partIds.map((id) => `${id}_C`)]]));
  }

  /**
   * Add one point.
   * @throws InputError (bad-option, --csv) past maxRows
   */
  add(timeS: number, eventIndex: number, kind: "step-end" | "peak" | "sample", temperatureC: readonly number[]): void {
    if (this.rowCount >= this.maxRows)
      throw inputError("bad-option", "--csv", `at most ${this.maxRows} rows (a longer --sample-step, a larger --sample-ratio, or 0 for none)`, `more than ${this.maxRows} rows`);
    this.rows.push([timeS, eventIndex, kind, ...temperatureC.map((t) => Number(t.toFixed(6)))]);
    this.rowCount++;
    if (this.rows.length >= 4096) this.flush();
  }

  private flush(): void {
    if (this.rows.length === 0) return;
    this.chunks.push(lazyCsv.stringify(this.rows));
    this.rows = [];
  }

  /** The whole CSV text. */
  text(): string {
    this.flush();
    return this.chunks.join("");
  }
}
