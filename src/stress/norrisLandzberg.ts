import { describeFound, inputError } from "../errors/InputError.js";
import { CELSIUS_TO_KELVIN, type CycleLoad, type FittedRange, type LifetimeModel, cycleQuantity } from "./LifetimeModel.js";

/** Norris-Landzberg parameters: a reference cycle (from a test) and the three exponents. */
export interface NorrisLandzbergParameters {
  /** cycles to failure of the reference cycle, > 0 */
  readonly referenceCycles: number;
  /** reference range ΔT_ref [K], > 0 */
  readonly referenceRangeK: number;
  /** reference cycling frequency f_ref [Hz], > 0 */
  readonly referenceFrequencyHz: number;
  /** reference maximum temperature [°C] */
  readonly referenceMaxC: number;
  /** range exponent n, > 0 */
  readonly exponent: number;
  /** frequency exponent m, ≥ 0 */
  readonly frequencyExponent: number;
  /** Ea/k_B [K], ≥ 0 */
  readonly activationTemperatureK: number;
  readonly fitted?: FittedRange;
}

/**
 * The exponents Norris and Landzberg published for eutectic tin-lead (63Sn-37Pb) flip-chip
 * joints: n = 1.9, m = 1/3, Ea/k = 1414 K. Source: Norris and Landzberg, "Reliability of
 * controlled collapse interconnections", IBM J. Res. Develop. 13(3), 1969, pp. 266-271
 * (from memory). They describe solder joints, not die attach or bond wires of a power part.
 */
export const NORRIS_LANDZBERG_SNPB = { exponent: 1.9, frequencyExponent: 1 / 3, activationTemperatureK: 1414 } as const;

/**
 * Norris-Landzberg cycles to failure of a temperature cycle, relative to a reference cycle:
 *   N_f = N_ref·(ΔT_ref/ΔT)^n·(f/f_ref)^m·exp(Ea/k·(1/T_max − 1/T_max,ref))
 * with f = 1/(cycle duration) [Hz] (f_ref for a cycle of zero duration: no frequency credit),
 * T_max in K. Source: Norris and Landzberg (1969), as
 * {@link NORRIS_LANDZBERG_SNPB} (the acceleration-factor equation, from memory).
 * Validity: no published range is enforced (the test ranges behind the solder exponents are not
 * recalled reliably, and the reference cycle is the user's); the ranges given in `fittedRange`
 * are checked per cycle, and without them the damage report says the cycles could not be
 * checked. Cost O(1).
 * @example
 * const p = { referenceCycles: 1e4, referenceRangeK: 100, referenceFrequencyHz: 1 / 3600, referenceMaxC: 125, ...NORRIS_LANDZBERG_SNPB };
 * norrisLandzbergCycles(p, { rangeK: 50, minC: 50, maxC: 100, meanC: 75, heatingTimeS: 1, durationS: 3600 }) // => 47347
 */
export function norrisLandzbergCycles(p: NorrisLandzbergParameters, load: CycleLoad): number {
  if (load.rangeK <= 0) return Number.POSITIVE_INFINITY;
  // a cycle of zero duration (two turning points at one instant) gets no frequency credit
  const f = load.durationS > 0 ? cycleQuantity(load, "frequency") : p.referenceFrequencyHz;
  const tMaxK = load.maxC + CELSIUS_TO_KELVIN;
  const tRefK = p.referenceMaxC + CELSIUS_TO_KELVIN;
  return (
    p.referenceCycles *
    Math.pow(p.referenceRangeK / load.rangeK, p.exponent) *
    Math.pow(f / p.referenceFrequencyHz, p.frequencyExponent) *
    Math.exp(p.activationTemperatureK * (1 / tMaxK - 1 / tRefK))
  );
}

/**
 * Norris-Landzberg acceleration factor N_field/N_test:
 *   AF = (ΔT_test/ΔT_field)^n·(f_field/f_test)^m·exp(Ea/k·(1/T_max,field − 1/T_max,test))
 * Source: Norris and Landzberg (1969) (from memory). Temperatures in °C, converted to K. Cost O(1).
 * @example
 * const test = { rangeK: 100, frequencyHz: 1 / 3600, maxC: 125 };
 * norrisLandzbergAccelerationFactor(test, { rangeK: 50, frequencyHz: 1 / 3600, maxC: 100 }, NORRIS_LANDZBERG_SNPB) // => 4.735
 */
export function norrisLandzbergAccelerationFactor(
  test: { rangeK: number; frequencyHz: number; maxC: number },
  field: { rangeK: number; frequencyHz: number; maxC: number },
  exponents: { exponent: number; frequencyExponent: number; activationTemperatureK: number },
): number {
  return (
    Math.pow(test.rangeK / field.rangeK, exponents.exponent) *
    Math.pow(field.frequencyHz / test.frequencyHz, exponents.frequencyExponent) *
    Math.exp(exponents.activationTemperatureK * (1 / (field.maxC + CELSIUS_TO_KELVIN) - 1 / (test.maxC + CELSIUS_TO_KELVIN)))
  );
}

/**
 * Check Norris-Landzberg parameters and build the model.
 * @throws InputError `out-of-range` for non-positive reference values or negative exponents
 * @example
 * const p = { referenceCycles: 1e4, referenceRangeK: 100, referenceFrequencyHz: 1 / 3600, referenceMaxC: 125, ...NORRIS_LANDZBERG_SNPB };
 * norrisLandzbergModel(p).name // => "Norris-Landzberg"
 */
export function norrisLandzbergModel(p: NorrisLandzbergParameters, field = "lifetime"): LifetimeModel {
  const positive: [number, string, string][] = [
    [p.referenceCycles, "referenceCycles", "a number of cycles > 0"],
    [p.referenceRangeK, "referenceRange", "a temperature range > 0 K"],
    [p.referenceFrequencyHz, "referenceFrequency", "a frequency > 0 Hz"],
    [p.exponent, "exponent", "an exponent n > 0 (life falls as the range grows)"],
  ];
  for (const [v, name, expected] of positive)
    if (!(v > 0) || !Number.isFinite(v)) throw inputError("out-of-range", `${field}.${name}`, expected, describeFound(v));
  if (!(p.frequencyExponent >= 0) || !Number.isFinite(p.frequencyExponent))
    throw inputError("out-of-range", `${field}.frequencyExponent`, "an exponent m ≥ 0", describeFound(p.frequencyExponent));
  if (!(p.activationTemperatureK >= 0) || !Number.isFinite(p.activationTemperatureK))
    throw inputError("out-of-range", `${field}.activationTemperature`, "Ea/k ≥ 0 K", describeFound(p.activationTemperatureK));
  if (!(p.referenceMaxC > -CELSIUS_TO_KELVIN)) throw inputError("out-of-range", `${field}.referenceMaxTemperature`, "a temperature above absolute zero", describeFound(p.referenceMaxC));
  const warnings: string[] = [];
  if (
    p.exponent === NORRIS_LANDZBERG_SNPB.exponent &&
    p.frequencyExponent === NORRIS_LANDZBERG_SNPB.frequencyExponent &&
    p.activationTemperatureK === NORRIS_LANDZBERG_SNPB.activationTemperatureK
  )
    warnings.push("Norris-Landzberg: the published exponents describe tin-lead solder joints (Norris and Landzberg 1969, from memory), not a power part's die attach or bond wires");
  return { name: "Norris-Landzberg", cyclesToFailure: (load) => norrisLandzbergCycles(p, load), fitted: p.fitted ?? {}, parameterWarnings: warnings };
}
