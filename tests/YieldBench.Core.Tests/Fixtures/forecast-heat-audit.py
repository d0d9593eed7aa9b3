# Independent check of the forecast's heat balance (docs/methods.md Part 5, "Temperature and heat") on the demo's
# harvest in progress, for tests/YieldBench.Cli.Tests/ForecastHeatAuditTests.cs. Written from the methods text, not
# the code. Produced with Debian 12 python3 3.11.2, numpy 1.24.2, scipy 1.10.1, openpyxl 3.0.9:
#   dotnet run -c Release --project src/YieldBench.Cli -- forecast --out /tmp/fc      (from the repository root)
#   /usr/bin/python3 tests/YieldBench.Core.Tests/Fixtures/forecast-heat-audit.py /tmp/fc
# Formulas: sugar per °Brix of fall q = sugar(S0) / (S0 - F), sugar(B) the OIV must table interpolated linearly
# (src/YieldBench.Core/Units/oiv-must-table.csv); heat 100.4 kJ/mol of hexose, 180.16 g/mol (Colombié, Malherbe &
# Sablayrolles 2007); rise per °Brix beta = q / 180.16 x 100.4 / (rho cp), rho = SG(S0) x 0.99820 with SG the inverse
# of the NBS-fitted cubic, cp the Choi & Okos (1986) water/carbohydrate model at 20 °C and S0's mass fractions;
# reachable = last temperature + beta (last °Brix - F); cooling kW = mu_m q V / 180.16 x 100.4 / 3600 with mu_m in
# °Brix/h and V the must volume after recorded additions. S0 (the fitted start) is not in the outputs, so it is taken
# as the record's starting sugar +-1 °Brix: beta and kW move by under 1.3 % over that range. Eliminating q between the
# two outputs leaves reachable = last T + kW x 3600 / (mu_m V) / (rho cp) x (last °Brix - F), where only rho cp
# depends on S0 (0.3 % per °Brix): the relation the test holds, to 0.1 K.
import json, sys, datetime as dt, numpy as np, openpyxl
from scipy.optimize import brentq
root = sys.argv[1]; here = __file__.rsplit('/', 1)[0] if '/' in __file__ else '.'
tab = np.loadtxt(here + '/../../../src/YieldBench.Core/Units/oiv-must-table.csv', delimiter=',', comments='#', skiprows=5, encoding='utf-8')
def sugar(b): return np.interp(b, tab[:, 0], tab[:, 1])
def sg(b): return brentq(lambda s: ((182.4601*s - 775.6821)*s + 1262.7794)*s - 669.5622 - b, 0.95, 1.3, xtol=1e-14)
def cp(b, T=20.0):
    w = 4.1762 - 9.0864e-5*T + 5.4731e-6*T*T; c = 1.5488 + 1.9625e-3*T - 5.9399e-6*T*T
    return (1 - b/100)*w + b/100*c
fc = json.load(open(root + '/forecast.json'))
wb = openpyxl.load_workbook(here + '/../../../demo-data/running/tallowmere-2026-harvest-in-progress.xlsx', data_only=True)
lots = {r[0]: r for r in wb['Lots in progress'].iter_rows(min_row=2, values_only=True)}
logs = {}
for r in wb['Logs 2026'].iter_rows(min_row=2, values_only=True):
    logs.setdefault(r[0], []).append((dt.datetime.combine(r[1].date(), r[2]), r[3], r[4]))
xl = openpyxl.load_workbook(root + '/forecast.xlsx', data_only=True)['Forecast']
hdr = [c.value for c in xl[1]]; full = {r[1]: dict(zip(hdr, r)) for r in xl.iter_rows(min_row=2, values_only=True)}
for L in fc['lots']:
    rec = lots[L['lot_id']]; S = rec[7]; V = rec[8] or rec[4]
    F = L['basis']['settles_at_brix']; mu = L['basis']['peak_rate_brix_per_day']/24
    lg = sorted(logs[L['lot_id']]); T = [x[2] for x in lg if x[2] is not None][-1]; b = [x[1] for x in lg if x[1] is not None][-1]
    x = full[L['lot_id']]; kw = x['Heat at the peak rate: cooling to hold it (kW)']; reach = x['Reachable with no cooling from now (°C)']
    band = []
    for S0 in (S - 1, S, S + 1):
        q = sugar(S0)/(S0 - F); band.append((mu*q*V/180.16*100.4/3600, T + q/180.16*100.4/(sg(S0)*0.99820*cp(S0))*(b - F)))
    rel = T + kw*3600/(mu*V)/(sg(S)*0.99820*cp(S))*(b - F)
    print('%s start %.1f °Brix, %d L, last %.1f °Brix %.1f °C | kW tool %.4f, recomputed %.4f (S0 +-1: %.4f..%.4f) | reachable tool %.3f, recomputed %.3f (%.3f..%.3f), relation %.3f' % (
        L['lot_id'], S, V, b, T, kw, band[1][0], min(v[0] for v in band), max(v[0] for v in band), reach, band[1][1], min(v[1] for v in band), max(v[1] for v in band), rel))
