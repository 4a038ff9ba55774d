/**
 * Eigen-decomposition of complex Hermitian matrices (for FDD: a 16×16 CSD matrix at each of
 * ~1000 lines, so this is the hot path).
 *
 * Method: Householder reduction to Hermitian tridiagonal form [1, §8.3.1], a unitary
 * diagonal scaling that makes the off-diagonal real and non-negative, eigenvalues of the
 * real tridiagonal by implicit QL [2], and only the requested eigenvectors by inverse
 * iteration on the tridiagonal, transformed back through the reflectors [3].
 * Cost ≈ (4/3)n³ complex multiply-adds for the reduction + O(n²) per eigenvector, i.e.
 * about half of a full QL with accumulated vectors when only 1–3 vectors are needed.
 *
 * For a Hermitian positive semi-definite matrix (a CSD matrix) the eigenvalues are its
 * singular values and the eigenvectors its singular vectors [REFERENCES.md, FDD].
 *
 * [1] Golub & Van Loan, Matrix Computations, 4th ed., 2013.
 * [2] Press et al., Numerical Recipes, 3rd ed., §11.4.
 * [3] Anderson et al., LAPACK Users' Guide, 3rd ed. (xHETRD, xSTEIN, xUNMTR).
 */
import { assertInteger } from "@/lib/numeric/validate";
import {
  createInverseIterationScratch,
  hypot2,
  inverseIteration,
  tridiagonalEigenvalues,
  type InverseIterationScratch,
} from "./tridiagonal";

/** Reusable solver for n×n Hermitian matrices; holds all scratch memory (not re-entrant). */
export interface HermitianEigenSolver {
  readonly n: number;
  /**
   * Decomposes the Hermitian matrix stored row-major at `re/im[offset … offset+n²)`
   * (only the lower triangle is read). Writes all n eigenvalues sorted descending into
   * `values` and the first `k` eigenvectors (unit 2-norm) into `vecRe/vecIm` as rows
   * (k × n) starting at `vecOffset`. Internal fast path: no validation.
   */
  solve(
    re: Float64Array,
    im: Float64Array,
    offset: number,
    k: number,
    values: Float64Array,
    vecRe: Float64Array,
    vecIm: Float64Array,
    vecOffset?: number,
  ): void;
}

/**
 * Creates a solver for n×n Hermitian matrices.
 *
 * @param n - matrix order, integer 1…4096.
 * @throws TypeError / RangeError for a bad n.
 */
export function createHermitianEigenSolver(n: number): HermitianEigenSolver {
  assertInteger(n, "n", 1, 4096);
  return new Solver(n);
}

class Solver implements HermitianEigenSolver {
  private readonly ar: Float64Array;
  private readonly ai: Float64Array;
  private readonly tau: Float64Array;
  private readonly d: Float64Array;
  private readonly e: Float64Array;
  private readonly eIm: Float64Array;
  private readonly er: Float64Array;
  private readonly dr: Float64Array;
  private readonly lam: Float64Array;
  private readonly phRe: Float64Array;
  private readonly phIm: Float64Array;
  private readonly pr: Float64Array;
  private readonly pi: Float64Array;
  private readonly z: Float64Array;
  private readonly scratch: InverseIterationScratch;

  constructor(readonly n: number) {
    this.ar = new Float64Array(n * n);
    this.ai = new Float64Array(n * n);
    this.tau = new Float64Array(n);
    this.d = new Float64Array(n);
    this.e = new Float64Array(n);
    this.eIm = new Float64Array(n);
    this.er = new Float64Array(n);
    this.dr = new Float64Array(n);
    this.lam = new Float64Array(n);
    this.phRe = new Float64Array(n);
    this.phIm = new Float64Array(n);
    this.pr = new Float64Array(n);
    this.pi = new Float64Array(n);
    this.z = new Float64Array(n * n);
    this.scratch = createInverseIterationScratch(n);
  }

  solve(re: Float64Array, im: Float64Array, offset: number, k: number, values: Float64Array, vecRe: Float64Array, vecIm: Float64Array, vecOffset = 0): void {
    const n = this.n;
    const { ar, ai } = this;
    // Copy the lower triangle and mirror it: the reduction below updates full rows.
    for (let i = 0; i < n; i++) {
      for (let j = 0; j <= i; j++) {
        const v = offset + i * n + j;
        ar[i * n + j] = re[v];
        ai[i * n + j] = i === j ? 0 : im[v];
        ar[j * n + i] = re[v];
        ai[j * n + i] = i === j ? 0 : -im[v];
      }
    }
    this.reduce();
    const { d, er, dr, lam } = this;
    for (let i = 0; i < n; i++) {
      lam[i] = d[i];
      dr[i] = er[i];
    }
    tridiagonalEigenvalues(lam, dr, n);
    sortDescending(lam, n);
    for (let i = 0; i < n; i++) values[i] = lam[i];
    if (k <= 0) return;
    inverseIteration(d, er, n, lam, k, this.z, this.scratch);
    for (let j = 0; j < k; j++) this.backTransform(j, vecRe, vecIm, vecOffset + j * n);
  }

