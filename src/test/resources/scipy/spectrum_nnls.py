"""Reference for the relaxation-spectrum inversion: the same regularised NNLS problem solved by SciPy.

Run: python3 spectrum_nnls.py   (writes spectrum_sweep.csv and spectrum_nnls.out beside it)
The sweep is invented: two Maxwell modes (1e5 Pa at 0.01 s, 2e4 Pa at 1 s) and E_e = 1e3 Pa,
41 frequencies 0.01-100 Hz, 2 % log-normal noise (numpy seed 2026). The problem is built exactly as
RelaxationSpectrum builds it: tau grid 10 a decade over 1/w_max..1/w_min widened by 0.5 decade,
rows E', E'' divided by their measured values, unknowns in units of the median |E*|, second
differences times lambda as extra rows, then scipy.optimize.nnls.
"""
import math
import numpy as np
import scipy
from scipy.optimize import nnls

rng = np.random.default_rng(2026)
rows = []
for i in range(41):
    f = 0.01 * 1e4 ** (i / 40.0)
    w = 2 * math.pi * f
    re, im = 1e3, 0.0
    for e, t in ((1e5, 0.01), (2e4, 1.0)):
        x = w * t
        re += e * x * x / (1 + x * x)
        im += e * x / (1 + x * x)
    rows.append((f, re * math.exp(0.02 * rng.standard_normal()), im * math.exp(0.02 * rng.standard_normal())))
with open("spectrum_sweep.csv", "w") as out:
    out.write("# sample: spectrum-check\n# modulus: tensile\n# note: invented data for a cross-check, see spectrum_nnls.py\n")
    out.write("frequency [Hz],storage_modulus [Pa],loss_modulus [Pa]\n")
    for f, re, im in rows:
        out.write("%.17g,%.17g,%.17g\n" % (f, re, im))
# read back what was written, as the Java side reads it
data = [(2 * math.pi * f, re, im) for f, re, im in rows]
wmin = min(d[0] for d in data)
wmax = max(d[0] for d in data)
lo = math.log10(1 / wmax) - 0.5
hi = math.log10(1 / wmin) + 0.5
m = int(math.ceil((hi - lo) * 10)) + 1
tau = np.array([10 ** (lo + (hi - lo) * j / (m - 1)) for j in range(m)])
d = math.log(tau[1] / tau[0])
mags = sorted(math.hypot(re, im) for _, re, im in data)
scale = mags[len(mags) // 2]
K = np.zeros((2 * len(data), m + 1))
for i, (w, re, im) in enumerate(data):
    x = w * tau
    den = 1 + x * x
    K[2 * i, :m] = scale * d * (x * x / den) / re
    K[2 * i + 1, :m] = scale * d * (x / den) / im
    K[2 * i, m] = scale / re
print_lines = ["scipy %s" % scipy.__version__, "points %d" % m]
for lam in (0.1, 0.01):
    L = np.zeros((m - 2, m + 1))
    for i in range(m - 2):
        L[i, i], L[i, i + 1], L[i, i + 2] = lam, -2 * lam, lam
    A = np.vstack([K, L])
    b = np.concatenate([np.ones(2 * len(data)), np.zeros(m - 2)])
    x, _ = nnls(A, b, maxiter=50 * (m + 1))
    print_lines.append("lambda %g" % lam)
    print_lines.append("h " + " ".join("%.12g" % (v * scale) for v in x[:m]))
    print_lines.append("constant %.12g" % (x[m] * scale))
with open("spectrum_nnls.out", "w") as out:
    out.write("\n".join(print_lines) + "\n")
