import { describeFound, inputError } from "../errors/InputError.js";
import { type CycleLoad, type FittedInterval, type FittedRange, type LifetimeModel, mergeFittedRange } from "./LifetimeModel.js";

/** CIPS 2008 coefficients: N_f = K·ΔT^β1·exp(β2/(T_min + 273))·t_on^β3·I^β4·V^β5·D^β6. */
export interface Cips2008Coefficients {
  readonly k: number;
  readonly beta1: number;
  readonly beta2: number;
  readonly beta3: number;
  readonly beta4: number;
  readonly beta5: number;
  readonly beta6: number;
}

/** The part's fixed quantities the CIPS 2008 model reads. */
export interface Cips2008Part {
  /** current per bond wire (load current / wires) [A] */
  readonly currentPerWireA: number;
  /** blocking voltage class of the chip [V] (the model reads V/100) */
  readonly voltageClassV: number;
  /** bond wire diameter [m] (the model reads micrometres) */
  readonly wireDiameterM: number;
}

/** CIPS 2008 parameters: part quantities, coefficients and an optional fitted range. */
export interface Cips2008Parameters extends Cips2008Part {
  readonly coefficients: Cips2008Coefficients;
  readonly fitted?: FittedRange;
}

/**
 * The published CIPS 2008 coefficients: K = 9.30e14, β1 = −4.416, β2 = 1285 K,
 * β3 = −0.463, β4 = −0.716, β5 = −0.761, β6 = −0.5.
 * Source: Bayerer, Herrmann, Licht, Lutz, Feller, "Model for power cycling lifetime of IGBT
 * modules - various factors influencing lifetime", Proc. CIPS 2008, Nuremberg, eq. (1) and its
 * table of parameters (from memory). Fitted on IGBT modules with aluminium bond wires.
 */
export const CIPS2008_PUBLISHED: Cips2008Coefficients = {
  k: 9.3e14,
  beta1: -4.416,
  beta2: 1285,
  beta3: -0.463,
  beta4: -0.716,
  beta5: -0.761,
  beta6: -0.5,
};

const ORIGIN = "Bayerer et al. 2008, from memory";

/**
 * Validity range of CIPS 2008 by cycle quantity, the cycles its test data covered: ΔT 45-150 K,
 * T_min 20-120 °C, heating time t_on 1-15 s (Bayerer et al. 2008, from memory). Cycles outside
 * are still evaluated and reported as extrapolated; a short pulse (t_on well under 1 s) is the
 * common case in pre-charge parts, where t_on^−0.463 is extrapolated.
 */
export const CIPS2008_FITTED: FittedRange = {
  range: { min: 45, max: 150, origin: ORIGIN },
  min: { min: 20, max: 120, origin: ORIGIN },
  heatingTime: { min: 1, max: 15, origin: ORIGIN },
};

/** Part quantities the CIPS 2008 data covered: I 3-23 A per wire, V 600-3300 V, D 75-500 µm (from memory). */
export const CIPS2008_PART_FITTED: Readonly<Record<keyof Cips2008Part, FittedInterval>> = {
  currentPerWireA: { min: 3, max: 23, origin: ORIGIN },
  voltageClassV: { min: 600, max: 3300, origin: ORIGIN },
  wireDiameterM: { min: 75e-6, max: 500e-6, origin: ORIGIN },
};

/**
 * CIPS 2008 cycles to failure:
 *   N_f = K·ΔT^β1·exp(β2/(T_min + 273))·t_on^β3·I^β4·(V/100)^β5·D^β6
 * with ΔT [K], T_min the cycle's lower temperature [°C] (the source adds 273, not 273.15),
 * t_on the heating time [s], I the current per bond wire [A], V the voltage class [V], D the
 * bond wire diameter [µm]. Source: Bayerer et al. (2008), eq. (1), as {@link CIPS2008_PUBLISHED}
 * (from memory). Validity: {@link CIPS2008_FITTED} and {@link CIPS2008_PART_FITTED}. Cost O(1).
 * @example
 * const p = { coefficients: CIPS2008_PUBLISHED, currentPerWireA: 10, voltageClassV: 600, wireDiameterM: 300e-6 };
 * cips2008Cycles(p, { rangeK: 60, minC: 40, heatingTimeS: 1.5 }) // => 1.8658e6
 */
