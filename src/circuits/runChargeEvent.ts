import { describeFound, inputError } from "../errors/InputError.js";
import { type PowerSegment, type PowerTerm, segmentEnergy } from "../thermal/powerTrace.js";
import { type BusLoad, busLoadStartsOn, busLoadTerms, busLoadThresholds } from "./BusLoad.js";
import { type BusLevel, type BusRegime, type ChargeModel, type Quadratic, evalQuadratic } from "./BusRegime.js";
import type { ChargeConditions, CircuitOutcome, CircuitResult, CircuitSample } from "./CircuitResult.js";
import { type RegimeStretch, integrateBusOde } from "./integrateBusOde.js";
import { type ResolvedCompletion, reasonNumber, resolveCompletion } from "./resolveCompletion.js";
import { type ProtectionFiring, validateProtection } from "./AttemptProtection.js";
import { ProtectionMonitor } from "./ProtectionMonitor.js";
import { stretchPath } from "./stretchPath.js";

/** Samples per exact (analytic) stretch when samples are requested. */
export const SAMPLES_PER_STRETCH = 16;

/**
 * Limits that keep one event's memory bounded (a load cycling on and off for a long timeout adds
 * segments every cycle): at most this many regime changes (load switching, mode changes) and this
 * many power-trace segments in all roles together. Past either, the event is refused with an
 * InputError on `completion.timeoutS` that states the cycle period. About 200,000 segments take
 * some 30 MB.
 */
export const EVENT_LIMITS = { regimeChanges: 100_000, traceSegments: 200_000 } as const;

/**
 * Build the regime for a feed mode and a load state: capacitor current
 * i(V) = feed(V) − (G·V + I + P/V), load power G·V² + I·V + P. A clamped regime holds the bus at
 * 0 V (a short, or a constant-current load the feed cannot supply): every power is its value at
 * V = 0 and nothing moves.
 */
export function buildRegime(model: ChargeModel, load: BusLoad, mode: string, loadOn: boolean, clamped: boolean): BusRegime {
  const feed = model.feed(mode, loadOn);
  const key = `${mode}|${loadOn ? "on" : "off"}${clamped ? "|clamped" : ""}`;
  if (clamped) {
    if (feed.h !== 0) throw new Error(`feed mode ${mode} has a constant-power term and cannot hold the bus at 0 V`);
    const at0 = (q: Quadratic): Quadratic => ({ c0: q.c0, c1: 0, c2: 0 });
    const partPower: Record<string, Quadratic> = {};
    for (const [k, q] of Object.entries(feed.partPower)) partPower[k] = at0(q);
    return {
      key, g0: 0, g1: 0, h: 0, feed: { g0: feed.g0, g1: 0, h: 0 }, sourcePower: at0(feed.sourcePower),
      loadPower: { c0: 0, c1: 0, c2: 0 }, partPower, levels: [], mode, loadOn, clamped,
    };
  }
  const terms = busLoadTerms(load, loadOn);
  const levels: BusLevel[] = [...feed.levels];
  if (load.kind === "constant-current" || load.kind === "constant-power") {
    const { enableV, disableV } = busLoadThresholds(load);
    if (!loadOn) levels.push({ voltageV: enableV, rising: true, key: "load-on" });
    else if (disableV > 0) levels.push({ voltageV: disableV, rising: false, key: "load-off" });
    else levels.push({ voltageV: 0, rising: false, key: "load-clamp" });
  }
  return {
    key,
    g0: feed.g0 - terms.currentA,
    g1: feed.g1 + terms.conductanceS,
    h: feed.h - terms.powerW,
    feed: { g0: feed.g0, g1: feed.g1, h: feed.h },
    sourcePower: feed.sourcePower,
    loadPower: { c0: terms.powerW, c1: terms.currentA, c2: terms.conductanceS },
    partPower: feed.partPower,
    levels,
    mode,
    loadOn,
    clamped,
  };
}

/** Capacitor current i(V) = g0 − g1·V + h/V of a regime [A]. */
function capacitorCurrent(r: BusRegime, v: number): number {
  return r.g0 - r.g1 * v + (r.h === 0 ? 0 : r.h / v);
}

