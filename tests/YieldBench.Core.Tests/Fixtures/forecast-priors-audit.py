# Reference values for tests/YieldBench.Cli.Tests/ForecastPriorsAuditTests.cs: the forecast's rate and lag priors
# (docs/methods.md Part 5, "Priors from the history" and "Seasons, and lots that run together") recomputed from the
# methods text, not from the C# code, given each past log's fit as scipy made it (forecast-course-audit.py; its output
# for the demo is kinetics-audit/demo-courses.csv, for Corrowind forecast-priors-audit/corrowind-courses.csv).
# The form with the smaller sum of squares on most lots; per fitted lot log mu_m = log(kappa (S0 - F)) and lambda;
# regressed (numpy lstsq) on one column per strain with 3 or more fitted lots (rarer strains one column per colour),
# the usual peak of the lot's vessel type and colour (the median highest logged temperature of the history's fitted
# lots there) and log YAN (used when 80 % of the fitted lots record it; a lot without one at the history's mean), both
# covariates centred. Residuals less each season's mean residual (its shift; the lag's too), the lag's divided by the
# predicted lag (at least 4 h); the 2 x 2 scatter over kept lots with n - rank - seasons degrees of freedom, and per
# colour (10 or more kept lots) with the colour's share of them; lots beyond 9.21 in Mahalanobis distance (each against
# its colour's scatter) set aside and the fit made again, twice, the later scatters divided by 0.9535. The share set
# aside (k + 1)/(n + 2); the season spread sqrt(var(shifts) - mean(scatter / kept lots of the season)), at least 0.10.
# Where the text left a choice open (the season shift taken from residuals, not fitted as a column; the lag's shift;
# a missing YAN), the python follows what methods.md now says.
# Produced with Debian 12 python 3.11.2, numpy 1.24.2, openpyxl 3.0.9, from the repository root, OUT any new folder:
#   dotnet run -c Release --project src/YieldBench.Cli -- review --out OUT/demo
#   /usr/bin/python3 tests/YieldBench.Core.Tests/Fixtures/forecast-priors-audit.py OUT/demo/data/lots.csv \
#       tests/YieldBench.Core.Tests/Fixtures/kinetics-audit/demo-courses.csv demo-data/history/tallowmere-fermentation-logs.xlsx \
#       tests/YieldBench.Core.Tests/Fixtures/forecast-priors-audit/demo.out.csv
#   dotnet run -c Release --project src/YieldBench.Cli -- review tests/YieldBench.Core.Tests/Fixtures/corrowind-input --out OUT/cw
#   /usr/bin/python3 tests/YieldBench.Core.Tests/Fixtures/forecast-course-audit.py OUT/cw/data/lots.csv \
#       tests/YieldBench.Core.Tests/Fixtures/corrowind-input/corrowind-logs.csv > tests/YieldBench.Core.Tests/Fixtures/forecast-priors-audit/corrowind-courses.csv
#   /usr/bin/python3 tests/YieldBench.Core.Tests/Fixtures/forecast-priors-audit.py OUT/cw/data/lots.csv \
#       tests/YieldBench.Core.Tests/Fixtures/forecast-priors-audit/corrowind-courses.csv tests/YieldBench.Core.Tests/Fixtures/corrowind-input/corrowind-logs.csv \
#       tests/YieldBench.Core.Tests/Fixtures/forecast-priors-audit/corrowind.out.csv
#   dotnet run -c Release --project src/YieldBench.Cli -- review tests/YieldBench.Core.Tests/Fixtures/kinetics-audit/brackenfold-input --out OUT/bf
#   /usr/bin/python3 tests/YieldBench.Core.Tests/Fixtures/forecast-priors-audit.py OUT/bf/data/lots.csv \
#       tests/YieldBench.Core.Tests/Fixtures/kinetics-audit/brackenfold-courses.csv \
#       tests/YieldBench.Core.Tests/Fixtures/kinetics-audit/brackenfold-input/brackenfold-logs-*.csv \
#       tests/YieldBench.Core.Tests/Fixtures/forecast-priors-audit/brackenfold.out.csv
# (each .out.csv then renamed to .csv).
import csv, datetime as dt, math, os, re, sys
import numpy as np
from audit_logs import num, read_logs, read_lots

