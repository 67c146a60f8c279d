import { describeFound, inputError } from "../errors/InputError.js";
import type { RatingStatus } from "./pulseEnergyRating.js";
import { temperatureHeadroomFactor } from "./temperatureHeadroomFactor.js";

/** One corner of a safe-operating-area boundary: at this drain-source voltage, this drain current. */
export interface SoaPoint {
  /** drain-source voltage [V] */
  readonly vdsV: number;
  /** largest drain current allowed there [A] */
  readonly idA: number;
}

/** The SOA boundary for one single-pulse duration (Infinity for DC). */
export interface SoaCurve {
  /** pulse duration [s], or Infinity for the DC boundary */
  readonly durationS: number;
  /** boundary corners, in increasing voltage */
  readonly points: readonly SoaPoint[];
}

/** A MOSFET's SOA table: boundaries for several pulse durations, shortest first. */
export type SoaTable = readonly SoaCurve[];

/** One operating point of an event: time [s], drain-source voltage [V], drain current [A]. */
export interface OperatingPoint {
  readonly timeS: number;
  readonly vdsV: number;
  readonly idA: number;
}

/**
 * Allowed drain current on one boundary at a voltage, log-log interpolated between corners:
 *   ln I = ln I_i + (ln I_(i+1) − ln I_i)·(ln V − ln V_i)/(ln V_(i+1) − ln V_i).
 * Below the first corner the first corner's current holds (the boundary is flat or falling, so
 * this is never more than the true limit); above the last corner: undefined (not covered).
 */
function allowedOnCurve(curve: SoaCurve, vdsV: number): number | undefined {
  const points = curve.points;
  const first = points[0]!;
  if (vdsV <= first.vdsV) return first.idA;
  const last = points[points.length - 1]!;
  if (vdsV > last.vdsV) return undefined;
  let i = 0;
  while (points[i + 1]!.vdsV < vdsV) i++;
  const a = points[i]!;
  const b = points[i + 1]!;
  if (vdsV === b.vdsV) return b.idA;
  const f = Math.log(vdsV / a.vdsV) / Math.log(b.vdsV / a.vdsV);
  return a.idA * Math.exp(f * Math.log(b.idA / a.idA));
}

/**
 * Largest drain current the SOA table allows at a drain-source voltage for a single pulse of a
 * given duration.
 *
 * Within a boundary: log-log interpolation in voltage (SOA boundaries are straight lines on
 * log-log axes between corners). Between two boundaries of durations t_k < t < t_(k+1): log-log
 * interpolation in duration of the two allowed currents,
 *   ln I = ln I_k + (ln I_(k+1) − ln I_k)·(ln t − ln t_k)/(ln t_(k+1) − ln t_k).
 * Shorter than the shortest boundary: that boundary (a shorter pulse is allowed at least as
 * much). Longer than the longest finite boundary: the DC boundary if the table has one, else
 * undefined. Between the longest finite boundary and DC: the DC boundary (conservative).
 * Source: log-log interpolation of SOA charts is common practice: the boundaries are drawn on
 * log-log axes, where each segment between corners is a straight line (a power law, I ∝ V^−1 on
 * the power-limited segment); the choices outside the table are ours and always err toward the
 * lower current.
 * Cost O(curves + corners). Assumes a table that passed {@link validateSoaTable}.
 * @returns the allowed current [A], or undefined where the table does not cover (V, t)
 * @example
 * const soa = [{ durationS: 0.001, points: [{ vdsV: 10, idA: 100 }, { vdsV: 100, idA: 5 }] }];
 * allowedDrainCurrentA(soa, 50, 0.001) // => 12.32
 */
export function allowedDrainCurrentA(table: SoaTable, vdsV: number, durationS: number): number | undefined {
  const first = table[0]!;
  if (durationS <= first.durationS) return allowedOnCurve(first, vdsV);
  let k = 0;
  while (k + 1 < table.length && table[k + 1]!.durationS < durationS) k++;
  const lower = table[k]!;
  const upper = table[k + 1];
  if (upper === undefined) return undefined;
  if (upper.durationS === Number.POSITIVE_INFINITY || durationS === upper.durationS) return allowedOnCurve(upper, vdsV);
  const ia = allowedOnCurve(lower, vdsV);
  const ib = allowedOnCurve(upper, vdsV);
  if (ia === undefined || ib === undefined) return undefined;
  const f = Math.log(durationS / lower.durationS) / Math.log(upper.durationS / lower.durationS);
  return ia * Math.exp(f * Math.log(ib / ia));
}

