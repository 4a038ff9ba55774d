/**
 * Ordinary least squares for the baseline models (internal helper, trusted inputs).
 *
 * Method: Householder QR of the design matrix (ml-matrix) [1]; columns are centred and
 * scaled before the factorisation so that a temperature column (tens of °C) and an
 * intercept do not make the problem needlessly ill-conditioned.
 *
 * [1] Golub & Van Loan, Matrix Computations, 4th ed., §5.3.
 */
import { Matrix, QrDecomposition } from "ml-matrix";

/** Coefficients (intercept first, then one per column) and the residual sum of squares. */
export interface OlsResult {
  intercept: number;
  beta: Float64Array;
  rss: number;
}

/**
 * Fits y ≈ c + Σ_j beta_j·X_j; returns null when the columns are collinear (rank deficient).
 * `columns` are n-long arrays; cost O(n k²) for k columns.
 */
export function fitOls(columns: ReadonlyArray<ArrayLike<number>>, y: ArrayLike<number>): OlsResult | null {
  const n = y.length;
  const k = columns.length;
  const means = columns.map((c) => mean(c));
  const scales = columns.map((c, j) => {
    let s = 0;
    for (let i = 0; i < n; i++) s += (c[i] - means[j]) ** 2;
    return Math.sqrt(s / n);
  });
  if (scales.some((s) => !(s > 0))) return null;
  const ym = mean(y);
  const X = new Matrix(n, k);
  const Y = new Matrix(n, 1);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < k; j++) X.set(i, j, (columns[j][i] - means[j]) / scales[j]);
    Y.set(i, 0, y[i] - ym);
  }
  const beta = new Float64Array(k);
  if (k > 0) {
    const qr = new QrDecomposition(X);
    if (!qr.isFullRank()) return null;
    const b = qr.solve(Y);
    for (let j = 0; j < k; j++) beta[j] = b.get(j, 0) / scales[j];
  }
  let intercept = ym;
  for (let j = 0; j < k; j++) intercept -= beta[j] * means[j];
  let rss = 0;
  for (let i = 0; i < n; i++) {
    let f = intercept;
    for (let j = 0; j < k; j++) f += beta[j] * columns[j][i];
    rss += (y[i] - f) ** 2;
  }
  return { intercept, beta, rss };
}

function mean(a: ArrayLike<number>): number {
  let s = 0;
  for (let i = 0; i < a.length; i++) s += a[i];
  return s / a.length;
}
