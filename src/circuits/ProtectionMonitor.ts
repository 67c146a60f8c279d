import type { AttemptProtection, ProtectionFiring } from "./AttemptProtection.js";
import { reasonNumber } from "./resolveCompletion.js";

/**
 * One stretch of the bus inside an attempt, as the protection monitor sees it: where it starts
 * (attempt time and voltage), how long it lasts, the bus voltage at any time inside it, and the
 * current the pre-charge path draws as g0 − g1·V + h/V.
 */
export interface StretchPath {
  /** attempt time at the start of the stretch [s] */
  readonly startS: number;
  readonly durationS: number;
  readonly startV: number;
  readonly endV: number;
  /** the feed's current terms: i(V) = g0 − g1·V + h/V [A] */
  readonly feed: { readonly g0: number; readonly g1: number; readonly h: number };
  /**
   * closed form of the stretch when it is linear: V(s) = vf + d·e^(−rate·s) (rate > 0) or
   * V(s) = vf + k·s (rate = 0, vf the start voltage); undefined for an ODE stretch
   */
  readonly closed?: { readonly vf: number; readonly d: number; readonly rate: number; readonly k: number };
  /** the bus voltage s seconds into the stretch [V] (exact, or the ODE's own solution) */
  readonly voltageAt: (s: number) => number;
  /** (s, i) along an ODE stretch, dense enough that i is piecewise linear between them within the power tolerance */
  readonly currentSamples?: () => readonly { readonly s: number; readonly i: number }[];
}

/** Bisection iterations of a firing time: 2^-80 of the stretch, below a double's resolution. */
const BISECTION_STEPS = 80;

/** The first s in [0, hi] where the non-decreasing f(s) reaches target, by bisection (f(hi) ≥ target). */
function solveRising(f: (s: number) => number, target: number, hi: number): number {
  let lo = 0;
  let up = hi;
  for (let n = 0; n < BISECTION_STEPS && up - lo > 0; n++) {
    const mid = 0.5 * (lo + up);
    if (mid === lo || mid === up) break;
    if (f(mid) >= target) up = mid;
    else lo = mid;
  }
  return up;
}

/**
 * Watches one attempt's protection stretch by stretch and finds the first moment one fires.
 * Along a stretch the bus voltage is monotone (a scalar autonomous ODE: Hirsch, Smale & Devaney,
 * Differential Equations, Dynamical Systems, and an Introduction to Chaos, 3rd ed. (2013), ch. 1,
 * from memory), and so is the path's current, an affine function of V (plus h/V, monotone too);
 * so a level of voltage or current is crossed at most once per stretch.
 * - bus checks and rise checks: the bus voltage at the check time (closed form, or the ODE);
 * - over-current: the time the current crosses the trip level (closed form V = (g0 − I)/g1 on a
 *   linear stretch; bisection on the ODE otherwise), then the delay, carried across stretches;
 * - I²t: ∫i² dt in closed form on a linear stretch, i(s) = a + b·e^(−rs):
 *   a²s + 2ab(1 − e^(−rs))/r + b²(1 − e^(−2rs))/(2r) (a ramp: (α + βs)² integrated); on an ODE
 *   stretch i is taken piecewise linear between dense samples; the limit's moment by bisection of
 *   the monotone integral;
 * - maximum on-time: the time itself.
 * A protection due exactly at a stretch's end fires at the start of the next stretch; when the
 * attempt ends there (completed, or its timer ran out), the attempt's own end takes precedence.
 * Cost O(protections) per linear stretch plus 80 bisection steps per firing; an ODE stretch
 * costs one ODE run per voltage evaluation.
 */
export class ProtectionMonitor {
  private aboveSinceS: number | undefined;
  private i2tSumA2s = 0;
  private readonly riseFromV = new Map<number, number>();

  constructor(private readonly protection: AttemptProtection) {}

