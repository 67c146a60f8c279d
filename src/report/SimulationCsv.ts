import { lazyCsv } from "../format/lazyCsv.js";

/**
 * The `--csv` time series of a simulation, built as it streams: one row per step end and per
 * interior local maximum (so every local peak is in the file), with time [s], the index of the
 * event whose window holds the point, the point kind ("step-end" | "peak") and each part's
 * temperature [°C]. Rows are stringified in chunks (csv-stringify) to keep the number of live
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

  /** @param partIds the part ids, in profile order (column headings `<id>_C`) */
  constructor(partIds: readonly string[]) {
    this.chunks.push(lazyCsv.stringify([["time_s", "event", "point", ...partIds.map((id) => `${id}_C`)]]));
  }

  /** Add one point. */
  add(timeS: number, eventIndex: number, kind: "step-end" | "peak", temperatureC: readonly number[]): void {
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
