/** Information criteria the fit can use to choose its number of stages. */
export type FitCriterion = "bic" | "aicc";

/** The criteria by name, for option validation and help text. */
export const FIT_CRITERIA: readonly FitCriterion[] = ["bic", "aicc"];

/**
 * Information criterion of a least-squares fit with Gaussian errors (smaller is better):
 *   BIC  = N·ln(S/N) + k·ln N                                 (Schwarz)
 *   AICc = N·ln(S/N) + 2k + 2k(k+1)/(N − k − 1)               (Akaike, small-sample corrected)
 * with N points, k fitted parameters (2 per Foster stage) and S the residual sum of squares.
 * S is floored at N·resolution², the squared relative resolution of the data: below that, a
 * smaller residual is not evidence of a better model, and the penalty picks the fewer stages.
 * Source: Schwarz, "Estimating the dimension of a model", Annals of Statistics 6 (1978) 461-464;
 * Burnham & Anderson, Model Selection and Multimodel Inference, 2nd ed. (2002), §2.2 (AIC in the
 * least-squares form N·ln(σ̂²) + 2K) and §2.4 (AICc, after Hurvich & Tsai 1989).
 * Validity: AICc needs N > k + 1 (returns +Infinity otherwise). Cost O(1).
 * @param criterion "bic" or "aicc"
 * @param pointCount N
 * @param parameterCount k
 * @param sumSquares S, the residual sum of squares (relative residuals here)
 * @param resolution relative resolution of the data (for example 1e-4)
 */
export function fitCriterion(criterion: FitCriterion, pointCount: number, parameterCount: number, sumSquares: number, resolution: number): number {
  const n = pointCount;
  const k = parameterCount;
  const s = Math.max(sumSquares, n * resolution * resolution);
  const fit = n * Math.log(s / n);
  if (criterion === "bic") return fit + k * Math.log(n);
  if (n - k - 1 <= 0) return Number.POSITIVE_INFINITY;
  return fit + 2 * k + (2 * k * (k + 1)) / (n - k - 1);
}
