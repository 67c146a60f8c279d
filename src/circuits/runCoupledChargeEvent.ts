import { inputError, describeFound } from "../errors/InputError.js";
import type { PowerSegment } from "../thermal/powerTrace.js";
import { type BusLoad, busLoadStartsOn } from "./BusLoad.js";
import { type BusLevel, type BusRegime, type ChargeModel, evalQuadratic } from "./BusRegime.js";
import type { ChargeConditions, CircuitOutcome, CircuitResult, CircuitSample } from "./CircuitResult.js";
import { type ChargeThermalContext, contextZth } from "./ChargeThermalContext.js";
import type { ElectroThermalSummary, ThermalRunaway } from "./ElectroThermalSummary.js";
import { reasonNumber, resolveCompletion } from "./resolveCompletion.js";
import { EVENT_LIMITS, buildRegime, nextRegime, project } from "./runChargeEvent.js";

/**
 * A charging element whose values follow its parts' temperatures: at every set of temperatures
 * it is an ordinary {@link ChargeModel} (the same modes, the same part keys), so the coupled
 * runner reuses the feed terms of the frozen model at each instant.
 */
export interface CoupledChargeModel {
  readonly capacitanceF: number;
  readonly traceRoles: readonly string[];
  /** the role whose temperature sets the element's values */
  readonly readsRole: string;
  /** report that part's loop gain (a current source whose current follows its temperature); false
   *  for an element whose drive falls as the bus charges (an NTC), where the loop gain at a fixed
   *  bus voltage says nothing about stability */
  readonly reportsLoopGain: boolean;
  /** loop gain above which the event's margin is a warning */
  readonly warningLoopGain: number;
  /** temperature of that part past which the element has lost control of its current (a MOSFET
   *  threshold at 0 V) [°C]: reaching it is a runaway too; undefined: none */
  readonly lostControlC?: number;
  /** the element with its values at these part temperatures [°C, by role] */
  at(temperatureC: Readonly<Record<string, number>>): ChargeModel;
}

/**
 * Accuracy of the coupled path, declared once: across every step the power of each part and the
 * capacitor current are linear in time (the power trace the thermal engine receives); the step
 * is accepted when the coupled solution at its midpoint lies within `powerTolerance` of the
 * part's largest power so far (floored at 1e-6 of the largest part's) and within
 * `currentTolerance` of the largest current so far.
 * Why 1e-4, and why not wider: the chord of a smooth power over a step misses its area by 2/3 of
 * its midpoint gap (the gap of a parabola is h²·P''/8, its area error h³·P''/12), so a part's
 * energy, the bus charge (hence the completion time) and a slow mode's temperature err by a
 * fraction of the same order as the tolerance: 8.7e-5, 5e-5 and 4e-5 in energy, duration and
 * peak rise against odex on the two-mode bench charge (test/circuits/electroThermal.test.ts holds
 * them within 1e-4). The tolerance is thus the accuracy promised, not a margin; the scheme is
 * second order, so widening it tenfold would save only a factor √10 ≈ 3 in steps. The end point's
 * fixed-point iteration stops at a change of 1e-7 (relative), three decades below, so it adds
 * nothing visible to that error.
 */
export const COUPLED_ACCURACY = { powerTolerance: 1e-4, currentTolerance: 1e-4 } as const;

/** Temperature step of the numerical (forward) derivative ∂P/∂T in the loop gain [K]. */
const DERIVATIVE_STEP_K = 0.01;

/** What the solution is at one instant, in one regime. */
interface Point {
  readonly regime: BusRegime;
  /** capacitor current and the element's own current [A] */
  readonly capA: number;
  readonly feedA: number;
  /** power of every part key (keys order), of the source and of the load [W] */
  readonly partW: Float64Array;
  readonly sourceW: number;
  readonly loadW: number;
  /** power heating each coupled part (context order) [W] */
  readonly heatW: Float64Array;
  /** each coupled part's temperature [°C] */
  readonly tempC: Float64Array;
}

