import { describeFound, inputError } from "../errors/InputError.js";
import { CELSIUS_TO_KELVIN, type CycleLoad, type FittedRange, type LifetimeModel, mergeFittedRange } from "./LifetimeModel.js";

/**
 * The gas constant R [J/(mol·K)] of the LESIT formula: 8.314, the value the published fit was
 * made with (Held et al. 1997, from memory). A and Q were fitted together with it, so the
 * published set gives the paper's lifetimes only with this R. The exact value of the 2019 SI
 * (CODATA 2018, N_A·k = 8.314462618) is 5.6e-5 larger: Q/(R·T_m) ≈ 26.6 at 80 °C would fall by
 * 1.5e-3 and the cycles to failure by 0.15 %, a shift the fit does not contain.
 */
export const LESIT_GAS_CONSTANT = 8.314;

/** LESIT parameters: N_f = A·ΔT^α·exp(Q/(R·T_m)). */
export interface LesitParameters {
  /** coefficient A [cycles·K^−α] */
  readonly coefficient: number;
  /** range exponent α, < 0 */
  readonly rangeExponent: number;
  /** activation energy Q [J/mol], ≥ 0 */
  readonly activationEnergyJPerMol: number;
  readonly fitted?: FittedRange;
}

/**
 * The LESIT parameter set: A = 640, α = −5, Q = 7.8e4 J/mol (with R = {@link LESIT_GAS_CONSTANT}).
 * Source: Held, Jacob, Nicoletti, Scacco, Poech, "Fast power cycling test for IGBT modules in
 * traction application", Proc. PEDS 1997, pp. 425-430 (from memory). Fitted on IGBT modules with
 * aluminium bond wires on Al2O3 / AlN substrates (bond-wire lift-off).
 */
export const LESIT_PUBLISHED: LesitParameters = { coefficient: 640, rangeExponent: -5, activationEnergyJPerMol: 7.8e4 };

/**
 * Validity range of the LESIT fit: the cycles its tests covered, ΔT 30-80 K and mean temperature
 * 60-120 °C (Held et al. 1997, from memory; give `fitted` to override). The model has no
 * heating-time term and we recall no heating-time range from the source, so none is checked.
 */
export const LESIT_FITTED: FittedRange = {
  range: { min: 30, max: 80, origin: "Held et al. 1997, from memory" },
  mean: { min: 60, max: 120, origin: "Held et al. 1997, from memory" },
};

/**
 * LESIT cycles to failure:
 *   N_f = A·ΔT^α·exp(Q/(R·T_m)),  ΔT [K], T_m = mean temperature [K] = mean [°C] + 273.15,
 *   R = {@link LESIT_GAS_CONSTANT} = 8.314 J/(mol·K)
 * Source: Held et al. (1997), as {@link LESIT_PUBLISHED}, equation of the lifetime fit (from
 * memory). Validity: {@link LESIT_FITTED}. Cost O(1).
 * @example
 * lesitCycles(LESIT_PUBLISHED, { rangeK: 60, meanC: 80 }) // => 283707
 */
export function lesitCycles(p: LesitParameters, load: Pick<CycleLoad, "rangeK" | "meanC">): number {
  if (load.rangeK <= 0) return Number.POSITIVE_INFINITY;
  const tmK = load.meanC + CELSIUS_TO_KELVIN;
  return p.coefficient * Math.pow(load.rangeK, p.rangeExponent) * Math.exp(p.activationEnergyJPerMol / (LESIT_GAS_CONSTANT * tmK));
}

/**
 * Check LESIT parameters and build the model; the fitted range is {@link LESIT_FITTED} unless
 * the caller gives its own.
 * @throws InputError `out-of-range` for A ≤ 0, α ≥ 0 (life must fall as ΔT grows) or Q < 0
 * @example
 * lesitModel(LESIT_PUBLISHED).name // => "LESIT (Held et al., 1997)"
 */
export function lesitModel(p: LesitParameters, field = "lifetime"): LifetimeModel {
  if (!(p.coefficient > 0) || !Number.isFinite(p.coefficient)) throw inputError("out-of-range", `${field}.coefficient`, "a coefficient A > 0", describeFound(p.coefficient));
  if (!(p.rangeExponent < 0) || !Number.isFinite(p.rangeExponent))
    throw inputError("out-of-range", `${field}.rangeExponent`, "a range exponent α < 0 (life falls as the range grows)", describeFound(p.rangeExponent));
  if (!(p.activationEnergyJPerMol >= 0) || !Number.isFinite(p.activationEnergyJPerMol))
    throw inputError("out-of-range", `${field}.activationEnergy`, "an activation energy Q ≥ 0 J/mol", describeFound(p.activationEnergyJPerMol));
  const published =
    p.coefficient === LESIT_PUBLISHED.coefficient &&
    p.rangeExponent === LESIT_PUBLISHED.rangeExponent &&
    p.activationEnergyJPerMol === LESIT_PUBLISHED.activationEnergyJPerMol;
  return {
    name: "LESIT (Held et al., 1997)",
    cyclesToFailure: (load) => lesitCycles(p, load),
    fitted: mergeFittedRange(LESIT_FITTED, p.fitted),
    parameterWarnings: published
      ? ["LESIT: the published parameter set (recalled, from memory) was fitted on IGBT power modules with aluminium bond wires; check it fits this part"]
      : [],
  };
}
