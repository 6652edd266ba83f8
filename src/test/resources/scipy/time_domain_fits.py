"""Reference fits of time-domain tests with SciPy, for TimeDomainFitTest.

Data: 30 times log-spaced from 0.005 s to 50 s; a zener stress relaxation
E(t) = E_r + E_1 exp(-t/tau) and a Burgers creep J(t) = 1/E_1 + t/eta_1 + (1 - exp(-E_2 t/eta_2))/E_2,
each value multiplied by exp(0.02 * z) with z from numpy's default_rng(seed 7) (relaxation) and
default_rng(seed 8) (creep). The data are written beside this script (time_domain_data.csv) so the
Java test fits exactly the same numbers. Objective: log residuals ln(model) - ln(data), fitted in the
logarithms of the parameters with least_squares(method="lm"), as Viscarta fits them.
Run: python3 time_domain_fits.py > time_domain_fits.txt
"""
import numpy as np
import scipy
from scipy.optimize import least_squares

t = np.logspace(np.log10(0.005), np.log10(50), 30)
zener_true = np.array([1e4, 3e4, 0.05])
burgers_true = np.array([1e5, 1e4, 5e4, 5e2])


def zener(p, t):
    return p[0] + p[1] * np.exp(-t / p[2])


def burgers(p, t):
    return 1 / p[0] + t / p[1] + (1 - np.exp(-p[2] * t / p[3])) / p[2]


relax = zener(zener_true, t) * np.exp(0.02 * np.random.default_rng(7).standard_normal(t.size))
creep = burgers(burgers_true, t) * np.exp(0.02 * np.random.default_rng(8).standard_normal(t.size))
with open(__file__.replace("time_domain_fits.py", "time_domain_data.csv"), "w") as f:
    f.write("time_s,relaxation_pa,creep_per_pa\n")
    for a, b, c in zip(t, relax, creep):
        f.write(f"{float(a)!r},{float(b)!r},{float(c)!r}\n")

print(f"scipy {scipy.__version__}, numpy {np.__version__}")
for name, fn, data, start in (("zener relaxation", zener, relax, zener_true * 1.5),
                              ("burgers creep", burgers, creep, burgers_true * 0.7)):
    r = least_squares(lambda u: np.log(fn(np.exp(u), t)) - np.log(data), np.log(start), method="lm",
                      xtol=1e-15, ftol=1e-15, gtol=1e-15, max_nfev=20000)
    p = np.exp(r.x)
    print(name, " ".join(repr(float(v)) for v in p), "rss", repr(float(np.sum(r.fun ** 2))))
