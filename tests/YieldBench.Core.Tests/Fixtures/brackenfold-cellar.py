# An invented cellar for the kinetics audit (kinetics-audit.py): Brackenfold Cellars (invented; no real winery, yeast
# or data), strains BF-A3, BF-K9 (reds), BF-M4, BF-S6 (whites), seasons 2019-2021, 78 lots, each with a log. Logs follow
# the modified Gompertz course (Zwietering et al. 1990) with reading noise; in them: a red that passes 40 °C, a
# white stuck near 3.5 °Brix (28.4 g/L residual sugar), a red that stalls four days at 10 °Brix and then finishes, a
# white that idles 60 h at 8 °Brix, two readings at one time, an hourly probe log, a white whose temperature sits at the
# 20 °C line, a lot without an inoculation time, and a season logged in SG.
# Writes its four CSV files into kinetics-audit/brackenfold-input beside this script:
#   /usr/bin/python3 brackenfold-cellar.py        (Debian 12 python 3.11.2; the standard library only)
import csv, math, random, datetime as dt, os
rng = random.Random(4242)
out = os.path.join(os.path.dirname(os.path.abspath(__file__)), "kinetics-audit", "brackenfold-input")
strains = {"BF-A3": ("red", 0.16, 12, 0.60), "BF-K9": ("red", 0.12, 22, 0.585), "BF-M4": ("white", 0.09, 30, 0.59), "BF-S6": ("white", 0.11, 18, 0.575)}
lots, logs = [], []
def gomp(A, mu, lam, t): return A * math.exp(-math.exp(min(mu * math.e / A * (lam - t) + 1, 50)))
n = 0
for season in (2019, 2020, 2021):
    for strain, (colour, mu, lag, f) in strains.items():
        for k in range(7 if strain != "BF-S6" else 5):
            n += 1
            lot = "BF%d-%02d" % (season % 100, n)
            b0 = round(rng.gauss(24.5 if colour == "red" else 21.5, 1.2), 1)
            rs = round(rng.uniform(0.6, 3.0), 1)
            if season == 2020 and strain == "BF-M4" and k == 2: rs = 28.4                  # the stalled lot is stuck
            pause = {(2021, "BF-K9", 3): (10.0, 100.0), (2021, "BF-S6", 1): (8.0, 60.0)}.get((season, strain, k))  # (°Brix, h)
            abv = round(f * b0 + rng.gauss(0, 0.1), 2)
            inoc = dt.datetime(season, 9, 3 + n % 25, 9 + k % 8, 5 * k % 60)
            inoc_written = "" if (season == 2020 and k == 3) else inoc.strftime("%Y-%m-%d %H:%M")
            lots.append([lot, season, strain, b0, abv, rs, "Tank" if colour == "white" else "Open bin", colour, inoc_written, "Syrah" if colour == "red" else "Semillon"])
            A = b0 + rng.uniform(1.4, 2.0); m = mu * rng.uniform(0.8, 1.25); lam = lag * rng.uniform(0.8, 1.2)
            peak = (31 if colour == "red" else 17) + rng.uniform(-2, 3)
            if season == 2021 and strain == "BF-A3" and k == 0: peak = 41.5; m *= 1.3   # a hot red
            probe = season == 2019 and strain == "BF-K9" and k == 1                      # hourly probe log

            t = rng.uniform(2, 8); rows = []
            t_pause = None
            if pause:  # the sugar holds near pause[0] °Brix for pause[1] hours, then the course goes on where it left off
                t_pause = next(h / 10 for h in range(20000) if b0 - gomp(A, m, lam, h / 10) <= pause[0])
            while True:
                if t_pause is None or t < t_pause: c = gomp(A, m, lam, t)
                elif t < t_pause + pause[1]: c = gomp(A, m, lam, t_pause) + 0.1 * (t - t_pause) / 24
                else: c = gomp(A, m, lam, t - pause[1]) + 0.1 * pause[1] / 24
                if season == 2020 and strain == "BF-M4" and k == 2 and c > b0 - 3.5:  # a stall at 3.5 °Brix
                    c = min(c, b0 - 3.5 + 0.02 * (t / 24))
                brix = b0 - c
                temp = 14 + (peak - 14) * min(1.0, max(0.0, (c / A) * 2.2 if c / A < 0.45 else 1 - (c / A - 0.45) * 1.1))
                if colour == "white" and season == 2019 and k == 4: temp = min(temp, 20.0) if temp > 19.6 else temp  # sits at the 20 °C line
                when = inoc + dt.timedelta(hours=t)
                noise = 0.03 if probe else 0.15
                rows.append((when, brix + rng.gauss(0, noise), temp + rng.gauss(0, 0.08 if probe else 0.2)))
                if brix < -1.2 or t > 1200: break
                t += 1.0 if probe else rng.choice([9.8, 14.2, 10.1, 13.9, 24.0])
            if season == 2019 and strain == "BF-A3" and k == 2: rows.insert(5, (rows[5][0], rows[5][1] + 0.2, rows[5][2] + 0.3))  # duplicate time
            for when, brix, temp in rows:
                sg = ((season == 2021) and not probe)
                if sg:
                    # SG by the NBS cubic's inverse, to 0.001
                    lo, hi = 0.95, 1.3
                    for _ in range(80):
                        mid = (lo + hi) / 2
                        lo, hi = (mid, hi) if ((182.4601 * mid - 775.6821) * mid + 1262.7794) * mid - 669.5622 < brix else (lo, mid)
                    val = "%.3f" % ((lo + hi) / 2)
                else:
                    val = "%.1f" % brix if not probe else "%.2f" % brix
                logs.append((season, lot, when.strftime("%Y-%m-%d"), when.strftime("%H:%M"), val if not sg else None, val if sg else None,
                             "%.1f" % temp if not (colour == "white" and season == 2019 and k == 4 and abs(temp - 20) < 0.2) else "20.0"))
with open(os.path.join(out, "brackenfold-lots.csv"), "w", newline="") as fh:
    w = csv.writer(fh); w.writerow(["Lot", "Season", "Strain", "Start Brix", "Final ABV %", "RS g/L", "Vessel", "Colour", "Inoculated", "Variety"]); w.writerows(lots)
for season in (2019, 2020, 2021):
    with open(os.path.join(out, "brackenfold-logs-%d.csv" % season), "w", newline="") as fh:
        w = csv.writer(fh)
        w.writerow(["Lot", "Date", "Time", "SG" if season == 2021 else "Brix", "Temp °C"])
        for r in logs:
            if r[0] == season: w.writerow([r[1], r[2], r[3], r[5] if season == 2021 else r[4], r[6]])
