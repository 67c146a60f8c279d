import { describeFound, inputError } from "../errors/InputError.js";
import type { CauerLadder } from "./cauerLadder.js";

/** A lump of material: its mass and specific heat. */
export interface LumpedMass {
  readonly massKg: number;
  readonly specificHeatJPerKgK: number;
}

/**
 * A part described by lumps: the heated element (a resistor wire, a die, a film) and optionally
 * the body it sits on (a ceramic core, a housing, a tab), each at one uniform temperature.
 */
export interface LumpedDescription {
  /** the element the power is dissipated in */
  readonly element: LumpedMass;
  /** resistance from the last lump (element, or body when given) to ambient [K/W] */
  readonly rToAmbientKPerW: number;
  /** the body the element sits on, with the resistance between the two; omit for one stage */
  readonly body?: LumpedMass & { readonly rElementToBodyKPerW: number };
}

/**
 * A Cauer ladder from a lumped description.
 *   one stage:  C = m·c, R = R_to_ambient               → tau = R·C
 *   two stages: C1 = m_e·c_e, R1 = R_element_to_body; C2 = m_b·c_b, R2 = R_body_to_ambient
 * The ladder's nodes are physical and named so (`part: resistor`: "element", "body"), so it can be
 * chained; its exact Foster form comes from cauerToModal.
 * Source: Incropera et al., Fundamentals of Heat and Mass Transfer, 7th ed. (2011), §5.1 (lumped
 * capacitance method, eq. 5.2-5.7: rho·V·c·dT/dt = −(T − T_inf)/R_t, tau_t = R_t·C_t) and §5.2
 * (validity: Biot number Bi = h·L_c/k < 0.1, eq. 5.10).
 * Validity: each lump must be nearly isothermal (Bi < 0.1): a thin wire or a small ceramic core
 * is, a long rod heated at one end is not. Constant properties (c at 300 K, see MATERIALS).
 * Cost O(1).
 * @throws InputError `out-of-range` naming the first mass, specific heat or resistance that is not > 0
 * @example
 * lumpedNetwork({ element: { massKg: 0.01, specificHeatJPerKgK: 385 }, rToAmbientKPerW: 4 }).stages // => [{ cJPerK: 3.85, rKPerW: 4 }]
 */
export function lumpedNetwork(description: LumpedDescription, field = "lumped"): CauerLadder {
  const positive = (value: number, name: string, words: string): void => {
    if (!Number.isFinite(value) || !(value > 0)) throw inputError("out-of-range", `${field}.${name}`, words, describeFound(value));
  };
  positive(description.element.massKg, "element.mass", "a mass > 0 kg");
  positive(description.element.specificHeatJPerKgK, "element.specificHeat", "a specific heat > 0 J/(kg K)");
  positive(description.rToAmbientKPerW, "rToAmbient", "a thermal resistance > 0 K/W");
  const elementC = description.element.massKg * description.element.specificHeatJPerKgK;
  const body = description.body;
  if (body === undefined) return { kind: "cauer", part: "resistor", stages: [{ cJPerK: elementC, rKPerW: description.rToAmbientKPerW }] };
  positive(body.massKg, "body.mass", "a mass > 0 kg");
  positive(body.specificHeatJPerKgK, "body.specificHeat", "a specific heat > 0 J/(kg K)");
  positive(body.rElementToBodyKPerW, "body.rElementToBody", "a thermal resistance > 0 K/W");
  return {
    kind: "cauer",
    part: "resistor",
    stages: [
      { cJPerK: elementC, rKPerW: body.rElementToBodyKPerW },
      { cJPerK: body.massKg * body.specificHeatJPerKgK, rKPerW: description.rToAmbientKPerW },
    ],
  };
}

/**
 * Adiabatic sizing bound: the smallest mass that absorbs a pulse energy E with a rise of at most
 * ΔT when no heat leaves during the pulse,
 *   m = E / (c·ΔT)   [kg].
 * Any heat lost during the pulse only lowers the rise, so this mass is enough for a pulse much
 * shorter than the part's time constant to ambient, and the bound is conservative for longer ones.
 * Source: Incropera et al., Fundamentals of Heat and Mass Transfer, 7th ed. (2011), §1.3.1 (energy
 * balance, stored thermal energy ΔE_st = m·c·ΔT for a solid of constant specific heat) and §5.3
 * (lumped capacitance with heat input and no outflow).
 * Validity: the mass heats uniformly (small Biot number), constant c; ΔT > 0.
 * Cost O(1).
 * @param energyJ pulse energy E [J] > 0
 * @param specificHeatJPerKgK c [J/(kg·K)] > 0
 * @param riseK allowed rise ΔT [K] > 0
 * @throws InputError `out-of-range`
 * @example
 * adiabaticMass(12, 385, 150) // => 2.0779e-4
 * // 0.21 g of copper takes 12 J with a 150 K rise
 */
export function adiabaticMass(energyJ: number, specificHeatJPerKgK: number, riseK: number): number {
  if (!Number.isFinite(energyJ) || !(energyJ > 0)) throw inputError("out-of-range", "energy", "a pulse energy > 0 J", describeFound(energyJ));
  if (!Number.isFinite(specificHeatJPerKgK) || !(specificHeatJPerKgK > 0))
    throw inputError("out-of-range", "specificHeat", "a specific heat > 0 J/(kg K)", describeFound(specificHeatJPerKgK));
  if (!Number.isFinite(riseK) || !(riseK > 0)) throw inputError("out-of-range", "rise", "an allowed temperature rise > 0 K", describeFound(riseK));
  return energyJ / (specificHeatJPerKgK * riseK);
}
