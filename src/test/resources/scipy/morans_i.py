"""Moran's I by direct evaluation with numpy, for MoranITest.

A 6 x 5 grid at 10 um spacing with the values below; weights w_ij = 1 for two positions closer
than 15 um (rook neighbours), 0 otherwise and on the diagonal. I = (n / W) sum_ij w_ij z_i z_j /
sum_i z_i^2 with z = x - mean; E[I] = -1/(n-1); variance under the normality assumption
Var = (n^2 S1 - n S2 + 3 W^2) / (W^2 (n^2 - 1)) - E[I]^2, S1 = 1/2 sum_ij (w_ij + w_ji)^2,
S2 = sum_i (sum_j w_ij + sum_j w_ji)^2 (Cliff and Ord 1981). Run: python3 morans_i.py > morans_i.txt
"""
import numpy as np

xs, ys = np.meshgrid(np.arange(6) * 10e-6, np.arange(5) * 10e-6)
xs, ys = xs.ravel(), ys.ravel()
vals = np.array([3.1, 2.9, 3.4, 4.0, 4.2, 4.8, 2.7, 3.0, 3.3, 3.9, 4.4, 4.6, 2.5, 2.8, 3.6, 3.8, 4.5, 5.0,
                 2.2, 2.6, 3.2, 4.1, 4.3, 4.9, 2.0, 2.4, 3.5, 3.7, 4.7, 5.1])
n = vals.size
d = np.hypot(xs[:, None] - xs[None, :], ys[:, None] - ys[None, :])
w = ((d < 15e-6) & (d > 0)).astype(float)
z = vals - vals.mean()
W = w.sum()
I = n / W * (z @ w @ z) / (z @ z)
E = -1 / (n - 1)
S1 = 0.5 * ((w + w.T) ** 2).sum()
S2 = ((w.sum(axis=1) + w.sum(axis=0)) ** 2).sum()
var = (n * n * S1 - n * S2 + 3 * W * W) / (W * W * (n * n - 1)) - E * E
print("values", " ".join(repr(float(v)) for v in vals))
print("I", repr(float(I)))
print("E", repr(float(E)))
print("var", repr(float(var)))
print("z", repr(float((I - E) / np.sqrt(var))))
print("numpy", np.__version__)
