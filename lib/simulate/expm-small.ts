/**
 * Matrix exponential of a small dense matrix (a handful of rows), for exact
 * discretisation of modal state-space models.
 *
 * Method: scaling and squaring with a truncated Taylor series [1, method 3]: scale by 2^{−s}
 * so that ‖M‖₁·2^{−s} ≤ 1/2, sum 18 terms (truncation < (1/2)^{19}/19! ≈ 1e−23 relative),
 * square s times. Adequate for the well-scaled 4×4 augmented matrices used here; not a
 * general-purpose expm (no Padé balancing). Internal helper: trusts its caller.
 *
 * [1] Moler & Van Loan, "Nineteen dubious ways to compute the exponential of a matrix,
 *     twenty-five years later", SIAM Rev. 45(1), 2003.
 */

/** e^M for a row-major n×n matrix `m`; returns a new row-major array. */
export function expmSmall(m: Float64Array, n: number): Float64Array {
  let norm = 0;
  for (let j = 0; j < n; j++) {
    let col = 0;
    for (let i = 0; i < n; i++) col += Math.abs(m[i * n + j]);
    norm = Math.max(norm, col);
  }
  const s = norm > 0.5 ? Math.ceil(Math.log2(norm / 0.5)) : 0;
  const scale = 2 ** -s;
  const a = m.map((x) => x * scale);
  const result = identity(n);
  let term = identity(n);
  for (let k = 1; k <= 18; k++) {
    term = multiply(term, a, n);
    for (let i = 0; i < term.length; i++) term[i] /= k;
    for (let i = 0; i < term.length; i++) result[i] += term[i];
  }
  let r = result;
  for (let i = 0; i < s; i++) r = multiply(r, r, n);
  return r;
}

function identity(n: number): Float64Array {
  const out = new Float64Array(n * n);
  for (let i = 0; i < n; i++) out[i * n + i] = 1;
  return out;
}

function multiply(a: Float64Array, b: Float64Array, n: number): Float64Array {
  const out = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    for (let k = 0; k < n; k++) {
      const aik = a[i * n + k];
      if (aik === 0) continue;
      for (let j = 0; j < n; j++) out[i * n + j] += aik * b[k * n + j];
    }
  }
  return out;
}
