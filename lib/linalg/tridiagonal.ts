/**
 * Real symmetric tridiagonal kernels used by the Hermitian eigen-solver: eigenvalues by the
 * implicit QL method with Wilkinson shifts [1, tqli], and eigenvectors by inverse iteration
 * with re-orthogonalisation inside clusters, after LAPACK's dstein [2].
 *
 * Internal module: callers (lib/linalg) guarantee array sizes; no validation here.
 *
 * [1] Press et al., Numerical Recipes, 3rd ed., §11.4 (tqli).
 * [2] Anderson et al., LAPACK Users' Guide, 3rd ed., 1999 (xSTEIN).
 */

const EPS = Number.EPSILON;

/**
 * √(a² + b²) without overflow or underflow, by scaling with the larger magnitude.
 * Math.hypot is variadic and several times slower in V8; this sits in the QL inner loop.
 */
export function hypot2(a: number, b: number): number {
  let x = a < 0 ? -a : a;
  let y = b < 0 ? -b : b;
  if (x < y) {
    const t = x;
    x = y;
    y = t;
  }
  if (x === 0) return 0;
  const r = y / x;
  return x * Math.sqrt(1 + r * r);
}

/**
 * Eigenvalues of the tridiagonal matrix with diagonal `d` and off-diagonal `e`
 * (e[i] = T[i, i+1], e[n−1] ignored). Overwrites `d` with the eigenvalues (unsorted) and
 * destroys `e`.
 * @throws Error when QL does not converge in 60 iterations for one eigenvalue (not seen
 *   for Hermitian input; kept as a guard against NaN input).
 */
export function tridiagonalEigenvalues(d: Float64Array, e: Float64Array, n: number): void {
  e[n - 1] = 0;
  for (let l = 0; l < n; l++) {
    let iter = 0;
    let m: number;
    do {
      for (m = l; m < n - 1; m++) {
        const dd = Math.abs(d[m]) + Math.abs(d[m + 1]);
        if (Math.abs(e[m]) <= EPS * dd) break;
      }
      if (m !== l) {
        if (iter++ === 60) throw new Error("tridiagonal QL did not converge in 60 iterations");
        let g = (d[l + 1] - d[l]) / (2 * e[l]);
        let r = hypot2(g, 1);
        g = d[m] - d[l] + e[l] / (g + (g >= 0 ? Math.abs(r) : -Math.abs(r)));
        let s = 1;
        let c = 1;
        let p = 0;
        let i: number;
        let underflow = false;
        for (i = m - 1; i >= l; i--) {
          const f = s * e[i];
          const b = c * e[i];
          r = hypot2(f, g);
          e[i + 1] = r;
          if (r === 0) {
            d[i + 1] -= p;
            e[m] = 0;
            underflow = true;
            break;
          }
          s = f / r;
          c = g / r;
          g = d[i + 1] - p;
          r = (d[i] - g) * s + 2 * c * b;
          p = s * r;
          d[i + 1] = g + p;
          g = c * r - b;
        }
        if (underflow) continue;
        d[l] -= p;
        e[l] = g;
        e[m] = 0;
      }
    } while (m !== l);
  }
}

/** Scratch space for {@link inverseIteration}, sized for n. */
export interface InverseIterationScratch {
  c: Float64Array;
  dg: Float64Array;
  sup: Float64Array;
  b: Float64Array;
}

export function createInverseIterationScratch(n: number): InverseIterationScratch {
  return { c: new Float64Array(n), dg: new Float64Array(n), sup: new Float64Array(n), b: new Float64Array(n) };
}

/**
 * Eigenvectors of the tridiagonal (d, e) for the eigenvalues `lambda[0…k−1]` (sorted
 * descending), written as rows of `z` (k × n, unit 2-norm). Vectors whose eigenvalues lie
 * within 10⁻³‖T‖₁ of each other are re-orthogonalised by modified Gram–Schmidt, as dstein.
 */
