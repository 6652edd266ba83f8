"""SciPy side of the single-fit benchmark (PRODUCT.md: Viscarta's fit must be >= 100x faster).

Fits the zener model jointly to ln E' and ln E'' with scipy.optimize.least_squares(method="lm"),
parameters in log space and the analytic Jacobian, from one start, on the sweep that
org.viscarta.bench.Benchmarks writes to target/bench/zener-sweep.csv.

Run: python3 src/test/resources/bench/scipy_zener_fit.py target/bench/zener-sweep.csv
The fitted values printed here for src/test/resources/scipy/zener-sweep.csv (a copy of that sweep)
are kept in src/test/resources/scipy/zener-sweep.out and checked by ScipyCrossCheckTest.
"""
import sys
import time

import numpy as np
import scipy
from scipy.optimize import least_squares



def zener_problem(freq, storage, loss):
    """Residuals, analytic Jacobian and first start of the zener fit to one sweep (arrays in Hz and Pa):
    log residuals of E' and E'' jointly, parameters ln(E_r, E_1, tau)."""
    w = 2 * np.pi * freq
    ln_s, ln_l = np.log(storage), np.log(loss)

    def model(u):
        er, e1, tau = np.exp(u)
        x = w * tau
        d = 1 + x * x
        return er + e1 * x * x / d, e1 * x / d, er, e1, x, d

    def resid(u):
        s, l, *_ = model(u)
        return np.concatenate([np.log(s) - ln_s, np.log(l) - ln_l])

    def jac(u):
        s, l, er, e1, x, d = model(u)
        js = np.column_stack([er / s, e1 * x * x / d / s, e1 * 2 * x * x / (d * d) / s])
        jl = np.column_stack([np.zeros_like(x), np.ones_like(x), (1 - x * x) / d])
        return np.vstack([js, jl])

    # the same first start as Viscarta's Zener.startValues: 0.9 min E', spread, 1/omega at the E'' peak
    start = np.log([0.9 * storage.min(), max(storage.max() - storage.min(), 0.1 * storage.min()), 1 / w[np.argmax(loss)]])
    return resid, jac, start


if __name__ == "__main__":
    data = np.loadtxt(sys.argv[1], delimiter=",", skiprows=1)
    resid, jac, start = zener_problem(data[:, 0], data[:, 1], data[:, 2])
    for _ in range(50):
        least_squares(resid, start, jac=jac, method="lm", xtol=1e-14, ftol=1e-14, gtol=1e-14)
    times = []
    for _ in range(500):
        t0 = time.perf_counter()
        r = least_squares(resid, start, jac=jac, method="lm", xtol=1e-14, ftol=1e-14, gtol=1e-14)
        times.append(time.perf_counter() - t0)
    print(f"scipy {scipy.__version__}: least_squares(lm) zener, 20 frequencies, one start: "
          f"median {np.median(times) * 1e6:.1f} us")
    print("E_r", repr(float(np.exp(r.x[0]))))
    print("E_1", repr(float(np.exp(r.x[1]))))
    print("tau", repr(float(np.exp(r.x[2]))))
    print("rss", repr(float(2 * r.cost)))
