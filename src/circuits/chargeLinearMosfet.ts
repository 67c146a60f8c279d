import { describeFound, inputError } from "../errors/InputError.js";
import { type BusLoad, NO_BUS_LOAD, validateBusLoad } from "./BusLoad.js";
import type { ChargeModel, FeedTerms } from "./BusRegime.js";
import type { ChargeConditions, CircuitResult } from "./CircuitResult.js";
import { requirePositive } from "./requirePositive.js";
import { runChargeEvent } from "./runChargeEvent.js";
import { type CoupledChargeModel, runCoupledChargeEvent } from "./runCoupledChargeEvent.js";
import { DEFAULT_LOOP_GAIN_WARNING } from "./ElectroThermalSummary.js";
import { THRESHOLD_REFERENCE_TEMPERATURE_C, type SquareLawPoint, squareLawOverdriveV, squareLawTempcoAPerK, transconductanceAt, zeroTempcoOverdriveV } from "./mosfetSquareLaw.js";

export { THRESHOLD_REFERENCE_TEMPERATURE_C };

/** Parameters of a linear-mode MOSFET pre-charge (a current source). */
export interface LinearMosfetParams {
  /** link capacitance C [F] */
  readonly capacitanceF: number;
  /** gate drive voltage (gate to the bottom of the source resistor) [V] */
  readonly gateVoltageV: number;
  /** gate threshold voltage at {@link THRESHOLD_REFERENCE_TEMPERATURE_C} [V] */
  readonly thresholdVoltageV: number;
  /** source resistor Rs that sets the current I = (Vgate − Vth)/Rs [Ω] */
  readonly sourceResistorOhm?: number;
  /** a fixed saturation current instead of (or, with Rs, as a cap on) the source-resistor current [A] */
  readonly saturationCurrentA?: number;
  /** on-resistance once the MOSFET is fully on [Ω] */
  readonly rdsOnOhm: number;
  /** threshold temperature coefficient [V/K] (negative for silicon MOSFETs); default 0 */
  readonly thresholdTempcoVPerK?: number;
  /** square-law transconductance parameter K at {@link THRESHOLD_REFERENCE_TEMPERATURE_C} [A/V²]:
   *  I = K·(V_GS − Vth)²; absent: a large-transconductance part (V_GS = Vth) */
  readonly transconductanceAPerV2?: number;
  /** mobility exponent m of K(T) = K·((T + 273.15)/298.15)^(−m) (about 1.5 to 2); default 0 (K constant) */
  readonly transconductanceExponent?: number;
  /** loop gain above which an event's electro-thermal margin is a warning (default {@link DEFAULT_LOOP_GAIN_WARNING}) */
  readonly loopGainWarning?: number;
  /** what else hangs on the bus (default none) */
  readonly load?: BusLoad;
}