/**
 * Check an SOA table: at least one boundary; durations > 0 strictly increasing (Infinity, for
 * DC, only last); each boundary with at least one corner, voltages > 0 strictly increasing,
 * currents > 0 and not rising with voltage; and a longer pulse never allowed more current than a
 * shorter one at any corner voltage both boundaries cover.
 * Cost O(curves × corners²).
 * @throws InputError `out-of-range` naming the boundary, the corner and the value
 * @example
 * validateSoaTable([{ durationS: 0.001, points: [{ vdsV: 10, idA: 100 }, { vdsV: 100, idA: 5 }] }]) // => undefined
 */
export function validateSoaTable(table: SoaTable, field = "ratings.soa"): void {
  if (table.length === 0) throw inputError("out-of-range", field, "at least one SOA boundary { duration, points }", "an empty table");
  table.forEach((curve, k) => {
    const at = `${field}[${k}]`;
    if (!(curve.durationS > 0) || Number.isNaN(curve.durationS))
      throw inputError("out-of-range", `${at}.duration`, 'a pulse duration > 0 s, or "dc"', describeFound(curve.durationS));
    const previous = table[k - 1];
    if (previous !== undefined && !(curve.durationS > previous.durationS))
      throw inputError("out-of-range", `${at}.duration`, `durations in increasing order (greater than ${previous.durationS} s)`, describeFound(curve.durationS));
    if (curve.points.length === 0) throw inputError("out-of-range", `${at}.points`, "at least one corner { vds, id }", "none");
    curve.points.forEach((p, i) => {
      if (!(p.vdsV > 0) || !Number.isFinite(p.vdsV)) throw inputError("out-of-range", `${at}.points[${i}].vds`, "a voltage > 0 V", describeFound(p.vdsV));
      if (!(p.idA > 0) || !Number.isFinite(p.idA)) throw inputError("out-of-range", `${at}.points[${i}].id`, "a current > 0 A", describeFound(p.idA));
      const before = curve.points[i - 1];
      if (before !== undefined && !(p.vdsV > before.vdsV))
        throw inputError("out-of-range", `${at}.points[${i}].vds`, `voltages in increasing order (greater than ${before.vdsV} V)`, `${p.vdsV} V`);
      if (before !== undefined && p.idA > before.idA)
        throw inputError("out-of-range", `${at}.points[${i}].id`, `currents that do not rise with voltage (at most ${before.idA} A)`, `${p.idA} A`);
    });
    if (previous !== undefined) {
      curve.points.forEach((p, i) => {
        const shorter = allowedOnCurve(previous, p.vdsV);
        if (shorter !== undefined && p.idA > shorter * (1 + 1e-12))
          throw inputError(
            "out-of-range",
            `${at}.points[${i}].id`,
            `at most the ${shorter} A the shorter pulse allows at ${p.vdsV} V (a longer pulse cannot allow more)`,
            `${p.idA} A`,
          );
      });
    }
  });
}

/** Temperatures an SOA table was drawn at, for derating it to a hotter part. */
export interface SoaDerating {
  /** case temperature the boundaries were drawn for [°C] (commonly 25 °C) */
  readonly referenceC: number;
  /** the part's maximum junction temperature [°C] */
  readonly maxJunctionC: number;
}

/**
 * Derating factor of an SOA table for a part that starts an event at temperature T [°C]:
 *   k = (T_j,max − T) / (T_j,max − T_ref), capped to [0, 1]
 * (the power a boundary allows scales with the temperature headroom; no credit is taken below
 * T_ref). Applied to the allowed current at every voltage, which is conservative in the
 * current-limited corner. Using the junction (or observed-node) temperature at the event start
 * in place of the case temperature is conservative too, since the junction is the hotter.
 * Source: linear derating of power-limited SOA with case temperature is common practice
 * ({@link temperatureHeadroomFactor}). Cost O(1).
 * @example
 * soaDeratingFactor({ referenceC: 25, maxJunctionC: 175 }, 100) // => 0.5
 */
