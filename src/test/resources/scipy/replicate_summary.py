"""Check values for ReplicateSummaryTest: mean, sample SD and 95 % Student-t interval of the mean.

Data A of DOMAIN.md section 10.8. Run: python3 replicate_summary.py
"""
import numpy as np
import scipy
from scipy import stats

a = np.array([10.2, 11.5, 9.8, 12.1, 10.9])
m = a.mean()
s = a.std(ddof=1)
lo, hi = stats.t.interval(0.95, len(a) - 1, loc=m, scale=stats.sem(a))
print(f"scipy {scipy.__version__}, numpy {np.__version__}")
print(f"mean {float(m)!r}")
print(f"sd {float(s)!r}")
print(f"ci95 {float(lo)!r} {float(hi)!r}")
