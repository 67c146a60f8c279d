import { type BusLoad, NO_BUS_LOAD, validateBusLoad } from "./BusLoad.js";
import type { ChargeModel, FeedTerms } from "./BusRegime.js";
import type { ChargeConditions, CircuitResult } from "./CircuitResult.js";
import { requirePositive } from "./requirePositive.js";
import { runChargeEvent } from "./runChargeEvent.js";
import { type ResistanceCurve, resistanceAt, validateResistanceCurve } from "./ResistanceCurve.js";
import { runCoupledChargeEvent } from "./runCoupledChargeEvent.js";
import { DEFAULT_LOOP_GAIN_WARNING } from "./ElectroThermalSummary.js";

/** Parameters of a series-resistor pre-charge. */
export interface SeriesResistorParams {
  /** pre-charge resistor R [Ω] */
  readonly resistanceOhm: number;
  /** resistance of the source and wiring Rsrc [Ω] (default 0) */
  readonly sourceResistanceOhm?: number;
  /** link capacitance C [F] */
  readonly capacitanceF: number;
  /** how R follows the resistor's own temperature (default: it does not); `resistanceOhm` is then
   *  its value at the curve's reference temperature */
  readonly temperatureCurve?: ResistanceCurve;
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
 * Temperature dependence (`temperatureCurve`: linear TCR, NTC, PTC; see ResistanceCurve): when
 * the conditions carry the parts' thermal context (as simulateProfile gives it) R follows the
 * resistor's temperature through the event, solved together with its thermal network
 * (runCoupledChargeEvent; the result carries the inrush peak, peakCurrentA); without one, R is
 * taken at the resistor's start temperature (conditions.partTemperatureC.resistor, 25 °C when
 * absent). Without a curve the exact closed forms are used.
 * Validity: ideal source and capacitor (no ESR); R(T) as the curve gives it.
 * Cost: see {@link runChargeEvent}; O(1) for no, resistive or shorted loads.
 * @throws InputError naming the field: `resistanceOhm` (> 0), `sourceResistanceOhm` (≥ 0),
 *   `capacitanceF` (> 0), `temperatureCurve.*` (validateResistanceCurve), `load.*`, and the
 *   conditions' fields
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
  const rSrc = params.sourceResistanceOhm ?? 0;
  const vs = conditions.sourceVoltageV;
  const curve = params.temperatureCurve;
  if (curve === undefined) return runChargeEvent(seriesResistorModel(params.resistanceOhm, rSrc, params.capacitanceF, vs), load, conditions);
  validateResistanceCurve(curve, "temperatureCurve");
  const thermal = conditions.thermal;
  if (thermal !== undefined && thermal.roles.includes("resistor")) {
    const coupled = {
      capacitanceF: params.capacitanceF,
      traceRoles: ["resistor"],
      readsRole: "resistor",
      reportsLoopGain: false,
      warningLoopGain: DEFAULT_LOOP_GAIN_WARNING,
      at: (temperatureC: Readonly<Record<string, number>>) => seriesResistorModel(resistanceAt(curve, params.resistanceOhm, temperatureC.resistor ?? 25), rSrc, params.capacitanceF, vs),
    };
    return runCoupledChargeEvent(coupled, load, conditions, thermal);
  }
  // no thermal context: R at the resistor's start temperature (25 °C when absent), held
  const startC = conditions.partTemperatureC?.resistor ?? 25;
  return runChargeEvent(seriesResistorModel(resistanceAt(curve, params.resistanceOhm, startC), rSrc, params.capacitanceF, vs), load, conditions);
}

/** The feed of a series-resistor pre-charge with resistance r (see chargeSeriesResistor). */
function seriesResistorModel(r: number, rSrc: number, capacitanceF: number, vs: number): ChargeModel {
  const rt = r + rSrc;
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
  return {
    capacitanceF,
    traceRoles: ["resistor"],
    feed: () => feed,
    initialMode: () => "resistor",
    nextMode: (mode) => mode,
  };
}