export function cips2008Cycles(p: Cips2008Parameters, load: Pick<CycleLoad, "rangeK" | "minC" | "heatingTimeS">): number {
  if (load.rangeK <= 0) return Number.POSITIVE_INFINITY;
  const c = p.coefficients;
  const tonS = Math.max(load.heatingTimeS, Number.MIN_VALUE);
  return (
    c.k *
    Math.pow(load.rangeK, c.beta1) *
    Math.exp(c.beta2 / (load.minC + 273)) *
    Math.pow(tonS, c.beta3) *
    Math.pow(p.currentPerWireA, c.beta4) *
    Math.pow(p.voltageClassV / 100, c.beta5) *
    Math.pow(p.wireDiameterM * 1e6, c.beta6)
  );
}

/**
 * Check CIPS 2008 parameters and build the model. Part quantities outside the fitted range give
 * a parameter warning (the model is still evaluated).
 * @throws InputError `out-of-range` for non-positive part quantities or K, β1 ≥ 0
 * @example
 * const p = { coefficients: CIPS2008_PUBLISHED, currentPerWireA: 10, voltageClassV: 600, wireDiameterM: 300e-6 };
 * cips2008Model(p).name // => "CIPS 2008 (Bayerer et al., 2008)"
 */
export function cips2008Model(p: Cips2008Parameters, field = "lifetime"): LifetimeModel {
  const parts: [number, string, string][] = [
    [p.currentPerWireA, "currentPerWire", "a current per bond wire > 0 A"],
    [p.voltageClassV, "voltageClass", "a voltage class > 0 V"],
    [p.wireDiameterM, "wireDiameter", 'a bond wire diameter > 0 m (such as "300 um")'],
    [p.coefficients.k, "k", "a coefficient K > 0"],
  ];
  for (const [v, name, expected] of parts)
    if (!(v > 0) || !Number.isFinite(v)) throw inputError("out-of-range", `${field}.${name}`, expected, describeFound(v));
  if (!(p.coefficients.beta1 < 0))
    throw inputError("out-of-range", `${field}.beta1`, "a range exponent β1 < 0 (life falls as the range grows)", describeFound(p.coefficients.beta1));
  for (const name of ["beta2", "beta3", "beta4", "beta5", "beta6"] as const)
    if (!Number.isFinite(p.coefficients[name])) throw inputError("not-finite", `${field}.${name}`, "a finite number", describeFound(p.coefficients[name]));
  const warnings: string[] = [];
  const words: Record<keyof Cips2008Part, [string, number, string]> = {
    currentPerWireA: ["current per bond wire", 1, "A"],
    voltageClassV: ["voltage class", 1, "V"],
    wireDiameterM: ["bond wire diameter", 1e6, "µm"],
  };
  for (const key of Object.keys(CIPS2008_PART_FITTED) as (keyof Cips2008Part)[]) {
    const range = CIPS2008_PART_FITTED[key];
    const [label, scale, unit] = words[key];
    if (p[key] < range.min || p[key] > range.max)
      warnings.push(
        `CIPS 2008: ${label} ${Number((p[key] * scale).toPrecision(6))} ${unit} is outside the fitted ${Number((range.min * scale).toPrecision(6))}-${Number((range.max * scale).toPrecision(6))} ${unit} (${range.origin})`,
      );
  }
  if (Object.entries(CIPS2008_PUBLISHED).every(([k, v]) => p.coefficients[k as keyof Cips2008Coefficients] === v))
    warnings.push("CIPS 2008: the published coefficients (recalled, from memory) were fitted on IGBT power modules with aluminium bond wires; check they fit this part");
  return {
    name: "CIPS 2008 (Bayerer et al., 2008)",
    cyclesToFailure: (load) => cips2008Cycles(p, load),
    fitted: mergeFittedRange(CIPS2008_FITTED, p.fitted),
    parameterWarnings: warnings,
  };
}
