import type { InputProblem } from "../errors/InputError.js";
import type { Verdict } from "../stress/Verdict.js";

/** One part of one unit of a fleet: what its log did to the part. */
export interface FleetPartRow {
  readonly id: string;
  /** highest temperature of the replay [°C] */
  readonly peakC: number;
  /** the part's limit less its peak [K] (negative: above the limit) */
  readonly marginK: number;
  /** seconds from the log's first line when the part first went above its limit; null: never */
  readonly firstExceedanceS: number | null;
  /** that moment on the unit's clock (ISO 8601, UTC) for a timestamped log; null otherwise */
  readonly firstExceedanceTimestamp: string | null;
  /** the file line of the log in effect then; null: never above the limit */
  readonly firstExceedanceLine: number | null;
  /** Miner damage of the whole log (open history); null without a lifetime model */
  readonly damageToDate: number | null;
  /**
   * years until the damage reaches 1 if the unit goes on as its log shows: (1 − D) / (D · logs per
   * year); 0 when D ≥ 1; null without a lifetime model, without damage (no end in sight) or
   * without a rate (a log of zero span and no --logs-per-year)
   */
  readonly remainingLifeYears: number | null;
}

/** A unit whose log was replayed. */
export interface FleetReplayedRow {
  readonly unit: string;
  /** the log as named on the command line, in the list file or found in a folder */
  readonly file: string;
  readonly verdict: Verdict;
  /** why, in words (simulationVerdict) */
  readonly reason: string;
  /** event lines in the log */
  readonly lines: number;
  /** seconds from the log's first line to its last */
  readonly spanS: number;
  /** the first line's time on the unit's clock (ISO 8601, UTC); null for a log in seconds */
  readonly startTimestamp: string | null;
  readonly parts: readonly FleetPartRow[];
  readonly error: null;
}

/** A unit whose log could not be replayed: the problem, with its file and line. */
export interface FleetBrokenRow {
  readonly unit: string;
  readonly file: string;
  readonly verdict: "error";
  /** the first problem of the InputError (file, line, field, expected, found) */
  readonly error: InputProblem;
}

/**
 * One row of a fleet summary: one unit, replayed or broken. A row depends only on the unit's log,
 * the profile and the fleet options, never on the other units or on which process replayed it, so
 * rows from any partition of a fleet merge into the same summary (mergeFleetRows).
 */
export type FleetUnitRow = FleetReplayedRow | FleetBrokenRow;
