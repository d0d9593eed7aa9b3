# Reference values for tests/YieldBench.Cli.Tests/ForecastBacktestAuditTests.cs: the forecast backtest's truths, cuts
# and baselines (docs/methods.md Part 5, "The backtest") recomputed from the methods text, not from the C# code.
# Each log prepared as Part 5 "Inputs" says (readings sorted by time, readings of one time averaged, time zero the
# recorded inoculation or else the first reading); the one-third level (1 - 1/3) x the record's starting °Brix after
# additions, dryness 0 °Brix. Truths: the first crossing of each level, linear between the two readings around it; the
# highest logged temperature. Each season held out in turn; each of its logs cut after 2, 3, 4 and 6 sugar readings
# (temperatures up to the cut kept); a target scored only when still ahead at the cut (the crossing reading lies after
# the cut; the highest temperature is logged after it). Baselines: the sugar line through the last two readings to the
# level (the strain median when it does not fall); for the peak the temperature line through the last two temperatures
# followed to the time the sugar line reaches half the starting sugar, never below the highest so far (and the highest
# so far when the sugar line does not fall or already lies below half); the strain's median hours from inoculation (from
# the first reading for a lot with no inoculation time) to one-third and dryness over the other seasons' lots, and their
# median highest logged temperature. Prints the table (lots, baseline MAEs) and writes one row per scored case.
# Produced with Debian 12 python 3.11.2, numpy 1.24.2, openpyxl 3.0.9, from the repository root, OUT any new folder:
#   dotnet run -c Release --project src/YieldBench.Cli -- review --out OUT/demo
#   /usr/bin/python3 tests/YieldBench.Core.Tests/Fixtures/forecast-backtest-audit.py OUT/demo/data/lots.csv \
#       demo-data/history/tallowmere-fermentation-logs.xlsx tests/YieldBench.Core.Tests/Fixtures/forecast-backtest-audit/demo.out.csv
#   dotnet run -c Release --project src/YieldBench.Cli -- review tests/YieldBench.Core.Tests/Fixtures/corrowind-input --out OUT/cw
#   /usr/bin/python3 tests/YieldBench.Core.Tests/Fixtures/forecast-backtest-audit.py OUT/cw/data/lots.csv \
#       tests/YieldBench.Core.Tests/Fixtures/corrowind-input/corrowind-logs.csv tests/YieldBench.Core.Tests/Fixtures/forecast-backtest-audit/corrowind.out.csv
#   dotnet run -c Release --project src/YieldBench.Cli -- review tests/YieldBench.Core.Tests/Fixtures/kinetics-audit/brackenfold-input --out OUT/bf
#   /usr/bin/python3 tests/YieldBench.Core.Tests/Fixtures/forecast-backtest-audit.py OUT/bf/data/lots.csv \
#       tests/YieldBench.Core.Tests/Fixtures/kinetics-audit/brackenfold-input/brackenfold-logs-*.csv \
#       tests/YieldBench.Core.Tests/Fixtures/forecast-backtest-audit/brackenfold.out.csv
# (each .out.csv then renamed to .csv). The tables printed agree with forecast.json's backtest rows (lots, baseline_line_mae,
# baseline_strain_mae, given to two decimals) for the demo and Corrowind in every row.
import csv, datetime as dt, math, os, sys
import numpy as np
from audit_logs import brix_from_sg, read_logs, read_lots

logs = read_logs([a for a in sys.argv[2:] if not a.endswith(".out.csv")])
lots = read_lots(sys.argv[1])
def L_add(lot_id): return lots[lot_id]["additions_applied"]
def hours(a, b): return (b - a).total_seconds() / 3600.0

def first_crossing(t, y, level):
    for i in range(len(y)):
        if y[i] <= level:
            if i == 0: return t[0], 0
            return t[i - 1] + (t[i] - t[i - 1]) * (y[i - 1] - level) / (y[i - 1] - y[i]), i
    return None, None

