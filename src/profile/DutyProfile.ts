import type { BusLoad } from "../circuits/BusLoad.js";
import type { ProfileSurroundings } from "./ProfileSurroundings.js";
import type { CompletionRule } from "../circuits/CircuitResult.js";
import type { DischargePath } from "../circuits/dischargeVoltage.js";
import type { ContactorSpec } from "../circuits/contactorClosing.js";
import type { ModalModel } from "../thermal/ModalModel.js";
import type { ThermalNetwork } from "../thermal/ThermalNetwork.js";
import type { PowerSegment } from "../thermal/powerTrace.js";
import type { RetryPlanInput } from "./profileSchema.js";
import type { StressConfig } from "../stress/resolveStressConfig.js";
import type { AttemptTiming } from "./attemptTiming.js";
import type { ResistanceCurve } from "../circuits/ResistanceCurve.js";

/** The circuit role a part plays; the circuit models name their power traces by these. */
export type CircuitRole = "resistor" | "mosfet" | "sourceResistor" | "switch";

/** A pre-charge circuit of a profile, in SI. */
export type ProfileCircuit = {
  readonly busVoltageV: number;
  readonly capacitanceF: number;
  readonly load: BusLoad;
  readonly completion: CompletionRule;
  readonly discharge: DischargePath;
  /** the main contactor's making-current rating and the loop it closes (`circuit.contactor`) */
  readonly contactor?: ContactorSpec;
  /** the charging element's peak (inrush) current rating [A], compared with each charge's peak */
  readonly peakCurrentRatingA?: number;
} & (
  | {
      readonly topology: "series-resistor";
      readonly resistanceOhm: number;
      readonly sourceResistanceOhm?: number;
      /** how the resistor's resistance follows its temperature; resistanceOhm is its value at the curve's reference */
      readonly temperatureCurve?: ResistanceCurve;
    }
  | {
      readonly topology: "linear-mosfet";
      readonly gateVoltageV: number;
      readonly thresholdVoltageV: number;
      readonly sourceResistorOhm?: number;
      readonly saturationCurrentA?: number;
      readonly rdsOnOhm: number;
      readonly thresholdTempcoVPerK?: number;
      /** square-law K at 25 °C [A/V²] */
      readonly transconductanceAPerV2?: number;
      /** mobility exponent m of K(T) */
      readonly transconductanceExponent?: number;
      /** loop gain above which an event's electro-thermal margin is a warning */
      readonly loopGainWarning?: number;
    }
  | {
      readonly topology: "converter";
      readonly mode: "constant-current" | "constant-power";
      readonly currentA?: number;
      readonly powerW?: number;
      readonly efficiency: number;
      readonly currentLimitA?: number;
    }
);

/**
 * A part whose temperature is tracked. Parts that name the same network file share one network
 * (for example a MOSFET and its source resistor on one heatsink): each heats its own source node
 * and is observed at its own node, and they heat each other through the network.
 */
export interface ProfilePart {
  readonly id: string;
  /** the circuit role whose dissipation heats it; undefined: heated only by power-trace events */
  readonly role?: CircuitRole;
  /** the network's modal model (shared by every part with the same networkKey) */
  readonly model: ModalModel;
  /** identifies the network: the file path as written, or the part's field for an inline network */
  readonly networkKey: string;
  /**
   * the network as written (Foster, Cauer or graph) before its modal reduction, shared like the
   * model; `heatledger size --scale element` scales one of its capacities. Undefined for a part
   * built from a modal model alone.
   */
  readonly network?: ThermalNetwork;
  /** the model source this part's power enters */
  readonly sourceIndex: number;
  /** the model node whose temperature is this part's */
  readonly observedIndex: number;
  readonly ambientC: number;
  readonly limitC: number;
  readonly marginK: number;
  /** ratings, lifetime model and cycle hysteresis (stress layer), resolved at load time; undefined: defaults, no ratings */
  readonly stress?: StressConfig;
}

