#!/usr/bin/env python3
"""Reference values for lib/stats (distribution functions, Hotelling T² limits), from SciPy.

Run: /usr/bin/python3 tests/reference/generate_stats_fixtures.py [output_dir]
(default output_dir: tests/reference/fixtures). Writes stats-distributions.json with the
SciPy and NumPy versions used. Pure function evaluations: no random numbers.
"""
import json
import os
import sys

import numpy as np
import scipy
from scipy import stats


def main():
    out_dir = sys.argv[1] if len(sys.argv) > 1 else os.path.join(os.path.dirname(__file__), "fixtures")
    probs = [0.001, 0.01, 0.05, 0.3, 0.5, 0.9, 0.95, 0.99, 0.9973, 0.999]
    chi_df = [1, 2, 3, 4, 7.5, 12, 30, 100]
    f_df = [(1, 5), (2, 10), (3, 47), (4, 30), (4, 96), (6, 12.5), (10, 200)]
    chi2_ppf = [[p, k, float(stats.chi2.ppf(p, k))] for p in probs for k in chi_df]
    chi2_cdf = [[x, k, float(stats.chi2.cdf(x, k))] for x in [0.2, 1.0, 3.3, 9.0, 25.0] for k in chi_df]
    f_ppf = [[p, a, b, float(stats.f.ppf(p, a, b))] for p in probs for (a, b) in f_df]
    f_cdf = [[x, a, b, float(stats.f.cdf(x, a, b))] for x in [0.1, 0.8, 2.0, 5.0] for (a, b) in f_df]
    norm_ppf = [[p, float(stats.norm.ppf(p))] for p in [1e-9, 1e-6, 0.00135, 0.025, 0.2, 0.5, 0.7, 0.975, 0.99865, 1 - 1e-6]]
    hotelling = []
    for p, m in [(1, 30), (2, 20), (2, 50), (3, 100), (4, 100), (4, 500), (6, 365)]:
        alpha = 0.0027
        ucl = p * (m + 1) * (m - 1) / (m * m - m * p) * stats.f.ppf(1 - alpha, p, m - p)
        hotelling.append([p, m, alpha, float(ucl)])
    data = {
        "versions": {"scipy": scipy.__version__, "numpy": np.__version__},
        "chi2Ppf": chi2_ppf, "chi2Cdf": chi2_cdf, "fPpf": f_ppf, "fCdf": f_cdf,
        "normPpf": norm_ppf, "hotellingUcl": hotelling,
    }
    os.makedirs(out_dir, exist_ok=True)
    with open(os.path.join(out_dir, "stats-distributions.json"), "w") as fh:
        json.dump(data, fh, indent=1)
        fh.write("\n")


if __name__ == "__main__":
    main()
