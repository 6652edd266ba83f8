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

from scipy_zener_fit import zener_problem  # the same residuals, Jacobian and start as the single-fit script

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
    resid, jac, start = zener_problem(d[:, 0], d[:, 1], d[:, 2])
    t0 = time.perf_counter()
    least_squares(resid, start, jac=jac, method="lm")
    times.append(time.perf_counter() - t0)

times = np.array(times[20:])  # the first fits warm SciPy up
print(f"scipy {scipy.__version__}: least_squares(lm) zener, one start, {len(times)} sweeps of 20 frequencies: "
      f"median {np.median(times) * 1e6:.0f} us per fit, mean {times.mean() * 1e6:.0f} us")
