import type { RatingStatus } from "./pulseEnergyRating.js";

/** The limits beside temperature the stress layer judges a resistor against, one verdict line each. */
export type LimitKind = "voltage" | "continuous-power" | "adiabatic" | "repetitive-pulse";

/** Words of each limit for the report lines, declared once. */
export const LIMIT_WORDS: Readonly<Record<LimitKind, string>> = {
  voltage: "voltage across the part",
  "continuous-power": "continuous power",
  adiabatic: "adiabatic element limit",
  "repetitive-pulse": "repetitive pulses",
};

/**
 * The verdict of one limit over a whole run: the worst case found (the event that came closest to
 * the limit or crossed it furthest), what was allowed there, and the margin allowed − found in
 * the limit's unit (negative when crossed). `status` follows the rating vocabulary: pass, fail,
 * or outside-table (the rule did not cover the case: warn).
 */
export interface LimitCheck {
  readonly limit: LimitKind;
  readonly status: RatingStatus;
  /** the worst value found, in `unit` */
  readonly found: number;
  /** the value allowed in that case, in `unit` (derated where the limit derates); undefined where the rule does not cover the case */
  readonly allowed: number | undefined;
  /** "V", "W", "K", "J" */
  readonly unit: string;
  /** index of the event of the worst case; undefined for a whole-run limit (continuous power) */
  readonly eventIndex: number | undefined;
  /** start time of that event [s]; undefined with no event */
  readonly eventStartS: number | undefined;
  /** what the allowance is and where it comes from, in words */
  readonly basis: string;
  /** events the limit was checked on (1 for a whole-run limit) */
  readonly checked: number;
  /** of those, how many crossed it */
  readonly crossed: number;
}

/**
 * Margin of a limit check, allowed − found in its unit, and as a share of the allowance
 * (undefined when nothing is allowed). Cost O(1).
 * @example
 * limitMargin({ found: 400, allowed: 300 }).margin // => -100
 */
export function limitMargin(check: Pick<LimitCheck, "found" | "allowed">): { margin: number | undefined; share: number | undefined } {
  if (check.allowed === undefined) return { margin: undefined, share: undefined };
  const margin = check.allowed - check.found;
  return { margin, share: check.allowed > 0 ? margin / check.allowed : undefined };
}