/** Power terms of a quadratic q(V) along V(s) = Vf + d·e^(−s/τ) (rate = 1/τ), or V(s) = V0 + k·s (rate = 0). */
function quadraticTerms(q: Quadratic, base: number, d: number, rate: number, k: number): PowerTerm[] {
  const terms: PowerTerm[] = [];
  if (rate > 0) {
    const c = evalQuadratic(q, base);
    const e1 = (q.c1 + 2 * q.c2 * base) * d;
    const e2 = q.c2 * d * d;
    if (c !== 0) terms.push({ a: c, b: 0, lambda: 0 });
    if (e1 !== 0) terms.push({ a: e1, b: 0, lambda: rate });
    if (e2 !== 0) terms.push({ a: e2, b: 0, lambda: 2 * rate });
  } else {
    if (q.c2 !== 0 && k !== 0) throw new Error("a quadratic power along a voltage ramp is not a power-trace term");
    const a = evalQuadratic(q, base);
    const b = q.c1 * k;
    if (a !== 0 || b !== 0) terms.push({ a, b, lambda: 0 });
  }
  return terms;
}

/**
 * One linear regime (h = 0) in closed form: C·dV/dt = g0 − g1·V gives
 * V(s) = Vf + (V0 − Vf)·e^(−s/τ) with Vf = g0/g1, τ = C/g1 (g1 > 0), or V(s) = V0 + (g0/C)·s
 * (g1 = 0); the time to a level L is τ·ln((V0 − Vf)/(L − Vf)) or (L − V0)·C/g0.
 * Source: Hayt, Kemmerly & Durbin, Engineering Circuit Analysis, 8th ed. (2012), §8.3 (the
 * source-free RC circuit) and §8.8 (driven RC circuits) (section numbers from memory).
 */
function linearStretch(r: BusRegime, c: number, v0: number, maxS: number, levels: readonly BusLevel[], wantSamples: boolean): RegimeStretch {
  const exp = r.g1 > 0;
  const vf = exp ? r.g0 / r.g1 : 0;
  const tau = exp ? c / r.g1 : Infinity;
  const d = v0 - vf;
  const k = exp ? 0 : r.g0 / c;
  const voltageAt = (s: number): number => (exp ? vf + d * Math.exp(-s / tau) : v0 + k * s);
  let best: { level: BusLevel; s: number } | undefined;
  for (const level of levels) {
    const L = level.voltageV;
    let s = Infinity;
    if (exp) {
      const moving = d < 0 ? level.rising && L > v0 && L < vf : d > 0 && !level.rising && L < v0 && L > vf;
      if (moving) s = tau * Math.log(d / (L - vf));
    } else if (k > 0 ? level.rising && L > v0 : k < 0 && !level.rising && L < v0) s = (L - v0) / k;
    if (s < Infinity && (best === undefined || s < best.s)) best = { level, s };
  }
  const durationS = best !== undefined && best.s <= maxS ? best.s : maxS;
  const level = best !== undefined && best.s <= maxS ? best.level : undefined;
  const rate = exp ? 1 / tau : 0;
  const base = exp ? vf : v0;
  const segments: Record<string, PowerSegment[]> = {};
  const partsJ: Record<string, number> = {};
  for (const [key, q] of Object.entries(r.partPower)) {
    const terms = quadraticTerms(q, base, d, rate, k);
    segments[key] = durationS > 0 && terms.length > 0 ? [{ startS: 0, durationS, terms }] : [];
    partsJ[key] = segmentEnergy(terms, durationS);
  }
  const samples: CircuitSample[] = [];
  if (wantSamples && durationS > 0) {
    for (let j = 0; j < SAMPLES_PER_STRETCH; j++) {
      const s = (j / SAMPLES_PER_STRETCH) * durationS;
      const v = voltageAt(s);
      samples.push({ timeS: s, voltageV: v, currentA: r.feed.g0 - r.feed.g1 * v + (r.feed.h === 0 ? 0 : r.feed.h / v), capacitorCurrentA: capacitorCurrent(r, v) });
    }
  }
  return {
    durationS,
    endVoltageV: level !== undefined ? level.voltageV : voltageAt(durationS),
    level,
    segments,
    sourceJ: segmentEnergy(quadraticTerms(r.sourcePower, base, d, rate, k), durationS),
    loadJ: segmentEnergy(quadraticTerms(r.loadPower, base, d, rate, k), durationS),
    partsJ,
    samples,
  };
}

/** Where the bus goes from a state if nothing stops it: reaches the threshold, settles, or cycles. */
export type Projection = { kind: "reaches" } | { kind: "settles"; voltageV: number } | { kind: "cycles"; lowV: number; highV: number };

