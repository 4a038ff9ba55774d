import { describe, expect, it } from "vitest";
import { createHermitianEigenSolver, eigHermitian } from "@/lib/linalg/hermitian-eigen";
import { createRng } from "@/lib/simulate";

/** A = B Bᴴ with B n×rank of standard complex normals: Hermitian PSD of the given rank. */
function randomPsd(n: number, rank: number, seed: number): { re: Float64Array; im: Float64Array } {
  const rng = createRng(seed);
  const br = Float64Array.from({ length: n * rank }, () => rng.normal());
  const bi = Float64Array.from({ length: n * rank }, () => rng.normal());
  const re = new Float64Array(n * n), im = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      for (let q = 0; q < rank; q++) {
        const ar = br[i * rank + q], ai = bi[i * rank + q], cr = br[j * rank + q], ci = -bi[j * rank + q];
        re[i * n + j] += ar * cr - ai * ci;
        im[i * n + j] += ar * ci + ai * cr;
      }
    }
  }
  return { re, im };
}

describe("eigHermitian", () => {
  for (const [n, rank] of [[1, 1], [2, 2], [7, 7], [16, 16], [16, 3], [16, 1], [12, 0]]) {
    it(`gives A v = λ v and orthonormal vectors for a ${n}×${n} matrix of rank ${rank}`, () => {
      const a = randomPsd(n, rank, 100 * n + rank);
      const { values, vectors } = eigHermitian({ rows: n, cols: n, ...a });
      let scale = 0;
      for (let i = 0; i < n * n; i++) scale = Math.max(scale, Math.abs(a.re[i]), Math.abs(a.im[i]));
      // Identities: residual ‖Av − λv‖ and unitarity VᴴV = I, tolerance 100·n·ε·max|A| [Golub & Van Loan §8.3]
      const tol = 100 * n * Number.EPSILON * Math.max(scale, 1);
      for (let j = 1; j < n; j++) expect(values[j]).toBeLessThanOrEqual(values[j - 1]);
      vectors.forEach((v, j) => {
        for (let i = 0; i < n; i++) {
          let sr = 0, si = 0;
          for (let c = 0; c < n; c++) {
            sr += a.re[i * n + c] * v.re[c] - a.im[i * n + c] * v.im[c];
            si += a.re[i * n + c] * v.im[c] + a.im[i * n + c] * v.re[c];
          }
          expect(Math.hypot(sr - values[j] * v.re[i], si - values[j] * v.im[i])).toBeLessThan(tol);
        }
        vectors.forEach((w, q) => {
          let dr = 0, di = 0;
          for (let i = 0; i < n; i++) {
            dr += v.re[i] * w.re[i] + v.im[i] * w.im[i];
            di += v.re[i] * w.im[i] - v.im[i] * w.re[i];
          }
          expect(Math.abs(Math.hypot(dr, di) - (q === j ? 1 : 0))).toBeLessThan(1e-12);
        });
      });
      // trace identity: Σλ = tr A
      let tr = 0, sum = 0;
      for (let i = 0; i < n; i++) tr += a.re[i * n + i];
      for (const v of values) sum += v;
      expect(Math.abs(sum - tr)).toBeLessThan(tol * n);
    });
  }

  it("finds the eigenvalues 1 ± 1 of [[1, j], [−j, 1]] (analytic)", () => {
    const { values, vectors } = eigHermitian({ rows: 2, cols: 2, re: [1, 0, 0, 1], im: [0, 1, -1, 0] });
    expect(values[0]).toBeCloseTo(2, 14);
    expect(values[1]).toBeCloseTo(0, 14);
    // eigenvector of 2: (1, −j)/√2 up to a phase: |v0| = |v1| = 1/√2
    expect(Math.hypot(vectors[0].re[0], vectors[0].im[0])).toBeCloseTo(Math.SQRT1_2, 12);
  });

  it("refuses non-square, non-Hermitian and non-finite input", () => {
    expect(() => eigHermitian({ rows: 2, cols: 3, re: [1, 2, 3, 4, 5, 6], im: [0, 0, 0, 0, 0, 0] })).toThrow(/square/);
    expect(() => eigHermitian({ rows: 2, cols: 2, re: [1, 2, 3, 1], im: [0, 0, 0, 0] })).toThrow(/Hermitian/);
    expect(() => eigHermitian({ rows: 2, cols: 2, re: [1, Number.NaN, Number.NaN, 1], im: [0, 0, 0, 0] })).toThrow(TypeError);
    expect(() => eigHermitian({ rows: 2, cols: 2, re: [1, 0, 0, 1], im: [0, 0, 0] })).toThrow(RangeError);
    expect(() => eigHermitian({ rows: 2, cols: 2, re: [1, 0, 0, 1], im: [0, 0, 0, 0] }, 3)).toThrow(/vectors must be ≤ 2 \(got 3\)/);
    expect(() => createHermitianEigenSolver(0)).toThrow(RangeError);
  });
});
