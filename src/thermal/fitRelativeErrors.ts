import { type FosterNetwork, fosterToModal } from "./fosterNetwork.js";
import { zth } from "./zth.js";
import type { ZthPoint } from "./fitZthPoints.js";

/** How well a Foster network reproduces a set of Zth points, as relative errors. */
export interface FitRelativeErrors {
  /** max_i |Zfit(t_i) − Z_i| / Z_i (dimensionless, 0.01 = 1 %) */
  readonly maxRelativeError: number;
  /** sqrt(mean_i ((Zfit(t_i) − Z_i) / Z_i)²) */
  readonly rmsRelativeError: number;
  /** the time of the point with the largest relative error [s] */
  readonly worstTimeS: number;
}

/**
 * Maximum and root-mean-square relative error of a Foster network's Zth against points:
 *   e_i = (Zfit(t_i) − Z_i) / Z_i,  max = max |e_i|,  rms = sqrt(Σ e_i² / N).
 * Relative (not absolute) errors, because Zth data span several decades and a datasheet curve is
 * read with about the same relative precision at every decade.
 * Cost O(points × stages).
 * @throws InputError `bad-network` for a network with a non-positive R or tau
 * @param points validated points (see validateZthPoints), at least one
 */
export function fitRelativeErrors(network: FosterNetwork, points: readonly ZthPoint[]): FitRelativeErrors {
  let max = 0;
  let sumSquares = 0;
  let worstTimeS = points[0]?.timeS ?? 0;
  const model = fosterToModal(network);
  for (const p of points) {
    const e = (zth(model, p.timeS) - p.zthKPerW) / p.zthKPerW;
    sumSquares += e * e;
    if (Math.abs(e) > max) {
      max = Math.abs(e);
      worstTimeS = p.timeS;
    }
  }
  return { maxRelativeError: max, rmsRelativeError: Math.sqrt(sumSquares / Math.max(points.length, 1)), worstTimeS };
}
