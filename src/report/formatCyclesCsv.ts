import { lazyCsv } from "../format/lazyCsv.js";
import type { RainflowCycle } from "../stress/rainflowCounter.js";

/** Column names of the cycles CSV, in order. */
export const CYCLES_CSV_COLUMNS = [
  "part",
  "start_s",
  "range_K",
  "mean_C",
  "min_C",
  "max_C",
  "count",
  "heating_time_s",
  "duration_s",
  "damage",
] as const;

/**
 * Counted cycles as CSV text (for `--cycles FILE`): one header line, then one row per cycle of
 * each part, in the order counted. `damage` is the cycle's count/N_f, empty for a part without
 * a lifetime model. Numbers are written in full precision. Returns the text; writes nothing.
 * Cost O(cycles).
 * @example
 * const cycles = rainflow([20, 80, 20].map((value, timeS) => ({ timeS, value })));
 * formatCyclesCsv([{ id: "R1", cycles }]).split("\n")[1] // => "R1,0,60,50,20,80,0.5,1,2,"
 */
export function formatCyclesCsv(parts: readonly { id: string; cycles: readonly RainflowCycle[]; damage?: readonly number[] | undefined }[]): string {
  const rows: (string | number)[][] = [];
  for (const part of parts)
    part.cycles.forEach((c, i) => {
      const d = part.damage?.[i];
      rows.push([part.id, c.startS, c.rangeK, c.meanC, c.minC, c.maxC, c.count, c.heatingTimeS, c.durationS, d === undefined ? "" : d]);
    });
  return lazyCsv.stringify(rows, { header: true, columns: [...CYCLES_CSV_COLUMNS] });
}
