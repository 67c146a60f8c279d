import type { ChargeConditions, CircuitResult } from "../circuits/CircuitResult.js";
import type { BusLoad } from "../circuits/BusLoad.js";
import type { DischargePath } from "../circuits/dischargeVoltage.js";
import type { ProfileCircuit } from "./DutyProfile.js";

/**
 * The electrical side the expansion calls: one pre-charge attempt of the profile's circuit with a
 * given bus load, and the capacitor's discharge while the bus is disconnected. The default is
 * built on src/circuits (see defaultCircuitModels); tests pass their own to check the expansion
 * logic (retries stop on success, exhausted retries lock out) against known outcomes.
 */
export interface CircuitModels {
  /** one pre-charge attempt; traces are in event-local time and named by circuit role */
  readonly charge: (circuit: ProfileCircuit, load: BusLoad, conditions: ChargeConditions) => CircuitResult;
  /** capacitor voltage after `durationS` on the discharge path, from `initialVoltageV` [V] */
  readonly discharge: (path: DischargePath, capacitanceF: number, initialVoltageV: number, durationS: number) => number;
}
