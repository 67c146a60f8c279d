import { describeFound, inputError } from "../errors/InputError.js";
import type { PulseEnergyPoint } from "./pulseEnergyRating.js";

/** One row of a peak pulse power rating: a rectangular pulse of this duration may carry this power. */
export interface PulsePowerPoint {
  /** pulse duration [s] */
  readonly durationS: number;
  /** largest power of one rectangular pulse of that duration [W] */
  readonly powerW: number;
}

/**
 * A peak pulse power rating (the form thick-film and surface-mount parts are often rated in) as a
 * single-pulse energy table: each row's rectangular pulse carries E = P·t. Rows must have
 * durations > 0 in increasing order and powers > 0 that do not rise with the duration (a longer
 * pulse cannot carry more power); the energy check of the converted table follows
 * (validatePulseEnergyTable: the energy must not fall). Source: E = P·t for a constant power,
 * Hayt, Kemmerly & Durbin, Engineering Circuit Analysis, 8th ed. (2012), §2.2 (p = v·i, energy
 * its time integral). Cost O(rows).
 * @throws InputError `out-of-range` naming the row and the value
 * @example
 * pulsePowerToEnergyTable([{ durationS: 0.001, powerW: 500 }, { durationS: 0.1, powerW: 20 }]) // => [{ durationS: 0.001, energyJ: 0.5 }, { durationS: 0.1, energyJ: 2 }]
 */
export function pulsePowerToEnergyTable(table: readonly PulsePowerPoint[], field = "ratings.pulsePower"): PulseEnergyPoint[] {
  if (table.length === 0) throw inputError("out-of-range", field, "at least one row { duration, power }", "an empty table");
  table.forEach((row, i) => {
    if (!(row.durationS > 0) || !Number.isFinite(row.durationS)) throw inputError("out-of-range", `${field}[${i}].duration`, "a duration > 0 s", describeFound(row.durationS));
    if (!(row.powerW > 0) || !Number.isFinite(row.powerW)) throw inputError("out-of-range", `${field}[${i}].power`, "a power > 0 W", describeFound(row.powerW));
    const before = table[i - 1];
    if (before !== undefined && !(row.durationS > before.durationS))
      throw inputError("out-of-range", `${field}[${i}].duration`, `durations in increasing order (greater than ${before.durationS} s of row ${i - 1})`, `${row.durationS} s`);
    if (before !== undefined && row.powerW > before.powerW)
      throw inputError("out-of-range", `${field}[${i}].power`, `powers that do not rise with the duration (at most ${before.powerW} W of row ${i - 1})`, `${row.powerW} W`);
  });
  return table.map((row) => ({ durationS: row.durationS, energyJ: row.powerW * row.durationS }));
}
