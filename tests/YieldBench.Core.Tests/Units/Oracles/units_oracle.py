"""Reference values for the units and conversion tests, computed outside the project.

Run with Debian's Python and SciPy (apt-get install -y python3-scipy; measured with python3 3.11.2,
python3-numpy 1:1.24.2-1+deb12u1, python3-scipy 1.10.1-2):

    /usr/bin/python3 tests/YieldBench.Core.Tests/Units/Oracles/units_oracle.py

Every printed value is quoted beside its assertion in the C# tests.
"""
import numpy as np
import scipy
from scipy.interpolate import PchipInterpolator
from scipy.optimize import brentq

WATER, AIR = 0.99820, 0.0012


def brix_from_sg(s):  # NBS-fitted cubic, apparent SG 20/20
    return ((182.4601 * s - 775.6821) * s + 1262.7794) * s - 669.5622


def sg_from_brix(b):
    return brentq(lambda s: brix_from_sg(s) - b, 0.9, 1.4, xtol=1e-15, rtol=1e-15)


def density(b):  # g/mL at 20 °C, the project's rule SG x 0.99820 (air buoyancy neglected)
    return sg_from_brix(b) * WATER


def solids(b):
    return b * 10 * density(b)


ROWS = [(10.0, 82.2), (15.0, 136.1), (20.0, 191.9), (22.0, 214.7), (24.0, 237.8),
        (25.0, 249.5), (26.0, 261.2), (28.0, 284.9), (30.0, 308.9)]
B = np.array([r[0] for r in ROWS])
S = np.array([r[1] for r in ROWS])
NS = np.array([solids(b) for b in B]) - S
curve = PchipInterpolator(B, NS)


def sugar(x):
    return max(0.0, solids(x) - float(curve(min(max(x, 10.0), 30.0))))


print("scipy", scipy.__version__)
print("S=1.040 ->", brix_from_sg(1.040))
print("between rows", {x: sugar(x) for x in [10.5, 12.0, 12.5, 17.5, 21.0, 23.3, 25.5, 27.0, 29.0]})
print("outside", {x: sugar(x) for x in [5.0, 40.0]})
print("sugar starts at", brentq(lambda b: solids(b) - NS[0], 1, 5, xtol=1e-14))
loo = []
for k in range(1, len(B) - 1):
    m = np.ones(len(B), bool)
    m[k] = False
    loo.append(solids(B[k]) - float(PchipInterpolator(B[m], NS[m])(B[k])) - S[k])
print("leave-one-out worst", max(abs(e) for e in loo))
print("true SG of apparent 1.08297", (AIR + 1.08297 * (WATER - AIR)) / WATER)
print("Bx of density 1.0391", brix_from_sg(1.0391 / WATER))
print("alternative rule 22.7 Bx", (22.7 - 2.1) * 10 * density(22.7) / 17)


def d(s):
    return s * WATER


# Hand balances of AdditionBalanceTests with the Zoecklein SGs (24 Bx 1.10101, 22 Bx 1.09193, 20 Bx 1.08297)
m0 = 1000 * d(1.10101); m1 = m0 + 100 * WATER; b1 = 100 * m0 * 0.24 / m1
print("water: B1", b1, "SG(B1)", sg_from_brix(b1), "V1", m1 / d(sg_from_brix(b1)), "sugar", 237.8 * 1000 / (m1 / d(sg_from_brix(b1))))
m0 = 1000 * d(1.08297); m1 = m0 + 20; b1 = 100 * (m0 * 0.20 + 20) / m1; v1 = m1 / d(sg_from_brix(b1))
print("sugar: B1", b1, "SG(B1)", sg_from_brix(b1), "V1", v1, "sugar", (191.9 * 1000 + 20000 * 2 * 180.156 / 342.297) / v1)
m0 = 1000 * d(1.10101); ma = m0 * 0.24 / 0.22
print("water for 22: W", (ma - m0) / WATER, "V+W", 1000 + (ma - m0) / WATER, "mass/density", ma / d(1.09193))
m0 = 1000 * d(1.08297)
print("sugar for 22: K", (22 * m0 - 100 * m0 * 0.20) / 78)
m0 = 10 * d(1.09193)
print("odd", 100 * (m0 * 0.22 + 900) / (m0 + 900))