# each lot: prepared course (hours from inoculation, or from the first reading)
course = {}
for lot_id, rows in logs.items():
    L = lots[lot_id]
    rows.sort(key=lambda r: r[0])
    merged = {}
    for ts, s, tc in rows:
        m = merged.setdefault(ts, ([], []))
        if s is not None: m[0].append(s)
        if tc is not None: m[1].append(tc)
    stamps = sorted(merged)
    origin = dt.datetime.fromisoformat(L["inoculation_date"]) if L["inoculation_date"] else stamps[0]
    sug = [(hours(origin, ts), float(np.mean(merged[ts][0]))) for ts in stamps if merged[ts][0]]
    tem = [(hours(origin, ts), float(np.mean(merged[ts][1]))) for ts in stamps if merged[ts][1]]
    # the record's starting °Brix after additions: as written where no addition applied (lots.csv repeats it exactly),
    # else the review's addition balance at the two decimals lots.csv gives
    # (a start recorded in SG is converted by the NBS cubic of Part 1)
    s0 = float(L["starting_brix"]) if L["additions_applied"] == "true" else \
        brix_from_sg(float(L["starting_sugar_as_recorded"])) if L["starting_sugar_scale"] == "SG" else float(L["measured_starting_brix"])
    if L["additions_applied"] != "true" and L["starting_sugar_scale"] not in ("SG", "°Brix"): raise SystemExit("scale " + L["starting_sugar_scale"])
    level = s0 * (1 - 1 / 3)
    t, y = [a for a, _ in sug], [b for _, b in sug]
    third, third_i = first_crossing(t, y, level)
    dry, dry_i = first_crossing(t, y, 0.0)
    peak = max(v for _, v in tem) if tem else None
    course[lot_id] = dict(id=lot_id, season=int(L["season"]), strain=L["strain"], s0=s0, level=level, sug=sug, tem=tem,
                          third=third, third_i=third_i, dry=dry, dry_i=dry_i, peak=peak, inoculated=bool(L["inoculation_date"]),
                          third_ff=None if third is None else third - t[0], dry_ff=None if dry is None else dry - t[0])

CUTS = [2, 3, 4, 6]

seasons = sorted({c["season"] for c in course.values()})
res = {}
detail = []
for held in seasons:
    past = [c for c in course.values() if c["season"] != held]
    def strain_median(strain, key):
        # hours from inoculation over the lots with an inoculation time; from the first reading, and the peak, over all
        ok = lambda c: c[key] is not None and (key.endswith("_ff") or key == "peak" or c["inoculated"])
        v = [c[key] for c in past if c["strain"] == strain and ok(c)]
        if not v: v = [c[key] for c in past if ok(c)]
        return float(np.median(v))
    for lot_id, c in sorted(course.items()):
        if c["season"] != held: continue
        for k in CUTS:
            if len(c["sug"]) < k: continue
            tk, yk = c["sug"][k - 1]; tj, yj = c["sug"][k - 2]
            slope = (yk - yj) / (tk - tj)
            temps = [(a, b) for a, b in c["tem"] if a <= tk]
            for target in ("one_third", "dry", "peak_temp"):
                if target == "peak_temp":
                    later = [b for a, b in c["tem"] if a > tk]
                    if not later or not temps or max(later) <= max(b for _, b in temps): continue
                    truth = c["peak"]
                    strain = strain_median(c["strain"], "peak")
                    # when the sugar line does not fall, or the last reading is already below half the start, the
                    # highest temperature so far (the text says "never below the highest so far")
                    line = max(b for _, b in temps)
                    if slope < 0 and yk > c["s0"] / 2 and len(temps) >= 2:
                        (ta, va), (tb, vb) = temps[-2], temps[-1]
                        th = tk + (c["s0"] / 2 - yk) / slope
                        line = max(line, vb + (vb - va) / (tb - ta) * (th - tb))
                else:
                    key = "third" if target == "one_third" else "dry"
                    truth, idx = c[key], c[key + "_i"]
                    if truth is None or idx < k: continue
                    lev = c["level"] if target == "one_third" else 0.0
                    # the strain's median hours from inoculation, or for a lot with no inoculation time from the first reading
                    strain = strain_median(c["strain"], key) if c["inoculated"] else c["sug"][0][0] + strain_median(c["strain"], key + "_ff")
                    line = tk + (lev - yk) / slope if slope < 0 else strain
                res.setdefault((target, k), []).append((abs(line - truth), abs(strain - truth)))
                detail.append((held, lot_id, target, k, L_add(lot_id), truth, line, strain))

out = open(sys.argv[-1], "w", newline="", encoding="utf-8") if sys.argv[-1].endswith(".out.csv") else sys.stdout
w = csv.writer(out, lineterminator="\n")
w.writerow(["season", "lot_id", "target", "readings", "additions", "truth", "line", "strain_median"])
for d in detail: w.writerow(list(d[:5]) + ["%.10g" % v for v in d[5:]])
print("target,readings,lots,baseline_line_mae,baseline_strain_mae")
for target in ("one_third", "dry", "peak_temp"):
    for k in CUTS:
        e = np.array(res.get((target, k), []))
        print("%s,%d,%d,%.4f,%.4f" % (target, k, len(e), e[:, 0].mean(), e[:, 1].mean()))
