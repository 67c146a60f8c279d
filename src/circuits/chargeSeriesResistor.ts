import { type BusLoad, NO_BUS_LOAD, validateBusLoad } from "./BusLoad.js";
import type { ChargeModel, FeedTerms } from "./BusRegime.js";
import type { ChargeConditions, CircuitResult } from "./CircuitResult.js";
import { requirePositive } from "./requirePositive.js";
import { runChargeEvent } from "./runChargeEvent.js";

/** Parameters of a series-resistor pre-charge. */
export interface SeriesResistorParams {
  /** pre-charge resistor R [Ω] */
  readonly resistanceOhm: number;
  /** resistance of the source and wiring Rsrc [Ω] (default 0) */
  readonly sourceResistanceOhm?: number;
  /** link capacitance C [F] */
  readonly capacitanceF: number;
  /** what else hangs on the bus (default none) */
  readonly load?: BusLoad;
}

/**
 * Series-resistor pre-charge: the source Vs charges the link capacitor C through the pre-charge
 * resistor R and the source resistance Rsrc (Rt = R + Rsrc), with an optional load on the bus.
 *
 * Current I = (Vs − Vc)/Rt; the resistor dissipates I²·R (trace role "resistor"), the source
 * resistance I²·Rsrc (energy key "sourceResistance", no trace). With no load or a resistive load
 * RL the bus is linear: Vc(t) = Vf + (V0 − Vf)·e^(−t/τ'), Vf = Vs·RL/(Rt + RL),
 * τ' = C·(Rt ∥ RL), so the resistor power (Vs − Vc)²·R/Rt² is exactly a constant plus e^(−t/τ')
 * and e^(−2t/τ') terms; with no load, Vf = Vs and τ = Rt·C, the time to 95 % of a charge from 0 is
 * τ·ln 20 and the resistor takes C·(Vs − V0)²/2·R/Rt whatever R is. A constant-current load is
 * linear too (Vf = Vs − I·Rt); a constant-power load is integrated by odex. A short holds the bus
 * at 0 V: the resistor dissipates Vs²·R/Rt² until the timeout.
 *
 * Source: Hayt, Kemmerly & Durbin, Engineering Circuit Analysis, 8th ed. (2012), §8.3 and §8.8
 * (source-free and driven RC circuits), §5.3 (Thévenin equivalent of source and load), §7.1
 * (capacitor energy C·V²/2) (section numbers from memory); the energy lost in charging through
 * any resistance, C·(Vs − V0)²/2 shared as R/Rt, is ∫i²·Rt dt = ∫(Vs − V)·C dV (i = C·dV/dt,
 * i·Rt = Vs − V), integrated here.
 * Validity: ideal source, resistor and capacitor (no ESR, no temperature dependence of R).
 * Cost: see {@link runChargeEvent}; O(1) for no, resistive or shorted loads.
 * @throws InputError naming the field: `resistanceOhm` (> 0), `sourceResistanceOhm` (≥ 0),
 *   `capacitanceF` (> 0), `load.*`, and the conditions' fields
 * @example
 * const conditions = { sourceVoltageV: 48, initialVoltageV: 0, completion: { fraction: 0.95, timeoutS: 1 } };
 * chargeSeriesResistor({ resistanceOhm: 10, capacitanceF: 0.002 }, conditions).energy.partsJ.resistor // => 2.2982
 */
export function chargeSeriesResistor(params: SeriesResistorParams, conditions: ChargeConditions): CircuitResult {
  requirePositive(params.resistanceOhm, "resistanceOhm", "a pre-charge resistance > 0 Ω");
  requirePositive(params.sourceResistanceOhm ?? 0, "sourceResistanceOhm", "a source resistance ≥ 0 Ω", true);
  requirePositive(params.capacitanceF, "capacitanceF", "a capacitance > 0 F");
  const load = params.load ?? NO_BUS_LOAD;
  validateBusLoad(load);
  const r = params.resistanceOhm;
  const rSrc = params.sourceResistanceOhm ?? 0;
  const rt = r + rSrc;
  const vs = conditions.sourceVoltageV;
  // (Vs − V)²·Rk/Rt² for a series part of resistance Rk
  const loss = (rk: number) => ({ c0: (vs * vs * rk) / (rt * rt), c1: (-2 * vs * rk) / (rt * rt), c2: rk / (rt * rt) });
  const feed: FeedTerms = {
    g0: vs / rt,
    g1: 1 / rt,
    h: 0,
    sourcePower: { c0: (vs * vs) / rt, c1: -vs / rt, c2: 0 },
    partPower: { resistor: loss(r), sourceResistance: loss(rSrc) },
    levels: [],
    description: "series resistor",
  };
  const model: ChargeModel = {
    capacitanceF: params.capacitanceF,
    traceRoles: ["resistor"],
    feed: () => feed,
    initialMode: () => "resistor",
    nextMode: (mode) => mode,
  };
  return runChargeEvent(model, load, conditions);
}
