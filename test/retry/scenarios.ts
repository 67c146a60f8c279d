// Invented test scenarios for the planner (not a test file: imported by the tests and the bench).
import { type ModalModel, type RetryScenario, constantPowerSegment } from "../../src/internal.js";

/** A fault the attempts cannot clear: every attempt dissipates P for tOn whatever the bus voltage. */
export function rectangularFault(name: string, model: ModalModel, powerW: number, onS: number, limits: { ambientC: number; limitC: number; marginK: number }): RetryScenario {
  return {
    name,
    model,
    ...limits,
    initialVoltageV: 0,
    attempt: () => ({ trace: [constantPowerSegment(0, onS, powerW)], durationS: onS, endVoltageV: 0 }),
    discharge: (v) => v,
  };
}

/**
 * A series resistor charging C from V0 to `fraction`·Vs, after which the main contactor closes
 * into a fault and trips `tripS` later; the bus is left at Vs and a bleeder (time constant
 * bleedS) empties it before the next attempt. Resistor power p(s) = (Vs − V0)²/R·e^(−2s/RC),
 * charge time RC·ln((Vs − V0)/((1 − fraction)·Vs)) (textbook RC charging: Hambley, Electrical
 * Engineering: Principles and Applications, 7th ed. (2018), §4.2). Quick retries find the bus
 * nearly full (little energy), medium ones find it empty while the part is still hot, slow ones
 * find the part cool.
 */
export function chargeThenTrip(
  name: string,
  model: ModalModel,
  circuit: { sourceV: number; resistanceOhm: number; capacitanceF: number; fraction: number; tripS: number; bleedS: number },
  limits: { ambientC: number; limitC: number; marginK: number },
): RetryScenario {
  const { sourceV, resistanceOhm: R, capacitanceF: C, fraction, tripS, bleedS } = circuit;
  return {
    name,
    model,
    ...limits,
    initialVoltageV: 0,
    attempt: ({ capacitorVoltageV: v0 }) => {
      const dv = sourceV - v0;
      const target = (1 - fraction) * sourceV;
      const chargeS = dv > target ? R * C * Math.log(dv / target) : 0;
      const trace = chargeS > 0 ? [{ startS: 0, durationS: chargeS, terms: [{ a: (dv * dv) / R, b: 0, lambda: 2 / (R * C) }] }] : [];
      return { trace, durationS: chargeS + tripS, endVoltageV: sourceV };
    },
    discharge: (v, waitS) => v * Math.exp(-waitS / bleedS),
  };
}
