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


def density(b):  # true density g/mL from apparent SG (weights in air)
    return AIR + sg_from_brix(b) * (WATER - AIR)


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
print("Bx of density 1.0391", brix_from_sg((1.0391 - AIR) / (WATER - AIR)))
print("alternative rule 22.7 Bx", (22.7 - 2.1) * 10 * density(22.7) / 17)
