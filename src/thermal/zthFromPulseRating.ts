import { describeFound, inputError } from "../errors/InputError.js";
import type { ZthPoint } from "./fitZthPoints.js";

/** One row of a single-pulse energy rating: the most energy a rectangular pulse of this length may carry. */
export interface PulseRatingRow {
  /** pulse duration t_p [s], > 0 */
  readonly durationS: number;
  /** largest energy of one rectangular pulse of that duration [J], > 0 */
  readonly energyJ: number;
}

/** The conditions a pulse rating table was stated at. */
export interface PulseRatingConditions {
  /** element temperature before the pulse [°C] */
  readonly startC: number;
  /** largest element temperature the rating allows [°C], > startC */
  readonly maxC: number;
}

/**
 * The assumptions behind {@link zthFromPulseRating}, declared once so the docs, the CLI output and
 * its --json all print the same words.
 */
export const PULSE_RATING_ASSUMPTIONS: readonly string[] = [
  "each rated pulse is rectangular (constant power E/t_p for t_p) and starts from the stated start temperature",
  "the rating is the energy that brings the element exactly to the stated maximum temperature at the end of the pulse",
  "the table itself captures the transition from adiabatic heating (short pulses) to steady state (long pulses)",
  "the part is linear: thermal resistance and heat capacity do not change with temperature (constant properties)",
  "no derating, safety factor or repeated-pulse allowance is hidden in the table",
];

/**
 * Transient thermal impedance points from a single-pulse energy rating table:
 *   Zth(t_p) = ΔT_allowed · t_p / E_max(t_p),   ΔT_allowed = T_max − T_start.
 * A rectangular pulse of power P = E/t_p into a linear network raises the element by P·Zth(t)
 * at time t; Zth rises monotonically, so the peak is at the end of the pulse, and the rated
 * energy is the one for which that peak equals ΔT_allowed.
 * Source: JEDEC JESD51-1 (1995), §3 (Zth as the response to a power step); Incropera et al.,
 * Fundamentals of Heat and Mass Transfer, 7th ed. (2011), §5.1 and §5.3 (lumped capacitance: for
 * short pulses E = C·ΔT, so Zth(t_p) → t_p/C, the adiabatic limit).
 * Validity: the assumptions in PULSE_RATING_ASSUMPTIONS. Two consistency checks follow from them
 * (Zth of a passive RC network rises with t and Zth/t falls): E_max must not fall as t_p grows,
 * and the rated power E_max/t_p must not rise; a table breaking either by more than 1e-6 relative
 * (rounding) was misread and is rejected.
 * Cost O(rows).
 * @param table rows in increasing duration
 * @param conditions start and maximum element temperature [°C]
 * @param field dotted field path for messages
 * @throws InputError `bad-network` for a bad row, `out-of-range` for a maximum not above the start
 * @example
 * zthFromPulseRating([{ durationS: 0.01, energyJ: 50 }], { startC: 25, maxC: 275 }) // => [{ timeS: 0.01, zthKPerW: 0.05 }]
 */
export function zthFromPulseRating(table: readonly PulseRatingRow[], conditions: PulseRatingConditions, field = "table"): ZthPoint[] {
  if (!Number.isFinite(conditions.startC)) throw inputError("not-finite", "startTemperature", "a finite start temperature in °C", describeFound(conditions.startC));
  if (!Number.isFinite(conditions.maxC) || !(conditions.maxC > conditions.startC))
    throw inputError("out-of-range", "maxTemperature", `a maximum element temperature above the start temperature ${conditions.startC} °C`, describeFound(conditions.maxC));
  if (table.length === 0) throw inputError("bad-network", field, "at least one rating row (pulse duration, energy)", "none");
  const riseK = conditions.maxC - conditions.startC;
  const slack = 1 + 1e-6;
  table.forEach((row, i) => {
    if (!Number.isFinite(row.durationS) || !(row.durationS > 0))
      throw inputError("bad-network", `${field}[${i}].duration`, "a pulse duration > 0 s", describeFound(row.durationS));
    if (!Number.isFinite(row.energyJ) || !(row.energyJ > 0))
      throw inputError("bad-network", `${field}[${i}].energy`, "a pulse energy > 0 J", describeFound(row.energyJ));
    const before = table[i - 1];
    if (before === undefined) return;
    if (!(row.durationS > before.durationS))
      throw inputError("bad-network", `${field}[${i}].duration`, `a duration longer than the previous row's ${before.durationS} s (durations must increase)`, describeFound(row.durationS));
    if (row.energyJ * slack < before.energyJ)
      throw inputError("bad-network", `${field}[${i}].energy`, `an energy of at least the previous row's ${before.energyJ} J (a longer pulse cannot be rated for less energy)`, describeFound(row.energyJ));
    if (row.energyJ / row.durationS > slack * (before.energyJ / before.durationS))
      throw inputError(
        "bad-network",
        `${field}[${i}].energy`,
        `a rated power E/t_p of at most the previous row's ${Number((before.energyJ / before.durationS).toPrecision(6))} W (a longer pulse cannot carry more power)`,
        `${row.energyJ} J in ${row.durationS} s = ${Number((row.energyJ / row.durationS).toPrecision(6))} W`,
      );
  });
  return table.map((row) => ({ timeS: row.durationS, zthKPerW: (riseK * row.durationS) / row.energyJ }));
}
