import { describeFound, inputError } from "../errors/InputError.js";
import type { PulseEnergyPoint } from "./pulseEnergyRating.js";

/** One resistance value of an energy-per-ohm series table: E/R at each of the table's durations. */
export interface EnergyPerOhmRow {
  /** resistance value of the series [ohm], > 0 */
  readonly resistanceOhm: number;
  /** single-pulse energy divided by the resistance [J/ohm], one per duration of the table */
  readonly energyPerOhmJPerOhm: readonly number[];
}

/**
 * An energy-per-ohm rating of one resistor series (the form wire-wound series are often rated
 * in): for each pulse duration, the single-pulse energy divided by the resistance value, against
 * the value. Finer wire for higher values carries less energy per ohm, so the column falls with
 * the value; the allowed energy of one value is E = R·(E/R)(R).
 */
export interface EnergyPerOhmSeries {
  /** pulse durations of the columns [s], increasing */
  readonly durationsS: readonly number[];
  /** rows in increasing resistance */
  readonly rows: readonly EnergyPerOhmRow[];
}

/**
 * Check an energy-per-ohm series table: at least one duration (> 0, increasing) and one row,
 * resistances > 0 and increasing, one energy per ohm > 0 for every duration in every row.
 * Cost O(rows × durations).
 * @throws InputError `out-of-range` naming the row, the column and the value
 * @example
 * validateEnergyPerOhmSeries({ durationsS: [0.01], rows: [{ resistanceOhm: 10, energyPerOhmJPerOhm: [2] }] }) // => undefined
 */
export function validateEnergyPerOhmSeries(series: EnergyPerOhmSeries, field = "ratings.energyPerOhm"): void {
  const { durationsS, rows } = series;
  if (durationsS.length === 0) throw inputError("out-of-range", `${field}.durations`, "at least one pulse duration", "an empty list");
  durationsS.forEach((t, j) => {
    if (!(t > 0) || !Number.isFinite(t)) throw inputError("out-of-range", `${field}.durations[${j}]`, "a duration > 0 s", describeFound(t));
    if (j > 0 && !(t > durationsS[j - 1]!))
      throw inputError("out-of-range", `${field}.durations[${j}]`, `durations in increasing order (greater than ${durationsS[j - 1]} s)`, `${t} s`);
  });
  if (rows.length === 0) throw inputError("out-of-range", `${field}.rows`, "at least one row { resistance, energyPerOhm }", "an empty table");
  rows.forEach((row, i) => {
    const f = `${field}.rows[${i}]`;
    if (!(row.resistanceOhm > 0) || !Number.isFinite(row.resistanceOhm)) throw inputError("out-of-range", `${f}.resistance`, "a resistance > 0 ohm", describeFound(row.resistanceOhm));
    const before = rows[i - 1];
    if (before !== undefined && !(row.resistanceOhm > before.resistanceOhm))
      throw inputError("out-of-range", `${f}.resistance`, `resistances in increasing order (greater than ${before.resistanceOhm} ohm of row ${i - 1})`, `${row.resistanceOhm} ohm`);
    if (row.energyPerOhmJPerOhm.length !== durationsS.length)
      throw inputError("out-of-range", `${f}.energyPerOhm`, `one energy per ohm for each of the ${durationsS.length} durations`, `${row.energyPerOhmJPerOhm.length} values`);
    row.energyPerOhmJPerOhm.forEach((e, j) => {
      if (!(e > 0) || !Number.isFinite(e)) throw inputError("out-of-range", `${f}.energyPerOhm[${j}]`, "an energy per ohm > 0 J/ohm", describeFound(e));
    });
  });
}

/**
 * The single-pulse energy table of one resistance value of a series: in each duration column,
 * E/R is interpolated log-log between the two rows around R,
 *   ln(E/R) = ln(E/R)_i + (ln(E/R)_(i+1) − ln(E/R)_i)·(ln R − ln R_i)/(ln R_(i+1) − ln R_i),
 * and multiplied by R. Exact at the rows. A value outside the series' range is refused (the
 * series says nothing of it). Source: log-log interpolation of ratings between published values
 * is common practice (the tables are drawn on log-log axes, near-straight between points).
 * Cost O(rows + durations). Assumes a table that passed {@link validateEnergyPerOhmSeries}.
 * @throws InputError `out-of-range` for a resistance outside the series' range
 * @example
 * const series = { durationsS: [0.01, 1], rows: [{ resistanceOhm: 1, energyPerOhmJPerOhm: [10, 40] }, { resistanceOhm: 100, energyPerOhmJPerOhm: [1, 4] }] };
 * energyPerOhmTable(series, 10) // => [{ durationS: 0.01, energyJ: 31.622776601683793 }, { durationS: 1, energyJ: 126.49110640673517 }]
 */
export function energyPerOhmTable(series: EnergyPerOhmSeries, resistanceOhm: number, field = "ratings.resistance"): PulseEnergyPoint[] {
  const { rows } = series;
  const first = rows[0]!;
  const last = rows[rows.length - 1]!;
  if (!(resistanceOhm >= first.resistanceOhm && resistanceOhm <= last.resistanceOhm))
    throw inputError("out-of-range", field, `a resistance the series covers, ${first.resistanceOhm} to ${last.resistanceOhm} ohm`, describeFound(resistanceOhm));
  let i = 0;
  while (i < rows.length - 2 && rows[i + 1]!.resistanceOhm < resistanceOhm) i++;
  const a = rows[i]!;
  const b = rows[Math.min(i + 1, rows.length - 1)]!;
  const f = a === b ? 0 : Math.log(resistanceOhm / a.resistanceOhm) / Math.log(b.resistanceOhm / a.resistanceOhm);
  return series.durationsS.map((durationS, j) => {
    const ea = a.energyPerOhmJPerOhm[j]!;
    const eb = b.energyPerOhmJPerOhm[j]!;
    const perOhm = f === 0 ? ea : f === 1 ? eb : ea * Math.exp(f * Math.log(eb / ea));
    return { durationS, energyJ: perOhm * resistanceOhm };
  });
}
