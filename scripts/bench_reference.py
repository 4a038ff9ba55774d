#!/usr/bin/env python3
"""SciPy/NumPy reference timing of the FDD chain for `npm run bench`.

Usage: bench_reference.py <record.f32> <channels> <fs> <nperseg> <runs>
The record is float32 little-endian, interleaved sample by sample. Times the same work as
the TypeScript chain's spectral part: the full CSD matrix with scipy.signal.csd (Hann,
50 % overlap, density; csd(y_j, Y) = G[:, j]) and numpy.linalg.svd
of G at every line (singular values and vectors). One csd call per column j over
channels i ≥ j (the Hermitian half), mirrored. Single-threaded BLAS, like one core.
Prints one JSON line: {"medianMs", "runsMs", "scipy", "numpy"}.
"""
import os

for var in ("OMP_NUM_THREADS", "OPENBLAS_NUM_THREADS", "MKL_NUM_THREADS"):
    os.environ[var] = "1"

import json  # noqa: E402
import sys  # noqa: E402
import time  # noqa: E402

import numpy as np  # noqa: E402
import scipy  # noqa: E402
import scipy.signal as sig  # noqa: E402


def chain(y, fs, nperseg):
    n = y.shape[0]
    g = None
    for j in range(n):
        # lower triangle of column j only (G is Hermitian), as our code does
        f, col = sig.csd(y[j][None, :], y[j:], fs=fs, window="hann", nperseg=nperseg,
                         noverlap=nperseg // 2, detrend="constant", scaling="density")
        if g is None:
            g = np.empty((col.shape[-1], n, n), dtype=complex)
        g[:, j:, j] = col.T  # G_ij = csd(y_j, y_i), i >= j
        g[:, j, j:] = col.T.conj()
    u, s, vh = np.linalg.svd(g)
    return f, s, u[:, :, 0]


def main():
    path, n, fs, nperseg, runs = sys.argv[1], int(sys.argv[2]), float(sys.argv[3]), int(sys.argv[4]), int(sys.argv[5])
    y = np.fromfile(path, dtype="<f4").astype(np.float64).reshape(-1, n).T.copy()
    chain(y, fs, nperseg)  # warm-up (imports, FFT plans)
    times = []
    for _ in range(runs):
        t0 = time.perf_counter()
        chain(y, fs, nperseg)
        times.append((time.perf_counter() - t0) * 1000)
    print(json.dumps({"medianMs": float(np.median(times)), "runsMs": times, "scipy": scipy.__version__, "numpy": np.__version__}))


if __name__ == "__main__":
    main()
