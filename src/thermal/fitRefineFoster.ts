import { levenbergMarquardt } from "ml-levenberg-marquardt";
import type { FosterStage } from "./fosterNetwork.js";
import type { ZthPoint } from "./fitZthPoints.js";

/** Settings of the Levenberg-Marquardt refinement (all required: resolved by the caller). */
export interface RefineSettings {
  /** iteration cap of one Levenberg-Marquardt run */
  readonly maxIterations: number;
}

/** A refined set of Foster stages and how the solver got there. */
export interface RefinedFoster {
  /** stages sorted by increasing tau */
  readonly stages: FosterStage[];
  /** sum of squared relative residuals Σ (Zfit(t_i)/Z_i − 1)² */
  readonly sumSquares: number;
  /** Levenberg-Marquardt iterations used */
  readonly iterations: number;
}

/** Time constants may wander this many decades beyond the data (loose bounds: a guard, not a constraint). */
const TAU_BOUND_DECADES = 3;
/** Iterations per Levenberg-Marquardt run between restarts from the best point. */
const REFINE_CHUNK = 10;
/** A run that lowers the residual sum by less than this fraction ends the refinement (it would change N·ln S, the criterion's fit term, by under N·1e-6). */
const REFINE_STALL = 1e-6;

/**
 * Refine Foster stages by Levenberg-Marquardt on the parameters ln R_k and ln tau_k, minimising the
 * sum of squared relative residuals
 *   S = Σ_i ( Σ_k R_k·(1 − e^(−t_i/tau_k)) / Z_i − 1 )².
 * Log parameters keep R and tau positive without hard bounds and make steps scale-free over many
 * decades. The Jacobian is analytic:
 *   ∂r_i/∂ln R_k   = R_k·(1 − e^(−t_i/tau_k)) / Z_i
 *   ∂r_i/∂ln tau_k = −R_k·(t_i/tau_k)·e^(−t_i/tau_k) / Z_i.
 * Source: Marquardt, "An algorithm for least-squares estimation of nonlinear parameters", J. SIAM
 * 11 (1963) 431-441; Press et al., Numerical Recipes, 3rd ed. (2007), §15.5.2 (the method);
 * solver: ml-levenberg-marquardt (npm), which keeps the best parameters it has seen.
 * Validity: validated points; the start stages must have R > 0 and tau > 0.
 * Cost O(iterations × points × stages²).
 */
export function refineFosterFit(points: readonly ZthPoint[], start: readonly FosterStage[], settings: RefineSettings): RefinedFoster {
  const n = start.length;
  const times = points.map((p) => p.timeS);
  const inverse = points.map((p) => 1 / p.zthKPerW);
  const first = times[0]!;
  const last = times[times.length - 1]!;
  const totalGuess = start.reduce((a, s) => a + s.rKPerW, 0);
  const model = (params: number[]) => {
    const r = params.slice(0, n).map(Math.exp);
    const tau = params.slice(n).map(Math.exp);
    return (i: number): number => {
      const t = times[i]!;
      let z = 0;
      for (let k = 0; k < n; k++) z += r[k]! * -Math.expm1(-t / tau[k]!);
      return z * inverse[i]!;
    };
  };
  const jacobian = (params: number[]) => {
    const r = params.slice(0, n).map(Math.exp);
    const tau = params.slice(n).map(Math.exp);
    return (i: number): number[] => {
      const t = times[i]!;
      const out = new Array<number>(2 * n);
      for (let k = 0; k < n; k++) {
        const x = t / tau[k]!;
        out[k] = r[k]! * -Math.expm1(-x) * inverse[i]!;
        out[n + k] = -r[k]! * x * Math.exp(-x) * inverse[i]!;
      }
      return out;
    };
  };
  const logR = Math.log(totalGuess);
  const initialValues = [...start.map((s) => Math.log(s.rKPerW)), ...start.map((s) => Math.log(s.tauS))];
  const tauMin = Math.log(first) - TAU_BOUND_DECADES * Math.LN10;
  const tauMax = Math.log(last) + TAU_BOUND_DECADES * Math.LN10;
  const minValues = [...start.map(() => logR - 40), ...start.map(() => tauMin)];
  const maxValues = [...start.map(() => logR + 10), ...start.map(() => tauMax)];
  const sumSquaresOf = (params: number[]): number => {
    const f = model(params);
    let sum = 0;
    for (let i = 0; i < times.length; i++) sum += (f(i) - 1) ** 2;
    return sum;
  };
  let params = initialValues.map((v, j) => Math.min(Math.max(v, minValues[j]!), maxValues[j]!));
  let sumSquares = sumSquaresOf(params);
  let iterations = 0;
  // Runs of REFINE_CHUNK iterations, each restarted from the best parameters so far: a run that
  // fails (the library throws on a singular normal matrix when a stage has vanished) loses only
  // itself, and a run that no longer improves S by a relative REFINE_STALL ends the refinement.
  while (iterations < settings.maxIterations) {
    const chunk = Math.min(REFINE_CHUNK, settings.maxIterations - iterations);
    let result;
    try {
      result = levenbergMarquardt({ x: times.map((_, i) => i), y: times.map(() => 1) }, model, {
        initialValues: params,
        jacobianFunction: jacobian,
        minValues,
        maxValues,
        maxIterations: chunk,
        // the library stops when S ≤ errorTolerance and only accepts a new best below best − errorTolerance:
        // 0 lets it polish down to rounding instead of stopping at its default 1e-7
        errorTolerance: 0,
        damping: 1e-3,
      });
    } catch {
      break;
    }
    iterations += Math.max(result.iterations, 1);
    const next = sumSquaresOf(result.parameterValues);
    if (!(next < sumSquares)) break;
    const gain = (sumSquares - next) / sumSquares;
    params = result.parameterValues;
    sumSquares = next;
    if (gain < REFINE_STALL || result.iterations < chunk) break;
  }
  const p = params;
  const stages = Array.from({ length: n }, (_, k) => ({ rKPerW: Math.exp(p[k]!), tauS: Math.exp(p[n + k]!) })).sort((a, b) => a.tauS - b.tauS);
  return { stages, sumSquares, iterations };
}
