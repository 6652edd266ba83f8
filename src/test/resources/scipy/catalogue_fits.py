"""Cross-check fixture for ScipyCatalogueTest: one noisy sweep per model of the catalogue (plus a
second zener), fitted with scipy.optimize.least_squares(method="lm") on the residuals Viscarta uses
by default (ln M_model - ln M_data for storage and loss moduli), in the same transformed parameters
(log for positive values, logit for exponents in (0, 1), identity for power-law slopes), started
from the truth times 1.3 (slopes plus 0.1).

Writes catalogue_sweeps.csv (the data) and catalogue_fits.csv (SciPy's optimum) beside this file.
Run: python3 catalogue_fits.py
"""
import csv
import os

import numpy as np
import scipy
from scipy.optimize import least_squares

HERE = os.path.dirname(os.path.abspath(__file__))


def fractional_arm(w, tau, a):
    x = (w * tau) ** a
    c, s = np.cos(a * np.pi / 2), np.sin(a * np.pi / 2)
    d = 1 + 2 * x * c + x * x
    return (x * x + x * c) / d, x * s / d


def springpot(w, c, a):
    return c * w ** a * np.cos(a * np.pi / 2), c * w ** a * np.sin(a * np.pi / 2)


MODELS = {
    "springpot": (["c", "alpha"], "LG", springpot),
    "empirical-power-law": (["A", "a", "B", "b"], "LILI",
                            lambda w, A, a, B, b: (A * (w / (2 * np.pi)) ** a, B * (w / (2 * np.pi)) ** b)),
    "springpot-dashpot": (["c", "alpha", "eta"], "LGL",
                          lambda w, c, a, eta: (springpot(w, c, a)[0], springpot(w, c, a)[1] + w * eta)),
    "maxwell": (["E", "tau"], "LL",
                lambda w, E, tau: (E * (w * tau) ** 2 / (1 + (w * tau) ** 2), E * w * tau / (1 + (w * tau) ** 2))),
    "kelvin-voigt": (["E", "eta"], "LL", lambda w, E, eta: (E + 0 * w, w * eta)),
    "zener": (["E_r", "E_1", "tau"], "LLL",
              lambda w, er, e1, tau: (er + e1 * (w * tau) ** 2 / (1 + (w * tau) ** 2), e1 * w * tau / (1 + (w * tau) ** 2))),
    "burgers": (["E_1", "eta_1", "E_2", "eta_2"], "LLLL", None),
    "generalized-maxwell": (["E_inf", "E_1", "E_2", "tau_1", "tau_2"], "LLLLL", None),
    "fractional-kelvin-voigt": (["E", "c", "alpha"], "LLG",
                                lambda w, E, c, a: (E + springpot(w, c, a)[0], springpot(w, c, a)[1])),
    "fractional-maxwell": (["E", "tau", "alpha"], "LLG",
                           lambda w, E, tau, a: tuple(E * g for g in fractional_arm(w, tau, a))),
    "fractional-zener": (["E_r", "E_1", "tau", "alpha"], "LLLG",
                         lambda w, er, e1, tau, a: (er + e1 * fractional_arm(w, tau, a)[0], e1 * fractional_arm(w, tau, a)[1])),
}


def burgers(w, e1, eta1, e2, eta2):
    d = e2 ** 2 + w ** 2 * eta2 ** 2
    jp = 1 / e1 + e2 / d
    jpp = 1 / (w * eta1) + w * eta2 / d
    n = jp ** 2 + jpp ** 2
    return jp / n, jpp / n


def gm2(w, einf, e1, e2, t1, t2):
    s, l = einf + 0 * w, 0 * w
    for e, t in ((e1, t1), (e2, t2)):
        x = w * t
        s = s + e * x * x / (1 + x * x)
        l = l + e * x / (1 + x * x)
    return s, l


MODELS["burgers"] = (MODELS["burgers"][0], MODELS["burgers"][1], burgers)
MODELS["generalized-maxwell"] = (MODELS["generalized-maxwell"][0], MODELS["generalized-maxwell"][1], gm2)

CASES = [
    ("springpot", [1e4, 0.3]),
    ("empirical-power-law", [1e4, 0.2, 2e3, 0.4]),
    ("springpot-dashpot", [1e4, 0.2, 5.0]),
    ("maxwell", [1e5, 0.05]),
    ("kelvin-voigt", [1e4, 50.0]),
    ("zener", [1e4, 3e4, 0.05]),
    ("zener", [2e6, 1e6, 1.5]),
    ("burgers", [1e5, 1e4, 5e4, 5e2]),
    ("generalized-maxwell", [1e3, 1e4, 5e3, 0.01, 1.0]),
    ("fractional-kelvin-voigt", [1e4, 3e3, 0.4]),
    ("fractional-maxwell", [1e5, 0.05, 0.6]),
    ("fractional-zener", [1e4, 3e4, 0.05, 0.6]),
]

to_u = {"L": np.log, "G": lambda v: np.log(v / (1 - v)), "I": lambda v: v}
to_theta = {"L": np.exp, "G": lambda u: 1 / (1 + np.exp(-u)), "I": lambda u: u}

def main():
    rng = np.random.default_rng(20261201)
    f = 0.01 * 1e4 ** (np.arange(20) / 19)
    w = 2 * np.pi * f
    sweeps, fits = [], []
    for k, (model, truth) in enumerate(CASES):
        names, kinds, fn = MODELS[model]
        s, l = fn(w, *truth)
        s = s * np.exp(0.03 * rng.standard_normal(len(f)))
        l = l * np.exp(0.03 * rng.standard_normal(len(f)))
        for fi, si, li in zip(f, s, l):
            sweeps.append([k, model, repr(float(fi)), repr(float(si)), repr(float(li))])

        def theta(u):
            return [to_theta[kd](ui) for kd, ui in zip(kinds, u)]

        def resid(u):
            ms, ml = fn(w, *theta(u))
            return np.concatenate([np.log(ms) - np.log(s), np.log(ml) - np.log(l)])

        start = [to_u[kd](v * 1.3 if kd != "I" else v + 0.1) if kd != "G" else to_u[kd](min(v * 1.3, 0.95))
                 for kd, v in zip(kinds, truth)]
        r = least_squares(resid, start, method="lm", xtol=1e-15, ftol=1e-15, gtol=1e-15, max_nfev=100000)
        rss = float(np.sum(r.fun ** 2))
        for name, value in zip(names, theta(r.x)):
            fits.append([k, model, name, repr(float(value)), repr(rss)])

    with open(os.path.join(HERE, "catalogue_sweeps.csv"), "w", newline="") as fh:
        wr = csv.writer(fh)
        wr.writerow(["case", "model", "frequency_hz", "storage_pa", "loss_pa"])
        wr.writerows(sweeps)
    with open(os.path.join(HERE, "catalogue_fits.csv"), "w", newline="") as fh:
        wr = csv.writer(fh)
        wr.writerow(["case", "model", "parameter", "value", "rss"])
        wr.writerows(fits)
    print(f"scipy {scipy.__version__}, numpy {np.__version__}: {len(CASES)} sweeps fitted")


if __name__ == "__main__":
    main()
