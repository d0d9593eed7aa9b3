# Reference values for tests/YieldBench.Core.Tests/Statistics. Produced with:
#   apt-get install -y python3-scipy python3-statsmodels   (Debian 12: scipy 1.10.1, statsmodels 0.13.5)
#   /usr/bin/python3 reference-values.py
import numpy as np
from scipy import stats
x = [1, 2, 3, 4, 10, 12, 18]; y = [9, 15, 19, 20, 45, 55, 78]
print("theil sen 0.07", stats.theilslopes(y, x, 0.07))
print("theil sen 0.95", stats.theilslopes(y, x, 0.95))
air = [80, 80, 75, 62, 62, 62, 62, 62, 58, 58, 58, 58, 58, 58, 50, 50, 50, 50, 50, 56, 70]
loss = [42, 37, 37, 28, 18, 18, 19, 20, 15, 14, 14, 13, 11, 12, 8, 7, 8, 8, 9, 15, 15]
print("theil stackloss air 0.95", stats.theilslopes(loss, air, 0.95))
g1 = [2.9, 3.0, 2.5, 2.6, 3.2]; g2 = [3.8, 2.7, 4.0, 2.4]; g3 = [2.8, 3.4, 3.7, 2.2, 2.0, 3.0]
print("kruskal", stats.kruskal(g1, g2, g3))
a = [0.58, 0.61, 0.55, 0.63, 0.60, 0.57]; b = [0.52, 0.56, 0.54, 0.59, 0.50, 0.53, 0.51]
print("mwu exact", stats.mannwhitneyu(a, b, alternative="two-sided", method="exact"))
ta = [0.58, 0.60, 0.60, 0.62, 0.57, 0.61, 0.59, 0.60, 0.63, 0.58]
tb = [0.56, 0.58, 0.57, 0.60, 0.55, 0.57, 0.58, 0.56, 0.59]
print("mwu asymptotic ties", stats.mannwhitneyu(ta, tb, alternative="two-sided", method="asymptotic", use_continuity=True))
print("chem trim_mean 0.2", stats.trim_mean([2.9,3.1,3.4,3.4,3.7,3.7,2.8,2.5,2.4,2.4,2.7,2.2,5.28,3.37,3.03,3.03,28.95,3.77,3.4,2.2,3.5,3.6,3.7,3.7], 0.2))
rng = np.random.default_rng(11)
n = 2000
xs = np.round(rng.uniform(18, 28, n), 1); ys = np.round(0.6 * xs + rng.standard_t(3, n) * 0.3, 2)
np.savetxt("theilsen2000.txt", np.column_stack([xs, ys]), fmt="%.2f")  # copied into GeneratedSamples.cs
print("theil 2000 0.95", stats.theilslopes(ys, xs, 0.95))
