import { inputError } from "../errors/InputError.js";
import type { PowerSegment } from "../thermal/powerTrace.js";
import type { CircuitSample } from "./CircuitResult.js";
import { type BusLevel, type BusRegime, type Quadratic, evalQuadratic } from "./BusRegime.js";
import { ODEX_OUTCOME, createOdexSolver } from "./loadOdex.js";

/**
 * Accuracy of the nonlinear path, declared once:
 * - `odeTolerance`: odex's relative and absolute tolerance on the scaled bus voltage V/Vscale
 *   and on the scaled integrals ∫V dt, ∫V² dt;
 * - `powerTolerance`: the piecewise-linear power of each part stays within this fraction of that
 *   part's largest power over 0 ≤ V ≤ Vscale (or of 1e-9 of the largest part's, for a part
 *   whose power is negligible), checked at the quarter, half and three-quarter
 *   points of every segment against the ODE's dense output (tested against the closed-form
 *   trajectory in test/circuits/constantPowerLoad.test.ts).
 */
export const NONLINEAR_ACCURACY = { odeTolerance: 1e-11, powerTolerance: 1e-4 } as const;

/**
 * A nonlinear stretch that comes within this distance of its equilibrium (in units of the
 * voltage scale, about 1e-9 × the source voltage) is taken as settled there for the rest of the
 * stretch. The ODE itself runs at 1e-11, so the snap moves the bus by at most this much.
 */
export const SETTLE_TOLERANCE = 1e-9;

/** At most this many segment splits per ODE step (a guard; smooth powers need a handful). */
export const MAX_SPLITS_PER_STEP = 256;

/** What one stretch of a regime produced, in stretch-local time. */
export interface RegimeStretch {
  readonly durationS: number;
  readonly endVoltageV: number;
  /** the level that ended the stretch, or undefined when the time ran out */
  readonly level: BusLevel | undefined;
  /** segments per part key, starting at 0 */
  readonly segments: Readonly<Record<string, PowerSegment[]>>;
  readonly sourceJ: number;
  readonly loadJ: number;
  readonly partsJ: Readonly<Record<string, number>>;
  readonly samples: CircuitSample[];
}

/** Largest |q(V)| over 0 ≤ V ≤ vMax. */
function quadraticScale(q: Quadratic, vMax: number): number {
  let m = Math.max(Math.abs(q.c0), Math.abs(evalQuadratic(q, vMax)));
  if (q.c2 !== 0) {
    const vertex = -q.c1 / (2 * q.c2);
    if (vertex > 0 && vertex < vMax) m = Math.max(m, Math.abs(evalQuadratic(q, vertex)));
  }
  return m;
}

/**
 * Integrate one nonlinear bus regime, C·dV/dt = g0 − g1·V + h/V, from V0 for at most maxS
 * seconds or until the bus crosses one of `levels`, with odex (adaptive extrapolation, dense
 * output), and turn every part's power into continuous piecewise-linear segments.
 *
 * Scaling: u = V/Vscale and x = t/T with T = C·Vscale/Iscale, Iscale the largest current term;
 * odex then works on a problem of unit size (it never starts below a step of 1e-4). The energies
 * come from the integrals ∫V dt and ∫V² dt carried as two more ODE components, so the energy
 * balance holds to the ODE tolerance, not to the power tolerance.
 * Level crossings are located by bisection on the dense output (the solution of a scalar
 * autonomous ODE is monotone, so a sign change over a step brackets the only crossing).
 * Source: E. Hairer, S. P. Nørsett, G. Wanner, Solving Ordinary Differential Equations I,
 * 2nd ed. (1993), §II.9 (ODEX) and §II.6 (dense output); monotonicity of scalar autonomous ODEs:
 * Hirsch, Smale & Devaney, Differential Equations, Dynamical Systems, and an Introduction to
 * Chaos, 3rd ed. (2013), ch. 1 (first-order autonomous equations: phase line) (section numbers
 * from memory).
 * Validity: V stays > 0 (constant-power terms are only present above a disable voltage > 0).
 * Cost: O(ODE steps × parts × subdivisions).
 * @param wantSamples also return (t, V, I) at every segment boundary
 */
