import type { BusLoad } from "../circuits/BusLoad.js";
import type { CompletionRule } from "../circuits/CircuitResult.js";
import { inputError } from "../errors/InputError.js";
import type { ProfileCircuit, SupervisionSpec } from "../profile/DutyProfile.js";
import { formatNumber } from "../text/formatTable.js";

/** One healthy system the supervisor must let through: a corner of the supervision corner set. */
export interface HealthyCorner {
  /** "3.3 mF, 51.2 V, 92 %, load none" */
  readonly name: string;
  readonly capacitanceF: number;
  readonly busVoltageV: number;
  readonly load: BusLoad;
  /** completion rule with the corner's threshold (no dwell; the timeout is set by the caller) */
  readonly completion: Omit<CompletionRule, "timeoutS">;
  /** the completion threshold [V] */
  readonly thresholdV: number;
}

/** A bus load in a few words, for corner names. */
export function describeLoad(load: BusLoad): string {
  switch (load.kind) {
    case "none":
      return "no load";
    case "short":
      return "short";
    case "resistive":
      return `${formatNumber(load.resistanceOhm, 3)} ohm`;
    case "constant-current":
      return `${formatNumber(load.currentA, 3)} A`;
    case "constant-power":
      return `${formatNumber(load.powerW, 3)} W from ${formatNumber(load.enableV, 3)} V`;
  }
}

/**
 * The healthy corner set: every combination of the ends of the capacitance, bus voltage and
 * completion fraction ranges with every legitimate load (2 × 2 × 2 × loads at most; a range of
 * one value adds one end). The completion rule is the corner's fraction when the profile gives a
 * range, else the circuit's own fraction and/or `within` margin; a dwell is dropped (the
 * supervisor's checks are about the voltage).
 * Cost O(corners).
 * @throws InputError `bad-profile` at `supervision.corners.completionFraction` when neither the
 *   range nor the circuit gives a voltage threshold (a dwell-only completion rule)
 */
export function healthyCorners(spec: SupervisionSpec, circuit: ProfileCircuit): HealthyCorner[] {
  const ends = (r: { low: number; high: number }): number[] => (r.low === r.high ? [r.low] : [r.low, r.high]);
  const fractions: (number | undefined)[] = spec.completionFraction === undefined ? [undefined] : ends(spec.completionFraction);
  const own = circuit.completion;
  if (spec.completionFraction === undefined && own.fraction === undefined && own.withinV === undefined)
    throw inputError("bad-profile", "supervision.corners.completionFraction", "a completion threshold (a fraction range here, or circuit.completion.fraction or .within)", "a dwell-only completion rule");
  const corners: HealthyCorner[] = [];
  for (const c of ends(spec.capacitanceF))
    for (const v of ends(spec.busVoltageV))
      for (const k of fractions)
        for (const load of spec.loads) {
          const completion: Omit<CompletionRule, "timeoutS"> =
            k === undefined ? { ...(own.fraction === undefined ? {} : { fraction: own.fraction }), ...(own.withinV === undefined ? {} : { withinV: own.withinV }) } : { fraction: k };
          const byFraction = completion.fraction === undefined ? Infinity : completion.fraction * v;
          const byMargin = completion.withinV === undefined ? Infinity : v - completion.withinV;
          const thresholdV = Math.min(byFraction, byMargin);
          const kWords = completion.fraction !== undefined && byFraction <= byMargin ? `${formatNumber(completion.fraction * 100, 3)} %` : `within ${formatNumber(completion.withinV ?? 0, 3)} V`;
          corners.push({
            name: `${formatNumber(c * 1e3, 3)} mF, ${formatNumber(v, 3)} V, ${kWords}, ${describeLoad(load)}`,
            capacitanceF: c,
            busVoltageV: v,
            load,
            completion,
            thresholdV,
          });
        }
  return corners;
}
