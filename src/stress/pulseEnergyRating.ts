import { describeFound, inputError } from "../errors/InputError.js";
import { equivalentPulseDurationS } from "./equivalentPulseDuration.js";
import { temperatureHeadroomFactor } from "./temperatureHeadroomFactor.js";

/** One row of a single-pulse energy rating table: a rectangular pulse of this duration may carry this energy. */
export interface PulseEnergyPoint {
  /** pulse duration [s] */
  readonly durationS: number;
  /** rated energy [J] */
  readonly energyJ: number;
}

/** Where a duration falls relative to a rating table. */
export type TablePosition = "in-table" | "below-table" | "above-table";

/** A rating looked up at one duration. */
export interface PulseEnergyLookup {
  /** rated energy [J]; undefined outside the table */
  readonly energyJ: number | undefined;
  readonly position: TablePosition;
}

/**
 * Check a single-pulse energy rating table: at least one row, durations > 0 and strictly
 * increasing, energies > 0 and non-decreasing. A longer pulse of the same energy can never be
 * harder on a part: its peak rise is (E/t)·Zth(t), and Zth(t)/t falls with t for every Foster
 * network (each term R_i·(1 − e^(−t/τ_i))/t falls), so the rated energy cannot fall with t.
 * Cost O(rows).
 * @throws InputError `out-of-range` naming the row and the value
 * @example
 * validatePulseEnergyTable([{ durationS: 0.01, energyJ: 50 }, { durationS: 1, energyJ: 200 }]) // => undefined
 */
export function validatePulseEnergyTable(table: readonly PulseEnergyPoint[], field = "ratings.pulseEnergy"): void {
  if (table.length === 0) throw inputError("out-of-range", field, "at least one row { duration, energy }", "an empty table");
  table.forEach((row, i) => {
    if (!(row.durationS > 0) || !Number.isFinite(row.durationS))
      throw inputError("out-of-range", `${field}[${i}].duration`, "a duration > 0 s", describeFound(row.durationS));
    if (!(row.energyJ > 0) || !Number.isFinite(row.energyJ))
      throw inputError("out-of-range", `${field}[${i}].energy`, "an energy > 0 J", describeFound(row.energyJ));
    const previous = table[i - 1];
    if (previous !== undefined && !(row.durationS > previous.durationS))
      throw inputError(
        "out-of-range",
        `${field}[${i}].duration`,
        `durations in increasing order (greater than ${previous.durationS} s of row ${i - 1})`,
        `${row.durationS} s`,
      );
    if (previous !== undefined && row.energyJ < previous.energyJ)
      throw inputError(
        "out-of-range",
        `${field}[${i}].energy`,
        `energies that do not fall as the duration grows (at least ${previous.energyJ} J of row ${i - 1})`,
        `${row.energyJ} J`,
      );
  });
}

/**
 * Rated single-pulse energy at a duration, by log-log interpolation between table rows:
 *   ln E = ln E_i + (ln E_(i+1) − ln E_i)·(ln t − ln t_i)/(ln t_(i+1) − ln t_i).
 * Exact at the rows. Outside the table there is no rating (energyJ undefined, position says on
 * which side): ratings are not extrapolated, because below the shortest row the curve flattens
 * toward the adiabatic limit and above the longest it bends toward steady state, neither of
 * which a straight line on log-log axes follows. Source: log-log interpolation of pulse ratings
 * is common practice: rating curves are drawn on log-log axes, where they run as near-straight
 * lines between the points a maker gives (a power law E ∝ t^a between rows).
 * Cost O(log rows). Assumes a table that passed {@link validatePulseEnergyTable}.
 * @example
 * interpolatePulseEnergy([{ durationS: 0.01, energyJ: 50 }, { durationS: 1, energyJ: 200 }], 0.1) // => { energyJ: 100, position: "in-table" }
 */
export function interpolatePulseEnergy(table: readonly PulseEnergyPoint[], durationS: number): PulseEnergyLookup {
  const first = table[0]!;
  const last = table[table.length - 1]!;
  if (durationS < first.durationS) return { energyJ: undefined, position: "below-table" };
  if (durationS > last.durationS) return { energyJ: undefined, position: "above-table" };
  let lo = 0;
  let hi = table.length - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (table[mid]!.durationS <= durationS) lo = mid;
    else hi = mid;
  }
  const a = table[lo]!;
  const b = table[hi]!;
  if (durationS === a.durationS) return { energyJ: a.energyJ, position: "in-table" };
  if (durationS === b.durationS) return { energyJ: b.energyJ, position: "in-table" };
  const f = Math.log(durationS / a.durationS) / Math.log(b.durationS / a.durationS);
  return { energyJ: a.energyJ * Math.exp(f * Math.log(b.energyJ / a.energyJ)), position: "in-table" };
}

/**
 * Defaults of the single-pulse energy derating, declared once (read by the profile resolver, the
 * report notes and the docs): a table is taken to state pulses that start from 25 °C unless the
 * profile says otherwise (`ratings.pulseEnergyDerating.reference`), the temperature single-pulse
 * ratings are commonly stated from (common practice). The temperature at which nothing is left
 * defaults to the part's own limit (`limits.maxTemperature`), not to a constant.
 */
