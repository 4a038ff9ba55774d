/**
 * Frequency Domain Decomposition: the singular value decomposition of the CSD matrix at
 * every line [1]. G(f) is Hermitian positive semi-definite, so its singular values are its
 * eigenvalues and its singular vectors its eigenvectors (REFERENCES.md, FDD); the complex
 * Hermitian eigen-solver of lib/linalg is used line by line.
 *
 * [1] Brincker, Zhang & Andersen, Smart Mater. Struct. 10(3):441, 2001.
 */
import { createHermitianEigenSolver } from "@/lib/linalg/hermitian-eigen";
import { assertInteger } from "@/lib/numeric/validate";
import type { CsdMatrix } from "@/lib/signal/welch-csd";

/** Singular values and leading singular vectors of G(f) at every line. */
export interface FddDecomposition {
  nChannels: number;
  nLines: number;
  frequencyHz: Float64Array;
  lineSpacingHz: number;
  sampleRateHz: number;
  nperseg: number;
  averages: number;
  /** s[r][k]: the (r+1)-th singular value at line k, u²/Hz; r < min(n, 3). */
  singularValues: Float64Array[];
  /** Number of singular vectors kept per line (≤ n). */
  nVectors: number;
  /** Vectors, layout [line][rank][channel]: element (k, r, i) at (k·nVectors + r)·n + i; unit 2-norm. */
  vectorsRe: Float64Array;
  vectorsIm: Float64Array;
}

/**
 * Decomposes a CSD matrix line by line.
 *
 * @param csd - from estimateCsdMatrix (line-major Hermitian matrices).
 * @param vectors - singular vectors kept per line, integer 1…n; default min(n, 3)
 *   (EFDD compares a mode shape with the first three vectors around a peak).
 * @returns singular values s₁ ≥ s₂ ≥ s₃ per line (u²/Hz; negative rounding residue is
 *   clamped to 0) and the leading vectors.
 * @throws TypeError when `csd` is not a CSD matrix; RangeError for a bad vector count.
 * Cost: per line (4/3)n³ complex multiply-adds + O(n²) per vector.
 */
export function decomposeCsdMatrix(csd: CsdMatrix, vectors?: number): FddDecomposition {
  if (typeof csd !== "object" || csd === null || !(csd.re instanceof Float64Array) || !(csd.im instanceof Float64Array)) {
    throw new TypeError("csd must be a CsdMatrix (from estimateCsdMatrix)");
  }
  const n = csd.nChannels;
  assertInteger(n, "csd.nChannels", 1, 4096);
  if (csd.re.length !== csd.nLines * n * n || csd.im.length !== csd.re.length) {
    throw new RangeError(`csd.re/im must hold nLines·n² = ${csd.nLines * n * n} values (got ${csd.re.length})`);
  }
  const k = vectors ?? Math.min(n, 3);
  assertInteger(k, "vectors", 1, n);
  const nSv = Math.min(n, 3);
  const solver = createHermitianEigenSolver(n);
  const values = new Float64Array(n);
  const s: Float64Array[] = [];
  for (let r = 0; r < nSv; r++) s.push(new Float64Array(csd.nLines));
  const vr = new Float64Array(csd.nLines * k * n);
  const vi = new Float64Array(csd.nLines * k * n);
  const nn = n * n;
  for (let line = 0; line < csd.nLines; line++) {
    solver.solve(csd.re, csd.im, line * nn, k, values, vr, vi, line * k * n);
    for (let r = 0; r < nSv; r++) s[r][line] = values[r] > 0 ? values[r] : 0;
  }
  return {
    nChannels: n,
    nLines: csd.nLines,
    frequencyHz: csd.frequencyHz,
    lineSpacingHz: csd.lineSpacingHz,
    sampleRateHz: csd.sampleRateHz,
    nperseg: csd.nperseg,
    averages: csd.averages,
    singularValues: s,
    nVectors: k,
    vectorsRe: vr,
    vectorsIm: vi,
  };
}

/** Copies singular vector `rank` (0-based) at `line` (internal helper; trusts indices). */
export function singularVector(fdd: FddDecomposition, line: number, rank: number): { re: Float64Array; im: Float64Array } {
  const n = fdd.nChannels;
  const o = (line * fdd.nVectors + rank) * n;
  return { re: fdd.vectorsRe.slice(o, o + n), im: fdd.vectorsIm.slice(o, o + n) };
}

/** MAC between a vector and singular vector `rank` at `line`, without allocation (internal). */
export function macWithVector(fdd: FddDecomposition, line: number, rank: number, re: ArrayLike<number>, im: ArrayLike<number>): number {
  const n = fdd.nChannels;
  const o = (line * fdd.nVectors + rank) * n;
  let cr = 0, ci = 0, aa = 0, bb = 0;
  for (let i = 0; i < n; i++) {
    const ar = re[i], ai = im[i], br = fdd.vectorsRe[o + i], bi = fdd.vectorsIm[o + i];
    cr += ar * br + ai * bi;
    ci += ar * bi - ai * br;
    aa += ar * ar + ai * ai;
    bb += br * br + bi * bi;
  }
  return aa === 0 || bb === 0 ? 0 : (cr * cr + ci * ci) / (aa * bb);
}
