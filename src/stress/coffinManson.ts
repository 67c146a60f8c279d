import { describeFound, inputError } from "../errors/InputError.js";
import { type CycleLoad, type FittedRange, type LifetimeModel } from "./LifetimeModel.js";

/**
 * Coffin-Manson parameters in reference-point form: a cycle of range ΔT_ref survives N_ref
 * cycles, and life scales as ΔT^−n. (Equivalent to N_f = A·ΔT^−n with A = N_ref·ΔT_ref^n.)
 */
export interface CoffinMansonParameters {
  /** cycles to failure at the reference range, > 0 */
  readonly referenceCycles: number;
  /** reference range ΔT_ref [K], > 0 */
  readonly referenceRangeK: number;
  /** exponent n, > 0 */
  readonly exponent: number;
  /** ranges the parameters were fitted on (user's; none by default) */
  readonly fitted?: FittedRange;
}

/**
 * Coffin-Manson cycles to failure of a temperature cycle:
 *   N_f = N_ref·(ΔT_ref/ΔT)^n        (ΔT in K; N_f = Infinity for ΔT = 0)
 * Source: Coffin, "A study of the effects of cyclic thermal stresses on a ductile metal",
 * Trans. ASME 76 (1954) 931-950; Manson, NACA TN 2933 (1953); the thermal-cycling form with ΔT
 * in place of the plastic strain range as in JEDEC JEP122 (failure mechanisms and models for
 * semiconductor devices), temperature-cycling section (from memory).
 * Validity: no published range (the parameters are the user's own, from the part maker or a
 * cycling test); the ranges given in `fittedRange` are checked per cycle, and without them the
 * damage report says the cycles could not be checked. Cost O(1).
 * @example
 * coffinMansonCycles({ referenceCycles: 1e5, referenceRangeK: 50, exponent: 5 }, 100) // => 3125
 */
export function coffinMansonCycles(p: CoffinMansonParameters, rangeK: number): number {
  if (rangeK <= 0) return Number.POSITIVE_INFINITY;
  return p.referenceCycles * Math.pow(p.referenceRangeK / rangeK, p.exponent);
}

/**
 * Coffin-Manson acceleration factor of a test cycle over a field cycle, N_field/N_test:
 *   AF = (ΔT_test/ΔT_field)^n
 * Source: as {@link coffinMansonCycles}. Cost O(1).
 * @example
 * coffinMansonAccelerationFactor(100, 50, 5) // => 32
 */
export function coffinMansonAccelerationFactor(testRangeK: number, fieldRangeK: number, exponent: number): number {
  return Math.pow(testRangeK / fieldRangeK, exponent);
}

/**
 * Check Coffin-Manson parameters. The only cycling model offered for resistors (with the user's
 * own parameters: there is no published set for them).
 * @throws InputError `out-of-range` for a non-positive cycle count, range or exponent
 * @example
 * const model = coffinMansonModel({ referenceCycles: 1e5, referenceRangeK: 50, exponent: 5 });
 * model.cyclesToFailure({ rangeK: 100, meanC: 75, minC: 25, maxC: 125, heatingTimeS: 1, durationS: 2 }) // => 3125
 */
export function coffinMansonModel(p: CoffinMansonParameters, field = "lifetime"): LifetimeModel {
  if (!(p.referenceCycles > 0) || !Number.isFinite(p.referenceCycles))
    throw inputError("out-of-range", `${field}.referenceCycles`, "a number of cycles > 0", describeFound(p.referenceCycles));
  if (!(p.referenceRangeK > 0) || !Number.isFinite(p.referenceRangeK))
    throw inputError("out-of-range", `${field}.referenceRange`, "a temperature range > 0 K", describeFound(p.referenceRangeK));
  if (!(p.exponent > 0) || !Number.isFinite(p.exponent))
    throw inputError("out-of-range", `${field}.exponent`, "an exponent n > 0 (life falls as the range grows)", describeFound(p.exponent));
  return {
    name: "Coffin-Manson",
    cyclesToFailure: (load: CycleLoad) => coffinMansonCycles(p, load.rangeK),
    fitted: p.fitted ?? {},
    parameterWarnings: [],
  };
}
