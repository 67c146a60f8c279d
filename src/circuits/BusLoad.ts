import { describeFound, inputError } from "../errors/InputError.js";

/**
 * What hangs on the DC bus in parallel with the link capacitor while it is being charged.
 *
 * - `none`: nothing; the capacitor alone.
 * - `short`: a short circuit across the bus (a fault): the capacitor is emptied at once and the
 *   bus stays at 0 V, so the charging element carries its full short-circuit current.
 * - `resistive`: a resistance R [Ω]; draws V/R.
 * - `constant-current`: draws I [A] while on. It switches on when the bus rises to `enableV` and
 *   off when the bus falls below `disableV` (both default 0 V: always on). If the source cannot
 *   supply the current even at 0 V, the bus is held at 0 V and the load takes what the source
 *   delivers (a collapsed bus behaves as a short).
 * - `constant-power`: draws P [W] while on (an auxiliary converter with under-voltage lockout): on
 *   at `enableV`, off below `disableV`, with 0 < disableV < enableV (the hysteresis).
 *
 * A load that has thresholds starts the event off unless the bus is already at or above its
 * enable voltage (its controller has not started yet).
 */
export type BusLoad =
  | { kind: "none" }
  | { kind: "short" }
  | { kind: "resistive"; resistanceOhm: number }
  | { kind: "constant-current"; currentA: number; enableV?: number; disableV?: number }
  | { kind: "constant-power"; powerW: number; enableV: number; disableV: number };

/** The default bus load: none. */
export const NO_BUS_LOAD: BusLoad = { kind: "none" };

/** What a bus load adds to the capacitor's current equation while it is on: i = G·V + I + P/V. */
export interface BusLoadTerms {
  /** conductance G [S] */
  readonly conductanceS: number;
  /** constant current I [A] */
  readonly currentA: number;
  /** constant power P [W] */
  readonly powerW: number;
}

const OFF: BusLoadTerms = { conductanceS: 0, currentA: 0, powerW: 0 };

/** The load's enable and disable voltages [V]; 0 means "no threshold". */
export function busLoadThresholds(load: BusLoad): { enableV: number; disableV: number } {
  if (load.kind === "constant-current") return { enableV: load.enableV ?? 0, disableV: load.disableV ?? 0 };
  if (load.kind === "constant-power") return { enableV: load.enableV, disableV: load.disableV };
  return { enableV: 0, disableV: 0 };
}

/** Whether the load is on at the start of an event with the bus at `voltageV`. */
export function busLoadStartsOn(load: BusLoad, voltageV: number): boolean {
  if (load.kind === "none" || load.kind === "short") return false;
  return voltageV >= busLoadThresholds(load).enableV;
}

/**
 * The current terms of a load (G, I, P) in its on or off state. A short is not expressible this
 * way (it pins the bus); the caller treats it separately.
 */
export function busLoadTerms(load: BusLoad, on: boolean): BusLoadTerms {
  if (!on) return OFF;
  switch (load.kind) {
    case "resistive":
      return { conductanceS: 1 / load.resistanceOhm, currentA: 0, powerW: 0 };
    case "constant-current":
      return { conductanceS: 0, currentA: load.currentA, powerW: 0 };
    case "constant-power":
      return { conductanceS: 0, currentA: 0, powerW: load.powerW };
    default:
      return OFF;
  }
}

/**
 * Check a bus load: a resistance > 0, a current or power > 0, thresholds ≥ 0 with
 * disable < enable (constant-power loads need 0 < disable < enable; a constant-current load may
 * leave both at 0 V).
 * Cost O(1).
 * @throws InputError `out-of-range` / `not-finite` naming the field, e.g. `load.resistanceOhm`
 */
export function validateBusLoad(load: BusLoad, field = "load"): void {
  const positive = (value: number, name: string, expected: string): void => {
    if (!Number.isFinite(value)) throw inputError("not-finite", `${field}.${name}`, expected, describeFound(value));
    if (!(value > 0)) throw inputError("out-of-range", `${field}.${name}`, expected, describeFound(value));
  };
  switch (load.kind) {
    case "none":
    case "short":
      return;
    case "resistive":
      positive(load.resistanceOhm, "resistanceOhm", "a load resistance > 0 Ω");
      return;
    case "constant-current":
    case "constant-power": {
      if (load.kind === "constant-current") positive(load.currentA, "currentA", "a load current > 0 A");
      else positive(load.powerW, "powerW", "a load power > 0 W");
      const { enableV, disableV } = busLoadThresholds(load);
      const minDisable = load.kind === "constant-power" ? "> 0 V" : "≥ 0 V";
      if (!Number.isFinite(disableV) || disableV < 0 || (load.kind === "constant-power" && disableV === 0))
        throw inputError("out-of-range", `${field}.disableV`, `a disable (under-voltage lockout) voltage ${minDisable}`, describeFound(disableV));
      if (!Number.isFinite(enableV) || enableV < 0)
        throw inputError("out-of-range", `${field}.enableV`, "an enable voltage ≥ 0 V", describeFound(enableV));
      if (!(disableV < enableV) && !(disableV === 0 && enableV === 0))
        throw inputError("out-of-range", `${field}.enableV`, `an enable voltage above the disable voltage (${disableV} V)`, describeFound(enableV));
      return;
    }
    default:
      throw inputError("out-of-range", `${field}.kind`, 'one of "none", "short", "resistive", "constant-current", "constant-power"', describeFound((load as { kind: unknown }).kind));
  }
}
