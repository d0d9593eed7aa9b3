# Bootstrap percentile intervals of the median as reported in a review's workbook (docs/methods.md Part 2 §3), judged
# against the near-exact bootstrap law of each group's median (40,000 resamples here) within the Monte Carlo precision
# of the tool's 2,000 resamples: at each end, P(median* < end) <= p + d and P(median* <= end) >= p - d, p = 0.025 and
# 0.975, d = 4.5 sqrt(p (1 - p) / 2000) = 0.0157. Cited by tests/YieldBench.Core.Tests/Statistics/BootstrapLawTests.cs.
# Produced with Debian 12 python3 3.11.2, numpy 1.24.2, pandas 1.5.3, openpyxl 3.0.9:
#   dotnet run -c Release --project src/YieldBench.Cli -- review --out /tmp/r
#   /usr/bin/python3 odd-lot-flags-audit.py --lots /tmp/r/report.xlsx /tmp/r/lots.csv   (writes the Lots sheet as CSV)
#   /usr/bin/python3 bootstrap-audit.py /tmp/r/lots.csv /tmp/r/report.xlsx 40000
# Demo (main 1fe9e40): 216 intervals checked, none outside; an invented cellar of 108 lots: 184, none outside.
import sys, numpy as np, pandas as pd, openpyxl
lots = pd.read_csv(sys.argv[1]); R = int(sys.argv[3]); rng = np.random.default_rng(20261205)
wb = openpyxl.load_workbook(sys.argv[2], read_only=True, data_only=True)
meas = {'abv_per_brix': 'Alcohol per °Brix (% v/v per °Brix)', 'abv_per_brix_fermented': 'Alcohol per °Brix fermented',
        'sugar_gl_per_abv': 'Sugar per % alcohol (g/L per % v/v)', 'gay_lussac_efficiency': 'Share of Gay-Lussac yield'}
vessel = lots['Vessel'].fillna('(not recorded)').str.strip().str.lower()
B = lots['Starting sugar after additions (°Brix)']
band = np.select([B < 21, B < 23, B < 25, B < 27], ['<21', '21–23', '23–25', '25–27'], '≥27')
keys = {'strain': lots['Strain'].astype(str), 'vessel': vessel, 'starting sugar band': pd.Series(band), 'variety': lots['Variety'].astype(str),
        'season': lots['Season'].astype(str), 'strain × vessel': lots['Strain'] + ' × ' + vessel, 'strain × season': lots['Strain'] + ' × ' + lots['Season'].astype(str)}
rows = []
for s in ['By strain', 'By vessel', 'By sugar band', 'By variety', 'By season', 'Strain by vessel', 'Strain by season']:
    rs = list(wb[s].iter_rows(values_only=True)); h = rs[0]
    rows += [dict(zip(h, r)) for r in rs[1:] if r[0] is not None]
p = 0.025; sig = np.sqrt(p*(1 - p)/2000); delta = 4.5*sig
checked = bad = 0; worst = 0; exs = []
for r in rows:
    if r['Median 95 % interval low'] is None: continue
    g = r['Grouping']; key = keys.get(g)
    if key is None: print('unknown grouping', g); continue
    x = lots.loc[(key.str.lower() == str(r['Group']).lower()).values, meas[r['Measure']]].astype(float).dropna().values
    x = x[np.isfinite(x)]
    if len(x) != r['Lots'] or abs(np.median(x) - r['Median']) > 1e-12:
        print('group mismatch', g, r['Group'], r['Measure'], len(x), r['Lots']); continue
    xs = np.sort(x); n = len(xs)
    med = np.median(xs[np.sort(rng.integers(0, n, size=(R, n)), axis=1)], axis=1) if n <= 60 else np.median(rng.choice(xs, size=(R, n)), axis=1)
    med.sort()
    lo, hi = r['Median 95 % interval low'], r['Median 95 % interval high']
    # F(lo-) <= p + delta and F(lo) >= p - delta ; same at 1 - p for hi
    Flo_m = np.searchsorted(med, lo - 1e-12, 'left')/R; Flo = np.searchsorted(med, lo + 1e-12, 'right')/R
    Fhi_m = np.searchsorted(med, hi - 1e-12, 'left')/R; Fhi = np.searchsorted(med, hi + 1e-12, 'right')/R
    ok = Flo_m <= p + delta and Flo >= p - delta and Fhi_m <= 1 - p + delta and Fhi >= 1 - p - delta
    mlo, mhi = np.quantile(med, [p, 1 - p])
    ex = max(Flo_m - p, p - Flo, Fhi_m - (1 - p), (1 - p) - Fhi); worst = max(worst, ex); exs.append((ex, g, r['Group'], r['Measure'], n, Flo_m, Flo, Fhi_m, Fhi))
    checked += 1
    if not ok:
        bad += 1; print('OUTSIDE', g, r['Group'], r['Measure'], n, 'tool', lo, hi, 'mine', mlo, mhi, 'F', Flo_m, Flo, Fhi_m, Fhi)
print('checked %d intervals, %d outside the band; delta %.4f (4.5 sigma of a 2,000-resample quantile at p = 0.025); worst excess %.4f' % (checked, bad, delta, worst))
exs.sort(key=lambda e: -e[0])
for e in exs[:8]: print('excess %.4f' % e[0], e[1:])
z = np.array([e[0] for e in exs])/sig
print('excess in sigmas: quantiles 50/90/99 %%: %.2f %.2f %.2f' % tuple(np.quantile(z, [0.5, 0.9, 0.99])))