export function soaDeratingFactor(derating: SoaDerating, temperatureC: number): number {
  return temperatureHeadroomFactor(derating.referenceC, derating.maxJunctionC, temperatureC);
}

/** The worst operating point of an event against the SOA. */
export interface SoaWorstPoint extends OperatingPoint {
  /** allowed current at that voltage and the event's pulse duration [A] */
  readonly allowedA: number;
  /** idA / allowedA (> 1 fails) */
  readonly utilisation: number;
}

/** Result of {@link checkSoa} for one event. */
export interface SoaCheck {
  readonly status: RatingStatus;
  /** pulse duration the boundaries were read at [s] */
  readonly durationS: number;
  /** operating points checked (points with current > 0 and Vds > 0) */
  readonly pointsChecked: number;
  /** points past the boundary */
  readonly pointsOutside: number;
  /** points the table does not cover */
  readonly pointsNotCovered: number;
  /** highest utilisation among covered points; undefined if none was covered */
  readonly worst: SoaWorstPoint | undefined;
  /** factor the boundaries were multiplied by (1: not derated) */
  readonly deratingFactor: number;
}

/**
 * Check every operating point (Vds, Id) of an event against the SOA table, reading the
 * boundaries at the event's whole conduction time as the pulse duration (every point is held to
 * the boundary of the full pulse: SOA shrinks with duration, so this is conservative; common
 * practice). Fails when any point lies above the allowed current; "outside-table" when none
 * fails but some point is not covered (a voltage above the table's last corner, or a pulse longer
 * than the longest boundary of a table without DC). Points with Id ≤ 0 or Vds ≤ 0 carry no SOA
 * stress and are skipped. `deratingFactor` (from {@link soaDeratingFactor}) scales every boundary.
 * Cost O(points × (curves + corners)).
 * @throws InputError `not-finite` for a non-finite sample, `out-of-range` for a duration ≤ 0
 * @example
 * const soa = [
 *   { durationS: 0.001, points: [{ vdsV: 10, idA: 100 }, { vdsV: 100, idA: 5 }] },
 *   { durationS: 0.01, points: [{ vdsV: 10, idA: 40 }, { vdsV: 100, idA: 2 }] },
 * ];
 * checkSoa(soa, [{ timeS: 0, vdsV: 50, idA: 3 }], 0.005).status // => "pass"
 */
export function checkSoa(table: SoaTable, points: readonly OperatingPoint[], durationS: number, field = "event", deratingFactor = 1): SoaCheck {
  if (!(durationS > 0) || !Number.isFinite(durationS))
    throw inputError("out-of-range", `${field}.durationS`, "an event duration > 0 s", describeFound(durationS));
  let worst: SoaWorstPoint | undefined;
  let pointsChecked = 0;
  let pointsOutside = 0;
  let pointsNotCovered = 0;
  points.forEach((p, i) => {
    if (!Number.isFinite(p.vdsV) || !Number.isFinite(p.idA) || !Number.isFinite(p.timeS))
      throw inputError("not-finite", `${field}.operatingPoints[${i}]`, "finite time, Vds and Id", describeFound(p));
    if (!(p.idA > 0) || !(p.vdsV > 0)) return;
    pointsChecked++;
    const tableA = allowedDrainCurrentA(table, p.vdsV, durationS);
    if (tableA === undefined) {
      pointsNotCovered++;
      return;
    }
    const allowedA = tableA * deratingFactor;
    const utilisation = allowedA > 0 ? p.idA / allowedA : Number.POSITIVE_INFINITY;
    if (utilisation > 1) pointsOutside++;
    if (worst === undefined || utilisation > worst.utilisation) worst = { ...p, allowedA, utilisation };
  });
  const status: RatingStatus = pointsOutside > 0 ? "fail" : pointsNotCovered > 0 ? "outside-table" : "pass";
  return { status, durationS, pointsChecked, pointsOutside, pointsNotCovered, worst, deratingFactor };
}
