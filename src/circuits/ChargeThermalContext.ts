/**
 * The thermal side of one charging event, handed to a circuit model whose values follow its
 * parts' temperatures (a MOSFET threshold that drifts, a resistor with a temperature
 * coefficient): the modal form of the parts the charge heats, restricted to the modes they can
 * see, and the free decay of the heat they already hold at the event start.
 *
 * During the event the temperature of part i is
 *   T_i(t) = ambient_i + Σ_m startRiseK[i][m]·e^(−t/tau_m) + Σ_j Σ_m gainKPerW[i][j][m]·y[j][m](t),
 * where y[j][m] is the modal state of part j's power during the event (dy/dt = (P_j − y)/tau_m,
 * y(0) = 0). The first sum is the exact cooling of the start state (the modes are independent),
 * the second the event's own heat: together they equal the thermal engine's superposition.
 * Source: modal superposition of docs/engine.md ("The modal form").
 */
export interface ChargeThermalContext {
  /** the circuit role of each coupled part (the power of that role heats it) */
  readonly roles: readonly string[];
  /** ambient of each coupled part [°C] */
  readonly ambientC: readonly number[];
  /** time constants of the modes the coupled parts see [s] */
  readonly tauS: readonly number[];
  /** gains [K/W] indexed [observed part i][heated part j][mode m] */
  readonly gainKPerW: readonly (readonly (readonly number[])[])[];
  /** rise of part i at the event start, per mode [K]: it decays as e^(−t/tau_m) */
  readonly startRiseK: readonly (readonly number[])[];
}

/**
 * Transfer impedance Zth from part j's power to part i's temperature after t seconds of a step
 * [K/W]: Σ_m gain[i][j][m]·(1 − e^(−t/tau_m)). Source: docs/engine.md ("The modal form").
 * Cost O(modes).
 */
export function contextZth(context: ChargeThermalContext, i: number, j: number, timeS: number): number {
  const gains = context.gainKPerW[i]![j]!;
  let sum = 0;
  for (let m = 0; m < gains.length; m++) sum -= gains[m]! * Math.expm1(-timeS / context.tauS[m]!);
  return sum;
}