/**
 * Linear-mode MOSFET pre-charge: the MOSFET with a source resistor Rs is a current source,
 * I = (Vgate − Vth)/Rs (or a given saturation current, for a gate-driven switch; with both, the
 * smaller). With a transconductance parameter K the gate-source voltage is no longer taken as Vth:
 * the square law I = K·(Vgate − I·Rs − Vth)² sets the current (closed form in mosfetSquareLaw.ts;
 * without Rs, I = K·(Vgate − Vth)²), still capped by a given saturation current. The MOSFET dissipates (Vs − Vc − I·Rs)·I (role "mosfet"), Rs dissipates I²·Rs (role
 * "sourceResistor"). Once the MOSFET runs out of headroom, at Vc = Vs − I·(Rs + Rds(on)), it is
 * fully on and the circuit is a series resistance Rs + Rds(on); if a load pulls the bus back below
 * that voltage the current source takes over again.
 *
 * With no load the current-source stretch is an exact ramp Vc = V0 + I·t/C with MOSFET power
 * falling linearly; a resistive load gives exponentials, a constant-power load an ODE (odex).
 *
 * Threshold drift: Vth(T) = Vth + k·(T − 25 °C), floored at 0 V; mobility drift (with K):
 * K(T) = K·((T + 273.15)/298.15)^(−m). When the conditions carry the
 * parts' thermal context (`conditions.thermal`, as simulateProfile gives it) the junction
 * temperature is followed through the event: the charge and the parts' modal states are solved
 * together (runCoupledChargeEvent), so the current rises as the die heats (k < 0), and the result
 * carries the event's electro-thermal loop gain (ElectroThermalSummary). Without a context T is
 * the MOSFET's temperature at the event start (conditions.partTemperatureC.mosfet; 25 °C when
 * absent), held for the whole event. With k = 0 and no mobility drift the exact closed forms are
 * used either way. The loop gain takes the total dI/dT, both drifts; with both, the current's
 * coefficient changes sign at the overdrive x_ZTC = −2·k·(T + 273.15)/m, and the summary carries
 * the operating point against it at the event's hottest (`squareLaw`, a SquareLawPoint).
 * Caution for users: at high drain-source voltage a MOSFET in linear mode can fail by thermal
 * instability inside its thermal rating; check the maker's SOA for DC/linear operation.
 *
 * Source: Sedra & Smith, Microelectronic Circuits, 7th ed. (2015), §5.2 (MOSFET saturation
 * region; a current source with source degeneration, from memory); series RC response: Hayt,
 * Kemmerly & Durbin, Engineering Circuit Analysis, 8th ed. (2012), §8.8 (driven RC circuit);
 * charging by a constant current dV/dt = I/C: §7.1 (capacitor v–i relation) (section numbers
 * from memory).
 * Validity: without K the gate-source voltage is taken as Vth (square-law overdrive neglected: a
 * large-transconductance part); with K the square law of the saturation region holds down to the
 * knee (the triode region is the Rds(on) mode); ideal source.
 * Cost: see {@link runChargeEvent}; O(1) for no or resistive loads.
 * @throws InputError naming the field: `capacitanceF`, `rdsOnOhm`, `sourceResistorOhm`,
 *   `saturationCurrentA` (> 0; at least one of the two, or K), `gateVoltageV` (above the threshold at
 *   the part's temperature), `thresholdVoltageV` (≥ 0), `thresholdTempcoVPerK` (finite),
 *   `transconductanceAPerV2` (> 0), `transconductanceExponent` (finite, only with K),
 *   `partTemperatureC.mosfet` (finite), `loopGainWarning` (> 0), `load.*`, and the conditions' fields
 * @example
 * const conditions = { sourceVoltageV: 48, initialVoltageV: 0, completion: { fraction: 0.95, timeoutS: 1 } };
 * const params = { capacitanceF: 0.002, gateVoltageV: 5, thresholdVoltageV: 3, sourceResistorOhm: 1, rdsOnOhm: 0.01 };
 * chargeLinearMosfet(params, conditions).durationS // => 0.0456
 */
