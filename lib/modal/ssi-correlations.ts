/**
 * Output correlations and the block Toeplitz matrix of reference-based covariance-driven
 * stochastic subspace identification [1].
 *
 * R_k = E[y_{m+k} y_ref,mᵀ] (l × r, l channels, r references) is estimated unbiasedly as
 * (1/(N−k)) Σ_m y_{m+k} y_ref,mᵀ after removing each channel's mean. The Toeplitz matrix
 *   T_{1|i} = [[R_i, R_{i−1}, …, R_1], [R_{i+1}, R_i, …, R_2], …, [R_{2i−1}, …, R_i]]
 * (li × ri) factors as O_i·Γ_i^ref, so its column space is that of the observability matrix.
 * Lags are few (2i − 1, tens) and records long, so direct sums (l·r·2i·N multiply-adds,
 * inner loop over contiguous samples) beat an FFT route here. Internal helpers.
 *
 * [1] Peeters & De Roeck, "Reference-based stochastic subspace identification for
 *     output-only modal analysis", MSSP 13(6):855–878, 1999.
 */
import { Matrix } from "ml-matrix";

/** Channels with their mean removed (new arrays; the record is not touched). */
export function centre(data: readonly ArrayLike<number>[]): Float64Array[] {
  return data.map((x) => {
    let s = 0;
    for (let k = 0; k < x.length; k++) s += x[k];
    const mean = s / x.length;
    const out = new Float64Array(x.length);
    for (let k = 0; k < x.length; k++) out[k] = x[k] - mean;
    return out;
  });
}

/**
 * Correlations R_0 … R_maxLag; R_k stored row-major l × r in `out[k]`.
 * `y` are centred channels, `refs` indices into `y`.
 */
export function outputCorrelations(y: readonly Float64Array[], refs: readonly number[], maxLag: number): Float64Array[] {
  const l = y.length;
  const r = refs.length;
  const n = y[0].length;
  const out: Float64Array[] = [];
  for (let k = 0; k <= maxLag; k++) {
    const rk = new Float64Array(l * r);
    const len = n - k;
    for (let c = 0; c < l; c++) {
      const yc = y[c];
      for (let j = 0; j < r; j++) {
        const yr = y[refs[j]];
        let s = 0;
        for (let m = 0; m < len; m++) s += yc[m + k] * yr[m];
        rk[c * r + j] = s / len;
      }
    }
    out.push(rk);
  }
  return out;
}

/** The li × ri block Toeplitz matrix T_{1|i} from R_1 … R_{2i−1} (see header). */
export function blockToeplitz(corr: readonly Float64Array[], l: number, r: number, i: number): Matrix {
  const t = new Matrix(l * i, r * i);
  for (let br = 0; br < i; br++) {
    for (let bc = 0; bc < i; bc++) {
      const rk = corr[i + br - bc]; // block (br, bc) = R_{i + br − bc}
      for (let a = 0; a < l; a++) {
        for (let b = 0; b < r; b++) t.set(br * l + a, bc * r + b, rk[a * r + b]);
      }
    }
  }
  return t;
}