  /** The first firing inside the stretch (before its end), or undefined after taking the stretch into the state. */
  scan(path: StretchPath): ProtectionFiring | undefined {
    const p = this.protection;
    const t0 = path.startS;
    const dur = path.durationS;
    const inside = (t: number): boolean => t >= t0 && t - t0 < dur;
    let best: ProtectionFiring | undefined;
    const offer = (f: ProtectionFiring): void => {
      if (best === undefined || f.timeS < best.timeS) best = f;
    };
    if (p.maxOnTimeS !== undefined && inside(p.maxOnTimeS))
      offer({ kind: "max-on-time", timeS: p.maxOnTimeS, words: `maximum on-time of ${reasonNumber(p.maxOnTimeS)} s reached` });
    for (const b of p.busChecks ?? []) {
      if (!inside(b.atS)) continue;
      const v = path.voltageAt(b.atS - t0);
      if (b.minV !== undefined && v < b.minV)
        offer({ kind: "bus-check", timeS: b.atS, words: `bus check at ${reasonNumber(b.atS)} s: bus at ${reasonNumber(v)} V, below ${reasonNumber(b.minV)} V` });
      else if (b.maxV !== undefined && v > b.maxV)
        offer({ kind: "bus-check", timeS: b.atS, words: `bus check at ${reasonNumber(b.atS)} s: bus at ${reasonNumber(v)} V, above ${reasonNumber(b.maxV)} V` });
    }
    (p.riseChecks ?? []).forEach((r, index) => {
      if (inside(r.fromS)) this.riseFromV.set(index, path.voltageAt(r.fromS - t0));
      if (!inside(r.toS)) return;
      const from = this.riseFromV.get(index) ?? path.startV;
      const rate = (path.voltageAt(r.toS - t0) - from) / (r.toS - r.fromS);
      if (rate < r.minRateVPerS)
        offer({
          kind: "rise-check",
          timeS: r.toS,
          words: `rise check from ${reasonNumber(r.fromS)} s to ${reasonNumber(r.toS)} s: the bus rose ${reasonNumber(rate)} V/s, slower than ${reasonNumber(r.minRateVPerS)} V/s`,
        });
    });
    const oc = p.overCurrent;
    let aboveAfter = this.aboveSinceS;
    if (oc !== undefined) {
      const current = (s: number): number => this.currentAt(path, s);
      const i0 = current(0);
      const iEnd = this.currentOfV(path, path.endV);
      let since = this.aboveSinceS;
      let leaveS = dur;
      if (i0 > oc.currentA) {
        since ??= t0;
        if (!(iEnd > oc.currentA)) leaveS = this.currentCrossing(path, oc.currentA, false);
        aboveAfter = leaveS < dur ? undefined : since;
      } else if (iEnd > oc.currentA) {
        since = t0 + this.currentCrossing(path, oc.currentA, true);
        aboveAfter = since;
      } else {
        since = undefined;
        aboveAfter = undefined;
      }
      if (since !== undefined) {
        const fire = since + oc.delayS;
        if (fire >= t0 && fire - t0 <= leaveS && inside(fire))
          offer({ kind: "over-current", timeS: fire, words: `over-current trip: above ${reasonNumber(oc.currentA)} A for ${reasonNumber(oc.delayS)} s (from ${reasonNumber(since)} s)` });
      }
    }
    const total = p.i2t === undefined || p.i2t.length === 0 ? 0 : this.i2tUntil(path, dur);
    for (const limit of p.i2t ?? []) {
      const left = limit.limitA2s - this.i2tSumA2s;
      if (left > total) continue;
      const s = left <= 0 ? 0 : solveRising((x) => this.i2tUntil(path, x), left, dur);
      if (s < dur)
        offer({
          kind: limit.kind === "fuse" ? "fuse" : "firmware-i2t",
          timeS: t0 + s,
          words: `${limit.kind === "fuse" ? "fuse" : "firmware I²t limit"} of ${reasonNumber(limit.limitA2s)} A²s reached at ${reasonNumber(t0 + s)} s`,
        });
    }
    if (best !== undefined) return best;
    this.aboveSinceS = aboveAfter;
    this.i2tSumA2s += total;
    return undefined;
  }

  private currentOfV(path: StretchPath, v: number): number {
    const f = path.feed;
    return f.g0 - f.g1 * v + (f.h === 0 ? 0 : f.h / v);
  }

  private currentAt(path: StretchPath, s: number): number {
    return this.currentOfV(path, s === 0 ? path.startV : path.voltageAt(s));
  }

  /** Time into the stretch where the current crosses level (upward when rising), which it does. */
  private currentCrossing(path: StretchPath, level: number, rising: boolean): number {
    const c = path.closed;
    const f = path.feed;
    if (c !== undefined && f.h === 0 && f.g1 > 0) {
      const vx = (f.g0 - level) / f.g1;
      if (c.rate > 0) {
        const ratio = (vx - c.vf) / c.d;
        if (ratio > 0 && ratio <= 1) return Math.min(path.durationS, Math.log(1 / ratio) / c.rate);
      } else if (c.k !== 0) return Math.min(path.durationS, Math.max(0, (vx - c.vf) / c.k));
    }
    const sign = rising ? 1 : -1;
    return solveRising((s) => sign * this.currentAt(path, s), sign * level, path.durationS);
  }

  /** ∫ i² ds over the first s seconds of the stretch [A²s]. */
  private i2tUntil(path: StretchPath, s: number): number {
    if (!(s > 0)) return 0;
    const c = path.closed;
    const f = path.feed;
    if (c !== undefined && f.h === 0) {
      if (c.rate > 0) {
        const a = f.g0 - f.g1 * c.vf;
        const b = -f.g1 * c.d;
        const r = c.rate;
        return a * a * s + (2 * a * b * -Math.expm1(-r * s)) / r + (b * b * -Math.expm1(-2 * r * s)) / (2 * r);
      }
      const alpha = f.g0 - f.g1 * c.vf;
      const beta = -f.g1 * c.k;
      return alpha * alpha * s + alpha * beta * s * s + (beta * beta * s * s * s) / 3;
    }
    // ODE stretch: i piecewise linear between dense samples, (ia² + ia·ib + ib²)·h/3 per piece
    const samples = path.currentSamples?.() ?? [
      { s: 0, i: this.currentOfV(path, path.startV) },
      { s: path.durationS, i: this.currentOfV(path, path.endV) },
    ];
    let sum = 0;
    for (let k = 1; k < samples.length; k++) {
      const a = samples[k - 1]!;
      let b = samples[k]!;
      if (a.s >= s) break;
      if (b.s > s) b = { s, i: a.i + ((b.i - a.i) * (s - a.s)) / (b.s - a.s) };
      const h = b.s - a.s;
      sum += (h * (a.i * a.i + a.i * b.i + b.i * b.i)) / 3;
    }
    return sum;
  }
}
