import { describeFound, inputError } from "../errors/InputError.js";
import type { ChargeConditions } from "./CircuitResult.js";

/**
 * The range of completion fractions seen in practice: a pre-charge is usually called done at
 * 90 % to 95 % of the source voltage (common practice, no published source). For help texts and
 * examples; it is not a default, the profile states its own rule.
 */
export const COMMON_COMPLETION_FRACTIONS = { low: 0.9, high: 0.95 } as const;

/** A validated completion rule with no optional fields. */
export interface ResolvedCompletion {
  /** bus voltage at which the charge completes [V], or undefined for a dwell-only rule */
  readonly thresholdV: number | undefined;
  /** the threshold in words: "95 % of 48 V (45.6 V)" */
  readonly thresholdWords: string;
  /** fixed dwell [s] (Infinity when none) */
  readonly dwellS: number;
  /** abort time [s] */
  readonly timeoutS: number;
}

/** A number in reasons and messages: four significant digits, no trailing zeros. */
export function reasonNumber(x: number): string {
  return String(Number(x.toPrecision(4)));
}

/**
 * Validate the conditions of a charging event and resolve its completion rule: the threshold is
 * fraction·Vs, or Vs − withinV, or the lower of the two when both are given (the first reached
 * while rising); a dwell-only rule has no threshold.
 * Cost O(1).
 * @throws InputError naming the field: `sourceVoltageV` (> 0), `initialVoltageV` (≥ 0),
 *   `completion.fraction` (inside (0, 1)), `completion.withinV` (between 0 and Vs),
 *   `completion.dwellS` (> 0), `completion.timeoutS` (≥ 0), `completion` (at least one rule)
 */
export function resolveCompletion(conditions: ChargeConditions): ResolvedCompletion {
  const { sourceVoltageV: vs, initialVoltageV: v0, completion } = conditions;
  if (!Number.isFinite(vs) || !(vs > 0)) throw inputError("out-of-range", "sourceVoltageV", "a source voltage > 0 V", describeFound(vs));
  if (!Number.isFinite(v0) || !(v0 >= 0)) throw inputError("out-of-range", "initialVoltageV", "an initial capacitor voltage ≥ 0 V", describeFound(v0));
  if (completion === undefined || completion === null) throw inputError("out-of-range", "completion", "a completion rule", "nothing");
  const { fraction, withinV, dwellS, timeoutS } = completion;
  if (!Number.isFinite(timeoutS) || !(timeoutS >= 0)) throw inputError("out-of-range", "completion.timeoutS", "a timeout ≥ 0 s", describeFound(timeoutS));
  if (fraction !== undefined && !(fraction > 0 && fraction < 1))
    throw inputError("out-of-range", "completion.fraction", "a fraction of the source voltage between 0 and 1 (exclusive)", describeFound(fraction));
  if (withinV !== undefined && !(withinV > 0 && withinV < vs))
    throw inputError("out-of-range", "completion.withinV", `a margin between 0 V and the source voltage (${vs} V), exclusive`, describeFound(withinV));
  if (dwellS !== undefined && !(dwellS > 0 && Number.isFinite(dwellS)))
    throw inputError("out-of-range", "completion.dwellS", "a dwell time > 0 s", describeFound(dwellS));
  if (fraction === undefined && withinV === undefined && dwellS === undefined)
    throw inputError("out-of-range", "completion", "a completion fraction, a withinV margin or a dwell time", "none of them");
  const byFraction = fraction === undefined ? Infinity : fraction * vs;
  const byMargin = withinV === undefined ? Infinity : vs - withinV;
  const thresholdV = Math.min(byFraction, byMargin);
  const thresholdWords =
    thresholdV === Infinity
      ? "no voltage threshold"
      : byFraction <= byMargin
        ? `${reasonNumber(fraction! * 100)} % of ${reasonNumber(vs)} V (${reasonNumber(thresholdV)} V)`
        : `within ${reasonNumber(withinV!)} V of ${reasonNumber(vs)} V (${reasonNumber(thresholdV)} V)`;
  return { thresholdV: thresholdV === Infinity ? undefined : thresholdV, thresholdWords, dwellS: dwellS ?? Infinity, timeoutS };
}