  /** Householder tridiagonalisation (columns 0…n−3), then the real-off-diagonal scaling. */
  private reduce(): void {
    const n = this.n;
    const { ar, ai, tau, d, e, eIm, er, pr, pi, phRe, phIm } = this;
    for (let k = 0; k < n - 2; k++) {
      const c0 = (k + 1) * n + k;
      let rest = 0;
      for (let r = k + 2; r < n; r++) rest += ar[r * n + k] ** 2 + ai[r * n + k] ** 2;
      const x0r = ar[c0], x0i = ai[c0];
      if (rest === 0) {
        tau[k] = 0; // already tridiagonal in this column: identity reflector
        continue;
      }
      const ax0 = hypot2(x0r, x0i);
      const sigma = Math.sqrt(rest + ax0 * ax0);
      const phr = ax0 === 0 ? 1 : x0r / ax0;
      const phi = ax0 === 0 ? 0 : x0i / ax0;
      // v = x − α e₁ with α = −e^{j arg x₀}σ (no cancellation); v₀ = e^{j arg x₀}(|x₀|+σ).
      ar[c0] = phr * (ax0 + sigma);
      ai[c0] = phi * (ax0 + sigma);
      const t = 1 / (sigma * (sigma + ax0)); // 2/(vᴴv)
      tau[k] = t;
      // p = τ B v on the trailing block B = A[k+1:, k+1:]
      let kr = 0;
      for (let i = k + 1; i < n; i++) {
        let sr = 0, si = 0;
        const row = i * n;
        for (let j = k + 1; j < n; j++) {
          const br = ar[row + j], bi = ai[row + j], vr = ar[j * n + k], vi = ai[j * n + k];
          sr += br * vr - bi * vi;
          si += br * vi + bi * vr;
        }
        pr[i] = t * sr;
        pi[i] = t * si;
        const vr = ar[row + k], vi = ai[row + k];
        kr += vr * pr[i] + vi * pi[i]; // Re(conj(v)·p); vᴴp is real in exact arithmetic
      }
      const K = 0.5 * t * kr;
      for (let i = k + 1; i < n; i++) {
        pr[i] -= K * ar[i * n + k];
        pi[i] -= K * ai[i * n + k];
      }
      // B ← B − v wᴴ − w vᴴ (w held in p)
      for (let i = k + 1; i < n; i++) {
        const vir = ar[i * n + k], vii = ai[i * n + k], wir = pr[i], wii = pi[i];
        const row = i * n;
        for (let j = k + 1; j < n; j++) {
          const vjr = ar[j * n + k], vji = ai[j * n + k], wjr = pr[j], wji = pi[j];
          ar[row + j] -= vir * wjr + vii * wji + wir * vjr + wii * vji;
          ai[row + j] -= vii * wjr - vir * wji + wii * vjr - wir * vji;
        }
      }
      // The sub-diagonal becomes α; keep it aside (column k below the diagonal holds v).
      e[k] = -phr * sigma;
      eIm[k] = -phi * sigma;
    }
    // Collect diagonal and complex off-diagonal, then scale so the off-diagonal is real ≥ 0.
    for (let i = 0; i < n; i++) d[i] = ar[i * n + i];
    phRe[0] = 1;
    phIm[0] = 0;
    for (let k = 0; k < n - 1; k++) {
      let offR: number, offI: number;
      if (k < n - 2 && tau[k] !== 0) {
        offR = e[k];
        offI = eIm[k];
      } else {
        offR = ar[(k + 1) * n + k];
        offI = ai[(k + 1) * n + k];
      }
      const mag = hypot2(offR, offI);
      // δ_{k+1} = δ_k · e_k/|e_k| makes conj(δ_{k+1}) e_k δ_k = |e_k|
      if (mag > 0) {
        const ur = offR / mag, ui = offI / mag;
        phRe[k + 1] = phRe[k] * ur - phIm[k] * ui;
        phIm[k + 1] = phRe[k] * ui + phIm[k] * ur;
      } else {
        phRe[k + 1] = phRe[k];
        phIm[k + 1] = phIm[k];
      }
      er[k] = mag;
    }
    er[n - 1] = 0;
  }

