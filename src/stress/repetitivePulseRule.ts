import { describeFound, inputError } from "../errors/InputError.js";
import type { RatingStatus, TablePosition } from "./pulseEnergyRating.js";

/** One row of a repetitive-pulse rule: pulses repeated at this period (or duty cycle) may each carry this energy. */
export interface RepetitivePulsePoint {
  /** repetition period [s] when the rule is by period, duty cycle (0..1] when by duty cycle */
  readonly at: number;
  /** allowed energy of each pulse of the train [J] */
  readonly energyJ: number;
}

/**
 * A repetitive-pulse rule: the energy each pulse of a train may carry, against the repetition
 * period (rows in increasing period, energies that do not fall: a longer rest lets more heat
 * out) or against the duty cycle t_pulse/period (rows in increasing duty cycle, energies that do
 * not rise).
 */
export interface RepetitivePulseRule {
  readonly by: "period" | "duty-cycle";
  readonly rows: readonly RepetitivePulsePoint[];
}

/**
 * Check a repetitive-pulse rule: at least one row; periods > 0, or duty cycles in (0, 1],
 * increasing; energies > 0, not falling with the period (not rising with the duty cycle).
 * Cost O(rows).
 * @throws InputError `out-of-range` naming the row and the value
 * @example
 * validateRepetitivePulseRule({ by: "period", rows: [{ at: 1, energyJ: 2 }, { at: 10, energyJ: 8 }] }) // => undefined
 */
export function validateRepetitivePulseRule(rule: RepetitivePulseRule, field = "ratings.repetitive"): void {
  const key = rule.by === "period" ? "period" : "dutyCycle";
  if (rule.rows.length === 0) throw inputError("out-of-range", field, `at least one row { ${key}, energy }`, "an empty table");
  rule.rows.forEach((row, i) => {
    const ok = rule.by === "period" ? row.at > 0 && Number.isFinite(row.at) : row.at > 0 && row.at <= 1;
    if (!ok) throw inputError("out-of-range", `${field}[${i}].${key}`, rule.by === "period" ? "a period > 0 s" : "a duty cycle above 0 and at most 1", describeFound(row.at));
    if (!(row.energyJ > 0) || !Number.isFinite(row.energyJ)) throw inputError("out-of-range", `${field}[${i}].energy`, "an energy > 0 J", describeFound(row.energyJ));
    const before = rule.rows[i - 1];
    if (before === undefined) return;
    if (!(row.at > before.at)) throw inputError("out-of-range", `${field}[${i}].${key}`, `values in increasing order (greater than ${before.at} of row ${i - 1})`, describeFound(row.at));
    if (rule.by === "period" && row.energyJ < before.energyJ)
      throw inputError("out-of-range", `${field}[${i}].energy`, `energies that do not fall as the period grows (at least ${before.energyJ} J of row ${i - 1})`, `${row.energyJ} J`);
    if (rule.by === "duty-cycle" && row.energyJ > before.energyJ)
      throw inputError("out-of-range", `${field}[${i}].energy`, `energies that do not rise with the duty cycle (at most ${before.energyJ} J of row ${i - 1})`, `${row.energyJ} J`);
  });
}

/** Result of {@link checkRepetitivePulse} for one pulse of a train. */
export interface RepetitivePulseCheck {
  readonly status: RatingStatus;
  /** energy of the pulse [J] */
  readonly energyJ: number;
  /** time since the previous pulse started [s] */
  readonly periodS: number;
  /** the rule's argument: the period [s], or the duty cycle t_eq/period */
  readonly at: number;
  /** allowed energy per pulse at that period or duty cycle, derated [J]; undefined outside the rule */
  readonly allowedEnergyJ: number | undefined;
  /** energy / allowance; undefined outside the rule */
  readonly utilisation: number | undefined;
  readonly position: TablePosition;
}

/**
 * Check one pulse of a train against a repetitive-pulse rule. The argument is the time since the
 * previous pulse started (period) or the duty cycle t_eq/period with t_eq the pulse's equivalent
 * rectangular duration E/P_peak. The allowance is interpolated log-log between rows (exact at
 * rows) and multiplied by the derating factor k of the part's start temperature. A period
 * longer than the longest row (or a duty cycle below the smallest) is left to the single-pulse
 * rating ("pass" with position "above-table": the pulses are far enough apart to count as
 * single); a shorter period (a larger duty cycle) than the rule covers is "outside-table".
 * Source: log-log interpolation between rated points is common practice (module of the
 * single-pulse rating, pulseEnergyRating.ts); the duty cycle as pulse time over period is the
 * usual definition (common practice).
 * Cost O(rows).
 * @example
 * checkRepetitivePulse({ by: "period", rows: [{ at: 1, energyJ: 2 }, { at: 100, energyJ: 20 }] }, 5, 10, 0.01).allowedEnergyJ // => 6.324555320336759
 */
export function checkRepetitivePulse(rule: RepetitivePulseRule, energyJ: number, periodS: number, equivalentDurationS: number, deratingFactor = 1): RepetitivePulseCheck {
  const at = rule.by === "period" ? periodS : equivalentDurationS / periodS;
  const rows = rule.rows;
  const first = rows[0]!;
  const last = rows[rows.length - 1]!;
  const base = { energyJ, periodS, at };
  const beyondSingle = rule.by === "period" ? at > last.at : at < first.at;
  if (beyondSingle) return { ...base, status: "pass", allowedEnergyJ: undefined, utilisation: undefined, position: "above-table" };
  const tooDense = rule.by === "period" ? at < first.at : at > last.at;
  if (tooDense || !Number.isFinite(at)) return { ...base, status: "outside-table", allowedEnergyJ: undefined, utilisation: undefined, position: "below-table" };
  let i = 0;
  while (i < rows.length - 2 && rows[i + 1]!.at < at) i++;
  const a = rows[i]!;
  const b = rows[Math.min(i + 1, rows.length - 1)]!;
  const f = a === b || at === a.at ? 0 : Math.log(at / a.at) / Math.log(b.at / a.at);
  const rated = f === 0 ? a.energyJ : a.energyJ * Math.exp(f * Math.log(b.energyJ / a.energyJ));
  const allowedEnergyJ = rated * deratingFactor;
  const utilisation = allowedEnergyJ > 0 ? energyJ / allowedEnergyJ : Number.POSITIVE_INFINITY;
  return { ...base, status: utilisation > 1 ? "fail" : "pass", allowedEnergyJ, utilisation, position: "in-table" };
}
