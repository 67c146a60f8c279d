import { fcnnlsVector } from "ml-fcnnls";
import type { FosterStage } from "./fosterNetwork.js";
import type { ZthPoint } from "./fitZthPoints.js";

/** Settings of the non-negative time-constant spectrum (all required: resolved by the caller). */
export interface NnlsSpectrumSettings {
  /** grid time constants per decade of time */
  readonly pointsPerDecade: number;
  /** decades the grid extends beyond the first and last data time on each side */
  readonly extendDecades: number;
  /** grid entries with R below this fraction of the total R are dropped */
  readonly pruneFraction: number;
}

/**
 * A first Foster network for Zth points from a non-negative least-squares time-constant spectrum.
 *
 * Fixes a log-spaced grid of time constants tau_j (pointsPerDecade per decade, from
 * t_first·10^−extendDecades to t_last·10^extendDecades) and solves for R_j ≥ 0 minimising the sum
 * of squared relative residuals
 *   Σ_i ( Σ_j R_j·(1 − e^(−t_i/tau_j)) / Z_i − 1 )²,
 * a linear least-squares problem with non-negativity (rows scaled by 1/Z_i, so every decade of
 * the curve weighs the same). The solution is sparse: a few clusters of neighbouring grid entries.
 * Pruning drops entries below pruneFraction·ΣR; each remaining run of neighbouring entries becomes
 * one stage with R = Σ R_j and ln tau = Σ R_j·ln tau_j / Σ R_j.
 * Source: Lawson & Hanson, Solving Least Squares Problems (1974, SIAM reprint 1995), ch. 23 (NNLS);
 * Van Benthem & Keenan, "Fast algorithm for the solution of large-scale non-negativity-constrained
 * least squares problems", J. Chemometrics 18 (2004) 441-450 (the FCNNLS solver used, ml-fcnnls);
 * Székely, "On the representation of infinite-length distributed RC one-ports", IEEE Trans.
 * Circuits and Systems 38 (1991) 711-719 (the time-constant spectrum of a thermal impedance).
 * Validity: points validated (times increasing, values > 0). The stage time constants are only
 * as good as the grid spacing; the Levenberg-Marquardt refinement that follows removes that limit.
 * Cost O(points × grid²) per active-set iteration.
 * @returns stages sorted by tau, at least one
 */
export function fitNnlsSpectrum(points: readonly ZthPoint[], settings: NnlsSpectrumSettings): FosterStage[] {
  const first = points[0]!.timeS;
  const last = points[points.length - 1]!.timeS;
  const lo = Math.log10(first) - settings.extendDecades;
  const hi = Math.log10(last) + settings.extendDecades;
  const count = Math.max(2, Math.round((hi - lo) * settings.pointsPerDecade) + 1);
  const grid = Array.from({ length: count }, (_, j) => 10 ** (lo + ((hi - lo) * j) / (count - 1)));
  const r = nonNegativeResistances(points, grid);
  const total = r.reduce((a, b) => a + b, 0);
  const stages: FosterStage[] = [];
  let sumR = 0;
  let sumRLogTau = 0;
  const close = (): void => {
    if (sumR > 0) stages.push({ rKPerW: sumR, tauS: Math.exp(sumRLogTau / sumR) });
    sumR = 0;
    sumRLogTau = 0;
  };
  grid.forEach((tau, j) => {
    const rj = r[j]!;
    if (rj > settings.pruneFraction * total) {
      sumR += rj;
      sumRLogTau += rj * Math.log(tau);
    } else close();
  });
  close();
  if (stages.length === 0) {
    // only possible for degenerate data; one stage at the middle of the data keeps the fit going
    const mean = points.reduce((a, p) => a + p.zthKPerW, 0) / points.length;
    stages.push({ rKPerW: mean, tauS: Math.sqrt(first * last) });
  }
  return stages;
}

/**
 * R_j ≥ 0 for fixed time constants, minimising the squared relative residuals (see fitNnlsSpectrum).
 * Exported for the initial guesses of the refinement. Cost O(points × taus²) per iteration.
 */
export function nonNegativeResistances(points: readonly ZthPoint[], tausS: readonly number[]): number[] {
  const matrix = points.map((p) => tausS.map((tau) => -Math.expm1(-p.timeS / tau) / p.zthKPerW));
  const ones = points.map(() => 1);
  const { K } = fcnnlsVector(matrix, ones, { maxIterations: 20 * tausS.length + 20 });
  return K.to1DArray().map((v) => (v > 0 ? v : 0));
}
