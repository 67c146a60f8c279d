import { chargeConverter } from "../circuits/chargeConverter.js";
import { chargeLinearMosfet } from "../circuits/chargeLinearMosfet.js";
import { chargeSeriesResistor } from "../circuits/chargeSeriesResistor.js";
import { dischargeVoltage } from "../circuits/dischargeVoltage.js";
import { InputError } from "../errors/InputError.js";
import type { CircuitModels } from "./CircuitModels.js";
import { circuitLoadField } from "./loadProblemsAt.js";

/**
 * Prefix circuit-model problems with the profile section their values came from: a load value
 * goes to its profile key under `circuit.load` (the event that brought its own load moves it on,
 * loadProblemsAt), anything else to `circuit`, naming the model's value.
 */
function inCircuit<T>(compute: () => T): T {
  try {
    return compute();
  } catch (error) {
    if (error instanceof InputError)
      throw new InputError(
        error.problems.map((p) => {
          const load = circuitLoadField(p.field);
          if (load !== undefined) return { ...p, field: load };
          return { ...p, field: "circuit", expected: p.field === "" ? p.expected : `${p.expected} (circuit model value ${p.field})` };
        }),
      );
    throw error;
  }
}

/**
 * The circuit models the CLI uses, from src/circuits: the profile's topology picks the pre-charge
 * model (chargeSeriesResistor, ...), and dischargeVoltage drains the capacitor between events.
 * A topology whose model is not yet part of this build is refused with a clear message.
 */
export const defaultCircuitModels: CircuitModels = {
  charge: (circuit, load, conditions) =>
    inCircuit(() => {
      switch (circuit.topology) {
        case "series-resistor":
          return chargeSeriesResistor(
            {
              resistanceOhm: circuit.resistanceOhm,
              capacitanceF: circuit.capacitanceF,
              load,
              ...(circuit.sourceResistanceOhm === undefined ? {} : { sourceResistanceOhm: circuit.sourceResistanceOhm }),
              ...(circuit.temperatureCurve === undefined ? {} : { temperatureCurve: circuit.temperatureCurve }),
            },
            conditions,
          );
        case "linear-mosfet":
          return chargeLinearMosfet(
            {
              capacitanceF: circuit.capacitanceF,
              gateVoltageV: circuit.gateVoltageV,
              thresholdVoltageV: circuit.thresholdVoltageV,
              rdsOnOhm: circuit.rdsOnOhm,
              load,
              ...(circuit.sourceResistorOhm === undefined ? {} : { sourceResistorOhm: circuit.sourceResistorOhm }),
              ...(circuit.saturationCurrentA === undefined ? {} : { saturationCurrentA: circuit.saturationCurrentA }),
              ...(circuit.thresholdTempcoVPerK === undefined ? {} : { thresholdTempcoVPerK: circuit.thresholdTempcoVPerK }),
              ...(circuit.transconductanceAPerV2 === undefined ? {} : { transconductanceAPerV2: circuit.transconductanceAPerV2 }),
              ...(circuit.transconductanceExponent === undefined ? {} : { transconductanceExponent: circuit.transconductanceExponent }),
              ...(circuit.loopGainWarning === undefined ? {} : { loopGainWarning: circuit.loopGainWarning }),
            },
            conditions,
          );
        case "converter":
          return chargeConverter(
            {
              capacitanceF: circuit.capacitanceF,
              mode: circuit.mode,
              efficiency: circuit.efficiency,
              load,
              ...(circuit.currentA === undefined ? {} : { currentA: circuit.currentA }),
              ...(circuit.powerW === undefined ? {} : { powerW: circuit.powerW }),
              ...(circuit.currentLimitA === undefined ? {} : { currentLimitA: circuit.currentLimitA }),
            },
            conditions,
          );
      }
    }),
  discharge: (path, capacitanceF, initialVoltageV, durationS) => inCircuit(() => dischargeVoltage(path, capacitanceF, initialVoltageV, durationS)),
};
