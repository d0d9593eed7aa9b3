# Recomputes the in-season forecast's fit of each past log (docs/methods.md Part 5, "The sugar course"):
# Brix(t) = S0 - (S0 - F) h(t; kappa, lambda), h the modified Gompertz or logistic of Zwietering et al. (1990) scaled to
# run from 0 to 1, fitted to every reading by least squares in all four parameters with scipy.optimize.curve_fit
# (MINPACK Levenberg-Marquardt), started from the best point of a 25 x 25 grid in (log kappa, lambda) with S0 and F solved
# there by linear least squares; a fit is kept when S0 <= 50, F >= -6 and S0 <= the highest reading + 8 °Brix.
# Produced with Debian 12 python 3.11.2, numpy 1.24.2, scipy 1.10.1, openpyxl 3.0.9, from the repository root:
#   /usr/bin/python3 tests/YieldBench.Core.Tests/Fixtures/forecast-course-audit.py /tmp/k/demo/data/lots.csv \
#       demo-data/history/tallowmere-fermentation-logs.xlsx > tests/YieldBench.Core.Tests/Fixtures/kinetics-audit/demo-courses.csv
#   /usr/bin/python3 tests/YieldBench.Core.Tests/Fixtures/forecast-course-audit.py /tmp/k/bf/data/lots.csv \
#       tests/YieldBench.Core.Tests/Fixtures/kinetics-audit/brackenfold-input/brackenfold-logs-*.csv \
#       > tests/YieldBench.Core.Tests/Fixtures/kinetics-audit/brackenfold-courses.csv
# (the review runs and the readings' preparation as in kinetics-audit.py's header). Held to the tool by
# tests/YieldBench.Cli.Tests/KineticsAuditTests.cs.
import csv, datetime as dt, math, os, sys
import numpy as np
from scipy.optimize import brentq, curve_fit
from audit_logs import read_logs, read_lots

logs = read_logs(sys.argv[2:])  # lot id -> list of (timestamp, brix or None, temp or None)
lots = read_lots(sys.argv[1])

def hours(a, b): return (b - a).total_seconds() / 3600.0

def h(model, kappa, lam, t):
    if model == "gompertz": return np.exp(-np.exp(np.minimum(kappa * np.e * (lam - t) + 1, 50)))
    return 1 / (1 + np.exp(np.minimum(4 * kappa * (lam - t) + 2, 50)))

def projected(model, t, y, kappa, lam):  # S0, F by linear least squares at (kappa, lambda): y = S0 (1 - h) + F h
    H = h(model, kappa, lam, t); X = np.column_stack([1 - H, H])
    coef, *_ = np.linalg.lstsq(X, y, rcond=None)
    return float(np.sum((X @ coef - y) ** 2)), coef

def fit(model, t, y):
    t = np.array(t); y = np.array(y)
    if len(t) < 6 or y.max() - y.min() < 3: return None
    span = max(t[-1] - t[0], 1.0)
    best = None
    for lk in np.linspace(np.log(0.5 / span), np.log(20 / span), 25):
        for lam in np.linspace(t[0] - 0.3 * span, t[0] + 0.7 * span, 25):
            ss, c = projected(model, t, y, np.exp(lk), lam)
            if best is None or ss < best[0]: best = (ss, c[0], c[1], np.exp(lk), lam)
    f = lambda tt, s0, fin, lk, lam: s0 - (s0 - fin) * h(model, np.exp(lk), lam, tt)
    try:
        p, _ = curve_fit(f, t, y, p0=[best[1], best[2], np.log(best[3]), best[4]], method="lm", xtol=1e-15, ftol=1e-15, gtol=1e-15, maxfev=100000)
    except RuntimeError:
        return None
    s0, fin, lk, lam = p
    ss = float(np.sum((f(t, *p) - y) ** 2))
    if not (s0 > fin and s0 <= 50 and fin >= -6 and s0 <= y.max() + 8): return None
    return s0, fin, np.exp(lk), lam, ss, len(t)

cols = ["season", "lot_id", "model", "start_brix", "final_brix", "kappa_per_h", "lag_h", "sum_of_squares", "points"]
w = csv.writer(sys.stdout, lineterminator="\n"); w.writerow(cols)
rows = []
for lot_id, rs in logs.items():
    L = lots[lot_id]
    rs.sort(key=lambda r: r[0])
    merged = {}
    for ts, s, tc in rs:
        if s is not None: merged.setdefault(ts, []).append(s)
    stamps = sorted(merged)
    inoc = dt.datetime.fromisoformat(L["inoculation_date"]) if L["inoculation_date"] else None
    first = stamps[0]
    origin = inoc if inoc is not None and -31 * 24 <= hours(first, inoc) <= 60 * 24 and hours(inoc, first) <= 60 * 24 else first
    t = [hours(origin, ts) for ts in stamps]; y = [float(np.mean(merged[ts])) for ts in stamps]
    for model in ("gompertz", "logistic"):
        r = fit(model, t, y)
        rows.append([L["season"], lot_id, model] + (["%.10g" % v for v in r[:5]] + [r[5]] if r else [""] * 6))
for r in sorted(rows, key=lambda r: (r[0], r[1], r[2])): w.writerow(r)