export const PULSE_ENERGY_DERATING_DEFAULTS = { referenceC: 25 } as const;

/** How a single-pulse energy table is derated for a part that starts an event hot. */
export interface PulseEnergyDerating {
  /** temperature the table's pulses start from, T_ref [°C] */
  readonly referenceC: number;
  /** temperature at which no energy is left, T_max [°C] (> T_ref) */
  readonly maxTemperatureC: number;
  /** where T_ref comes from: the profile, or {@link PULSE_ENERGY_DERATING_DEFAULTS} */
  readonly referenceFrom: "profile" | "default";
  /** where T_max comes from: the profile's rating key, or the part's temperature limit */
  readonly maxTemperatureFrom: "profile" | "part limit";
}

/**
 * Derating factor of a single-pulse energy rating for a part that starts an event at T_start [°C]:
 *   E_allowed = E_rated·k,  k = (T_max − T_start) / (T_max − T_ref), capped to [0, 1]
 * A rating table gives the energy that takes the part from T_ref to its maximum; a part that is
 * already hot has only the headroom T_max − T_start left ({@link temperatureHeadroomFactor}).
 * k = 0 at or above T_max: no energy is allowed. Source: common practice for resistor pulse
 * ratings. Cost O(1).
 * @example
 * const derating = { referenceC: 25, maxTemperatureC: 275, referenceFrom: "profile", maxTemperatureFrom: "profile" };
 * pulseEnergyDeratingFactor(derating, 150) // => 0.5
 */
export function pulseEnergyDeratingFactor(derating: PulseEnergyDerating, startTemperatureC: number): number {
  return temperatureHeadroomFactor(derating.referenceC, derating.maxTemperatureC, startTemperatureC);
}

/** Outcome of a rating check: within the rating, past it, or not covered by the table. */
export type RatingStatus = "pass" | "fail" | "outside-table";

/** Result of {@link checkPulseEnergy} for one event. */
export interface PulseEnergyCheck {
  readonly status: RatingStatus;
  /** energy of the event [J] */
  readonly energyJ: number;
  /** equivalent rectangular duration E/P_peak [s] */
  readonly equivalentDurationS: number;
  /** rated energy at that duration, as the table states it (from its reference temperature) [J]; undefined outside the table */
  readonly ratedEnergyJ: number | undefined;
  /** factor the rated energy was multiplied by for the event's start temperature (1: not derated) */
  readonly deratingFactor: number;
  /** the derated allowance ratedEnergyJ·deratingFactor [J]; undefined outside the table */
  readonly allowedEnergyJ: number | undefined;
  /** energy / allowance (> 1 fails; Infinity when nothing is allowed), undefined outside the table */
  readonly utilisation: number | undefined;
  readonly position: TablePosition;
}

/**
 * Check one event against a single-pulse energy rating: the event's equivalent rectangular
 * duration t_eq = E/P_peak ({@link equivalentPulseDurationS}) selects the rated energy
 * ({@link interpolatePulseEnergy}), the derating factor for the part's start temperature
 * ({@link pulseEnergyDeratingFactor}) scales it to the allowance; pass when
 * E ≤ E_rated(t_eq)·k, fail above it (always, with energy, when k = 0), "outside-table" when t_eq
 * lies outside the table. An event with no energy passes trivially.
 * Cost O(log rows).
 * @param deratingFactor k in [0, 1] (1: not derated)
 * @throws InputError for a negative energy or a non-positive peak power with positive energy
 * @example
 * const table = [{ durationS: 0.01, energyJ: 50 }, { durationS: 1, energyJ: 200 }];
 * checkPulseEnergy(table, 60, 600).utilisation // => 0.6
 */
export function checkPulseEnergy(table: readonly PulseEnergyPoint[], energyJ: number, peakPowerW: number, field = "event", deratingFactor = 1): PulseEnergyCheck {
  const base = { energyJ, deratingFactor };
  if (energyJ === 0) return { ...base, status: "pass", equivalentDurationS: 0, ratedEnergyJ: undefined, allowedEnergyJ: undefined, utilisation: 0, position: "in-table" };
  const equivalentDurationS = equivalentPulseDurationS(energyJ, peakPowerW, field);
  const lookup = interpolatePulseEnergy(table, equivalentDurationS);
  if (lookup.energyJ === undefined)
    return { ...base, status: "outside-table", equivalentDurationS, ratedEnergyJ: undefined, allowedEnergyJ: undefined, utilisation: undefined, position: lookup.position };
  const allowedEnergyJ = lookup.energyJ * deratingFactor;
  const utilisation = allowedEnergyJ > 0 ? energyJ / allowedEnergyJ : Number.POSITIVE_INFINITY;
  return { ...base, status: utilisation > 1 ? "fail" : "pass", equivalentDurationS, ratedEnergyJ: lookup.energyJ, allowedEnergyJ, utilisation, position: "in-table" };
}