/**
 * Follow the bus on its phase line, without time, from regime r at V: it moves in the direction
 * of i(V) to the nearest level unless an equilibrium (a root of −g1·V² + g0·V + h = 0) comes
 * first; a repeated (regime, level) means a limit cycle.
 * Source: Hirsch, Smale & Devaney (2013), ch. 1 (phase line of a first-order autonomous equation,
 * from memory).
 */
export function project(model: ChargeModel, load: BusLoad, r0: BusRegime, v0: number, levelsOf: (r: BusRegime) => readonly BusLevel[]): Projection {
  let r = r0;
  let v = v0;
  const seen = new Map<string, number>();
  const path: number[] = [];
  for (let n = 0; n < 10_000; n++) {
    const i = capacitorCurrent(r, v);
    if (r.clamped || i === 0 || !Number.isFinite(i)) return { kind: "settles", voltageV: v };
    const rising = i > 0;
    const roots: number[] = [];
    if (r.g1 > 0) {
      const disc = r.g0 * r.g0 + 4 * r.g1 * r.h;
      if (disc >= 0) {
        const sq = Math.sqrt(disc);
        roots.push((r.g0 + sq) / (2 * r.g1), (r.g0 - sq) / (2 * r.g1));
      }
    } else if (r.g0 !== 0) roots.push(r.h === 0 ? NaN : -r.h / r.g0);
    const ahead = (x: number): boolean => (rising ? x > v : x < v);
    const eq = roots.filter((x) => Number.isFinite(x) && ahead(x)).sort((a, b) => (rising ? a - b : b - a))[0];
    const lv = levelsOf(r).filter((l) => l.rising === rising && ahead(l.voltageV)).sort((a, b) => (rising ? a.voltageV - b.voltageV : b.voltageV - a.voltageV))[0];
    const levelFirst = lv !== undefined && (eq === undefined || (rising ? lv.voltageV < eq : lv.voltageV > eq));
    if (!levelFirst) return { kind: "settles", voltageV: eq ?? (rising ? v : 0) };
    if (lv.key === "complete") return { kind: "reaches" };
    const tag = `${r.key}@${lv.key}@${lv.voltageV}`;
    path.push(lv.voltageV);
    const first = seen.get(tag);
    if (first !== undefined) {
      const cycle = path.slice(first);
      return { kind: "cycles", lowV: Math.min(...cycle), highV: Math.max(...cycle) };
    }
    seen.set(tag, path.length - 1);
    const next = nextRegime(model, load, r, lv);
    r = next;
    v = lv.voltageV;
  }
  return { kind: "settles", voltageV: v };
}

/** The regime after crossing a level: the load switching, clamping at 0 V, or the feed's next mode. */
export function nextRegime(model: ChargeModel, load: BusLoad, r: BusRegime, level: BusLevel): BusRegime {
  switch (level.key) {
    case "load-on":
      return buildRegime(model, load, r.mode, true, false);
    case "load-off":
      return buildRegime(model, load, r.mode, false, false);
    case "load-clamp":
      return buildRegime(model, load, r.mode, r.loadOn, true);
    default:
      return buildRegime(model, load, model.nextMode(r.mode, level.key), r.loadOn, false);
  }
}

/**
 * Run one charging event of a {@link ChargeModel} against a bus load: from the initial voltage,
 * regime by regime (feed mode × load state), each linear regime in closed form (exact power-trace
 * terms: constants, e^(−s/τ), e^(−2s/τ), ramps) and each nonlinear one (constant-power terms) by
 * odex into piecewise-linear segments ({@link integrateBusOde}), until the completion threshold,
 * the dwell or the timeout. At the timeout the outcome is `timed-out` (the firmware's timer ended
 * the attempt), with `busStalled` true when the bus would never have reached the threshold (it
 * settles below it, is held at 0 V, or cycles with the load switching). A protection of the
 * completion rule (`completion.protection`) that fires first ends the attempt at that exact moment
 * with the outcome `tripped` and `trippedBy` ({@link ProtectionMonitor}).
 *
 * Energy bookkeeping: source = ΔE_C + Σ parts + load, where a short across a charged capacitor
 * dumps C·V0²/2 into the load at t = 0.
 * Source: Hayt, Kemmerly & Durbin, Engineering Circuit Analysis, 8th ed. (2012), §8.3 and §8.8
 * (first-order RC responses); the energy identity is Tellegen's theorem, Desoer & Kuh, Basic
 * Circuit Theory (1969), §9.5 (section numbers from memory).
 * Cost: O(regime changes × parts) for linear regimes, plus the ODE work for nonlinear ones
 * (a repeated nonlinear stretch, as in load cycling, is integrated once and reused).
 * @throws InputError for bad conditions (see {@link resolveCompletion}) or too many regime changes
 */