export function chargeLinearMosfet(params: LinearMosfetParams, conditions: ChargeConditions): CircuitResult {
  requirePositive(params.capacitanceF, "capacitanceF", "a capacitance > 0 F");
  requirePositive(params.rdsOnOhm, "rdsOnOhm", "an on-resistance > 0 Ω");
  requirePositive(params.thresholdVoltageV, "thresholdVoltageV", "a threshold voltage ≥ 0 V", true);
  if (params.sourceResistorOhm !== undefined) requirePositive(params.sourceResistorOhm, "sourceResistorOhm", "a source resistor > 0 Ω");
  if (params.saturationCurrentA !== undefined) requirePositive(params.saturationCurrentA, "saturationCurrentA", "a saturation current > 0 A");
  const kAt25 = params.transconductanceAPerV2;
  if (kAt25 !== undefined) requirePositive(kAt25, "transconductanceAPerV2", "a transconductance parameter > 0 A/V²");
  if (params.sourceResistorOhm === undefined && params.saturationCurrentA === undefined && kAt25 === undefined)
    throw inputError("out-of-range", "sourceResistorOhm", "a source resistor > 0 Ω, a saturationCurrentA or a transconductanceAPerV2", "none of them");
  const tempco = params.thresholdTempcoVPerK ?? 0;
  if (!Number.isFinite(tempco)) throw inputError("not-finite", "thresholdTempcoVPerK", "a temperature coefficient in V/K", describeFound(tempco));
  const exponent = params.transconductanceExponent ?? 0;
  if (!Number.isFinite(exponent)) throw inputError("not-finite", "transconductanceExponent", "a mobility exponent such as 1.5", describeFound(exponent));
  if (exponent !== 0 && kAt25 === undefined) throw inputError("out-of-range", "transconductanceExponent", "no exponent without a transconductanceAPerV2 (the K it applies to)", describeFound(exponent));
  const partC = conditions.partTemperatureC?.mosfet ?? THRESHOLD_REFERENCE_TEMPERATURE_C;
  if (!Number.isFinite(partC)) throw inputError("not-finite", "partTemperatureC.mosfet", "a temperature in °C", describeFound(partC));
  const vth = params.thresholdVoltageV + tempco * (partC - THRESHOLD_REFERENCE_TEMPERATURE_C);
  if (!Number.isFinite(params.gateVoltageV) || !(params.gateVoltageV > vth))
    throw inputError("out-of-range", "gateVoltageV", `a gate voltage above the threshold (${Number(vth.toPrecision(4))} V at ${Number(partC.toPrecision(4))} °C)`, describeFound(params.gateVoltageV));
  const load = params.load ?? NO_BUS_LOAD;
  validateBusLoad(load);

  const warning = params.loopGainWarning ?? DEFAULT_LOOP_GAIN_WARNING;
  if (!(warning > 0) || !Number.isFinite(warning)) throw inputError("out-of-range", "loopGainWarning", "a loop gain > 0 such as 0.5", describeFound(warning));
  const vs = conditions.sourceVoltageV;
  const thermal = conditions.thermal;
  const kAt = (temperatureC: number): number | undefined => (kAt25 === undefined ? undefined : transconductanceAt(kAt25, exponent, temperatureC));
  if ((tempco !== 0 || exponent !== 0) && thermal !== undefined && thermal.roles.includes("mosfet")) {
    const coupled: CoupledChargeModel = {
      capacitanceF: params.capacitanceF,
      traceRoles: MOSFET_TRACE_ROLES,
      readsRole: "mosfet",
      reportsLoopGain: true,
      warningLoopGain: warning,
      ...(tempco < 0 ? { lostControlC: THRESHOLD_REFERENCE_TEMPERATURE_C - params.thresholdVoltageV / tempco } : {}),
      at: (temperatureC) => {
        const t = temperatureC.mosfet ?? partC;
        return linearMosfetModel(params, vs, thresholdAt(params.thresholdVoltageV, tempco, t), kAt(t));
      },
    };
    const r = runCoupledChargeEvent(coupled, load, conditions, thermal);
    const summary = r.electroThermal;
    if (kAt25 === undefined || summary === undefined) return r;
    return { ...r, electroThermal: { ...summary, squareLaw: squareLawPoint(params, kAt25, exponent, tempco, summary.peakTemperatureC) } };
  }
  return runChargeEvent(linearMosfetModel(params, vs, vth, kAt(partC)), load, conditions);
}

