/**
 * Leading left singular vectors of the SSI block Toeplitz matrix T (li × ri, li ≥ ri).
 *
 * Method: eigen decomposition of the small Gram matrix TᵀT = V S² Vᵀ (ri × ri, symmetric,
 * Householder tridiagonalisation + QL in ml-matrix), then U_n = T V_n S_n^{-1} [1, §8.6].
 * It costs li·(ri)² for the product plus O((ri)³), several times less than a full SVD of T,
 * and only the leading ≤ maxOrder directions are needed. Squaring halves the relative
 * precision of small singular values (σ_k/σ_1 ≈ √ε·‖…‖ is lost), so directions with
 * σ_k < 1e-6·σ_1 are treated as numerical rank deficiency: they carry no system
 * information in a correlation matrix whose noise floor is far above that level. Internal.
 *
 * [1] Golub & Van Loan, Matrix Computations, 4th ed. (SVD via the symmetric eigenproblem).
 */
import { EigenvalueDecomposition, Matrix } from "ml-matrix";

/** Left singular vectors (li × k) and singular values (k), k = min(nMax, numerical rank). */
export function leadingLeftSingular(t: Matrix, nMax: number): { u: Matrix; s: number[] } {
  const g = t.transpose().mmul(t);
  const evd = new EigenvalueDecomposition(g, { assumeSymmetric: true });
  const lam = evd.realEigenvalues;
  const v = evd.eigenvectorMatrix;
  const order = lam.map((_, i) => i).sort((a, b) => lam[b] - lam[a]);
  const s1 = Math.sqrt(Math.max(lam[order[0]], 0));
  const keep: number[] = [];
  for (const j of order) {
    if (keep.length >= nMax) break;
    const s = Math.sqrt(Math.max(lam[j], 0));
    if (!(s > 1e-6 * s1)) break;
    keep.push(j);
  }
  const vk = new Matrix(v.rows, keep.length);
  keep.forEach((j, c) => {
    const inv = 1 / Math.sqrt(lam[j]);
    for (let r = 0; r < v.rows; r++) vk.set(r, c, v.get(r, j) * inv);
  });
  return { u: t.mmul(vk), s: keep.map((j) => Math.sqrt(lam[j])) };
}
