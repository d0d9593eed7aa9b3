# Recomputes the review's per-lot fermentation kinetics from docs/methods.md Part 4 (the text, not the tool's code): lag,
# one-third depletion, time to dryness, duration, maximum rate (between readings, or the local linear fit of a dense log),
# peak temperature, hours above the caution and danger lines, the highest temperature reachable without cooling, and the
# Zwietering et al. (1990) modified Gompertz and logistic fits by scipy.optimize.curve_fit (MINPACK Levenberg-Marquardt),
# the sluggish window and the stall (stuck, or stalled then finished), the heat removed; then per strain the median and type-7 quartiles of maximum rate, lag, days to dry and peak temperature.
# Produced with Debian 12 python 3.11.2, numpy 1.24.2, scipy 1.10.1, openpyxl 3.0.9
# (apt-get install -y python3-scipy python3-openpyxl), from the repository root:
#   dotnet run -c Release --project src/YieldBench.Cli -- review --out /tmp/k/demo
#   /usr/bin/python3 tests/YieldBench.Core.Tests/Fixtures/kinetics-audit.py /tmp/k/demo/data/lots.csv \
#       demo-data/history/tallowmere-fermentation-logs.xlsx > tests/YieldBench.Core.Tests/Fixtures/kinetics-audit/demo.csv
#   dotnet run -c Release --project src/YieldBench.Cli -- review tests/YieldBench.Core.Tests/Fixtures/kinetics-audit/brackenfold-input --out /tmp/k/bf
#   /usr/bin/python3 tests/YieldBench.Core.Tests/Fixtures/kinetics-audit.py /tmp/k/bf/data/lots.csv \
#       tests/YieldBench.Core.Tests/Fixtures/kinetics-audit/brackenfold-input/brackenfold-logs-*.csv \
#       > tests/YieldBench.Core.Tests/Fixtures/kinetics-audit/brackenfold.csv
# (brackenfold-input is made by brackenfold-cellar.py.) The first argument is the review's data/lots.csv, read only for
# the lots' ids, seasons, strains, colours and inoculation times as read, and their starting °Brix: the recorded °Brix
# (or SG through the NBS cubic) where no addition was applied, else the review's addition balance (docs/methods.md
# Part 1 §5, checked on its own in AdditionBalanceTests) at the 2 decimals lots.csv gives. The logs are read from the
# cellar's own files: long format (Lot, Date, Time, Brix or SG, Temp °C) or one sheet per lot named after it
# (Timestamp, Brix, Temp °C). Output: a row per lot, then '#' rows of the per-strain medians and quartiles.
# Held to the tool by tests/YieldBench.Cli.Tests/KineticsAuditTests.cs.
import csv, datetime as dt, math, os, sys
import numpy as np
from scipy.optimize import brentq, curve_fit
from audit_logs import brix_from_sg, read_logs, read_lots

def sg_from_brix(b):  # the cubic's inverse (it rises monotonically over the range)
    return brentq(lambda s: brix_from_sg(s) - b, 0.9, 1.3, xtol=1e-15)

# The OIV must table (OIV-MA-AS2-02 Table II, 10.0-30.0 °Brix in 0.1 steps), the repository's copy of it
OIV = [tuple(map(float, l.split(","))) for l in open(os.environ.get("OIV_TABLE", os.path.join(os.path.dirname(os.path.abspath(__file__)),
       "..", "..", "..", "src", "YieldBench.Core", "Units", "oiv-must-table.csv"))) if l[0].isdigit()]
def solids_gl(b): return b * 10 * sg_from_brix(b) * 0.99820
def sugar_gl(b):  # Part 1 §2: linear between rows; outside, the edge row's non-sugar solids; Part 4: 0 at or below 0 °Brix
    if b <= 0: return 0.0
    if b < 10: return max(0.0, solids_gl(b) - (solids_gl(10) - OIV[0][1]))
    if b > 30: return solids_gl(b) - (solids_gl(30) - OIV[-1][1])
    return float(np.interp(b, [r[0] for r in OIV], [r[1] for r in OIV]))
def cp(b):  # Choi & Okos (1986) water and carbohydrate at 20 °C, kJ/(kg K)
    w = 4.1762 - 9.0864e-5 * 20 + 5.4731e-6 * 400; c = 1.5488 + 1.9625e-3 * 20 - 5.9399e-6 * 400
    return (1 - b / 100) * w + b / 100 * c
def rise_k(b):  # Part 4, Heat: (S / 180.16) x 100.4 kJ/mol / (rho cp)
    return sugar_gl(b) / 180.16 * 100.4 / (sg_from_brix(b) * 0.99820 * cp(b))

logs = read_logs(sys.argv[2:])  # lot id -> list of (timestamp, brix or None, temp or None)
lots = read_lots(sys.argv[1])

def hours(a, b): return (b - a).total_seconds() / 3600.0

