"""The same analysis scripted in SciPy, for the comparison in `npm run bench` (bench/run.ts).

Reads the CSV from disk (numpy.loadtxt, header skipped, the named column), then for each of five
families (normal, lognormal, gamma, Weibull, exponential; location fixed at 0 for the positive
ones, as Plumbline fits them): the maximum-likelihood fit (`scipy.stats.<dist>.fit`), the
equiprobable chi-square test (k = round(2 n^0.4) cells capped at n/5, edges at the fitted model's
quantiles, counts by binary search on the sorted data, dof k - 1 - m) and the Anderson–Darling
statistic A² from logcdf/logsf of the fitted model. Prints one JSON line with the fitted
parameters and statistics. Usage: python3 scripts/bench-scipy.py FILE COLUMN
"""
import json
import sys

import numpy as np
from scipy import stats


def analyse(x: np.ndarray) -> dict:
    """The five fits and both statistics of one sample (the per-series work of a batch, too)."""
    xs = np.sort(x)
    n = xs.size
    k = min(int(round(2 * n ** 0.4)), n // 5)
    i = np.arange(1, n + 1, dtype=np.float64)
    out = {}
    fams = {
        "normal": (stats.norm, {}, 2),
        "lognormal": (stats.lognorm, {"floc": 0}, 2),
        "gamma": (stats.gamma, {"floc": 0}, 2),
        "weibull": (stats.weibull_min, {"floc": 0}, 2),
        "exponential": (stats.expon, {"floc": 0}, 1),
    }
    for name, (dist, fixed, m) in fams.items():
        params = dist.fit(xs, **fixed)
        fitted = dist(*params)
        inner = fitted.ppf(np.arange(1, k) / k)
        counts = np.diff(np.concatenate(([0], np.searchsorted(xs, inner, side="left"), [n])))
        expected = n / k
        chi2 = float(np.sum((counts - expected) ** 2) / expected)
        p_chi2 = float(stats.chi2.sf(chi2, k - 1 - m))
        a2 = float(-n - np.sum((2 * i - 1) * fitted.logcdf(xs) + (2 * (n - i) + 1) * fitted.logsf(xs)) / n)
        out[name] = {"params": [float(p) for p in params], "chi2": chi2, "pChi2": p_chi2, "a2": a2}
    return {"n": int(n), "k": k, "fits": out}


def main() -> None:
    path, column = sys.argv[1], sys.argv[2]
    with open(path, encoding="utf-8") as fh:
        header = fh.readline().strip().split(",")
    col = header.index(column)
    x = np.loadtxt(path, delimiter=",", skiprows=1, usecols=col, dtype=np.float64)
    print(json.dumps(analyse(x)))


if __name__ == "__main__":
    main()
