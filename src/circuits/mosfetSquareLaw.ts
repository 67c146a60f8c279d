/**
 * The drain current of a MOSFET in saturation by the square law, with its two temperature drifts,
 * and where the current's temperature coefficient changes sign.
 *
 * Why: a linear-mode pre-charge MOSFET whose threshold falls as its die heats conducts more
 * current when hot (positive feedback, the loop gain of ElectroThermalSummary); the carriers'
 * mobility falls with temperature too, which lowers the transconductance parameter K and the
 * current (negative feedback). Which of the two wins depends on the gate overdrive V_GS − Vth:
 * below the zero-temperature-coefficient (ZTC) overdrive the threshold term wins and the current
 * rises with temperature; above it the current falls.
 *
 * The laws, all at the junction temperature T [°C], Ta = T + 273.15 K:
 * - square law in saturation I = K·(V_GS − Vth)², K in A/V² (K = ½·µn·Cox·W/L): Sedra & Smith,
 *   Microelectronic Circuits, 7th ed. (2015), §5.2 (from memory);
 * - with a source resistor Rs between the source and the gate drive's return, V_GS = Vg − I·Rs;
 *   with x = V_GS − Vth and Vov = Vg − Vth: K·Rs·x² + x − Vov = 0, whose positive root is
 *   x = 2·Vov/(1 + √(1 + 4·K·Rs·Vov)) (written so that it does not cancel for large K·Rs·Vov), and
 *   I = K·x² (same section, source degeneration);
 * - mobility limited by lattice scattering falls as Ta^(−3/2): Sze & Ng, Physics of Semiconductor
 *   Devices, 3rd ed. (2007), §1.5.1 (from memory); inversion layers measure exponents of about
 *   1.5 to 2 (common practice). Hence K(T) = K(25 °C)·(Ta/298.15 K)^(−m);
 * - threshold Vth(T) = Vth(25 °C) + k·(T − 25 °C), floored at 0 V (chargeLinearMosfet).
 *
 * Temperature coefficient (the derivative of the root above, worked here): with dK/dT = −m·K/Ta
 * and dVov/dT = −k,
 *   dI/dT = K·x·(−m·x/Ta − 2·k)/(1 + 2·K·x·Rs),
 * which is zero at the overdrive x_ZTC = −2·k·Ta/m (only for k < 0 and m > 0: otherwise both terms
 * lower the current and there is no such point). Rs scales the coefficient but does not move the
 * point. With m = 2 the ZTC gate-source voltage Vth(T) + x_ZTC = Vth(25 °C) − k·298.15 K does not
 * depend on T. The sign change is the "temperature compensation point" of power MOSFETs: Spirito,
 * Breglio, d'Alessandro & Rinaldi, ISPSD 2002 (from memory).
 */

/** Temperature at which a MOSFET's threshold and transconductance parameter are given [°C] (the usual datasheet reference). */
export const THRESHOLD_REFERENCE_TEMPERATURE_C = 25;

/** Kelvin at 0 °C. */
const KELVIN_AT_0C = 273.15;

/**
 * K(T) = K(25 °C)·((T + 273.15)/298.15)^(−m) [A/V²] (see the module header). Cost O(1).
 * @param kAt25 K at 25 °C [A/V²]
 * @param exponent mobility exponent m (0: K constant)
 * @param temperatureC junction temperature [°C]
 */
export function transconductanceAt(kAt25: number, exponent: number, temperatureC: number): number {
  if (exponent === 0) return kAt25;
  return kAt25 * Math.pow((temperatureC + KELVIN_AT_0C) / (THRESHOLD_REFERENCE_TEMPERATURE_C + KELVIN_AT_0C), -exponent);
}

/**
 * The gate overdrive x = V_GS − Vth the square law settles at [V]: x = 2·Vov/(1 + √(1 + 4·K·Rs·Vov))
 * with a source resistor, Vov without (Rs = 0); 0 for Vov ≤ 0 (the part is off). Cost O(1).
 * @param kAPerV2 K [A/V²] (> 0)
 * @param driveV Vov = Vg − Vth [V]
 * @param sourceResistorOhm Rs [Ω] (0: none)
 */
export function squareLawOverdriveV(kAPerV2: number, driveV: number, sourceResistorOhm: number): number {
  if (!(driveV > 0)) return 0;
  return (2 * driveV) / (1 + Math.sqrt(1 + 4 * kAPerV2 * sourceResistorOhm * driveV));
}

/**
 * dI/dT of the square law at an overdrive x [A/K]: K·x·(−m·x/Ta − 2·k)/(1 + 2·K·x·Rs), the
 * threshold and the transconductance terms together (see the module header). Cost O(1).
 * @param kAPerV2 K at the temperature [A/V²]
 * @param overdriveV x = V_GS − Vth [V]
 * @param sourceResistorOhm Rs [Ω] (0: none)
 * @param tempcoVPerK threshold coefficient k [V/K]
 * @param exponent mobility exponent m
 * @param temperatureC junction temperature [°C]
 */
export function squareLawTempcoAPerK(kAPerV2: number, overdriveV: number, sourceResistorOhm: number, tempcoVPerK: number, exponent: number, temperatureC: number): number {
  const ta = temperatureC + KELVIN_AT_0C;
  return (kAPerV2 * overdriveV * ((-exponent * overdriveV) / ta - 2 * tempcoVPerK)) / (1 + 2 * kAPerV2 * overdriveV * sourceResistorOhm);
}

/**
 * The zero-temperature-coefficient overdrive x_ZTC = −2·k·(T + 273.15)/m [V], or undefined when
 * there is none (k ≥ 0 or m ≤ 0: the current never rises with temperature, or m = 0: it always
 * does). Below it the drain current rises as the die heats. Cost O(1).
 * @param tempcoVPerK threshold coefficient k [V/K]
 * @param exponent mobility exponent m
 * @param temperatureC junction temperature [°C]
 */
export function zeroTempcoOverdriveV(tempcoVPerK: number, exponent: number, temperatureC: number): number | undefined {
  if (!(tempcoVPerK < 0) || !(exponent > 0)) return undefined;
  return (-2 * tempcoVPerK * (temperatureC + KELVIN_AT_0C)) / exponent;
}

/**
 * A square-law MOSFET's operating point against its zero-temperature-coefficient point, at one
 * junction temperature (chargeLinearMosfet gives it at the event's hottest): below the ZTC
 * overdrive the drain current rises as the die heats.
 */
export interface SquareLawPoint {
  /** the junction temperature it is taken at [°C] */
  readonly temperatureC: number;
  /** gate overdrive V_GS − Vth there [V] */
  readonly overdriveV: number;
  /** the overdrive where dI/dT changes sign [V]; absent when it never does (see zeroTempcoOverdriveV) */
  readonly zeroTempcoOverdriveV?: number;
  /** dI/dT there, both drifts [A/K]; 0 when a saturation current caps the current */
  readonly tempcoAPerK: number;
  /** whether the given saturation current caps the square law there */
  readonly capped: boolean;
}
