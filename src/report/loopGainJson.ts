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
}

/** The `electroThermal` block of `simulate --json`. */
export interface LoopGainJson {
  readonly coupledCharges: number;
  readonly warnings: number;
  readonly runaways: number;
  /** the largest inrush current of all charges [A] (null when none reported one) */
  readonly peakCurrentA: number | null;
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
  if (tally.coupled === 0 && tally.inrush === undefined) return undefined;
  return {
    coupledCharges: tally.coupled,
    warnings: tally.warnings,
    runaways: tally.runawayCount,
    peakCurrentA: tally.inrush?.peakCurrentA ?? null,
    events: digest.all.flatMap((e) => {
      const s = e.electroThermal;
      if (s === undefined && e.peakCurrentA === undefined) return [];
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
        },
      ];
    }),
  };
}