lots_path, courses_path, log_paths = sys.argv[1], sys.argv[2], [a for a in sys.argv[3:] if not a.endswith(".out.csv")]
peaks = {}  # highest logged temperature per lot
for lot, readings in read_logs(log_paths).items():
    for ts, _, t in readings:
        # readings of one time are averaged before the highest is taken
        peaks.setdefault(lot, {}).setdefault(ts, []).append(t)
peak = {lot: max(np.mean([v for v in vs if v is not None]) for vs in d.values() if any(v is not None for v in vs)) for lot, d in peaks.items()}

lots = read_lots(lots_path)
fits = {}
for r in csv.DictReader(open(courses_path, encoding="utf-8")):
    if r["kappa_per_h"]:
        fits.setdefault(r["lot_id"], {})[r["model"]] = r
# the form: the smaller residual sum of squares on most lots (median of log(SS Gompertz / SS logistic) over lots with both)
ratios = [math.log(float(f["gompertz"]["sum_of_squares"]) / float(f["logistic"]["sum_of_squares"])) for f in fits.values() if len(f) == 2]
form = "gompertz" if np.median(ratios) <= 0 else "logistic"
print("form", form, "median log ratio %.4f" % np.median(ratios))

def key(s): return re.sub(r"[^0-9A-Za-z]", "", s or "").upper()
def colour(L): return {"red": "red", "white": "white", "rose": "white", "rosé": "white"}.get(L["colour"].lower())

F = []
for lot_id, f in fits.items():
    if form not in f: continue
    c = f[form]; L = lots[lot_id]
    s0, fin, kappa, lag = float(c["start_brix"]), float(c["final_brix"]), float(c["kappa_per_h"]), float(c["lag_h"])
    F.append(dict(id=lot_id, season=int(L["season"]), strain=key(L["strain"]), colour=colour(L), vessel=key(L["vessel"]),
                  yan=num(L["yan_mg_l"]), peak=peak.get(lot_id), logmu=math.log(kappa * (s0 - fin)), lag=lag))
n = len(F)
# a lot of unknown colour takes its strain's majority colour
major = {}
for s in {x["strain"] for x in F}:
    w = sum(1 for x in F if x["strain"] == s and x["colour"] == "white"); r = sum(1 for x in F if x["strain"] == s and x["colour"] == "red")
    major[s] = "white" if w > r else "red"
for x in F:
    if x["colour"] is None: x["colour"] = major[x["strain"]]
# the usual peak of the lot's vessel type and colour: the median highest logged temperature of the history's lots there
groups = {}
for x in F:
    if x["peak"] is not None: groups.setdefault((x["vessel"], x["colour"]), []).append(x["peak"])
usual = {g: float(np.median(v)) for g, v in groups.items()}
for x in F: x["usual"] = usual[(x["vessel"], x["colour"])]
# strain columns: strains with >= 3 fitted lots; rarer ones pooled per colour
counts = {s: sum(1 for x in F if x["strain"] == s) for s in {x["strain"] for x in F}}
cols = sorted(s for s, k in counts.items() if k >= 3)
for b in ("red", "white"):
    if any(x["strain"] not in cols and x["colour"] == b for x in F): cols.append("~" + b)
with_yan = [x for x in F if x["yan"] and x["yan"] > 0]
use_yan = len(with_yan) >= 0.8 * n
yc = np.mean([math.log(x["yan"]) for x in with_yan]) if use_yan else 0
tc = np.mean([x["usual"] for x in F])
def row(x):
    r = [0.0] * (len(cols) + (2 if use_yan else 1))
    r[cols.index(x["strain"]) if x["strain"] in cols else cols.index("~" + x["colour"])] = 1
    r[len(cols)] = x["usual"] - tc
    if use_yan: r[len(cols) + 1] = math.log(x["yan"]) - yc if x["yan"] and x["yan"] > 0 else 0.0  # a missing YAN at the mean
    return r