/** A fault condition met by a power-up. */
export interface FaultSpec {
  readonly type: "shorted-output" | "overloaded-bus" | "converter-early" | "trip-after-close";
  /** the load the bus presents during the attempt */
  readonly load: BusLoad;
  /** the profile path where the load's keys are written (for messages); undefined: `circuit.load` */
  readonly loadField?: string;
  /**
   * time from the contactor closing to the trip [s] (trip-after-close; 0 is a trip at the moment
   * the contactor closes); undefined: the fault does not trip the system, the bus stays on
   */
  readonly tripAfterS?: number;
}

/** One event of a profile, resolved to SI, with its field path for messages. */
export type ProfileEvent = { readonly field: string; readonly label?: string } & (
  | { readonly kind: "power-up"; readonly load?: BusLoad; readonly loadField?: string }
  | { readonly kind: "fault"; readonly fault: FaultSpec }
  | { readonly kind: "run" | "wait" | "lockout"; readonly durationS: number }
  | { readonly kind: "power-down"; readonly offS: number }
  | {
      readonly kind: "retry";
      readonly attempts: number;
      readonly intervalS: number;
      readonly backoff: number;
      readonly maxIntervalS: number;
      readonly fault?: FaultSpec;
      /** how many of the first attempts meet the fault (the rest see the normal load) */
      readonly faultyAttempts: number;
      readonly lockoutS: number;
    }
  | { readonly kind: "repeat"; readonly count: number; readonly periodS?: number; readonly events: readonly ProfileEvent[] }
  | { readonly kind: "power-trace"; readonly partIndex: number; readonly segments: readonly PowerSegment[]; readonly durationS: number }
);

/** A validated, fully resolved duty profile (every number SI; temperatures in °C). */
export interface DutyProfile {
  readonly file: string;
  readonly name: string;
  readonly description: string;
  readonly parts: readonly ProfilePart[];
  readonly circuit?: ProfileCircuit;
  readonly events: readonly ProfileEvent[];
  /** the retry plan section (questions and corners for `heatledger retries`), when given */
  readonly retryPlan?: RetryPlanInput;
  /**
   * the relay's switching times and the firmware's timer resolution (`circuit.relay`,
   * `firmware`), defaults filled in; undefined (a profile built by hand): ATTEMPT_TIMING_DEFAULTS
   */
  readonly timing?: AttemptTiming;
  /** the supervision section, when the profile has one (read by `heatledger supervise`) */
  readonly supervision?: SupervisionSpec;
  /** how many times a year the whole profile happens (for calendar life); undefined: not stated */
  readonly occursPerYear?: number;
  /** an ambient that varies with time and extra heat sources on network nodes; undefined: constant ambient */
  readonly surroundings?: ProfileSurroundings;
}

/** A closed range of one quantity [SI]; low = high for a single value. */
export interface QuantityRange {
  readonly low: number;
  readonly high: number;
}

/**
 * The supervision section of a profile, resolved to SI: the healthy corner set the pre-charge
 * supervisor must let through, and the check times and margins of its early-abort checks.
 * Ranges left out of the profile default to the circuit's own value (a range of one value).
 */
export interface SupervisionSpec {
  /** link capacitance over units and life [F] */
  readonly capacitanceF: QuantityRange;
  /** source (bus) voltage [V] */
  readonly busVoltageV: QuantityRange;
  /** completion fraction of the bus voltage; undefined: the circuit's completion rule */
  readonly completionFraction?: QuantityRange;
  /** legitimate loads on the bus while it charges (default: the circuit's load) */
  readonly loads: readonly BusLoad[];
  /** capacitor voltage at the start of a healthy charge [V] (default 0) */
  readonly startVoltageV: number;
  /** early-abort check times [s], ascending; undefined: chosen automatically */
  readonly checkTimesS?: readonly number[];
  /** rise-too-fast check times [s], ascending; undefined: the early-abort check times */
  readonly riseCheckTimesS?: readonly number[];
  /** margin kept between a check threshold and the healthy envelope, fraction of the voltage; undefined: the default */
  readonly checkMarginFraction?: number;
  /** the lowest threshold a check may use (measurement floor) [V]; undefined: the default */
  readonly minCheckVoltageV?: number;
}
