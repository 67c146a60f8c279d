import { describeFound, inputError } from "../errors/InputError.js";
import { type BusLoad, NO_BUS_LOAD, busLoadTerms, validateBusLoad } from "./BusLoad.js";
import type { BusLevel, ChargeModel, FeedTerms } from "./BusRegime.js";
import type { ChargeConditions, CircuitResult } from "./CircuitResult.js";
import { requirePositive } from "./requirePositive.js";
import { runChargeEvent } from "./runChargeEvent.js";

/** Parameters of a charging converter. */
export interface ConverterParams {
  /** link capacitance C [F] */
  readonly capacitanceF: number;
  /** what the converter regulates while charging */
  readonly mode: "constant-current" | "constant-power";
  /** output current in constant-current mode [A] */
  readonly currentA?: number;
  /** output power in constant-power mode [W] */
  readonly powerW?: number;
  /** efficiency η, 0 < η ≤ 1: input power = output power / η */
  readonly efficiency: number;
  /** output current limit [A]: caps the constant current; in constant-power mode the converter
   *  gives this current below P/Ilim (required when a constant-power charge starts from 0 V) */
  readonly currentLimitA?: number;
  /** what else hangs on the bus (default none) */
  readonly load?: BusLoad;
}

/**
 * A small charging converter between the source and the link: constant current I (capped by the
 * current limit) or constant power P (current-limited to Ilim below P/Ilim) into the bus, with
 * efficiency η. Its losses, (1/η − 1) × output power, heat its switch (role "switch"). The
 * converter charges the bus up to the source voltage and then holds it there, supplying the load
 * (a dwell-only rule can run past that point).
 *
 * Output power: V·I in constant current (C·dV/dt = I: an exact ramp, loss a ramp too), P in
 * constant power (C·V·dV/dt = P: V² = V0² + 2·P·t/C with no load, solved by odex in general; the
 * loss is the constant P·(1/η − 1)).
 * Source: energy balance of a converter with efficiency η (input = output/η): Erickson &
 * Maksimović, Fundamentals of Power Electronics, 2nd ed. (2001), §1.1 (section from memory);
 * capacitor charged by a current, C·dV/dt = I, and its energy C·V²/2: Hayt, Kemmerly & Durbin,
 * Engineering Circuit Analysis, 8th ed. (2012), §7.1 (section from memory).
 * Validity: an averaged model (no switching ripple); constant efficiency.
 * Cost: see {@link runChargeEvent}.
 * @throws InputError naming the field: `capacitanceF`, `mode`, `currentA` / `powerW` (> 0 for the
 *   mode), `efficiency` (0 < η ≤ 1), `currentLimitA` (> 0; required for constant power from 0 V),
 *   `load.*`, and the conditions' fields
 * @example
 * const conditions = { sourceVoltageV: 48, initialVoltageV: 0, completion: { fraction: 0.95, timeoutS: 1 } };
 * chargeConverter({ capacitanceF: 0.002, mode: "constant-current", currentA: 2, efficiency: 0.9 }, conditions).durationS // => 0.0456
 */
export function chargeConverter(params: ConverterParams, conditions: ChargeConditions): CircuitResult {
  requirePositive(params.capacitanceF, "capacitanceF", "a capacitance > 0 F");
  const eta = params.efficiency;
  if (!Number.isFinite(eta) || !(eta > 0 && eta <= 1)) throw inputError("out-of-range", "efficiency", "an efficiency above 0 and at most 1", describeFound(eta));
  if (params.currentLimitA !== undefined) requirePositive(params.currentLimitA, "currentLimitA", "a current limit > 0 A");
  const load = params.load ?? NO_BUS_LOAD;
  validateBusLoad(load);
  const vs = conditions.sourceVoltageV;
  const lossFactor = 1 / eta - 1;
  const limit = params.currentLimitA ?? Infinity;
  const hold: BusLevel = { voltageV: vs, rising: true, key: "converter-hold" };

  // Holding the bus at Vs: the converter mirrors the load, so the capacitor current is zero.
  const holdFeed = (loadOn: boolean): FeedTerms => {
    const t = busLoadTerms(load, loadOn);
    const out = { c0: t.powerW, c1: t.currentA, c2: t.conductanceS };
    return {
      g0: t.currentA,
      g1: -t.conductanceS,
      h: t.powerW,
      sourcePower: { c0: out.c0 / eta, c1: out.c1 / eta, c2: out.c2 / eta },
      partPower: { switch: { c0: out.c0 * lossFactor, c1: out.c1 * lossFactor, c2: out.c2 * lossFactor } },
      levels: [],
      description: "holding the bus at the source voltage",
    };
  };
  const currentFeed = (i: number, extra: readonly BusLevel[]): FeedTerms => ({
    g0: i,
    g1: 0,
    h: 0,
    sourcePower: { c0: 0, c1: i / eta, c2: 0 },
    partPower: { switch: { c0: 0, c1: i * lossFactor, c2: 0 } },
    levels: [hold, ...extra],
    description: "constant-current mode",
  });

  let model: ChargeModel;
  if (params.mode === "constant-current") {
    requirePositive(params.currentA, "currentA", "an output current > 0 A");
    const cc = currentFeed(Math.min(params.currentA, limit), []);
    model = {
      capacitanceF: params.capacitanceF,
      traceRoles: ["switch"],
      feed: (mode, loadOn) => (mode === "hold" ? holdFeed(loadOn) : cc),
      initialMode: (v) => (v >= vs ? "hold" : "current"),
      nextMode: () => "hold",
    };
  } else if (params.mode === "constant-power") {
    requirePositive(params.powerW, "powerW", "an output power > 0 W");
    const p = params.powerW;
    const kneeV = p / limit; // 0 without a limit
    if (kneeV === 0 && conditions.initialVoltageV === 0)
      throw inputError("out-of-range", "currentLimitA", "a current limit > 0 A (a constant-power charge from 0 V needs one)", "nothing");
    const limited = currentFeed(limit, kneeV < vs ? [{ voltageV: kneeV, rising: true, key: "converter-power" }] : []);
    const power: FeedTerms = {
      g0: 0,
      g1: 0,
      h: p,
      sourcePower: { c0: p / eta, c1: 0, c2: 0 },
      partPower: { switch: { c0: p * lossFactor, c1: 0, c2: 0 } },
      levels: [hold, ...(kneeV > 0 ? [{ voltageV: kneeV, rising: false, key: "converter-limit" }] : [])],
      description: "constant-power mode",
    };
    model = {
      capacitanceF: params.capacitanceF,
      traceRoles: ["switch"],
      feed: (mode, loadOn) => (mode === "hold" ? holdFeed(loadOn) : mode === "limit" ? limited : power),
      initialMode: (v) => (v >= vs ? "hold" : v < kneeV ? "limit" : "power"),
      nextMode: (_mode, key) => (key === "converter-hold" ? "hold" : key === "converter-power" ? "power" : "limit"),
    };
  } else {
    throw inputError("out-of-range", "mode", 'one of "constant-current", "constant-power"', describeFound(params.mode));
  }
  return runChargeEvent(model, load, conditions);
}
