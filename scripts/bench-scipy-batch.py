"""The batch analysis scripted in SciPy, for the comparison in `npm run bench` (bench/batch.ts).

Reads a long CSV (`series,value`: one row per value, a key column naming the series), groups the
values by series in file order, and runs on each series the same per-sample work as
scripts/bench-scipy.py (five maximum-likelihood fits with `scipy.stats.<dist>.fit`, the equiprobable
chi-square test and the Anderson–Darling statistic). With LIMIT, only the first LIMIT series are
analysed (the caller scales the time; SciPy's fits take long enough that 10,000 series would hold the
bench for many minutes). Prints one JSON line: series analysed and a checksum of the statistics.
Usage: python3 scripts/bench-scipy-batch.py FILE [LIMIT]
"""
import json
import os
import sys

import numpy as np

sys.path.insert(0, os.path.dirname(os.path.abspath(__file__)))
import importlib.util

_spec = importlib.util.spec_from_file_location("bench_scipy", os.path.join(os.path.dirname(os.path.abspath(__file__)), "bench-scipy.py"))
bench_scipy = importlib.util.module_from_spec(_spec)
_spec.loader.exec_module(bench_scipy)


def main() -> None:
    path = sys.argv[1]
    limit = int(sys.argv[2]) if len(sys.argv) > 2 else None
    series: dict[str, list[float]] = {}
    with open(path, encoding="utf-8") as fh:
        fh.readline()
        for line in fh:
            key, value = line.rstrip("\n").split(",")
            series.setdefault(key, []).append(float(value))
    done = 0
    checksum = 0.0
    for key, values in series.items():
        if limit is not None and done >= limit:
            break
        out = bench_scipy.analyse(np.asarray(values, dtype=np.float64))
        checksum += sum(f["a2"] for f in out["fits"].values())
        done += 1
    print(json.dumps({"series": done, "total": len(series), "checksumA2": checksum}))


if __name__ == "__main__":
    main()