export function inverseIteration(
  d: Float64Array,
  e: Float64Array,
  n: number,
  lambda: Float64Array,
  k: number,
  z: Float64Array,
  s: InverseIterationScratch,
): void {
  let tnorm = 0;
  for (let i = 0; i < n; i++) {
    const row = Math.abs(d[i]) + (i > 0 ? Math.abs(e[i - 1]) : 0) + (i < n - 1 ? Math.abs(e[i]) : 0);
    if (row > tnorm) tnorm = row;
  }
  if (tnorm === 0) tnorm = 1;
  const ortol = 1e-3 * tnorm;
  const pertol = 10 * EPS * tnorm;
  const tiny = EPS * tnorm;
  let clusterStart = 0;
  let prevShift = Infinity;
  for (let j = 0; j < k; j++) {
    let shift = lambda[j];
    if (j > 0 && lambda[j - 1] - lambda[j] > ortol) clusterStart = j;
    // Equal shifts give identical solves; separate them slightly (dstein's pertol).
    if (shift >= prevShift - pertol) shift = prevShift - pertol;
    prevShift = shift;
    const zo = j * n;
    // Deterministic start vector, different for each j so clusters are spanned.
    let seed = 12345 + 7919 * j;
    for (let i = 0; i < n; i++) {
      seed = (seed * 1103515245 + 12345) % 2147483648;
      z[zo + i] = seed / 2147483648 - 0.5 + 1 / n;
    }
    for (let it = 0; it < 3; it++) {
      for (let i = 0; i < n; i++) s.b[i] = z[zo + i];
      solveShifted(d, e, n, shift, tiny, s);
      for (let i = 0; i < n; i++) z[zo + i] = s.b[i];
      for (let q = clusterStart; q < j; q++) {
        const qo = q * n;
        let dot = 0;
        for (let i = 0; i < n; i++) dot += z[qo + i] * z[zo + i];
        for (let i = 0; i < n; i++) z[zo + i] -= dot * z[qo + i];
      }
      let nrm = 0;
      for (let i = 0; i < n; i++) nrm += z[zo + i] * z[zo + i];
      nrm = Math.sqrt(nrm);
      if (nrm === 0) {
        z[zo + (j % n)] = 1;
        continue;
      }
      for (let i = 0; i < n; i++) z[zo + i] /= nrm;
    }
  }
}

/**
 * Solves (T − shift·I)x = b in place in s.b by Gaussian elimination with partial pivoting
 * (LINPACK dgtsl layout); a zero pivot is replaced by `tiny` so the solve always succeeds,
 * which is what inverse iteration needs (the huge result is normalised afterwards).
 */
function solveShifted(d: Float64Array, e: Float64Array, n: number, shift: number, tiny: number, s: InverseIterationScratch): void {
  const { c, dg, sup, b } = s;
  // Row r is held as (c[r], dg[r], sup[r]) = entries at columns (r−1 | r, r | r+1, r+2):
  // before elimination c[r] is the sub-diagonal; after, the pivot.
  c[0] = d[0] - shift;
  if (n === 1) {
    b[0] /= c[0] === 0 ? tiny : c[0];
    return;
  }
  dg[0] = e[0];
  sup[0] = 0;
  for (let r = 1; r < n; r++) {
    c[r] = e[r - 1];
    dg[r] = d[r] - shift;
    sup[r] = r < n - 1 ? e[r] : 0;
  }
  for (let r = 0; r < n - 1; r++) {
    const r1 = r + 1;
    if (Math.abs(c[r1]) >= Math.abs(c[r])) {
      let t = c[r1]; c[r1] = c[r]; c[r] = t;
      t = dg[r1]; dg[r1] = dg[r]; dg[r] = t;
      t = sup[r1]; sup[r1] = sup[r]; sup[r] = t;
      t = b[r1]; b[r1] = b[r]; b[r] = t;
    }
    if (c[r] === 0) c[r] = tiny;
    const t = -c[r1] / c[r];
    c[r1] = dg[r1] + t * dg[r];
    dg[r1] = sup[r1] + t * sup[r];
    sup[r1] = 0;
    b[r1] += t * b[r];
  }
  if (c[n - 1] === 0) c[n - 1] = tiny;
  b[n - 1] /= c[n - 1];
  b[n - 2] = (b[n - 2] - dg[n - 2] * b[n - 1]) / c[n - 2];
  for (let r = n - 3; r >= 0; r--) b[r] = (b[r] - dg[r] * b[r + 1] - sup[r] * b[r + 2]) / c[r];
}
