import type { CompletionRule } from "../circuits/CircuitResult.js";
import type { CircuitModels } from "../profile/CircuitModels.js";
import type { ProfileCircuit } from "../profile/DutyProfile.js";
import { SIZE_DEFAULTS } from "./sizeDefaults.js";

/** Which circuit value is sized, and which way is slower (and cooler per unit time). */
export interface ChargingElementKnob {
  /** the profile key the value comes from ("resistance", "mosfet.sourceResistor", ...) */
  readonly field: string;
  /** what it is, in words */
  readonly name: string;
  /** unit of the value */
  readonly unit: "ohm" | "A" | "W";
  /** "largest": larger values charge more slowly; "smallest": smaller values do */
  readonly direction: "largest" | "smallest";
}

/** The slowest charging element that still completes a healthy power-up within the timeout. */
export interface ChargingElementSizing {
  /** undefined when the question does not apply (reason says why) */
  readonly knob?: ChargingElementKnob;
  /** "sized", "not-applicable" (a dwell-only completion rule) or "none" (no value completes) */
  readonly status: "sized" | "not-applicable" | "none";
  /** the profile's value [unit] */
  readonly presentValue?: number;
  /** time the profile's value takes to complete the healthy power-up [s]; Infinity when it does not */
  readonly presentChargeS?: number;
  /** the sized value [unit]: the largest resistance or the smallest current/power that completes */
  readonly value?: number;
  /** the charging current the sized value sets, where the knob is a current-setting resistor [A] */
  readonly currentA?: number;
  /** time the sized value takes to complete [s] (close to the timeout) */
  readonly chargeS?: number;
  /** the timeout [s] */
  readonly timeoutS: number;
  /** circuit model runs */
  readonly runs: number;
  /** one sentence */
  readonly reason: string;
}

function knobOf(circuit: ProfileCircuit): { knob: ChargingElementKnob; value: number; set: (x: number) => ProfileCircuit; current?: (x: number) => number } {
  switch (circuit.topology) {
    case "series-resistor":
      return {
        knob: { field: "circuit.resistance", name: "series pre-charge resistance", unit: "ohm", direction: "largest" },
        value: circuit.resistanceOhm,
        set: (x) => ({ ...circuit, resistanceOhm: x }),
      };
    case "linear-mosfet":
      if (circuit.sourceResistorOhm !== undefined) {
        const drive = circuit.gateVoltageV - circuit.thresholdVoltageV;
        return {
          knob: { field: "circuit.mosfet.sourceResistor", name: "source resistor (sets the current (Vgate − Vth)/Rs)", unit: "ohm", direction: "largest" },
          value: circuit.sourceResistorOhm,
          set: (x) => ({ ...circuit, sourceResistorOhm: x }),
          current: (x) => drive / x,
        };
      }
      return {
        knob: { field: "circuit.mosfet.saturationCurrent", name: "MOSFET charging current", unit: "A", direction: "smallest" },
        value: circuit.saturationCurrentA!,
        set: (x) => ({ ...circuit, saturationCurrentA: x }),
      };
    case "converter":
      return circuit.mode === "constant-current"
        ? { knob: { field: "circuit.converter.current", name: "converter charging current", unit: "A", direction: "smallest" }, value: circuit.currentA!, set: (x) => ({ ...circuit, currentA: x }) }
        : { knob: { field: "circuit.converter.power", name: "converter charging power", unit: "W", direction: "smallest" }, value: circuit.powerW!, set: (x) => ({ ...circuit, powerW: x }) };
  }
}