X = np.array([row(x) for x in F]); ym = np.array([x["logmu"] for x in F]); yl = np.array([x["lag"] for x in F])
season = np.array([x["season"] for x in F]); bucket = np.array([x["colour"] for x in F])
seasons = sorted(set(season))
p = X.shape[1]
keep = np.ones(n, bool)
for pas in range(3):
    bm = np.linalg.lstsq(X[keep], ym[keep], rcond=None)[0]; bl = np.linalg.lstsq(X[keep], yl[keep], rcond=None)[0]
    em = ym - X @ bm; el = yl - X @ bl
    shift = {s: em[keep & (season == s)].mean() for s in seasons}
    lshift = {s: el[keep & (season == s)].mean() for s in seasons}
    scale = np.maximum(X @ bl, 4.0)
    A = em - np.array([shift[s] for s in season]); B = (el - np.array([lshift[s] for s in season])) / scale
    # degrees of freedom: the kept lots less what the regression learns (its rank: a covariate that does not vary, or
    # that the strain columns already fix, learns nothing) and one shift per season
    rank = np.linalg.matrix_rank(X[keep])
    dof = keep.sum() - rank - len(seasons)
    trim = 1.0 if pas == 0 else 0.9535
    def cov(m, d): return np.array([[A[m] @ A[m], A[m] @ B[m]], [A[m] @ B[m], B[m] @ B[m]]]) / d / trim
    within = cov(keep, dof)
    byc = {}
    for b in ("red", "white"):
        m = keep & (bucket == b)
        if m.sum() >= 10: byc[b] = cov(m, max(1.0, m.sum() * dof / keep.sum()))
    newkeep = np.ones(n, bool)
    for i in range(n):
        V = byc.get(bucket[i], within); z = np.array([A[i], B[i]])
        newkeep[i] = np.linalg.det(V) <= 0 or z @ np.linalg.solve(V, z) <= 9.21
    keep = newkeep
sh = np.array([shift[s] for s in seasons])
between = sh.var(ddof=1) if len(seasons) > 1 else 0
noise = np.mean([within[0, 0] / (keep & (season == s)).sum() for s in seasons])
spread = max(0.10, math.sqrt(max(0, between - noise)))
out = csv.writer(open(sys.argv[-1], "w", newline="", encoding="utf-8") if sys.argv[-1].endswith(".out.csv") else sys.stdout, lineterminator="\n")
print("lots %d, columns %s, yan %s, kept %d, rank %d of %d" % (n, cols, use_yan, keep.sum(), rank, p), file=sys.stderr)
out.writerow(["quantity", "a", "b", "c"])
if rank == p:  # the slopes are only determined when the columns are independent
    out.writerow(["rate_temperature_slope", "%.10g" % bm[len(cols)], "", ""])
    out.writerow(["rate_nitrogen_slope", "%.10g" % (bm[len(cols) + 1] if use_yan else 0), "", ""])
out.writerow(["rate_outlier_share", "%.10g" % ((n - keep.sum() + 1) / (n + 2)), "", ""])
out.writerow(["within", "%.10g" % within[0, 0], "%.10g" % within[0, 1], "%.10g" % within[1, 1]])
for b, V in sorted(byc.items()): out.writerow(["within_" + b, "%.10g" % V[0, 0], "%.10g" % V[0, 1], "%.10g" % V[1, 1]])
out.writerow(["season_spread", "%.10g" % spread, "", ""])
for s in seasons: out.writerow(["season_shift_%d" % s, "%.10g" % shift[s], "", ""])
for i, x in enumerate(F): out.writerow(["prior_" + x["id"], "%.10g" % (X[i] @ bm), "%.10g" % (X[i] @ bl), ""])