def first_crossing(t, y, level):  # first time y reaches level (falling), linear between readings
    for i in range(len(y)):
        if y[i] <= level:
            if i == 0: return t[0]
            return t[i - 1] + (t[i] - t[i - 1]) * (y[i - 1] - level) / (y[i - 1] - y[i])
    return None

def gompertz(t, A, mu, lam): return A * np.exp(-np.exp(np.minimum(mu * np.e / A * (lam - t) + 1, 50)))
def logistic(t, A, mu, lam): return A / (1 + np.exp(np.minimum(4 * mu / A * (lam - t) + 2, 50)))

def fit(f, t, y):
    if len(t) < 6 or max(y) < 3: return None
    chords = [(y[i] - y[i - 1]) / (t[i] - t[i - 1]) for i in range(1, len(t))]
    k = int(np.argmax(chords)); mu0 = chords[k]
    lam0 = t[k] - y[k] / mu0
    try:
        p, _ = curve_fit(f, np.array(t), np.array(y), p0=[1.02 * max(y), mu0, lam0], method="lm", xtol=1e-14, ftol=1e-14, gtol=1e-14, maxfev=20000)
    except RuntimeError:
        return None
    r = np.array(y) - f(np.array(t), *p)
    rmse = math.sqrt(np.mean(r ** 2)); r2 = 1 - np.sum(r ** 2) / np.sum((np.array(y) - np.mean(y)) ** 2)
    return list(p) + [rmse, r2]

