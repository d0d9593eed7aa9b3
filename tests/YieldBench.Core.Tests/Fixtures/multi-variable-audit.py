# Reference values for tests/YieldBench.Modeling.Tests/MultiVariableAuditTests.cs: the multi-variable house-factor
# candidate of docs/methods.md Part 3 ("The multi-variable model") recomputed from the methods text, not from the C#
# code. The same features (starting Brix after additions, and vessel size, YAN, pH and mean fermentation temperature
# when recorded on at least half the training lots and not constant, missing values filled with the training median,
# all standardised by the training mean and n - 1 SD; strain, and vessel type and variety when they take two or more
# values, one-hot, "(not recorded)" for a blank; the label centred on its training mean) and the same penalised problem
# SDCA solves (ML.NET's objective: mean squared residual + L2/2 x ||(bias, w)||^2, L2 = 1e-3), solved in closed form
# by the normal equations with numpy, fold by fold (leave one season out) on the lots the house factor uses (the
# review's flagged lots left out). Also printed: the same with the bias not penalised, and minimum-norm least squares.
# Produced with Debian 12 python3 3.11.2, python3-numpy 1.24.2, from the repository root, OUT any new folder:
#   dotnet run -c Release --project src/YieldBench.Cli -- review --out OUT/demo
#   /usr/bin/python3 tests/YieldBench.Core.Tests/Fixtures/multi-variable-audit.py OUT/demo tests/YieldBench.Core.Tests/Fixtures/multi-variable-audit/demo.csv
#   /usr/bin/python3 tests/YieldBench.Core.Tests/Fixtures/corrowind-cellar.py
#   dotnet run -c Release --project src/YieldBench.Cli -- review tests/YieldBench.Core.Tests/Fixtures/corrowind-input --out OUT/cw
#   /usr/bin/python3 tests/YieldBench.Core.Tests/Fixtures/multi-variable-audit.py OUT/cw tests/YieldBench.Core.Tests/Fixtures/multi-variable-audit/corrowind.csv
# Printed (leave-one-season-out MAE of the penalised optimum): demo 0.190542 (218 lots), Corrowind 0.111774 (120 lots).
# lots.csv gives starting Brix at two decimals (0.003 % v/v at most in a prediction).
import csv, json, sys
import numpy as np

folder = sys.argv[1]
lam = 1e-3
rows = list(csv.DictReader(open(folder + '/data/lots.csv', encoding='utf-8')))
hf = json.load(open(folder + '/data/house-factor.json', encoding='utf-8'))
flagged = {f['lot_id'] for f in hf['flagged_lots']}
lots = [r for r in rows if r['lot_id'] not in flagged and r['final_abv'] and r['starting_brix']]
print('lots', len(lots))

def num(v):
    try:
        return float(v)
    except ValueError:
        return None

NUMS = ['vessel_capacity_l', 'yan_mg_l', 'ph', 'mean_temp_c']
CATS = ['vessel', 'variety']

def design(train, test):
    cols_num = ['starting_brix']
    fill = {}
    for c in NUMS:
        present = [num(r[c]) for r in train if num(r[c]) is not None]
        if len(present) >= 0.5 * len(train) and len(set(present)) >= 2:
            cols_num.append(c); fill[c] = float(np.median(present))
    cols_cat = ['strain'] + [c for c in CATS if len({r[c] or '(not recorded)' for r in train}) >= 2]
    def raw(r):
        return [num(r[c]) if c == 'starting_brix' else (num(r[c]) if num(r[c]) is not None else fill[c]) for c in cols_num]
    Rt = np.array([raw(r) for r in train]); mu = Rt.mean(0); sd = Rt.std(0, ddof=1); sd[sd == 0] = 1
    levels = {c: sorted({r[c] or '(not recorded)' for r in train}) for c in cols_cat}
    def X(rs):
        N = (np.array([raw(r) for r in rs]) - mu) / sd
        C = [np.array([[1.0 if (r[c] or '(not recorded)') == l else 0.0 for l in levels[c]] for r in rs]) for c in cols_cat]
        return np.hstack([N] + C)
    return X(train), X(test), cols_num + cols_cat

def fit_predict(train, test, variant):
    Xt, Xs, cols = design(train, test)
    y = np.array([float(r['final_abv']) for r in train]); c = y.mean(); yc = y - c
    n, p = Xt.shape
    if variant == 'ols':  # minimum-norm least squares, bias free
        A = np.hstack([np.ones((n, 1)), Xt]); beta = np.linalg.pinv(A) @ yc
        return c + np.hstack([np.ones((len(test), 1)), Xs]) @ beta, cols
    # ML.NET SDCA objective (squared loss (r)^2 averaged, lambda/2 ||w||^2); bias penalised or not
    A = np.hstack([np.ones((n, 1)), Xt])
    P = np.eye(p + 1) * (n * lam / 2)
    if variant == 'ridge-free-bias':
        P[0, 0] = 0
    beta = np.linalg.solve(A.T @ A + P, A.T @ yc)
    return c + np.hstack([np.ones((len(test), 1)), Xs]) @ beta, cols

seasons = sorted({r['season'] for r in lots})
for variant in ['ridge', 'ridge-free-bias', 'ols']:
    errs = []
    for s in seasons:
        tr = [r for r in lots if r['season'] != s]; te = [r for r in lots if r['season'] == s]
        pred, cols = fit_predict(tr, te, variant)
        errs += list(np.array([float(r['final_abv']) for r in te]) - pred)
    e = np.abs(errs)
    print(variant, 'LOSO MAE %.6f  bias %.6f  rmse %.6f  p90 %.6f' % (e.mean(), -np.mean(errs), np.sqrt(np.mean(np.square(errs))), np.percentile(e, 90)), cols)
c = next(c for c in hf['candidates'] if c['id'] == 'multi-variable')
print('tool LOSO', c['by_season'])

# per-lot leave-one-season-out predictions of the penalised optimum (bias penalised, ML.NET's objective)
if len(sys.argv) > 2:
    out = open(sys.argv[2], 'w', encoding='utf-8', newline='')
    w = csv.writer(out, lineterminator='\n')
    w.writerow(['lot_id', 'season', 'strain', 'starting_brix', 'final_abv', 'vessel', 'variety', 'vessel_capacity_l', 'yan_mg_l', 'ph', 'mean_temp_c', 'optimum_loso_abv'])
    for s in seasons:
        tr = [r for r in lots if r['season'] != s]; te = [r for r in lots if r['season'] == s]
        pred, cols = fit_predict(tr, te, 'ridge')
        for r, p in zip(te, pred):
            w.writerow([r['lot_id'], r['season'], r['strain'], r['starting_brix'], r['final_abv'], r['vessel'], r['variety'], r['vessel_capacity_l'], r['yan_mg_l'], r['ph'], r['mean_temp_c'], '%.10f' % p])
    out.close()
