"""Reference p-values for groups so far apart that 1 - cdf underflows to 0.

Run: python3 far_apart_groups.py > far_apart_groups.out   (SciPy's survival functions)
The groups are invented: three tight groups of tan δ values at 0.10, 0.30 and 0.50.
"""
import scipy
from scipy import stats

A = [0.100, 0.101, 0.099, 0.1005, 0.0995, 0.1002, 0.0998, 0.1001]
B = [0.300, 0.301, 0.299, 0.3005, 0.2995, 0.3002, 0.2998, 0.3001]
C = [0.500, 0.501, 0.499, 0.5005, 0.4995, 0.5002, 0.4998, 0.5001]
# Welch: two groups far apart, with few degrees of freedom, and with many
W1 = [1.00, 1.01, 0.99]
W2 = [2.00, 2.01, 1.99]

print("scipy", scipy.__version__)
f = stats.f_oneway(A, B, C)
print("anova_f %.12g" % f.statistic)
print("anova_p %.12g" % f.pvalue)
h = stats.kruskal(A, B, C)
print("kruskal_h %.12g" % h.statistic)
print("kruskal_p %.12g" % h.pvalue)
# a Kruskal–Wallis statistic beyond what 24 values can give, straight from the chi-square survival function
print("chi2_sf_400_df2 %.12g" % stats.chi2.sf(400.0, 2))
print("f_sf_1e5_2_21 %.12g" % stats.f.sf(1e5, 2, 21))
w = stats.ttest_ind(A, C, equal_var=False)
print("welch_AC_t %.12g" % w.statistic)
print("welch_AC_p %.12g" % w.pvalue)
