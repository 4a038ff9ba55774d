/**
 * Poles and mode shapes of SSI-COV models of increasing order from one SVD [1].
 *
 * With T_{1|i} = U S Vᵀ, the order-n observability matrix is O_n = U_n S_n^{1/2}. The
 * state matrix follows from its shift structure, O_up·A = O_down (least squares), and
 * C is its first block row. Writing O_n = U_n S_n^{1/2} gives A = S^{-1/2} X_n S^{1/2} with
 * X_n = U_up,n⁺ U_down,n: the same eigenvalues, eigenvectors v_A = S^{-1/2} v_X and shapes
 * C v_A = U_1,n v_X, so S cancels. Householder QR of U_up at the largest order, U_up = QR,
 * nests: U_up,n = Q_n R_n, hence X_n = R_n^{-1} (Qᵀ U_down)_{1:n,1:n}; one QR serves every
 * order and each order costs a triangular solve and one n × n eigen decomposition.
 * Discrete poles μ give λ = ln(μ)/Δt, f = |λ|/2π, ζ = −Re λ/|λ| [1]. Internal helper.
 *
 * [1] Peeters & De Roeck, MSSP 13(6):855–878, 1999.
 */
import { EigenvalueDecomposition, Matrix, QrDecomposition } from "ml-matrix";

/** One identified pole of one model order (internal type, also drawn in the diagram). */
export interface SsiPole {
  order: number;
  frequencyHz: number;
  dampingRatio: number;
  /** Complex shape at all channels, normalised so its largest component is 1 + 0j. */
  shape: { re: Float64Array; im: Float64Array };
}

/**
 * Poles of every order in `orders` (each ≤ U.columns), keeping one pole of each complex
 * pair (positive imaginary part) and discarding real eigenvalues (no oscillation).
 */
export function polesByOrder(u: Matrix, l: number, orders: readonly number[], dtS: number): SsiPole[][] {
  const nMax = Math.max(...orders);
  const rows = u.rows;
  const uUp = u.subMatrix(0, rows - l - 1, 0, nMax - 1);
  const uDown = u.subMatrix(l, rows - 1, 0, nMax - 1);
  const qr = new QrDecomposition(uUp);
  const q = qr.orthogonalMatrix; // (rows − l) × nMax
  const rFull = qr.upperTriangularMatrix; // nMax × nMax
  const m = q.transpose().mmul(uDown); // nMax × nMax
  const c = u.subMatrix(0, l - 1, 0, nMax - 1);
  return orders.map((n) => {
    const x = solveUpper(rFull, m, n);
    const evd = new EigenvalueDecomposition(x);
    return polesOf(evd, c, n, l, dtS);
  });
}

/** X = R_n^{-1} M_n (n × n), back substitution column by column. */
function solveUpper(r: Matrix, m: Matrix, n: number): Matrix {
  const x = new Matrix(n, n);
  for (let col = 0; col < n; col++) {
    for (let i = n - 1; i >= 0; i--) {
      let s = m.get(i, col);
      for (let k = i + 1; k < n; k++) s -= r.get(i, k) * x.get(k, col);
      x.set(i, col, s / r.get(i, i));
    }
  }
  return x;
}

function polesOf(evd: EigenvalueDecomposition, c: Matrix, n: number, l: number, dtS: number): SsiPole[] {
  const re = evd.realEigenvalues;
  const im = evd.imaginaryEigenvalues;
  const v = evd.eigenvectorMatrix;
  const poles: SsiPole[] = [];
  for (let j = 0; j < n; j++) {
    // EVD stores a complex pair a ± bi in columns j, j+1 as v_j ± i·v_{j+1} (b > 0 first).
    if (!(im[j] > 0)) continue;
    const mod = Math.hypot(re[j], im[j]);
    const lr = Math.log(mod) / dtS;
    const li = Math.atan2(im[j], re[j]) / dtS;
    const absLambda = Math.hypot(lr, li);
    const shRe = new Float64Array(l);
    const shIm = new Float64Array(l);
    for (let a = 0; a < l; a++) {
      let sr = 0;
      let si = 0;
      for (let k = 0; k < n; k++) {
        const ca = c.get(a, k);
        sr += ca * v.get(k, j);
        si += ca * v.get(k, j + 1);
      }
      shRe[a] = sr;
      shIm[a] = si;
    }
    normaliseComplex(shRe, shIm);
    poles.push({ order: n, frequencyHz: absLambda / (2 * Math.PI), dampingRatio: -lr / absLambda, shape: { re: shRe, im: shIm } });
  }
  return poles;
}

/** Divides the shape by its component of largest modulus (that one becomes 1 + 0j). */
function normaliseComplex(re: Float64Array, im: Float64Array): void {
  let best = 0;
  let arg = 0;
  for (let a = 0; a < re.length; a++) {
    const m2 = re[a] * re[a] + im[a] * im[a];
    if (m2 > best) {
      best = m2;
      arg = a;
    }
  }
  if (best === 0) return;
  const pr = re[arg] / best;
  const pi = -im[arg] / best; // 1/z = conj(z)/|z|²
  for (let a = 0; a < re.length; a++) {
    const r0 = re[a];
    re[a] = r0 * pr - im[a] * pi;
    im[a] = r0 * pi + im[a] * pr;
  }
}
