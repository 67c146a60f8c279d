import type { EventDigest } from "../profile/EventDigest.js";

/** One charge's electro-thermal margin in the JSON report. */
export interface LoopGainJsonEvent {
  readonly index: number;
  /** the part whose temperature sets the loop gain; null: no loop gain (an NTC, a PTC) */
  readonly role: string | null;
  /** the largest loop gain; null when the charge ran away (never a number then) or has none */
  readonly maxLoopGain: number | null;
  readonly maxLoopGainAtS: number | null;
  readonly warningLoopGain: number | null;
  /** "pass", "warn" (above the warning level) or "runaway"; null without a loop gain */
  readonly status: "pass" | "warn" | "runaway" | null;
  readonly runaway: { readonly timeS: number; readonly temperatureC: number } | null;
  /** the charging element's highest current in the event [A] */
  readonly peakCurrentA: number | null;
  /** a square-law MOSFET's operating point against its zero-temperature-coefficient point, at the
   *  charge's hottest (zeroTempcoOverdriveV null: no such point); null for other elements */
  readonly squareLaw: {
    readonly temperatureC: number;
    readonly overdriveV: number;
    readonly zeroTempcoOverdriveV: number | null;
    readonly tempcoAPerK: number;
    readonly capped: boolean;
  } | null;
}

/** The `electroThermal` block of `simulate --json`. */
export interface LoopGainJson {
  readonly coupledCharges: number;
  readonly warnings: number;
  readonly runaways: number;

  /** every listed event that carries a margin (the listing limit of the events applies) */
  readonly events: readonly LoopGainJsonEvent[];
}

/**
 * The electro-thermal margins of a run for `--json`: counts over every charge, and one entry per
 * listed event solved with its parts' temperatures; undefined when no charge was.
 * Cost O(events listed).
 */
export function loopGainJson(digest: EventDigest): LoopGainJson | undefined {
  const tally = digest.loopGain;
  if (tally.coupled === 0) return undefined;
  return {
    coupledCharges: tally.coupled,
    warnings: tally.warnings,
    runaways: tally.runawayCount,
    events: digest.all.flatMap((e) => {
      const s = e.electroThermal;
      if (s === undefined) return [];
      const ran = s?.runaway !== undefined;
      return [
        {
          index: e.index,
          role: s?.role ?? null,
          maxLoopGain: ran || s === undefined ? null : s.maxLoopGain,
          maxLoopGainAtS: ran || s === undefined ? null : s.maxLoopGainAtS,
          warningLoopGain: s?.warningLoopGain ?? null,
          status: s === undefined ? null : ran ? "runaway" : s.maxLoopGain > s.warningLoopGain ? "warn" : "pass",
          runaway: s?.runaway === undefined ? null : { timeS: s.runaway.timeS, temperatureC: s.runaway.temperatureC },
          peakCurrentA: e.peakCurrentA ?? null,
          squareLaw: s.squareLaw === undefined ? null : { ...s.squareLaw, zeroTempcoOverdriveV: s.squareLaw.zeroTempcoOverdriveV ?? null },
        },
      ];
    }),
  };
}

/** The `inrush` block of `simulate --json`: the largest charging current of the run and its rating. */
export interface InrushJson {
  /** the largest current the charging element delivered in any charge [A] */
  readonly peakCurrentA: number;
  readonly eventIndex: number;
  /** the profile's `circuit.peakCurrentRating` [A], or null */
  readonly ratingA: number | null;
  /** listed charges whose peak passed the rating */
  readonly overRating: readonly { readonly index: number; readonly peakCurrentA: number }[];
}

/**
 * The run's inrush peak for `--json` (undefined when no charge reported one), compared with the
 * element's peak-current rating when the profile gives one. Cost O(events listed).
 */
export function inrushJson(digest: EventDigest, ratingA: number | undefined): InrushJson | undefined {
  const peak = digest.loopGain.inrush;
  if (peak === undefined) return undefined;
  const over = ratingA === undefined ? [] : digest.all.filter((e) => (e.peakCurrentA ?? 0) > ratingA).map((e) => ({ index: e.index, peakCurrentA: e.peakCurrentA! }));
  return { peakCurrentA: peak.peakCurrentA, eventIndex: peak.index, ratingA: ratingA ?? null, overRating: over };
}