  /** x = Q·D·z for eigenvector row j of the real tridiagonal, written at `out`. */
  private backTransform(j: number, vecRe: Float64Array, vecIm: Float64Array, out: number): void {
    const n = this.n;
    const { ar, ai, tau, phRe, phIm, z } = this;
    for (let i = 0; i < n; i++) {
      const zi = z[j * n + i];
      vecRe[out + i] = phRe[i] * zi;
      vecIm[out + i] = phIm[i] * zi;
    }
    for (let k = n - 3; k >= 0; k--) {
      const t = tau[k];
      if (t === 0) continue;
      // y ← y − τ v (vᴴ y) on indices k+1…n−1
      let sr = 0, si = 0;
      for (let r = k + 1; r < n; r++) {
        const vr = ar[r * n + k], vi = ai[r * n + k], yr = vecRe[out + r], yi = vecIm[out + r];
        sr += vr * yr + vi * yi;
        si += vr * yi - vi * yr;
      }
      sr *= t;
      si *= t;
      for (let r = k + 1; r < n; r++) {
        const vr = ar[r * n + k], vi = ai[r * n + k];
        vecRe[out + r] -= vr * sr - vi * si;
        vecIm[out + r] -= vr * si + vi * sr;
      }
    }
  }
}

function sortDescending(a: Float64Array, n: number): void {
  for (let i = 1; i < n; i++) {
    const v = a[i];
    let j = i - 1;
    while (j >= 0 && a[j] < v) {
      a[j + 1] = a[j];
      j--;
    }
    a[j + 1] = v;
  }
}

/** A square complex matrix, row-major, separate real and imaginary parts. */
export interface ComplexMatrix {
  rows: number;
  cols: number;
  re: ArrayLike<number>;
  im: ArrayLike<number>;
}

/** Result of {@link eigHermitian}. */
export interface HermitianEigenResult {
  /** All n eigenvalues, sorted descending (real). */
  values: Float64Array;
  /** The first k eigenvectors (unit 2-norm), one per eigenvalue, in the same order. */
  vectors: { re: Float64Array; im: Float64Array }[];
}

/**
 * Eigenvalues (descending) and leading eigenvectors of a Hermitian matrix.
 *
 * @param a - square complex matrix, row-major, finite; Hermitian within
 *   n·max|a|·1e3·ε (only the lower triangle is used).
 * @param vectors - number of leading eigenvectors to return, 0…n; default n.
 * @returns values (sorted descending) and `vectors` unit eigenvectors; for a positive
 *   semi-definite matrix these are its singular values and singular vectors.
 * @throws TypeError for non-numeric or non-finite input; RangeError for a non-square or
 *   non-Hermitian matrix or a bad vector count.
 * @remarks Eigenvectors of a repeated eigenvalue are an orthonormal basis of its subspace
 *   (not unique); each vector is defined up to a unit complex factor.
 */
export function eigHermitian(a: ComplexMatrix, vectors?: number): HermitianEigenResult {
  if (typeof a !== "object" || a === null) throw new TypeError("a must be a matrix { rows, cols, re, im }");
  assertInteger(a.rows, "a.rows", 1, 4096);
  if (a.cols !== a.rows) throw new RangeError(`a must be square (got ${a.rows}×${a.cols})`);
  const n = a.rows;
  const k = vectors ?? n;
  assertInteger(k, "vectors", 0, n);
  const re = Float64Array.from(a.re as ArrayLike<number>);
  const im = Float64Array.from(a.im as ArrayLike<number>);
  if (re.length !== n * n || im.length !== n * n) {
    throw new RangeError(`a.re and a.im must hold rows·cols = ${n * n} values (got ${re.length} and ${im.length})`);
  }
  let maxAbs = 0;
  for (let i = 0; i < n * n; i++) {
    if (!Number.isFinite(re[i]) || !Number.isFinite(im[i])) throw new TypeError(`a must hold finite numbers (got ${re[i]} + ${im[i]}j at index ${i})`);
    maxAbs = Math.max(maxAbs, Math.abs(re[i]), Math.abs(im[i]));
  }
  const tol = n * maxAbs * 1e3 * Number.EPSILON; // rounding of a computed Hermitian product
  for (let i = 0; i < n; i++) {
    for (let j = 0; j <= i; j++) {
      const dr = Math.abs(re[i * n + j] - re[j * n + i]);
      const di = Math.abs(im[i * n + j] + im[j * n + i]);
      if (dr > tol || di > tol) throw new RangeError(`a must be Hermitian (a[${i}][${j}] ≠ conj(a[${j}][${i}]) by ${Math.max(dr, di)} > ${tol})`);
    }
  }
  const solver = createHermitianEigenSolver(n);
  const values = new Float64Array(n);
  const vr = new Float64Array(Math.max(1, k) * n);
  const vi = new Float64Array(Math.max(1, k) * n);
  solver.solve(re, im, 0, k, values, vr, vi, 0);
  const out: { re: Float64Array; im: Float64Array }[] = [];
  for (let j = 0; j < k; j++) out.push({ re: vr.slice(j * n, (j + 1) * n), im: vi.slice(j * n, (j + 1) * n) });
  return { values, vectors: out };
}
