import type { FleetUnitRow } from "./FleetUnitRow.js";

/** Rank classes of a row's verdict: the ones above limits first, broken logs last. */
const RANK_CLASS = { fail: 0, warn: 1, pass: 2, error: 3 } as const;

/** a < b as −1, a > b as 1, else 0 (numbers or strings by UTF-16 code units, never by locale). */
function order<T extends number | string>(a: T, b: T): number {
  return a < b ? -1 : a > b ? 1 : 0;
}

/** The least margin to a limit over a unit's parts [K] (most negative: furthest above its limit). */
export function leastMarginK(row: FleetUnitRow): number {
  return row.error === null ? Math.min(...row.parts.map((p) => p.marginK)) : Number.POSITIVE_INFINITY;
}

/** The greatest damage to date over a unit's parts; −1 when no part has a lifetime model. */
export function greatestDamage(row: FleetUnitRow): number {
  return row.error === null ? Math.max(-1, ...row.parts.map((p) => p.damageToDate ?? -1)) : -1;
}

/**
 * The risk order of a fleet's rows, a total order (so any partitioning, merged in any order,
 * sorts to the same list): verdict (fail, warn, pass, then logs that could not be replayed), then
 * the least margin to a limit (furthest above its limit first), then the greatest damage to date
 * (most first), then the unit id and the log's name (by UTF-16 code units, never by locale).
 * Unit ids are unique in a fleet summary (fleetSummary), so no two rows compare equal.
 * Source: ranking rule of our own (docs/fleet.md).
 * Cost O(parts).
 */
export function compareFleetRows(a: FleetUnitRow, b: FleetUnitRow): number {
  return (
    order(RANK_CLASS[a.verdict], RANK_CLASS[b.verdict]) ||
    order(leastMarginK(a), leastMarginK(b)) ||
    order(greatestDamage(b), greatestDamage(a)) ||
    order(a.unit, b.unit) ||
    order(a.file, b.file)
  );
}