/** The square-law operating point at a junction temperature against its ZTC point (see SquareLawPoint). */
function squareLawPoint(params: LinearMosfetParams, kAt25: number, exponent: number, tempco: number, temperatureC: number): SquareLawPoint {
  const k = transconductanceAt(kAt25, exponent, temperatureC);
  const rs = params.sourceResistorOhm ?? 0;
  const x = squareLawOverdriveV(k, params.gateVoltageV - thresholdAt(params.thresholdVoltageV, tempco, temperatureC), rs);
  const capped = k * x * x > (params.saturationCurrentA ?? Infinity);
  const ztc = zeroTempcoOverdriveV(tempco, exponent, temperatureC);
  return {
    temperatureC,
    overdriveV: x,
    ...(ztc === undefined ? {} : { zeroTempcoOverdriveV: ztc }),
    tempcoAPerK: capped ? 0 : squareLawTempcoAPerK(k, x, rs, tempco, exponent, temperatureC),
    capped,
  };
}

/** The roles a linear-mode MOSFET pre-charge reports a power trace for. */
const MOSFET_TRACE_ROLES = ["mosfet", "sourceResistor"] as const;

/**
 * Threshold at a junction temperature, Vth + k·(T − 25 °C), floored at 0 V: past that point the
 * gate has lost control of the current (the part has run away long before), and the floor keeps
 * the lumped model's current bounded by Vgate/Rs.
 */
function thresholdAt(vth25: number, tempcoVPerK: number, temperatureC: number): number {
  return Math.max(0, vth25 + tempcoVPerK * (temperatureC - THRESHOLD_REFERENCE_TEMPERATURE_C));
}

/**
 * The feed of a linear-mode MOSFET pre-charge at one threshold voltage and, for a square-law part,
 * one transconductance parameter K [A/V²] (see chargeLinearMosfet).
 */
function linearMosfetModel(params: LinearMosfetParams, vs: number, vth: number, kAPerV2: number | undefined): ChargeModel {
  const rs = params.sourceResistorOhm ?? 0;
  const rds = params.rdsOnOhm;
  const byGate = kAPerV2 === undefined ? (rs > 0 ? (params.gateVoltageV - vth) / rs : Infinity) : kAPerV2 * squareLawOverdriveV(kAPerV2, params.gateVoltageV - vth, rs) ** 2;
  const current = Math.max(0, Math.min(byGate, params.saturationCurrentA ?? Infinity));
  const kneeV = vs - current * (rs + rds);
  const rt = rs + rds;

  const linear = (): FeedTerms => ({
    g0: current,
    g1: 0,
    h: 0,
    sourcePower: { c0: vs * current, c1: 0, c2: 0 },
    partPower: { mosfet: { c0: (vs - current * rs) * current, c1: -current, c2: 0 }, sourceResistor: { c0: current * current * rs, c1: 0, c2: 0 } },
    levels: [{ voltageV: kneeV, rising: true, key: "mosfet-on" }],
    description: "current-source (linear) mode",
  });
  const loss = (rk: number) => ({ c0: (vs * vs * rk) / (rt * rt), c1: (-2 * vs * rk) / (rt * rt), c2: rk / (rt * rt) });
  const fullyOn = (): FeedTerms => ({
    g0: vs / rt,
    g1: 1 / rt,
    h: 0,
    sourcePower: { c0: (vs * vs) / rt, c1: -vs / rt, c2: 0 },
    partPower: { mosfet: loss(rds), sourceResistor: loss(rs) },
    levels: kneeV > 0 ? [{ voltageV: kneeV, rising: false, key: "mosfet-linear" }] : [],
    description: "fully-on mode",
  });
  // each mode's terms built on first use (the coupled runner asks for one mode per temperature)
  let linearTerms: FeedTerms | undefined;
  let onTerms: FeedTerms | undefined;
  return {
    capacitanceF: params.capacitanceF,
    traceRoles: MOSFET_TRACE_ROLES,
    feed: (mode) => (mode === "on" ? (onTerms ??= fullyOn()) : (linearTerms ??= linear())),
    initialMode: (v) => (v >= kneeV ? "on" : "linear"),
    nextMode: (_mode, key) => (key === "mosfet-on" ? "on" : "linear"),
  };
}
