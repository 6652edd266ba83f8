"""SciPy side of the whole-process fit benchmark: the time of SciPy's fit alone, per sweep.

Reads the tidy table that org.viscarta.bench.WholeProcess writes (sample, frequency [Hz],
storage_modulus [Pa], loss_modulus [Pa]; 20 frequencies a sweep), and fits the zener model to the
first N sweeps with scipy.optimize.least_squares(method="lm"): log residuals of E' and E'',
parameters in log space, the analytic Jacobian, one start (the start Viscarta's Zener.startValues
derives first). Only the fit is timed: not reading, not writing, not Python's start.

Run: python3 src/test/resources/bench/scipy_fit_campaign.py target/bench/whole/fit-small.csv 300
"""
import csv
import sys
import time

import numpy as np
import scipy
from scipy.optimize import least_squares

path, count = sys.argv[1], int(sys.argv[2])
sweeps = {}
with open(path) as f:
    rows = (r for r in f if not r.startswith("#"))
    reader = csv.reader(rows)
    next(reader)
    for name, fr, s, l in reader:
        if name not in sweeps and len(sweeps) == count:
            break
        sweeps.setdefault(name, []).append((float(fr), float(s), float(l)))

times = []
for name, pts in sweeps.items():
    d = np.array(pts)
    w = 2 * np.pi * d[:, 0]
    ln_s, ln_l = np.log(d[:, 1]), np.log(d[:, 2])

    def parts(u):
        er, e1, tau = np.exp(u)
        x = w * tau
        den = 1 + x * x
        return er + e1 * x * x / den, e1 * x / den, er, e1, x, den

    def resid(u):
        s, l, *_ = parts(u)
        return np.concatenate([np.log(s) - ln_s, np.log(l) - ln_l])

    def jac(u):
        s, l, er, e1, x, den = parts(u)
        js = np.column_stack([er / s, e1 * x * x / den / s, e1 * 2 * x * x / (den * den) / s])
        jl = np.column_stack([np.zeros_like(x), np.ones_like(x), (1 - x * x) / den])
        return np.vstack([js, jl])

    start = np.log([0.9 * d[:, 1].min(), max(d[:, 1].max() - d[:, 1].min(), 0.1 * d[:, 1].min()), 1 / w[np.argmax(d[:, 2])]])
    t0 = time.perf_counter()
    least_squares(resid, start, jac=jac, method="lm")
    times.append(time.perf_counter() - t0)

times = np.array(times[20:])  # the first fits warm SciPy up
print(f"scipy {scipy.__version__}: least_squares(lm) zener, one start, {len(times)} sweeps of 20 frequencies: "
      f"median {np.median(times) * 1e6:.0f} us per fit, mean {times.mean() * 1e6:.0f} us")