export function integrateBusOde(
  regime: BusRegime,
  capacitanceF: number,
  initialVoltageV: number,
  maxS: number,
  levels: readonly BusLevel[],
  scaleV: number,
  wantSamples: boolean,
): RegimeStretch {
  const { g0, g1, h } = regime;
  const current = (v: number): number => g0 - g1 * v + h / v;
  const iScale = Math.max(Math.abs(g0), g1 * scaleV, Math.abs(h) / scaleV, Math.abs(current(initialVoltageV)));
  const T = (capacitanceF * scaleV) / iScale;
  const u0 = initialVoltageV / scaleV;
  const keys = Object.keys(regime.partPower);
  // a part whose power is negligible beside the others (a source resistance of 1e-300 Ω) is held
  // to 1e-9 of the largest part's power instead of its own, which may underflow to 0
  const scales = keys.map((k) => quadraticScale(regime.partPower[k]!, scaleV));
  const largest = Math.max(0, ...scales);
  const roleTol = scales.map((sc) => NONLINEAR_ACCURACY.powerTolerance * Math.max(sc, 1e-9 * largest));
  const segments: Record<string, PowerSegment[]> = {};
  for (const k of keys) segments[k] = [];
  const samples: CircuitSample[] = [];
  const feedCurrent = (v: number): number => regime.feed.g0 - regime.feed.g1 * v + (regime.feed.h === 0 ? 0 : regime.feed.h / v);
  const pushSample = (x: number, u: number): void => {
    const v = u * scaleV;
    samples.push({ timeS: x * T, voltageV: v, currentA: feedCurrent(v), capacitorCurrentA: current(v) });
  };

  const emit = (xa: number, ua: number, xb: number, ub: number): void => {
    const hS = (xb - xa) * T;
    if (!(hS > 0)) return;
    keys.forEach((k) => {
      const q = regime.partPower[k]!;
      const pa = evalQuadratic(q, ua * scaleV);
      const pb = evalQuadratic(q, ub * scaleV);
      if (pa === 0 && pb === 0) return;
      const list = segments[k]!;
      const prev = list[list.length - 1];
      // a constant power (a converter's loss in constant-power mode) stays one segment
      const joins = prev !== undefined && Math.abs(prev.startS + prev.durationS - xa * T) <= 1e-12 * xb * T;
      if (pa === pb && joins && prev.terms[0]!.b === 0 && prev.terms[0]!.a === pa) {
        list[list.length - 1] = { ...prev, durationS: xb * T - prev.startS };
        return;
      }
      list.push({ startS: xa * T, durationS: hS, terms: [{ a: pa, b: (pb - pa) / hS, lambda: 0 }] });
    });
    if (wantSamples) pushSample(xa, ua);
  };

  // Split [xa, xb] until the chord of every part's power is within its tolerance at 1/4, 1/2, 3/4;
  // at most MAX_SPLITS_PER_STEP splits per ODE step, so a tolerance that rounding cannot meet
  // costs a bounded number of segments, never an exponential search.
  let splitsLeft = 0;
  const refine = (dense: (c: number, x: number) => number, xa: number, ua: number, xb: number, ub: number, depth: number): void => {
    const fits = (): boolean => {
      for (const f of [0.25, 0.5, 0.75]) {
        const u = dense(0, xa + f * (xb - xa));
        for (let i = 0; i < keys.length; i++) {
          const q = regime.partPower[keys[i]!]!;
          const chord = (1 - f) * evalQuadratic(q, ua * scaleV) + f * evalQuadratic(q, ub * scaleV);
          if (Math.abs(evalQuadratic(q, u * scaleV) - chord) > roleTol[i]!) return false;
        }
      }
      return true;
    };
    if (depth >= 40 || splitsLeft <= 0 || fits()) {
      emit(xa, ua, xb, ub);
      return;
    }
    splitsLeft--;
    const xm = 0.5 * (xa + xb);
    const um = dense(0, xm);
    refine(dense, xa, ua, xm, um, depth + 1);
    refine(dense, xm, um, xb, ub, depth + 1);
  };

  const solver = createOdexSolver(3);
  solver.relativeTolerance = NONLINEAR_ACCURACY.odeTolerance;
  solver.absoluteTolerance = NONLINEAR_ACCURACY.odeTolerance;
  solver.denseOutput = true;
  solver.maxSteps = 1_000_000;
  solver.initialStepSize = 1e-4;
  const f = (_x: number, y: number[]): number[] => {
    const u = y[0]!;
    return [current(u * scaleV) / iScale, u, u * u];
  };

  const xEnd = maxS / T;
  // The equilibrium ahead, if any: a root of −g1·V² + g0·V + h = 0 in the direction of motion.
  // Once the bus is within SETTLE_TOLERANCE of it the rest of the stretch is that constant state,
  // so a long stall costs a bounded number of ODE steps.
  const rising = current(initialVoltageV) > 0;
  const roots: number[] = [];
  if (g1 > 0) {
    const disc = g0 * g0 + 4 * g1 * h;
    if (disc >= 0) roots.push((g0 + Math.sqrt(disc)) / (2 * g1), (g0 - Math.sqrt(disc)) / (2 * g1));
  } else if (g0 !== 0) roots.push(-h / g0);
  const ahead = roots.filter((v) => v > 0 && (rising ? v > initialVoltageV : v < initialVoltageV)).sort((a, b) => (rising ? a - b : b - a));
  const uEq = ahead.length > 0 ? ahead[0]! / scaleV : undefined;
  let settled: { x: number; y: number[] } | undefined;
  let hit: { level: BusLevel; x: number; y: number[] } | undefined;
  let uPrev = u0;
  const levelsU = levels.map((l) => ({ level: l, u: l.voltageV / scaleV }));
  const crossed = (ua: number, ub: number, l: { level: BusLevel; u: number }): boolean =>
    l.level.rising ? ua < l.u && ub >= l.u : ua > l.u && ub <= l.u;

  let result: { y: number[]; outcome: number } = { y: [u0, 0, 0], outcome: ODEX_OUTCOME.converged };
  if (xEnd > 0) {
    result = solver.solve(f, 0, [u0, 0, 0], xEnd, (_n, xOld, x, y, dense) => {
      if (dense === undefined || x === xOld) return;
      splitsLeft = MAX_SPLITS_PER_STEP;
      const u1 = y[0]!;
      // the earliest level crossed in this step
      let first: { level: BusLevel; x: number } | undefined;
      for (const l of levelsU) {
        if (!crossed(uPrev, u1, l)) continue;
        let lo = xOld;
        let hi = x;
        for (let it = 0; it < 200 && hi - lo > 1e-15 * Math.max(1, Math.abs(hi)); it++) {
          const mid = 0.5 * (lo + hi);
          if (crossed(uPrev, dense(0, mid), l)) hi = mid;
          else lo = mid;
        }
        if (first === undefined || hi < first.x) first = { level: l.level, x: hi };
      }
      if (first !== undefined) {
        const uHit = first.level.voltageV / scaleV;
        refine(dense, xOld, uPrev, first.x, uHit, 0);
        hit = { level: first.level, x: first.x, y: [uHit, dense(1, first.x), dense(2, first.x)] };
        return false;
      }
      refine(dense, xOld, uPrev, x, u1, 0);
      uPrev = u1;
      if (uEq !== undefined && x < xEnd && Math.abs(u1 - uEq) <= SETTLE_TOLERANCE) {
        settled = { x, y: [uEq, y[1]!, y[2]!] };
        return false;
      }
    });
    if (hit === undefined && settled === undefined && result.outcome !== ODEX_OUTCOME.converged) {
      // A load that draws P/V (h > 0 pulls the bus down as h/V) drives the bus to 0 V in finite
      // time, its rate growing without bound: below some voltage no step size resolves it. When
      // the load's switch-off level lies there, the value is the cause: refuse it, saying why.
      const reachedV = uPrev * scaleV;
      const off = levels.find((l) => l.key === "load-off" && !l.rising && l.voltageV < reachedV);
      if (off !== undefined && h !== 0)
        throw inputError(
          "out-of-range",
          "load.disableV",
          `a disable (under-voltage lockout) voltage the bus can be followed down to: the load's current P/V grows without bound as the bus falls, and the integration could not go below ${reachedV.toPrecision(3)} V; raise disableAt above that`,
          `${off.voltageV} V`,
        );
      throw new Error(`odex stopped early (outcome ${result.outcome}) integrating the bus regime ${regime.key}`);
    }
  }
  if (settled !== undefined) {
    // the settled tail: V = V*, every power constant, ∫V dt and ∫V² dt grow linearly
    const rest = xEnd - settled.x;
    emit(settled.x, settled.y[0]!, xEnd, settled.y[0]!);
    result = { y: [settled.y[0]!, settled.y[1]! + settled.y[0]! * rest, settled.y[2]! + settled.y[0]! * settled.y[0]! * rest], outcome: ODEX_OUTCOME.converged };
  }
  const y = hit?.y ?? result.y;
  const durationS = hit === undefined ? maxS : hit.x * T;
  const intV = scaleV * T * y[1]!;
  const intV2 = scaleV * scaleV * T * y[2]!;
  const energy = (q: Quadratic): number => q.c0 * durationS + q.c1 * intV + q.c2 * intV2;
  const partsJ: Record<string, number> = {};
  for (const k of keys) partsJ[k] = energy(regime.partPower[k]!);
  return {
    durationS,
    endVoltageV: hit === undefined ? y[0]! * scaleV : hit.level.voltageV,
    level: hit?.level,
    segments,
    sourceJ: energy(regime.sourcePower),
    loadJ: energy(regime.loadPower),
    partsJ,
    samples,
  };
}
