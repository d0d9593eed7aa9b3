"""Reference values for the units and conversion tests, computed outside the project.

Run with Debian's Python and SciPy (apt-get install -y python3-scipy; measured with python3 3.11.2,
python3-numpy 1:1.24.2-1+deb12u1, python3-scipy 1.10.1-2):

    /usr/bin/python3 tests/YieldBench.Core.Tests/Units/Oracles/units_oracle.py

Every printed value is quoted beside its assertion in the C# tests.
"""
import csv
import os

import numpy as np
import scipy
from scipy.interpolate import PchipInterpolator
from scipy.optimize import brentq

WATER, AIR = 0.99820, 0.0012


def brix_from_sg(s):  # NBS-fitted cubic, apparent SG 20/20
    return ((182.4601 * s - 775.6821) * s + 1262.7794) * s - 669.5622


def sg_from_brix(b):
    return brentq(lambda s: brix_from_sg(s) - b, 0.9, 1.4, xtol=1e-15, rtol=1e-15)


def d(s):
    return s * WATER


def density(b):  # g/mL at 20 °C, the project's rule SG x 0.99820 (air buoyancy neglected)
    return sg_from_brix(b) * WATER


def solids(b):
    return b * 10 * density(b)


ROWS = [(10.0, 82.2), (15.0, 136.1), (20.0, 191.9), (22.0, 214.7), (24.0, 237.8),
        (25.0, 249.5), (26.0, 261.2), (28.0, 284.9), (30.0, 308.9)]
B = np.array([r[0] for r in ROWS])
S = np.array([r[1] for r in ROWS])
NS = np.array([solids(b) for b in B]) - S
curve = PchipInterpolator(B, NS)  # the earlier nine-row model


def nine_row_sugar(x):
    return max(0.0, solids(x) - float(curve(min(max(x, 10.0), 30.0))))


# The full table (the project's model): the embedded sugar column, linear between 0.1 °Brix rows, edge non-sugar
# solids held outside 10-30 °Brix.
HERE = os.path.dirname(os.path.abspath(__file__))
with open(os.path.join(HERE, "..", "..", "..", "..", "src", "YieldBench.Core", "Units", "oiv-must-table.csv")) as f:
    rows = [r for r in csv.reader(line for line in f if not line.startswith("#"))][1:]
TB = np.array([float(r[0]) for r in rows])
TS = np.array([float(r[1]) for r in rows])


def sugar(x):
    if 10.0 <= x <= 30.0:
        return float(np.interp(x, TB, TS))
    edge = NS[0] if x < 10 else NS[-1]
    return max(0.0, solids(x) - edge)


print("scipy", scipy.__version__)
print("S=1.040 ->", brix_from_sg(1.040))
print("outside", {x: sugar(x) for x in [5.0, 40.0]})
print("sugar starts at", brentq(lambda b: solids(b) - NS[0], 1, 5, xtol=1e-14))
diff = [(nine_row_sugar(b) - s, b) for b, s in zip(TB, TS)]
print("nine-row model vs table, largest", max(diff, key=lambda t: abs(t[0])))
print("nine-row model at", {b: round(nine_row_sugar(b), 5) for b in [25.4, 16.3, 25.1]})
print("true SG of apparent 1.08297", (AIR + 1.08297 * (WATER - AIR)) / WATER)
print("Bx of density 1.0391", brix_from_sg(1.0391 / WATER))
print("alternative rule 22.7 Bx", (22.7 - 2.1) * 10 * density(22.7) / 17)


# Hand balances of AdditionBalanceTests with the Zoecklein SGs (24 Bx 1.10101, 22 Bx 1.09193, 20 Bx 1.08297).
# After additions: solids Brix counts the sucrose's inversion (x 2*180.156/342.297); volume = mass / density at that
# Brix; sugar = (table sugar x V + 1000 x K x 1.0526) / V1; effective Brix = the table Brix of that sugar.
HEX = 2 * 180.156 / 342.297


def table_brix(g):  # inverse of the table's linear interpolation
    return float(np.interp(g, TS, TB))


def after(b0, sg0, s0, v, w, k, sg_solids=None):
    m0 = v * d(sg0); m1 = m0 + w * WATER + k; bs = 100 * (m0 * b0 / 100 + k * HEX) / m1
    v1 = m1 / d(sg_solids if sg_solids else sg_from_brix(bs))
    g = (s0 * v + 1000 * k * HEX) / v1
    return bs, v1, g, table_brix(g)


print("water: solids Bx, V1, sugar, effective Bx", after(24, 1.10101, 237.8, 1000, 100, 0))
print("sugar: solids Bx, V1, sugar, effective Bx", after(20, 1.08297, 191.9, 1000, 0, 20))
w22 = brentq(lambda w: after(24, 1.10101, 237.8, 1000, w, 0)[3] - 22.0, 0, 500, xtol=1e-12)
print("water for effective 22:", w22, after(24, 1.10101, 237.8, 1000, w22, 0))
k22 = brentq(lambda k: after(20, 1.08297, 191.9, 1000, 0, k)[3] - 22.0, 0, 100, xtol=1e-12)
print("sugar for effective 22:", k22, after(20, 1.08297, 191.9, 1000, 0, k22))
m0 = 10 * d(1.09193)
print("odd", 100 * (m0 * 0.22 + 900 * HEX) / (m0 + 900))
