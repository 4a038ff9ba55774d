/**
 * Our spectral estimates, eigen-solver and conditioning against SciPy/NumPy fixtures made by
 * tests/reference/generate_fixtures.py [lib] (versions recorded inside each fixture).
 */
import { describe, expect, it } from "vitest";
import welch from "./fixtures/welch-csd.json";
import herm from "./fixtures/hermitian-svd.json";
import cond from "./fixtures/conditioning.json";
import { estimateCsdMatrix } from "@/lib/signal/welch-csd";
import { eigHermitian } from "@/lib/linalg/hermitian-eigen";
import { decimate, firLowpass } from "@/lib/signal/decimate";
import { removeLinearTrend, removeMean } from "@/lib/signal/detrend";

function maxAbs(a: ArrayLike<number>): number {
  let m = 0;
  for (let i = 0; i < a.length; i++) m = Math.max(m, Math.abs(a[i]));
  return m;
}

describe(`estimateCsdMatrix vs scipy.signal.csd (SciPy ${welch.versions.scipy})`, () => {
  const csd = estimateCsdMatrix(welch.x, welch.fs, { nperseg: welch.nperseg, noverlap: welch.noverlap });
  const n = welch.x.length;

  it("has SciPy's frequency grid", () => {
    expect(csd.nLines).toBe(welch.f.length);
    welch.f.forEach((f, k) => expect(csd.frequencyHz[k]).toBeCloseTo(f, 12));
  });

  it("matches G_ij = csd(y_j, y_i) at every line to 1e-10 of the largest value", () => {
    // [lib] REFERENCES.md: SciPy's csd(x, y) = E[X* Y], so G_ij = csd(y_j, y_i)
    let scale = 0;
    for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) scale = Math.max(scale, maxAbs(welch.re[i][j]), maxAbs(welch.im[i][j]));
    let err = 0;
    for (let k = 0; k < csd.nLines; k++) {
      for (let i = 0; i < n; i++) {
        for (let j = 0; j < n; j++) {
          const o = k * n * n + i * n + j;
          err = Math.max(err, Math.abs(csd.re[o] - welch.re[i][j][k]), Math.abs(csd.im[o] - welch.im[i][j][k]));
        }
      }
    }
    expect(err / scale).toBeLessThan(1e-10);
  });

  it("has the diagonal of scipy.signal.welch", () => {
    const scale = maxAbs(welch.welch0);
    welch.welch0.forEach((p, k) => expect(Math.abs(csd.re[k * n * n] - p) / scale).toBeLessThan(1e-10));
  });

  it("gives the singular values of numpy.linalg.svd at sample lines", () => {
    welch.svdLines.forEach((k, idx) => {
      const m = { rows: n, cols: n, re: csd.re.slice(k * n * n, (k + 1) * n * n), im: csd.im.slice(k * n * n, (k + 1) * n * n) };
      const { values } = eigHermitian(m, 0);
      const ref = welch.svdValues[idx];
      ref.forEach((s, r) => expect(Math.abs(values[r] - s)).toBeLessThan(1e-10 * ref[0] + 1e-300));
    });
  });
});

describe(`eigHermitian vs numpy.linalg.svd (NumPy ${herm.versions.numpy})`, () => {
  for (const c of herm.cases) {
    it(`matches the singular values of a ${c.n}×${c.n} PSD matrix within n·ε·s₁·100`, () => {
      const { values } = eigHermitian({ rows: c.n, cols: c.n, re: c.re, im: c.im }, 0);
      // Tolerance: backward-stable reductions err by O(n·ε·‖A‖) [Golub & Van Loan §8.3]
      const tol = 100 * c.n * Number.EPSILON * c.singularValues[0];
      c.singularValues.forEach((s, r) => expect(Math.abs(Math.max(values[r], 0) - s)).toBeLessThan(tol));
    });
  }
});

describe(`conditioning vs scipy.signal (SciPy ${cond.versions.scipy})`, () => {
  it("removes the mean and the linear trend as scipy.signal.detrend", () => {
    const lin = removeLinearTrend(cond.x);
    const con = removeMean(cond.x);
    cond.linear.forEach((v, i) => expect(lin[i]).toBeCloseTo(v, 12));
    cond.constant.forEach((v, i) => expect(con[i]).toBeCloseTo(v, 12));
  });
  for (const q of [2, 4, 5]) {
    it(`designs firwin(${20 * q + 1}, 1/${q}, 'hamming') and decimates as decimate(x, ${q}, ftype='fir')`, () => {
      const key = String(q) as "2" | "4" | "5";
      const h = firLowpass(20 * q + 1, 1 / q);
      cond.firwin[key].forEach((v, i) => expect(h[i]).toBeCloseTo(v, 14));
      const y = decimate(cond.x, q);
      expect(y.length).toBe(cond.decimate[key].length);
      cond.decimate[key].forEach((v, i) => expect(y[i]).toBeCloseTo(v, 12));
    });
  }
});
