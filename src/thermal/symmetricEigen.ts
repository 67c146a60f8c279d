/** Eigen-decomposition of a real symmetric matrix: A = V·diag(values)·Vᵀ. */
export interface SymmetricEigen {
  /** eigenvalues, ascending */
  readonly values: number[];
  /** eigenvectors as columns: vectors[i][k] is component i of eigenvector k */
  readonly vectors: number[][];
}

/**
 * Cyclic Jacobi eigenvalue method for a real symmetric matrix.
 *
 * Chosen over a QR method because, for the positive definite matrices thermal networks produce
 * (C^-1/2·G·C^-1/2), Jacobi computes even the smallest eigenvalues to high relative accuracy when
 * time constants span many decades (1 µs to 1e5 s in one network).
 * Source: Golub & Van Loan, Matrix Computations, 4th ed. (2013), §8.5.2–8.5.3 (Algorithms 8.5.2
 * and 8.5.3); Demmel & Veselić, "Jacobi's method is more accurate than QR", SIAM J. Matrix Anal.
 * Appl. 13 (1992).
 * Cost O(n³) per sweep, typically 6–10 sweeps.
 * @param matrix symmetric n×n matrix (only symmetric input is meaningful; it is not checked)
 */
export function symmetricEigen(matrix: readonly (readonly number[])[]): SymmetricEigen {
  const n = matrix.length;
  const a = matrix.map((row) => row.slice());
  const v: number[][] = Array.from({ length: n }, (_, i) => Array.from({ length: n }, (_, j) => (i === j ? 1 : 0)));
  for (let sweep = 0; sweep < 100; sweep++) {
    let off = 0;
    for (let p = 0; p < n; p++) for (let q = p + 1; q < n; q++) off += a[p]![q]! * a[p]![q]!;
    if (off === 0) break;
    let rotated = false;
    for (let p = 0; p < n - 1; p++) {
      for (let q = p + 1; q < n; q++) {
        const apq = a[p]![q]!;
        if (apq === 0) continue;
        const app = a[p]![p]!;
        const aqq = a[q]![q]!;
        // Skip rotations that can no longer change the diagonal (relative test, Golub & Van Loan §8.5.3).
        if (Math.abs(apq) <= 1e-300 || Math.abs(apq) < 1e-18 * Math.sqrt(Math.abs(app * aqq))) {
          a[p]![q] = 0;
          a[q]![p] = 0;
          continue;
        }
        rotated = true;
        const theta = (aqq - app) / (2 * apq);
        const t = Math.sign(theta || 1) / (Math.abs(theta) + Math.sqrt(theta * theta + 1));
        const c = 1 / Math.sqrt(t * t + 1);
        const s = t * c;
        for (let k = 0; k < n; k++) {
          const akp = a[k]![p]!;
          const akq = a[k]![q]!;
          a[k]![p] = c * akp - s * akq;
          a[k]![q] = s * akp + c * akq;
        }
        for (let k = 0; k < n; k++) {
          const apk = a[p]![k]!;
          const aqk = a[q]![k]!;
          a[p]![k] = c * apk - s * aqk;
          a[q]![k] = s * apk + c * aqk;
        }
        a[p]![q] = 0;
        a[q]![p] = 0;
        a[p]![p] = app - t * apq;
        a[q]![q] = aqq + t * apq;
        for (let k = 0; k < n; k++) {
          const vkp = v[k]![p]!;
          const vkq = v[k]![q]!;
          v[k]![p] = c * vkp - s * vkq;
          v[k]![q] = s * vkp + c * vkq;
        }
      }
    }
    if (!rotated) break;
  }
  const order = Array.from({ length: n }, (_, i) => i).sort((i, j) => a[i]![i]! - a[j]![j]!);
  return {
    values: order.map((i) => a[i]![i]!),
    vectors: v.map((row) => order.map((i) => row[i]!)),
  };
}