/**
 * y at the end of a step of length h for one mode, dy/ds = (a + b·s − y)/tau:
 * y(h) = y0·e^(−x) + a·(1 − e^(−x)) + b·tau·(x − (1 − e^(−x))), x = h/tau (the bracket by its
 * series below x = 1e-3, where the difference cancels).
 * Source: variation of constants, Boyce & DiPrima, Elementary Differential Equations, 10th ed.
 * (2012), §2.1.
 */
function modeAdvance(y0: number, a: number, b: number, h: number, tau: number): number {
  const x = h / tau;
  const oneMinus = -Math.expm1(-x);
  const bracket = x < 1e-3 ? x * x * (0.5 - x * (1 / 6 - x / 24)) : x - oneMinus;
  return y0 * (1 - oneMinus) + a * oneMinus + b * tau * bracket;
}

/**
 * Run one charging event of an element whose values follow its parts' temperatures, solving the
 * bus and the parts' modal thermal states together. Each step holds every power and the capacitor
 * current linear in time: the modes advance in closed form under that linear power (the exact
 * update the thermal engine makes, so the power trace handed on reproduces the coupled
 * temperatures to rounding), the bus by the trapezoidal rule, and the end point is found by fixed-
 * point iteration; the step is accepted when the solution at the midpoint lies on the chords
 * within {@link COUPLED_ACCURACY}, and its length adapts as h·(tolerance/error)^(1/3). Levels
 * whose voltage moves with temperature (a MOSFET's knee) are located by bisection of the step.
 *
 * Why not odex, as for the constant-power loads: the modal states of a die have time constants
 * of milliseconds against charges of seconds, which makes the joint system stiff for an explicit
 * method; the exponential (closed-form) update of the modes is stable at any step.
 *
 * The loop gain G(t) = Σ_j ∂P_j/∂T·Zth_j(t) of the part with role `readsRole` (∂P/∂T by a
 * forward difference of 0.01 K at fixed bus voltage, Zth from the event start) is evaluated at every step
 * end; its maximum and the first time it reaches 1 (linear interpolation in the step) are the
 * {@link ElectroThermalSummary}.
 * Source: exponential integrators, Hochbruck & Ostermann, Acta Numerica 19 (2010), §2; the
 * trapezoidal rule, Hairer, Nørsett & Wanner, Solving Ordinary Differential Equations I, 2nd ed.
 * (1993), §II.7 (section numbers from memory); loop gain: see ElectroThermalSummary.
 * Validity: temperature-dependent feeds have no constant-power term; a bus held at 0 V stays held.
 * Cost: O(steps × (parts × modes + model evaluation)), a few hundred steps per event.
 * Protection inside the attempt (`completion.protection`) is not followed on this path yet: an
 * attempt that asks for it is refused rather than run as if unprotected.
 * @throws InputError for bad conditions, protection asked of a coupled event, or an event past EVENT_LIMITS
 */
