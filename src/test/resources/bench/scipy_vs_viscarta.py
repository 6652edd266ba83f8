"""Side-by-side speed of SciPy and Viscarta on the same sweeps (one per model of the catalogue).

org.viscarta.bench.Benchmarks writes target/bench/catalogue-sweeps.csv and its own timings to
target/bench/viscarta-fit-times.csv. This script fits the same sweeps with
scipy.optimize.least_squares(method="lm") on the same log residuals and parameter transforms,
from one start (the truth used by catalogue_fits.py's cases is not known here, so SciPy starts
from Viscarta's own first data-derived start is not available either: it starts from a generic
guess refined by a first SciPy fit, then is timed from that guess), and prints the ratio.

Run from the repository's top folder after the Java benchmark:
    python3 src/test/resources/bench/scipy_vs_viscarta.py target/bench
"""
import csv
import os
import sys
import time

import numpy as np
import scipy
from scipy.optimize import least_squares

sys.path.insert(0, os.path.join(os.path.dirname(os.path.abspath(__file__)), "..", "scipy"))
from catalogue_fits import MODELS, to_theta, to_u  # noqa: E402  (the model definitions of the SciPy fixture)

folder = sys.argv[1]
rows = list(csv.DictReader(open(os.path.join(folder, "catalogue-sweeps.csv"))))
times = {int(r["case"]): r for r in csv.DictReader(open(os.path.join(folder, "viscarta-fit-times.csv")))}
cases = {}
for r in rows:
    cases.setdefault(int(r["case"]), (r["model"], []))[1].append([float(r["frequency_hz"]), float(r["storage_pa"]), float(r["loss_pa"])])

print(f"scipy {scipy.__version__}, numpy {np.__version__}")
print(f"{'model':24s} {'SciPy µs':>10s} {'Viscarta µs (1 start)':>22s} {'ratio':>7s} {'Viscarta µs (all starts)':>25s} {'ratio':>7s}")
for k, (model, data) in sorted(cases.items()):
    names, kinds, fn = MODELS[model]
    d = np.array(data)
    w = 2 * np.pi * d[:, 0]
    s, l = d[:, 1], d[:, 2]

    def resid(u):
        th = [to_theta[kd](ui) for kd, ui in zip(kinds, u)]
        ms, ml = fn(w, *th)
        return np.concatenate([np.log(ms) - np.log(s), np.log(ml) - np.log(l)])

    # a start one would use without Viscarta's heuristics: moduli near the data, times at the window centre
    guess = []
    for name, kd in zip(names, kinds):
        if kd == "G":
            guess.append(to_u["G"](0.5))
        elif kd == "I":
            guess.append(0.0)
        elif name.startswith("tau") or name.startswith("eta"):
            guess.append(np.log(1 / np.sqrt(w[0] * w[-1]) * (np.median(s) if name.startswith("eta") else 1)))
        else:
            guess.append(np.log(np.median(s)))
    start = least_squares(resid, guess, method="lm").x * 0.98
    for _ in range(20):
        least_squares(resid, start, method="lm", xtol=1e-12, ftol=1e-12)
    ts = []
    for _ in range(100):
        t0 = time.perf_counter()
        least_squares(resid, start, method="lm", xtol=1e-12, ftol=1e-12)
        ts.append(time.perf_counter() - t0)
    sp = np.median(ts) * 1e6
    one = float(times[k]["viscarta_median_us_one_start"])
    allst = float(times[k]["viscarta_median_us_all_starts"])
    print(f"{model:24s} {sp:10.1f} {one:22.1f} {sp / one:7.1f} {allst:25.1f} {sp / allst:7.1f}")
