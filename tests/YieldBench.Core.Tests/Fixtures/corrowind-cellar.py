# An invented cellar for the audits of the multi-variable house-factor candidate and of the forecast's backtest and
# priors: Corrowind Vineyard (invented; no real winery, yeast or data), strains CW-B2, CW-E5, CW-H8 (reds), CW-L1,
# CW-T6 (whites), seasons 2016-2019, 30 lots a season, each with a log; and four lots of 2020 still fermenting.
# Alcohol: a per-strain factor x Brix, plus a little from YAN, less in barrels, and a season shift per strain.
# Logs: the modified Gompertz course (Zwietering et al. 1990), a season's lots a little faster or slower than the
# others, readings twice a day (some thrice) with 0.15 °Brix noise, the temperature climbing from the must's toward a
# peak with the rate. Vessel sizes follow the vessel type loosely (as in a real cellar), pH and YAN recorded on most lots,
# the mean fermentation temperature on three lots in four.
# Writes corrowind-input/ (history: lots and logs) and corrowind-running/ (lots still fermenting and their logs)
# beside this script:
#   /usr/bin/python3 corrowind-cellar.py        (Debian 12 python 3.11.2; the standard library only)
import csv, math, random, datetime as dt, os
rng = random.Random(1611)
here = os.path.dirname(os.path.abspath(__file__))
hist, run = os.path.join(here, "corrowind-input"), os.path.join(here, "corrowind-running")
os.makedirs(hist, exist_ok=True); os.makedirs(run, exist_ok=True)
# strain: colour, max rate (°Brix/h at 25 °C reds, 15 °C whites), lag (h), abv per °Brix
strains = {"CW-B2": ("red", 0.20, 10, 0.600), "CW-E5": ("red", 0.15, 16, 0.585), "CW-H8": ("red", 0.24, 7, 0.612),
           "CW-L1": ("white", 0.075, 26, 0.592), "CW-T6": ("white", 0.095, 18, 0.578)}
vessels = {"red": [("Open fermenter", 3000, 0.4), ("Steel tank", 8000, 0.4), ("Concrete tank", 5000, 0.2)],
           "white": [("Steel tank", 6000, 0.6), ("Barrel", 300, 0.4)]}
varieties = {"red": ["Tempranillo", "Grenache", "Mourvedre"], "white": ["Viognier", "Marsanne"]}
season_rate = {2016: 1.00, 2017: 1.12, 2018: 0.90, 2019: 1.04, 2020: 1.06}
abv_shift = {(y, s): rng.gauss(0, 0.08) for y in season_rate for s in strains}
def gomp(A, mu, lam, t): return A * math.exp(-math.exp(min(mu * math.e / A * (lam - t) + 1, 50)))
def pick(options):
    u, acc = rng.random(), 0.0
    for o in options:
        acc += o[2]
        if u <= acc: return o
    return options[-1]
lots, logs, rlots, rlogs = [], [], [], []
for season in (2016, 2017, 2018, 2019, 2020):
    running = season == 2020
    for i in range(4 if running else 30):
        strain = list(strains)[i % 5]
        colour, mu0, lag0, f = strains[strain]
        lot = "CW%d-%02d" % (season % 100, i + 1)
        vessel, size, _ = pick(vessels[colour])
        cap = int(round(size * rng.uniform(0.7, 1.3), -2)) if vessel != "Barrel" else 300
        volume = int(cap * rng.uniform(0.75, 0.9))
        b0 = round(rng.gauss(24.8 if colour == "red" else 22.2, 1.1), 1)
        yan = int(rng.uniform(140, 360)); ph = round(rng.uniform(3.25, 3.75), 2)
        abv = round(f * b0 + 0.0008 * (yan - 250) - (0.10 if vessel == "Barrel" else 0) + abv_shift[(season, strain)] + rng.gauss(0, 0.10), 2)
        inoc = dt.datetime(season, 9, 2 + (i * 7) % 26 if not running else 20 + i // 2, 8 + (i * 5) % 9, (i * 13) % 60)
        must_temp = (19 if colour == "red" else 13) + rng.uniform(-1.5, 1.5)
        peak = must_temp + (9 if colour == "red" else 4) + (2 if vessel == "Open fermenter" else 0) + rng.gauss(0, 1.0)
        mu = mu0 * season_rate[season] * math.exp(rng.gauss(0, 0.12)) * (1 + 0.03 * (peak - (28 if colour == "red" else 17)))
        lam = lag0 * math.exp(rng.gauss(0, 0.2)) / season_rate[season]
        A = b0 + rng.uniform(1.3, 2.1)
        rows, t, end = [], rng.uniform(3, 9), (rng.uniform(40, 70) if running else 2000)
        while t <= end:
            c = gomp(A, mu, lam, t); s = min(1.0, mu * math.e * (c / A) * -math.log(max(c / A, 1e-12)) / mu) if c > 0 else 0.0
            temp = must_temp + (peak - must_temp) * s
            brix = b0 - c
            rows.append((inoc + dt.timedelta(hours=t), brix + rng.gauss(0, 0.15), temp + rng.gauss(0, 0.25)))
            if brix < -1.0: break
            t += rng.choice([10.5, 13.5, 10.0, 14.0]) if i % 6 else rng.choice([7.5, 8.0, 8.5])
        when_written = inoc.strftime("%Y-%m-%d %H:%M")
        mean_temp = "%.1f" % (sum(r[2] for r in rows) / len(rows)) if i % 4 else ""
        if running:
            rlots.append([lot, season, strain, b0, vessel, cap, volume, colour, when_written, yan])
            rlogs += [(lot, r[0], r[1], r[2]) for r in rows]
        else:
            lots.append([lot, season, strain, b0, abv, round(rng.uniform(0.6, 2.6), 1), vessel, cap, volume, colour,
                         when_written, varieties[colour][i % len(varieties[colour])], yan if i % 9 else "", ph if i % 11 else "", mean_temp])
            logs += [(lot, r[0], r[1], r[2]) for r in rows]
with open(os.path.join(hist, "corrowind-lots.csv"), "w", newline="", encoding="utf-8") as fh:
    w = csv.writer(fh)
    w.writerow(["Lot", "Vintage", "Strain", "Start Brix", "Final ABV %", "RS g/L", "Vessel", "Vessel capacity L", "Must volume L",
                "Colour", "Inoculated", "Variety", "YAN mg/L", "pH", "Mean fermentation temp °C"])
    w.writerows(lots)
with open(os.path.join(hist, "corrowind-logs.csv"), "w", newline="", encoding="utf-8") as fh:
    w = csv.writer(fh); w.writerow(["Lot", "Date", "Time", "Brix", "Temp °C"])
    for lot, when, brix, temp in logs: w.writerow([lot, when.strftime("%Y-%m-%d"), when.strftime("%H:%M"), "%.1f" % brix, "%.1f" % temp])
with open(os.path.join(run, "corrowind-2020-running.csv"), "w", newline="", encoding="utf-8") as fh:
    w = csv.writer(fh)
    w.writerow(["Lot", "Vintage", "Strain", "Start Brix", "Vessel", "Vessel capacity L", "Must volume L", "Colour", "Inoculated", "YAN mg/L"])
    w.writerows(rlots)
with open(os.path.join(run, "corrowind-2020-logs.csv"), "w", newline="", encoding="utf-8") as fh:
    w = csv.writer(fh); w.writerow(["Lot", "Date", "Time", "Brix", "Temp °C"])
    for lot, when, brix, temp in rlogs: w.writerow([lot, when.strftime("%Y-%m-%d"), when.strftime("%H:%M"), "%.1f" % brix, "%.1f" % temp])