export function runCoupledChargeEvent(model: CoupledChargeModel, load: BusLoad, conditions: ChargeConditions, thermal: ChargeThermalContext): CircuitResult {
  if (conditions.completion.protection !== undefined)
    throw inputError(
      "bad-profile",
      "circuit.protection",
      "no protection checks on a circuit whose parts follow their temperature (threshold drift or a resistance curve): they are not supported together yet",
      "protection keys",
    );
  const rule = resolveCompletion(conditions);
  const c = model.capacitanceF;
  const v0 = conditions.initialVoltageV;
  const wantSamples = conditions.wantSamples === true;
  const n = thermal.roles.length;
  const M = thermal.tauS.length;
  const tau = thermal.tauS;
  const readIndex = model.reportsLoopGain ? thermal.roles.indexOf(model.readsRole) : -1;
  const fixedC = conditions.partTemperatureC ?? {};

  // temperatures by role: a role with no coupled part keeps its start temperature
  const byRole: Record<string, number> = { ...fixedC };
  const decay = new Float64Array(M);
  const temperatures = (timeS: number, y: Float64Array, out: Float64Array): void => {
    for (let m = 0; m < M; m++) decay[m] = Math.exp(-timeS / tau[m]!);
    for (let i = 0; i < n; i++) {
      let rise = 0;
      const start = thermal.startRiseK[i]!;
      for (let m = 0; m < M; m++) rise += start[m]! * decay[m]!;
      const gi = thermal.gainKPerW[i]!;
      for (let j = 0; j < n; j++) {
        const g = gi[j]!;
        for (let m = 0; m < M; m++) rise += g[m]! * y[j * M + m]!;
      }
      out[i] = thermal.ambientC[i]! + rise;
    }
  };

  let keys: readonly string[] = [];
  let mode = "";
  let loadOn = false;
  let clamped = false;
  const regimeAt = (tempC: Float64Array): BusRegime => {
    for (let i = n - 1; i >= 0; i--) byRole[thermal.roles[i]!] = tempC[i]!;
    return buildRegime(model.at(byRole), load, mode, loadOn, clamped);
  };
  const pointAt = (v: number, tempC: Float64Array, regime: BusRegime = regimeAt(tempC)): Point => {
    const partW = new Float64Array(keys.length);
    for (let i = 0; i < keys.length; i++) partW[i] = evalQuadratic(regime.partPower[keys[i]!]!, v);
    const heatW = new Float64Array(n);
    for (let j = 0; j < n; j++) {
      const q = regime.partPower[thermal.roles[j]!];
      heatW[j] = q === undefined ? 0 : evalQuadratic(q, v);
    }
    const f = regime.feed;
    const feedA = f.g0 - f.g1 * v + (f.h === 0 ? 0 : f.h / v);
    const capA = regime.clamped ? 0 : regime.g0 - regime.g1 * v + (regime.h === 0 ? 0 : regime.h / v);
    return { regime, capA, feedA, partW, sourceW: evalQuadratic(regime.sourcePower, v), loadW: evalQuadratic(regime.loadPower, v), heatW, tempC };
  };
  const evaluate = (timeS: number, v: number, y: Float64Array): Point => {
    const tempC = new Float64Array(n);
    temperatures(timeS, y, tempC);
    return pointAt(v, tempC);
  };

  // the start, as runChargeEvent: a short empties the capacitor at t = 0 and holds the bus
  let v = v0;
  let loadJ = 0;
  const startModel = model.at({ ...fixedC, ...Object.fromEntries(thermal.roles.map((r, i) => [r, startTemperature(thermal, i)])) });
  if (load.kind === "short") {
    loadJ += 0.5 * c * v0 * v0;
    v = 0;
    mode = startModel.initialMode(0);
    loadOn = true;
    clamped = true;
  } else {
    mode = startModel.initialMode(v0);
    loadOn = busLoadStartsOn(load, v0);
    const r = buildRegime(startModel, load, mode, loadOn, false);
    clamped = v === 0 && r.h === 0 && r.g0 < 0;
  }
  const threshold = rule.thresholdV;
  const completeLevel: BusLevel[] = threshold === undefined ? [] : [{ voltageV: threshold, rising: true, key: "complete" }];
  const levelsOf = (r: BusRegime): readonly BusLevel[] => (r.clamped ? [] : [...r.levels, ...completeLevel]);
  const limitS = Math.min(rule.dwellS, rule.timeoutS);

  let y: Float64Array = new Float64Array(n * M);
  let p0 = evaluate(0, v, y);
  keys = Object.keys(p0.regime.partPower);
  p0 = pointAt(v, p0.tempC, p0.regime);

  const traces: Record<string, PowerSegment[]> = {};
  for (const role of model.traceRoles) traces[role] = [];
  const partsJ: Record<string, number> = {};
  for (const k of [...model.traceRoles, ...keys]) partsJ[k] = 0;
  let sourceJ = 0;
  const samples: CircuitSample[] = [];
  const partScale = new Float64Array(keys.length);
  let currentScale = 0;
  const widen = (p: Point): void => {
    for (let k = 0; k < keys.length; k++) partScale[k] = Math.max(partScale[k]!, Math.abs(p.partW[k]!));
    currentScale = Math.max(currentScale, Math.abs(p.capA), Math.abs(p.feedA));
  };
  widen(p0);

  // the loop gain of the part whose temperature the element reads
  let maxGain = -Infinity;
  let maxGainAt = 0;
  let peakC = readIndex < 0 ? NaN : p0.tempC[readIndex]!;
  let runaway: ThermalRunaway | undefined;
  let lastGain = 0;
  let lastTempC = peakC;
  // the temperatures of the forward difference: a scratch array (the point built on it is dropped)
  const hi = new Float64Array(n);
  const loopGain = (timeS: number, v: number, p: Point): number => {
    if (readIndex < 0) return 0;
    hi.set(p.tempC);
    hi[readIndex] = hi[readIndex]! + DERIVATIVE_STEP_K;
    const ph = pointAt(v, hi);
    let g = 0;
    for (let j = 0; j < n; j++) g += ((ph.heatW[j]! - p.heatW[j]!) / DERIVATIVE_STEP_K) * contextZth(thermal, readIndex, j, timeS);
    return g;
  };
  const noteGain = (t0: number, t1: number, g1: number, p1: Point): void => {
    if (readIndex < 0) return;
    if (g1 > maxGain) {
      maxGain = g1;
      maxGainAt = t1;
    }
    peakC = Math.max(peakC, p1.tempC[readIndex]!);
    const tc1 = p1.tempC[readIndex]!;
    if (runaway === undefined && g1 >= 1) {
      const f = lastGain >= 1 ? 0 : (1 - lastGain) / (g1 - lastGain);
      runaway = { timeS: t0 + f * (t1 - t0), temperatureC: lastTempC + f * (tc1 - lastTempC) };
    }
    const lost = model.lostControlC;
    if (runaway === undefined && lost !== undefined && tc1 >= lost) {
      const f = lastTempC >= lost ? 0 : (lost - lastTempC) / (tc1 - lastTempC);
      runaway = { timeS: t0 + f * (t1 - t0), temperatureC: lost };
    }
    lastGain = g1;
    lastTempC = p1.tempC[readIndex]!;
  };
  noteGain(0, 0, loopGain(0, v, p0), p0);
  let peakCurrentA = p0.feedA;

  // one trial step of length h from (t, v, y, p0): end point, end state and the midpoint error
  const yEnd = new Float64Array(n * M);
  // the capacitor current and heat of the last accepted step as a parabola through its start,
  // midpoint and end (slope and curvature at its end), extrapolated as the first guess of the
  // next end point: the fixed-point iteration then starts within O(h³) and needs fewer rounds
  let slopeA = 0;
  let curveA = 0;
  const slopeW = new Float64Array(n);
  const curveW = new Float64Array(n);
  const guess = new Float64Array(n);
  const yMid = new Float64Array(n * M);
  const trial = (t: number, h: number): { p1: Point; pm: Point; v1: number; y1: Float64Array; error: number } | undefined => {
    let v1 = v;
    let p1 = p0;
    let i1 = p0.capA + (slopeA + 0.5 * curveA * h) * h;
    let heat1: Float64Array = guess;
    for (let j = 0; j < n; j++) guess[j] = p0.heatW[j]! + (slopeW[j]! + 0.5 * curveW[j]! * h) * h;
    for (let it = 0; it < 60; it++) {
      for (let j = 0; j < n; j++) {
        const a = p0.heatW[j]!;
        const b = (heat1[j]! - a) / h;
        for (let m = 0; m < M; m++) yEnd[j * M + m] = modeAdvance(y[j * M + m]!, a, b, h, tau[m]!);
      }
      v1 = clamped ? 0 : v + (h * (p0.capA + i1)) / (2 * c);
      const next = evaluate(t + h, v1, yEnd);
      let change = Math.abs(next.capA - i1) / Math.max(currentScale, 1e-300);
      for (let j = 0; j < n; j++) change = Math.max(change, Math.abs(next.heatW[j]! - heat1[j]!) / Math.max(Math.abs(next.heatW[j]!), 1e-300));
      p1 = next;
      i1 = next.capA;
      heat1 = next.heatW;
      if (!Number.isFinite(change)) return undefined;
      if (change <= 1e-7) {
        for (let j = 0; j < n; j++) {
          const a = p0.heatW[j]!;
          const b = (heat1[j]! - a) / h;
          for (let m = 0; m < M; m++) yMid[j * M + m] = modeAdvance(y[j * M + m]!, a, b, h / 2, tau[m]!);
        }
        const vm = clamped ? 0 : v + (h * (3 * p0.capA + i1)) / (8 * c);
        const pm = evaluate(t + h / 2, vm, yMid);
        if (pm.regime.key !== p0.regime.key) return undefined;
        let largest = 0;
        for (let k = 0; k < keys.length; k++) largest = Math.max(largest, partScale[k]!, Math.abs(p1.partW[k]!));
        let error = Math.abs(pm.capA - 0.5 * (p0.capA + p1.capA)) / (COUPLED_ACCURACY.currentTolerance * Math.max(currentScale, Math.abs(p1.capA), 1e-300));
        for (let k = 0; k < keys.length; k++) {
          const tol = COUPLED_ACCURACY.powerTolerance * Math.max(partScale[k]!, Math.abs(p1.partW[k]!), 1e-6 * largest, 1e-300);
          error = Math.max(error, Math.abs(pm.partW[k]! - 0.5 * (p0.partW[k]! + p1.partW[k]!)) / tol);
        }
        return { p1, pm, v1, y1: Float64Array.from(yEnd), error };
      }
    }
    return undefined;
  };

  let t = 0;
  let h = Math.min(limitS, Math.max(limitS / 256, 0));
  let outcome: CircuitOutcome | undefined;
  let reason = "";
  let busStalled = false;
  let changes = 0;
  let steps = 0;
  if (threshold !== undefined && v >= threshold) {
    outcome = "completed";
    reason = `bus already at ${reasonNumber(v)} V, at or above ${rule.thresholdWords}`;
  }
  while (outcome === undefined) {
    const remaining = limitS - t;
    if (!(remaining > 0)) break;
    h = Math.min(h, remaining);
    if (!(h > 1e-14 * Math.max(limitS, 1e-300))) throw new Error(`coupled charge step fell to ${h} s at ${t} s (regime ${p0.regime.key})`);
    let step = trial(t, h);
    if (step === undefined || step.error > 1) {
      h *= step === undefined ? 0.25 : Math.max(0.2, 0.9 * Math.cbrt(1 / step.error));
      continue;
    }
    // the earliest level crossed in the step, located by bisection of the step length
    const levels0 = levelsOf(p0.regime);
    const levels1 = levelsOf(step.p1.regime);
    const side = (level: BusLevel, vv: number): number => (level.rising ? vv - level.voltageV : level.voltageV - vv);
    let crossing: { index: number } | undefined;
    for (let k = 0; k < levels0.length; k++) {
      if (side(levels0[k]!, v) < 0 && side(levels1[k]!, step.v1) >= 0) {
        crossing = { index: k };
        break;
      }
    }
    let hit: BusLevel | undefined;
    if (crossing !== undefined) {
      // shrink the step to the first crossing of any level: regula falsi (Illinois) on the
      // distance of the bus from the crossed level, bracketed by [0, h]
      const level0 = levels0[crossing.index]!;
      let lo = 0;
      let hiH = h;
      let fLo = side(level0, v);
      let fHi = side(levels1[crossing.index]!, step.v1);
      let kept = 0;
      for (let it = 0; it < 60 && hiH - lo > 1e-12 * hiH; it++) {
        let mid = (lo * fHi - hiH * fLo) / (fHi - fLo);
        if (!(mid > lo && mid < hiH)) mid = 0.5 * (lo + hiH);
        const s = trial(t, mid);
        if (s === undefined) break;
        const lv = levelsOf(s.p1.regime);
        const f = side(lv[crossing.index]!, s.v1);
        if (lv.some((l, k) => k !== crossing!.index && side(levels0[k]!, v) < 0 && side(l, s.v1) >= 0) || f >= 0) {
          hiH = mid;
          fHi = f >= 0 ? f : 0;
          if (kept === -1) fLo *= 0.5;
          kept = -1;
          if (f === 0) break;
        } else {
          lo = mid;
          fLo = f;
          if (kept === 1) fHi *= 0.5;
          kept = 1;
        }
        if (Math.abs(f) <= 1e-12 * Math.max(Math.abs(level0.voltageV), 1)) {
          if (f >= 0) hiH = mid;
          break;
        }
      }
      h = hiH;
      step = trial(t, h)!;
      const lv = levelsOf(step.p1.regime);
      const k = lv.findIndex((l, kk) => side(levels0[kk]!, v) < 0 && side(l, step!.v1) >= 0);
      hit = lv[k < 0 ? crossing.index : k];
    }
    // accept: the linear segments of this step
    const { p1, v1, y1 } = step;
    for (const role of model.traceRoles) {
      const k = keys.indexOf(role);
      if (k < 0) continue;
      const a = p0.partW[k]!;
      const b = (p1.partW[k]! - a) / h;
      if (a !== 0 || b !== 0) traces[role]!.push({ startS: t, durationS: h, terms: [{ a, b, lambda: 0 }] });
    }
    for (let k = 0; k < keys.length; k++) partsJ[keys[k]!] = partsJ[keys[k]!]! + 0.5 * h * (p0.partW[k]! + p1.partW[k]!);
    sourceJ += 0.5 * h * (p0.sourceW + p1.sourceW);
    loadJ += 0.5 * h * (p0.loadW + p1.loadW);
    if (wantSamples) samples.push({ timeS: t, voltageV: v, currentA: p0.feedA, capacitorCurrentA: p0.capA });
    const pm = step.pm;
    slopeA = hit === undefined ? (p0.capA - 4 * pm.capA + 3 * p1.capA) / h : 0;
    curveA = hit === undefined ? (4 * (p0.capA - 2 * pm.capA + p1.capA)) / (h * h) : 0;
    for (let j = 0; j < n; j++) {
      slopeW[j] = hit === undefined ? (p0.heatW[j]! - 4 * pm.heatW[j]! + 3 * p1.heatW[j]!) / h : 0;
      curveW[j] = hit === undefined ? (4 * (p0.heatW[j]! - 2 * pm.heatW[j]! + p1.heatW[j]!)) / (h * h) : 0;
    }
    const t1 = t + h;
    noteGain(t, t1, loopGain(t1, v1, p1), p1);
    peakCurrentA = Math.max(peakCurrentA, p1.feedA);
    widen(p1);
    t = t1;
    v = hit === undefined ? v1 : hit.voltageV;
    y = y1;
    p0 = hit === undefined ? p1 : pointAt(v, p1.tempC);
    if (++steps > EVENT_LIMITS.traceSegments) throw eventTooLong(rule.timeoutS, changes, t);
    h = Math.min(h * (step.error > 0 ? Math.min(4, 0.9 * Math.cbrt(1 / step.error)) : 4), limitS);
    if (hit === undefined) continue;
    if (hit.key === "complete") {
      outcome = "completed";
      reason = `bus reached ${rule.thresholdWords} at ${reasonNumber(t)} s`;
      break;
    }
    if (++changes > EVENT_LIMITS.regimeChanges) throw eventTooLong(rule.timeoutS, changes, t);
    const frozen = model.at(byRoleAt(thermal, p0.tempC, fixedC));
    const next = nextRegime(frozen, load, p0.regime, hit);
    mode = next.mode;
    loadOn = next.loadOn;
    clamped = next.clamped || (v === 0 && next.h === 0 && next.g0 < 0);
    p0 = pointAt(v, p0.tempC);
    widen(p0);
    peakCurrentA = Math.max(peakCurrentA, p0.feedA);
  }
  if (outcome === undefined) {
    if (rule.dwellS <= rule.timeoutS) {
      outcome = "completed";
      reason = `fixed dwell of ${reasonNumber(rule.dwellS)} s ended with the bus at ${reasonNumber(v)} V`;
    } else {
      outcome = "timed-out";
      const frozen = model.at(byRoleAt(thermal, p0.tempC, fixedC));
      const p = threshold === undefined ? undefined : project(frozen, load, p0.regime, v, levelsOf);
      busStalled = p !== undefined && p.kind !== "reaches";
      reason =
        p === undefined
          ? `timeout at ${reasonNumber(t)} s before the dwell of ${reasonNumber(rule.dwellS)} s ended; bus at ${reasonNumber(v)} V`
          : p.kind === "reaches"
            ? `timeout at ${reasonNumber(t)} s with the bus at ${reasonNumber(v)} V, still short of ${rule.thresholdWords}`
            : `timeout at ${reasonNumber(t)} s with the bus at ${reasonNumber(v)} V; at the parts' temperatures then it would ${
                p.kind === "settles" ? `settle at ${reasonNumber(p.voltageV)} V` : `cycle between ${reasonNumber(p.lowV)} V and ${reasonNumber(p.highV)} V`
              }, below ${rule.thresholdWords}`;
    }
  }
  if (wantSamples) samples.push({ timeS: t, voltageV: v, currentA: p0.feedA, capacitorCurrentA: p0.capA });
  const electroThermal: ElectroThermalSummary | undefined =
    readIndex < 0
      ? undefined
      : {
          role: model.readsRole,
          maxLoopGain: maxGain,
          maxLoopGainAtS: maxGainAt,
          warningLoopGain: model.warningLoopGain,
          ...(runaway === undefined ? {} : { runaway }),
          peakTemperatureC: peakC,
        };
  const energy = { sourceJ, storedJ: 0.5 * c * (v * v - v0 * v0), loadJ, partsJ };
  return {
    ...{ outcome, busStalled, reason, durationS: t, endVoltageV: v, traces, energy },
    ...(wantSamples ? { samples } : {}),
    peakCurrentA,
    ...(electroThermal === undefined ? {} : { electroThermal }),
  };
}

/** Temperature of coupled part i at the event start [°C]. */
function startTemperature(thermal: ChargeThermalContext, i: number): number {
  return thermal.ambientC[i]! + thermal.startRiseK[i]!.reduce((s, x) => s + x, 0);
}

/** The coupled parts' temperatures by role, over the fixed ones. */
function byRoleAt(thermal: ChargeThermalContext, tempC: Float64Array, fixedC: Readonly<Record<string, number>>): Record<string, number> {
  const out: Record<string, number> = { ...fixedC };
  for (let i = thermal.roles.length - 1; i >= 0; i--) out[thermal.roles[i]!] = tempC[i]!;
  return out;
}

/** The coupled event outgrew EVENT_LIMITS: the timeout is what the user can shorten. */
function eventTooLong(timeoutS: number, changes: number, t: number) {
  const limit = `at most ${EVENT_LIMITS.traceSegments} coupled steps and ${EVENT_LIMITS.regimeChanges} load or mode changes`;
  return inputError("out-of-range", "completion.timeoutS", `a timeout short enough for ${limit} (${changes} changes in the first ${reasonNumber(t)} s)`, describeFound(timeoutS));
}
