#!/usr/bin/env python3
"""Reference fixtures for the numerical library, computed with SciPy/NumPy.

Run: /usr/bin/python3 tests/reference/generate_fixtures.py [output_dir]
(default output_dir: tests/reference/fixtures). Deterministic: fixed seeds, inputs are
stored in the fixtures, so the TypeScript tests never need NumPy's generator.

Conventions checked (REFERENCES.md, Spectral estimation):
- our G_ij(f) = E[Y_i Y_j^*] equals scipy.signal.csd(y_j, y_i) (SciPy's csd(x, y) = E[X^* Y]);
- Hann window (periodic, scipy's default for welch/csd), detrend='constant', density scaling.
"""
import json
import os
import sys

import numpy as np
import scipy
import scipy.signal as sig


def welch_fixture(rng):
    fs = 100.0
    n_ch, n = 3, 3000
    t = np.arange(n) / fs
    base = rng.standard_normal((n_ch, n))
    # correlated channels with a shared resonance-like component and a phase lag
    common = np.sin(2 * np.pi * 7.3 * t + 0.4) + 0.5 * rng.standard_normal(n)
    x = base + np.vstack([common, 0.6 * np.roll(common, 3), -0.8 * np.roll(common, 7)])
    x += np.array([[0.3], [-1.2], [2.0]])  # offsets, removed by detrend='constant'
    nperseg, noverlap = 256, 128
    re, im = [], []
    f = None
    for i in range(n_ch):
        row_re, row_im = [], []
        for j in range(n_ch):
            f, g = sig.csd(x[j], x[i], fs=fs, window="hann", nperseg=nperseg, noverlap=noverlap,
                           detrend="constant", scaling="density")
            row_re.append(g.real.tolist())
            row_im.append(g.imag.tolist())
        re.append(row_re)
        im.append(row_im)
    _, pxx = sig.welch(x[0], fs=fs, window="hann", nperseg=nperseg, noverlap=noverlap)
    # singular values of G at a few lines, G[line] = [[G_ij]]
    lines = [0, 19, 40, 64, 128]
    svals = []
    for k in lines:
        g = np.array([[re[i][j][k] + 1j * im[i][j][k] for j in range(n_ch)] for i in range(n_ch)])
        svals.append(np.linalg.svd(g, compute_uv=False).tolist())
    return {
        "fs": fs, "nperseg": nperseg, "noverlap": noverlap,
        "x": x.tolist(), "f": f.tolist(), "re": re, "im": im,
        "welch0": pxx.tolist(), "svdLines": lines, "svdValues": svals,
    }


def hermitian_fixture(rng):
    cases = []
    for n, rank in [(2, 2), (5, 5), (8, 3), (16, 16), (16, 2)]:
        b = rng.standard_normal((n, rank)) + 1j * rng.standard_normal((n, rank))
        a = b @ b.conj().T
        a = 0.5 * (a + a.conj().T)
        s = np.linalg.svd(a, compute_uv=False)
        cases.append({"n": n, "re": a.real.ravel().tolist(), "im": a.imag.ravel().tolist(), "singularValues": s.tolist()})
    return cases


def conditioning_fixture(rng):
    fs = 200.0
    n = 1003  # not a multiple of q: checks the output length and the end samples
    t = np.arange(n) / fs
    x = np.sin(2 * np.pi * 3.0 * t) + 0.3 * np.sin(2 * np.pi * 70.0 * t) + 0.1 * rng.standard_normal(n) + 0.02 * t
    out = {"fs": fs, "x": x.tolist(), "linear": sig.detrend(x, type="linear").tolist(),
           "constant": sig.detrend(x, type="constant").tolist(), "decimate": {}, "firwin": {}}
    for q in (2, 4, 5):
        out["decimate"][str(q)] = sig.decimate(x, q, ftype="fir", zero_phase=True).tolist()
        out["firwin"][str(q)] = sig.firwin(20 * q + 1, 1.0 / q, window="hamming").tolist()
    return out


def main():
    out_dir = sys.argv[1] if len(sys.argv) > 1 else os.path.join(os.path.dirname(__file__), "fixtures")
    os.makedirs(out_dir, exist_ok=True)
    rng = np.random.default_rng(20240611)
    versions = {"scipy": scipy.__version__, "numpy": np.__version__, "python": sys.version.split()[0]}
    files = {
        "welch-csd.json": welch_fixture(rng),
        "hermitian-svd.json": {"cases": hermitian_fixture(rng)},
        "conditioning.json": conditioning_fixture(rng),
    }
    for name, body in files.items():
        body = {"generatedBy": "tests/reference/generate_fixtures.py", "versions": versions, **body}
        with open(os.path.join(out_dir, name), "w") as fh:
            json.dump(body, fh, separators=(",", ":"))
    print("wrote", ", ".join(files), "to", out_dir, "with", versions)


if __name__ == "__main__":
    main()