out = []
for lot_id, rows in logs.items():
    L = lots[lot_id]
    rows.sort(key=lambda r: r[0])
    # readings sharing a timestamp are averaged, sugar and temperature separately
    merged = {}
    for ts, s, tc in rows:
        m = merged.setdefault(ts, ([], []))
        if s is not None: m[0].append(s)
        if tc is not None: m[1].append(tc)
    stamps = sorted(merged)
    sug = [(ts, np.mean(merged[ts][0])) for ts in stamps if merged[ts][0]]
    tem = [(ts, np.mean(merged[ts][1])) for ts in stamps if merged[ts][1]]
    inoc = dt.datetime.fromisoformat(L["inoculation_date"]) if L["inoculation_date"] else None
    first = sug[0][0]
    origin = inoc if inoc is not None and -31 * 24 <= hours(first, inoc) <= 60 * 24 and hours(inoc, first) <= 60 * 24 else first
    t = [hours(origin, ts) for ts, _ in sug]; y = [b for _, b in sug]
    # lag: sustained 1 °Brix drop below the first reading, at the last crossing
    level = y[0] - 1.0
    lag = None
    if y[-1] < level:
        j = max(i for i in range(len(y)) if y[i] > level)  # last reading above the level (a reading at it has fallen 1.0)
        lag = t[j] + (t[j + 1] - t[j]) * (y[j] - level) / (y[j] - y[j + 1])
        lag = max(lag, 0.0)
    # the lot's effective starting °Brix: as recorded (°Brix, or SG by the cubic) when no addition was applied, else the
    # review's balance (lots.csv, 2 decimals)
    if L["additions_applied"] == "false" and L["starting_sugar_scale"] in ("°Brix", "SG"):
        rec = float(L["starting_sugar_as_recorded"])
        start, start_from = (rec if L["starting_sugar_scale"] == "°Brix" else brix_from_sg(rec)), "record"
    else:
        start, start_from = (float(L["starting_brix"]), "lots.csv") if L["starting_brix"] else (y[0], "log")
    one_third = first_crossing(t, y, start * 2 / 3)
    one_third_first = first_crossing(t, y, y[0] * 2 / 3)  # the same from the log's first reading (kept beside it)
    dry = first_crossing(t, y, 0.0)
    gaps = np.diff([ts.timestamp() for ts, _ in sug]) / 3600
    spacing = float(np.median(gaps))
    if spacing <= 2:
        rates = []
        for i in range(len(t)):
            w = [k for k in range(len(t)) if abs(t[k] - t[i]) <= 6]
            if len(w) >= 3:
                rates.append((-np.polyfit([t[k] for k in w], [y[k] for k in w], 1)[0] * 24, t[i]))
        max_rate, max_rate_at = max(rates, key=lambda r: r[0])  # the first of equal maxima
    else:
        chords = [((y[i - 1] - y[i]) / (t[i] - t[i - 1]) * 24, (t[i - 1] + t[i]) / 2) for i in range(1, len(t))]
        max_rate, max_rate_at = max(chords, key=lambda r: r[0])
    # Sluggish and stuck: windows [t - D, t] ending at a reading, starting at or after the lag's end and the time of the
    # maximum rate; the first whose mean rate is below the limit while the sugar in it (and at its start) stays above
    # the level
    def brix_at(h):
        return float(np.interp(h, t, y))
    judge_from = max([t[0], max_rate_at] + ([lag] if lag is not None else []))
    def first_window(D, rate_limit, above):
        for i in range(len(t)):
            a = t[i] - D
            if a < judge_from - 1e-9: continue
            b0 = brix_at(a); rate = (b0 - y[i]) / D * 24
            inside = [y[k] for k in range(len(t)) if a <= t[k] <= t[i]]
            if rate < rate_limit and b0 > above and all(v > above for v in inside):
                return (a, t[i], rate)
        return None
    white = L["colour"] in ("white", "rose")
    sluggish = first_window(48, 0.25 if white else 0.5, 5.0)
    stall = first_window(72, 0.25, 0.0)
    lab_rs = float(L["residual_sugar_gl"]) if L["residual_sugar_gl"] else None
    dry_after = stall is not None and dry is not None and dry > stall[1]
    finished = dry_after or (lab_rs is not None and lab_rs <= 4)
    stuck = stall is not None and not finished
    restart = None
    if stall is not None and finished:
        r = [(brix_at(t[i] - 72) - y[i]) / 72 * 24 for i in range(len(t)) if t[i] - 72 >= stall[1] - 1e-9]
        restart = max(r) if r else None
    stalled_then_finished = restart is not None and restart >= 1.0
    red = L["colour"] not in ("white", "rose")
    caution, danger = (35, 40) if red else (20, 25)
    peak = max(c for _, c in tem) if tem else None
    def above(th):
        tot = 0.0
        for (a, ca), (b, cb) in zip(tem, tem[1:]):
            d = hours(a, b); lo, hi = min(ca, cb), max(ca, cb)
            if lo > th: tot += d  # above: strictly (a stretch at the threshold is not above it)
            elif hi > th: tot += d * (hi - th) / (hi - lo)
        return tot
    # heat: every sugar reading with its own temperature, or one interpolated between readings at most 6 h away
    potential = None
    for (ts, b) in sug:
        own = merged[ts][1]
        if own: c = float(np.mean(own))
        else:
            before = [p for p in tem if p[0] < ts]; after = [p for p in tem if p[0] > ts]
            if not before or not after or hours(before[-1][0], ts) > 6 or hours(ts, after[0][0]) > 6: continue
            (a, ca), (z, cz) = before[-1], after[0]
            c = ca + (cz - ca) * hours(a, ts) / hours(a, z)
        p = c + rise_k(b)
        if potential is None or p > potential: potential = p
    consumed = [y[0] - b for b in y]
    g = fit(gompertz, t, consumed); lg = fit(logistic, t, consumed)
    out.append(dict(season=L["season"], lot_id=lot_id, strain=L["strain"], start_brix=start, start_from=start_from, lag_h=lag, one_third_h=one_third, one_third_first_reading_h=one_third_first,
                    days_to_dry=None if dry is None else dry / 24, duration_h=t[-1], max_rate_brix_per_day=max_rate,
                    median_spacing_h=spacing, peak_temp_c=peak, time_above_caution_h=above(caution), time_above_danger_h=above(danger), potential_peak_temp_c=potential, heat_removed_k=None if potential is None or peak is None else potential - peak,
                    sluggish_from_h=sluggish and sluggish[0], sluggish_to_h=sluggish and sluggish[1], sluggish_rate=sluggish and sluggish[2],
                    stall_from_h=stall and stall[0], stall_to_h=stall and stall[1], stuck=str(stuck).lower(), stalled_then_finished=str(stalled_then_finished).lower(),
                    gompertz_a_brix=g and g[0], gompertz_mu_brix_per_h=g and g[1], gompertz_lambda_h=g and g[2], gompertz_rmse_brix=g and g[3],
                    logistic_a_brix=lg and lg[0], logistic_mu_brix_per_h=lg and lg[1], logistic_lambda_h=lg and lg[2], logistic_rmse_brix=lg and lg[3]))

out.sort(key=lambda r: (r["season"], r["lot_id"]))
cols = list(out[0].keys())
w = csv.writer(sys.stdout, lineterminator="\n")
w.writerow(cols)
for r in out:
    w.writerow([("" if r[c] is None else (("%.10g" % r[c]) if isinstance(r[c], float) else r[c])) for c in cols])

# per strain: type-7 median and quartiles (numpy's default 'linear' is Hyndman-Fan 7) of max rate, lag, days to dry, peak
print("#strain,measure,n,median,q1,q3")
for s in sorted({r["strain"] for r in out}):
    for m in ("max_rate_brix_per_day", "lag_h", "days_to_dry", "peak_temp_c"):
        v = [r[m] for r in out if r["strain"] == s and r[m] is not None]
        print("#%s,%s,%d,%.10g,%.10g,%.10g" % (s, m, len(v), np.median(v), np.quantile(v, 0.25), np.quantile(v, 0.75)))
