import type { PowerTrace } from "../thermal/powerTrace.js";
import type { AttemptProtection, ProtectionFiring } from "./AttemptProtection.js";
import type { ChargeThermalContext } from "./ChargeThermalContext.js";
import type { ElectroThermalSummary } from "./ElectroThermalSummary.js";

/**
 * How a pre-charge attempt ended, as the firmware sees it: the bus reached the completion threshold
 * (or the fixed dwell ended), or the timeout timer ended the attempt. Whether the bus could still
 * have got there is a separate fact, CircuitResult.busStalled. "tripped": a protection of the
 * completion rule (CompletionRule.protection) ended it first; CircuitResult.trippedBy names it.
 */
export type CircuitOutcome = "completed" | "timed-out" | "tripped";

/** The conditions one charging event starts from. */
export interface ChargeConditions {
  /** source (battery or rectified line) voltage [V] */
  readonly sourceVoltageV: number;
  /** capacitor voltage at the start of the event [V] */
  readonly initialVoltageV: number;
  /** when the charge counts as done, and when it is aborted */
  readonly completion: CompletionRule;
  /** temperature of each dissipating part at the event start [°C], by role; models that
   *  depend on temperature (a MOSFET's threshold drift) read it, others ignore it */
  readonly partTemperatureC?: Readonly<Record<string, number>>;
  /** the parts' thermal networks and start state, for models whose values follow the parts'
   *  temperatures during the event (solved together with the charge); absent: frozen at the start */
  readonly thermal?: ChargeThermalContext;
  /** also return a sampled time series of capacitor voltage and current (default false) */
  readonly wantSamples?: boolean;
}

/**
 * Completion and abort rule of a charge: done when Vc ≥ fraction·Vs, or when Vs − Vc ≤ withinV
 * (whichever is given; both given: the first reached), or after a fixed dwell; aborted at the
 * timeout.
 */
export interface CompletionRule {
  /** complete at Vc ≥ fraction·Vs, 0 < fraction < 1 */
  readonly fraction?: number;
  /** complete at Vs − Vc ≤ withinV [V] */
  readonly withinV?: number;
  /** complete after this time whatever the voltage [s] (a fixed pre-charge dwell) */
  readonly dwellS?: number;
  /** abort after this time [s] */
  readonly timeoutS: number;
  /** protection that may end the attempt sooner (bus checks, over-current, I²t, maximum on-time) */
  readonly protection?: AttemptProtection;
}

/** One sample of the circuit state, for plots and CSV. */
export interface CircuitSample {
  readonly timeS: number;
  /** capacitor (bus) voltage [V] */
  readonly voltageV: number;
  /** current the charging element delivers into the bus (the inrush current) [A] */
  readonly currentA: number;
  /** current into the capacitor itself: the element's current minus the load's [A] */
  readonly capacitorCurrentA?: number;
}

/** Energy bookkeeping of one event [J]: source = stored + Σ parts + load (+ converter losses). */
export interface EnergyBalance {
  /** energy delivered by the source */
  readonly sourceJ: number;
  /** change of the capacitor's stored energy, C(V_end² − V_0²)/2 */
  readonly storedJ: number;
  /** energy taken by the load on the bus */
  readonly loadJ: number;
  /** energy dissipated in each part, by role */
  readonly partsJ: Readonly<Record<string, number>>;
}

/**
 * What every circuit model returns for one event. Traces are in event-local time (the event
 * starts at t = 0); the profile layer shifts them onto the timeline and maps roles to parts.
 */
export interface CircuitResult {
  readonly outcome: CircuitOutcome;
  /**
   * true when the timer ended an attempt whose bus would never have reached the threshold (it
   * settles below it, is held at 0 V, as by a short, or cycles with the load switching); false
   * for a completed attempt and for one the timer ended while the bus was still rising toward it
   */
  readonly busStalled: boolean;
  /** one sentence: why the event ended ("bus reached 95 % of 48 V at 0.351 s") */
  readonly reason: string;
  /** how long the event lasted: until completion, dwell end or timeout [s] */
  readonly durationS: number;
  /** capacitor voltage at the end [V] */
  readonly endVoltageV: number;
  /** power per dissipating role ("resistor", "mosfet", "sourceResistor", "switch", ...) */
  readonly traces: Readonly<Record<string, PowerTrace>>;
  readonly energy: EnergyBalance;
  /** the protection that ended the attempt (outcome "tripped"), with the moment and the reason */
  readonly trippedBy?: ProtectionFiring;
  /** present when ChargeConditions.wantSamples was true */
  readonly samples?: readonly CircuitSample[];
  /** highest current the charging element delivered during the event (the inrush peak) [A] */
  readonly peakCurrentA?: number;
  /** the electro-thermal margin, for an event solved together with its parts' temperatures */
  readonly electroThermal?: ElectroThermalSummary;
}
