import type { SquareLawPoint } from "./mosfetSquareLaw.js";

/**
 * Loop-gain level above which an event's electro-thermal margin is reported as a warning, when
 * the profile does not set one (`circuit.loopGainWarning`). Our own choice: half the gain at
 * which the feedback runs away, so that a 2× error in the temperature coefficient or the thermal
 * impedance still leaves the loop stable.
 */
export const DEFAULT_LOOP_GAIN_WARNING = 0.5;

/**
 * Where an event's electro-thermal feedback ran away: the loop gain reached 1, or the part got so
 * hot that the element lost control of its current (a MOSFET threshold drifted to 0 V), whichever
 * came first.
 */
export interface ThermalRunaway {
  /** time from the event start [s] */
  readonly timeS: number;
  /** temperature of the part there [°C] */
  readonly temperatureC: number;
}

/**
 * The electro-thermal margin of one charging event of a part whose electrical values follow its
 * own temperature: the largest loop gain G(t) = Σ_j ∂P_j/∂T·Zth_j(t) over the event (for a
 * linear-mode MOSFET with a source resistor Rs: (V_DS − I·Rs)·dI/dT·Zth_jj(t) +
 * 2·I·Rs·dI/dT·Zth_j,Rs(t), i.e. V_DS·dI/dT·Zth(t) when the drop across Rs is small), and where
 * it reached 1 when it did.
 * Source: P. Spirito, G. Breglio, V. d'Alessandro, N. Rinaldi, "Thermal instabilities in high
 * current power MOS devices: experimental evidence, electro-thermal simulations and analytical
 * modeling", ISPSD 2002 (the loop gain criterion); the multi-source sum is our extension to
 * parts that heat each other.
 */
export interface ElectroThermalSummary {
  /** the circuit role whose temperature sets the element's values ("mosfet", "resistor") */
  readonly role: string;
  /** largest loop gain over the event (1 or more: see runaway) */
  readonly maxLoopGain: number;
  /** when, from the event start [s] */
  readonly maxLoopGainAtS: number;
  /** the loop gain level the profile warns above */
  readonly warningLoopGain: number;
  /** the first time the loop gain reached 1 (or control was lost); undefined when neither happened */
  readonly runaway?: ThermalRunaway;
  /** the part's highest temperature in the coupled solution [°C] */
  readonly peakTemperatureC: number;
  /** a square-law MOSFET (one given a transconductance parameter): its operating point against the
   *  zero-temperature-coefficient point, at peakTemperatureC */
  readonly squareLaw?: SquareLawPoint;
}