/**
 * The largest series resistance (series resistor; a linear MOSFET's source resistor) or the
 * smallest charging current or power (a MOSFET with a set saturation current; a converter) with
 * which a healthy power-up still completes within the profile's timeout: the capacitor from 0 V,
 * the circuit's own bus load, the profile's completion threshold (a fixed dwell in the rule is
 * left out: it would call any charge complete). The profile's circuit model is run (never a
 * re-derivation) and the value bisected on its logarithm between a value that completes and one
 * that does not, to SIZE_DEFAULTS.circuitRelativeWidth; the bracket is found by factors of
 * `bracketFactor` within `circuitSearchFactor` of the profile's value.
 * For a series resistor with no load the answer has a closed form (used by the tests): the bus
 * reaches k·Vs at t = tau·ln((Vs − V0)/((1 − k)·Vs)), tau = (R + Rsrc)·C, so
 *   R_max = timeout / (C·ln((Vs − V0)/((1 − k)·Vs))) − Rsrc.
 * Source: RC charging, Hayt, Kemmerly & Durbin, Engineering Circuit Analysis, 8th ed. (2012), §8.8
 * (driven RC circuit; section from memory); bisection, Press et al., Numerical Recipes, 3rd ed.
 * (2007), §9.1.
 * Validity: completion is monotone in the value (a slower element never completes sooner), true of
 * every model here with the loads it takes.
 * Cost: about 30 to 60 circuit runs, O(1) each for linear circuits.
 * @throws the circuit model's InputErrors
 * @example
 * sizeChargingElement(profile("warehouse-robot-48v.yaml").circuit, defaultCircuitModels).value // => 71.93
 */
export function sizeChargingElement(circuit: ProfileCircuit, models: CircuitModels): ChargingElementSizing {
  const timeoutS = circuit.completion.timeoutS;
  const rule: CompletionRule = {
    ...(circuit.completion.fraction === undefined ? {} : { fraction: circuit.completion.fraction }),
    ...(circuit.completion.withinV === undefined ? {} : { withinV: circuit.completion.withinV }),
    timeoutS,
  };
  if (rule.fraction === undefined && rule.withinV === undefined) {
    return { status: "not-applicable", timeoutS, runs: 0, reason: "the completion rule is a fixed dwell only: a charge is done when the dwell ends, whatever the resistance or current" };
  }
  const { knob, value: presentValue, set, current } = knobOf(circuit);
  let runs = 0;
  const attempt = (x: number) => {
    runs++;
    const at = set(x);
    return models.charge(at, at.load, { sourceVoltageV: at.busVoltageV, initialVoltageV: 0, completion: rule });
  };
  // slower(x, f): move x toward the slow side by a factor f
  const slower = (x: number, f: number): number => (knob.direction === "largest" ? x * f : x / f);
  const d = SIZE_DEFAULTS;
  const present = attempt(presentValue);
  const presentChargeS = present.outcome === "completed" ? present.durationS : Infinity;
  let fast: number; // completes
  let slow: number; // does not
  let fastDuration = presentChargeS;
  if (present.outcome === "completed") {
    fast = presentValue;
    for (;;) {
      const x = slower(fast, d.bracketFactor);
      const r = attempt(x);
      if (r.outcome !== "completed") {
        slow = x;
        break;
      }
      fast = x;
      fastDuration = r.durationS;
      if (Math.abs(Math.log(x / presentValue)) > Math.log(d.circuitSearchFactor)) {
        return { knob, status: "none", presentValue, presentChargeS, timeoutS, runs, reason: `the charge still completes at ${d.circuitSearchFactor} times the profile's ${knob.name}: the model does not slow down as expected` };
      }
    }
  } else {
    slow = presentValue;
    let last = present;
    for (;;) {
      const x = slower(slow, 1 / d.bracketFactor);
      const r = attempt(x);
      if (r.outcome === "completed") {
        fast = x;
        fastDuration = r.durationS;
        break;
      }
      slow = x;
      last = r;
      if (Math.abs(Math.log(x / presentValue)) > Math.log(d.circuitSearchFactor)) {
        return {
          knob,
          status: "none",
          presentValue,
          presentChargeS,
          timeoutS,
          runs,
          reason: `no ${knob.name} within a factor ${d.circuitSearchFactor} of the profile's completes a healthy power-up within ${Number(timeoutS.toPrecision(6))} s: ${last.reason}`,
        };
      }
    }
  }
  while (Math.abs(slow / fast - 1) > d.circuitRelativeWidth) {
    const mid = Math.sqrt(fast * slow);
    if (mid === fast || mid === slow) break;
    const r = attempt(mid);
    if (r.outcome === "completed") {
      fast = mid;
      fastDuration = r.durationS;
    } else slow = mid;
  }
  return {
    knob,
    status: "sized",
    presentValue,
    presentChargeS,
    value: fast,
    ...(current === undefined ? {} : { currentA: current(fast) }),
    chargeS: fastDuration,
    timeoutS,
    runs,
    reason: `the ${knob.direction} ${knob.name} that completes a healthy power-up from 0 V within ${Number(timeoutS.toPrecision(6))} s`,
  };
}