export function runChargeEvent(model: ChargeModel, load: BusLoad, conditions: ChargeConditions): CircuitResult {
  const rule: ResolvedCompletion = resolveCompletion(conditions);
  const c = model.capacitanceF;
  const vs = conditions.sourceVoltageV;
  const v0 = conditions.initialVoltageV;
  const wantSamples = conditions.wantSamples === true;
  const traces: Record<string, PowerSegment[]> = {};
  for (const role of model.traceRoles) traces[role] = [];
  const partsJ: Record<string, number> = {};
  for (const role of model.traceRoles) partsJ[role] = 0;
  let sourceJ = 0;
  let loadJ = 0;
  const samples: CircuitSample[] = [];

  let v = v0;
  let regime: BusRegime;
  if (load.kind === "short") {
    loadJ += 0.5 * c * v0 * v0; // the capacitor empties into the short at t = 0
    v = 0;
    regime = buildRegime(model, load, model.initialMode(0), true, true);
  } else {
    regime = buildRegime(model, load, model.initialMode(v0), busLoadStartsOn(load, v0), false);
    if (v === 0 && regime.h === 0 && regime.g0 < 0) regime = buildRegime(model, load, regime.mode, regime.loadOn, true);
  }
  const threshold = rule.thresholdV;
  const completeLevel: BusLevel[] = threshold === undefined ? [] : [{ voltageV: threshold, rising: true, key: "complete" }];
  const levelsOf = (r: BusRegime): readonly BusLevel[] => (r.clamped ? [] : [...r.levels, ...completeLevel]);
  const scaleV = Math.max(vs, v0, ...(load.kind === "constant-power" || load.kind === "constant-current" ? [busLoadThresholds(load).enableV] : []));
  const limitS = Math.min(rule.dwellS, rule.timeoutS);
  const cache = new Map<string, RegimeStretch>();
  if (conditions.completion.protection !== undefined) validateProtection(conditions.completion.protection);
  const monitor = conditions.completion.protection === undefined ? undefined : new ProtectionMonitor(conditions.completion.protection);
  let trippedBy: ProtectionFiring | undefined;

  let t = 0;
  let outcome: CircuitOutcome | undefined;
  let busStalled = false;
  let reason = "";
  if (threshold !== undefined && v >= threshold) {
    outcome = "completed";
    reason = `bus already at ${reasonNumber(v)} V, at or above ${rule.thresholdWords}`;
  }
  let changes = 0;
  let segmentCount = 0;
  // the element's current is monotone along each stretch (V is, and the current is affine in V, or
  // g0 − g1·V + h/V with h ≥ 0): its peak is at a stretch's start or end
  // (a constant-power feed at 0 V, which no stretch starts from, counts without its h/V term)
  const feedAt = (r: BusRegime, x: number): number => r.feed.g0 - r.feed.g1 * x + (r.feed.h === 0 || !(x > 0) ? 0 : r.feed.h / x);
  let peakCurrentA = feedAt(regime, v);
  while (outcome === undefined) {
    const remaining = limitS - t;
    const levels = levelsOf(regime);
    let stretch: RegimeStretch;
    if (regime.h === 0) stretch = linearStretch(regime, c, v, remaining, levels, wantSamples);
    else {
      const key = `${regime.key}@${v}`;
      const cached = cache.get(key);
      if (cached !== undefined && cached.durationS <= remaining) stretch = cached;
      else {
        stretch = integrateBusOde(regime, c, v, remaining, levels, scaleV, wantSamples);
        if (stretch.level !== undefined) cache.set(key, stretch);
      }
    }
    if (monitor !== undefined) {
      trippedBy = monitor.scan(stretchPath(regime, c, t, v, stretch.durationS, stretch.endVoltageV, scaleV));
      if (trippedBy !== undefined) {
        const cutS = trippedBy.timeS - t;
        stretch = regime.h === 0 ? linearStretch(regime, c, v, cutS, [], wantSamples) : integrateBusOde(regime, c, v, cutS, [], scaleV, wantSamples);
      }
    }
    for (const [key, segs] of Object.entries(stretch.segments)) {
      if (traces[key] === undefined) continue;
      for (const s of segs) traces[key]!.push({ ...s, startS: s.startS + t });
      segmentCount += segs.length;
    }
    for (const [key, e] of Object.entries(stretch.partsJ)) partsJ[key] = (partsJ[key] ?? 0) + e;
    sourceJ += stretch.sourceJ;
    loadJ += stretch.loadJ;
    for (const s of stretch.samples) samples.push({ ...s, timeS: s.timeS + t });
    t = trippedBy !== undefined ? trippedBy.timeS : stretch.level === undefined ? limitS : t + stretch.durationS;
    peakCurrentA = Math.max(peakCurrentA, feedAt(regime, v), feedAt(regime, stretch.endVoltageV));
    v = stretch.endVoltageV;
    if (trippedBy !== undefined) {
      outcome = "tripped";
      reason = `${trippedBy.words}; attempt ended with the bus at ${reasonNumber(v)} V`;
      break;
    }
    const level = stretch.level;
    if (level === undefined) {
      if (rule.dwellS <= rule.timeoutS) {
        outcome = "completed";
        reason = `fixed dwell of ${reasonNumber(rule.dwellS)} s ended with the bus at ${reasonNumber(v)} V`;
      } else if (threshold === undefined) {
        outcome = "timed-out";
        reason = `timeout at ${reasonNumber(t)} s before the dwell of ${reasonNumber(rule.dwellS)} s ended; bus at ${reasonNumber(v)} V`;
      } else {
        const p = project(model, load, regime, v, levelsOf);
        if (p.kind === "reaches") {
          outcome = "timed-out";
          reason = `timeout at ${reasonNumber(t)} s with the bus at ${reasonNumber(v)} V, still short of ${rule.thresholdWords}`;
        } else if (p.kind === "settles") {
          outcome = "timed-out";
          busStalled = true;
          reason = regime.clamped
            ? `bus held at 0 V (${load.kind === "short" ? "shorted" : "the load takes more than the source can give"}), below ${rule.thresholdWords}; timeout at ${reasonNumber(t)} s`
            : `bus settles at ${reasonNumber(p.voltageV)} V, below ${rule.thresholdWords}; timeout at ${reasonNumber(t)} s with the bus at ${reasonNumber(v)} V`;
        } else {
          outcome = "timed-out";
          busStalled = true;
          reason = `bus cycles between ${reasonNumber(p.lowV)} V and ${reasonNumber(p.highV)} V as the load switches on and off, below ${rule.thresholdWords}; timeout at ${reasonNumber(t)} s`;
        }
      }
      break;
    }
    if (level.key === "complete") {
      outcome = "completed";
      reason = `bus reached ${rule.thresholdWords} at ${reasonNumber(t)} s`;
      break;
    }
    if (++changes > EVENT_LIMITS.regimeChanges || segmentCount > EVENT_LIMITS.traceSegments)
      throw inputError(
        "out-of-range",
        "completion.timeoutS",
        `a timeout short enough for at most ${EVENT_LIMITS.regimeChanges} load or mode changes and ${EVENT_LIMITS.traceSegments} power segments ` +
          `(the bus switched ${changes} times in the first ${reasonNumber(t)} s)`,
        describeFound(rule.timeoutS),
      );
    regime = nextRegime(model, load, regime, level);
    v = level.voltageV;
    if (v === 0 && regime.h === 0 && regime.g0 < 0 && !regime.clamped) regime = buildRegime(model, load, regime.mode, regime.loadOn, true);
  }
  if (wantSamples) {
    const fr = regime.feed;
    samples.push({ timeS: t, voltageV: v, currentA: fr.g0 - fr.g1 * v + (fr.h === 0 ? 0 : fr.h / v), capacitorCurrentA: capacitorCurrent(regime, v) });
  }
  const result: CircuitResult = {
    outcome: outcome!,
    busStalled,
    reason,
    durationS: t,
    endVoltageV: v,
    traces,
    energy: { sourceJ, storedJ: 0.5 * c * (v * v - v0 * v0), loadJ, partsJ },
    ...(trippedBy === undefined ? {} : { trippedBy }),
    ...(wantSamples ? { samples } : {}),
    peakCurrentA,
  };
  return result;
}
