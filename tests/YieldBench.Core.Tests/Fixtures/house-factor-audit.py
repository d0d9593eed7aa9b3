# Reference values for tests/YieldBench.Core.Tests/HouseFactor/HouseFactorReferenceTests.cs: the house-factor analysis
# of docs/methods.md Part 3 recomputed from the methods text (not from the C# code) on an invented cellar
# (Quillhaven Cellars, invented strain codes QH-A1, QH-B4, QH-C7, QH-D2; four seasons of 27 lots; no real data).
# Produced with Debian 12 python3 3.11.2, python3-numpy 1.24.2, python3-scipy 1.10.1:
#   /usr/bin/python3 house-factor-audit.py            (from this folder; prints the lots as C# and every reference value)
# Sources of each formula (docs/methods.md Part 3): candidates (table "Candidates"; DerSimonian-Laird shrinkage;
# Huber through the origin as MASS rlm, k = 1.345, scale median|r|/0.6745, stop at 1e-4, at most 20 rounds; Theil-Sen
# with scipy.stats.theilslopes and intercept median(y) - b median(x)); OIV must table interpolated linearly
# (src/YieldBench.Core/Units/oiv-must-table.csv) / 16.83 for eu-convention; metrics (MAE, bias, RMSE, type-7 P90, US
# tolerance 1.5 / 1.0 % v/v with the 16 % no-crossing line, wrong side of 14 %); the season-aware error model (ANOVA
# MSW, MSB, n0; tau^2 = sigma_b^2 ((S-1)/S)^2; V = sigma_w^2 (1 + 1/n) + tau^2 (1 + 1/S); Welch-Satterthwaite nu);
# the MAE's standard error sqrt(sigma_w^2/n + sigma_b^2 sum n_g^2 / n^2) of the absolute errors; the one-standard-error
# rule (simplest by complexity, then MAE, then offer order); per-strain choices for strains with >= 15 lots; the
# planner's highest sugar b = (T - U(c) - a)/b1, U(c) = mean + t_nu(c) sqrt(V), or the OIV inverse of (T - U) x 16.83;
# SeasonCoverage: each season held out, the whole analysis (built-in candidates) on the others, its lots checked
# against the planner's 80/95 % interval of their strain and the overall band. Ten folds by lot (costly candidates
# above 100 lots) depend on the tool's seeded shuffle, so only the spread over 2,000 random shuffles is given.
import numpy as np
from scipy import stats
from scipy.stats import theilslopes

rng = np.random.default_rng(4242)
STRAINS = {'QH-A1': 0.00, 'QH-B4': 0.12, 'QH-C7': 0.45, 'QH-D2': -0.20}
shift = {(y, s): rng.normal(0, 0.10) for y in range(2020, 2024) for s in STRAINS}
lots = []
for y in range(2020, 2024):
    for i in range(27):
        s = list(STRAINS)[i % 4]; b = round(float(rng.uniform(20.6, 27.0)), 1)
        a = round(-2.33 + 0.687*b + STRAINS[s] + shift[(y, s)] + rng.normal(0, 0.12), 2)
        lots.append((y, '%d-%03d' % (y % 100, i + 1), s, b, a))
print('// lots (season, id, strain, starting °Brix, final % v/v)')
for k in range(0, len(lots), 3):
    print('        ' + ' '.join('(%d, "%s", "%s", %.1f, %.2f),' % l for l in lots[k:k + 3]))
SE = np.array([l[0] for l in lots]); ST = np.array([l[2] for l in lots]); B = np.array([l[3] for l in lots]); A = np.array([l[4] for l in lots])
F = A/B
tab = np.loadtxt('../../../src/YieldBench.Core/Units/oiv-must-table.csv', delimiter=',', comments='#', skiprows=5, encoding='utf-8')
def sugar(b): return np.interp(b, tab[:, 0], tab[:, 1])
def huber_origin(x, y, k=1.345):
    b = (x*y).sum()/(x*x).sum(); r = y - b*x
    for _ in range(20):
        s = np.median(np.abs(r))/0.6745; w = np.minimum(1, k/np.maximum(np.abs(r/s), 1e-300))
        bn = (w*x*y).sum()/(w*x*x).sum(); rn = y - bn*x
        conv = np.sqrt(((r - rn)**2).sum()/(r*r).sum()); b, r = bn, rn
        if conv <= 1e-4: break
    return b
def shrunk(fv, sv):
    ks = sorted(set(sv)); y = np.array([fv[sv == k].mean() for k in ks]); n = np.array([(sv == k).sum() for k in ks])
    sw2 = sum(((fv[sv == k] - fv[sv == k].mean())**2).sum() for k in ks)/sum(n - 1)
    v = sw2/n; w = 1/v; yb = (w*y).sum()/w.sum(); Q = (w*(y - yb)**2).sum()
    tau2 = max(0, (Q - (len(ks) - 1))/(w.sum() - (w*w).sum()/w.sum()))
    mu = (y/(v + tau2)).sum()/(1/(v + tau2)).sum(); return dict(zip(ks, mu + tau2/(tau2 + v)*(y - mu)))
CANDS = [('fixed-0.55', 0), ('fixed-0.59', 0), ('eu-convention', 0), ('pooled-median', 1), ('pooled-huber-origin', 1),
         ('pooled-theil-sen', 2), ('strain-median', 3), ('strain-shrunk', 4)]
def fit(cid, tr):
    b, a, f, s = B[tr], A[tr], F[tr], ST[tr]
    if cid == 'fixed-0.55': return (0.0, 0.55, None)
    if cid == 'fixed-0.59': return (0.0, 0.59, None)
    if cid == 'eu-convention': return ('eu', None, None)
    if cid == 'pooled-median': return (0.0, np.median(f), None)
    if cid == 'pooled-huber-origin': return (0.0, huber_origin(b, a), None)
    if cid == 'pooled-theil-sen': sl = theilslopes(a, b)[0]; return (np.median(a) - sl*np.median(b), sl, None)
    if cid == 'strain-median': return (0.0, np.median(f), {k: np.median(f[s == k]) for k in set(s)})
    if cid == 'strain-shrunk': return (0.0, None, shrunk(f, s))
def predict(m, bb, ss):
    a, b1, per = m
    if a == 'eu': return sugar(bb)/16.83
    if per is not None: return np.array([per[x] for x in ss])*bb
    return a + b1*bb
def backtest(cid, idx, groups):
    e = np.empty(len(idx)); p = np.empty(len(idx)); g = groups[idx]
    for s in sorted(set(g)):
        te = idx[g == s]; tr = idx[g != s]; p[g == s] = predict(fit(cid, tr), B[te], ST[te]); e[g == s] = A[te] - p[g == s]
    return e, p
def metrics(e, p, act):
    ae = np.abs(e); tol = np.where(p <= 14, 1.5, 1.0); within = (ae <= tol) & ((p > 16) == (act > 16))
    return dict(mae=ae.mean(), bias=-e.mean(), rmse=np.sqrt((e*e).mean()), p90=np.quantile(ae, 0.9), within=within.mean(), wrong=((p > 14) != (act > 14)).mean())
def anova(e, keys):
    n = len(e); gs = {}
    for k, v in zip(keys, e): gs.setdefault(k, []).append(v)
    G = len(gs); ng = np.array([len(v) for v in gs.values()]); mg = np.array([np.mean(v) for v in gs.values()])
    if G < 2 or G == n: return None
    msw = sum(((np.array(v) - np.mean(v))**2).sum() for v in gs.values())/(n - G); msb = (ng*(mg - e.mean())**2).sum()/(G - 1)
    return msw, msb, (n - (ng**2).sum()/n)/(G - 1), G, ng
def mae_se(ae, keys):
    a = anova(ae, keys)
    if a is None: return ae.std(ddof=1)/np.sqrt(len(ae))
    msw, msb, n0, G, ng = a; n = len(ae); return np.sqrt(msw/n + max(0, (msb - msw)/n0)*(ng**2).sum()/n**2)
def err_model(e, keys, S):
    n = len(e); a = anova(e, keys)
    if S < 2 or a is None: return e.mean(), e.std(ddof=1)**2*(1 + 1/n), n - 1
    msw, msb, n0, G, ng = a; sb2 = max(0, (msb - msw)/n0); tau2 = sb2*((S - 1)/S)**2; V = msw*(1 + 1/n) + tau2*(1 + 1/S)
    if sb2 == 0: return e.mean(), V, n - G
    bq = ((S - 1)/S)**2*(1 + 1/S)/n0; aq = 1 + 1/n - bq
    return e.mean(), V, V**2/(aq*aq*msw*msw/(n - G) + bq*bq*msb*msb/(G - 1))
def one_se(errs, keys):
    m = {c: np.abs(errs[c]).mean() for c, _ in CANDS}
    best = min(CANDS, key=lambda c: (m[c[0]], CANDS.index(c)))[0]; lim = m[best] + mae_se(np.abs(errs[best]), keys)
    return min([c for c in CANDS if m[c[0]] <= lim], key=lambda c: (c[1], m[c[0]], CANDS.index(c)))[0]
def analysis(idx):
    S = len(set(SE[idx])); ck = list(zip(SE[idx], ST[idx])); errs = {c: backtest(c, idx, SE)[0] for c, _ in CANDS}
    overall = one_se(errs, ck); lines = {'*': (overall, err_model(errs[overall], ck, S))}
    for s in sorted(set(ST[idx])):
        k = ST[idx] == s
        if k.sum() >= 15:
            ch = one_se({c: errs[c][k] for c, _ in CANDS}, list(SE[idx][k])); lines[s] = (ch, err_model(errs[ch][k], list(SE[idx][k]), S))
        else: lines[s] = lines['*']
    return errs, lines
idx = np.arange(len(lots)); ck = list(zip(SE, ST))
errs, lines = analysis(idx)
print('// candidates: id, leave-one-season-out MAE, its standard error, P90, share within tolerance; leave-one-lot-out MAE where run')
for c, _ in CANDS:
    e, p = backtest(c, idx, SE); m = metrics(e, p, A)
    lolo = ''
    if c not in ('pooled-huber-origin', 'pooled-theil-sen'):
        e2, p2 = backtest(c, idx, idx); lolo = ', LOLO MAE %.12f' % metrics(e2, p2, A)['mae']
    print('%s: LOSO MAE %.12f, SE %.12f, P90 %.12f, within %.12f%s' % (c, m['mae'], mae_se(np.abs(e), ck), m['p90'], m['within'], lolo))
print('// choices:', {k: v[0] for k, v in lines.items()})
print('// planner table: strain, target, confidence, highest °Brix, allowance U')
for key in ['*'] + sorted(set(ST)):
    cid, (mean, V, nu) = lines[key]; m = fit(cid, idx)
    for T in (13.0, 14.0, 15.0):
        for c in (0.8, 0.95):
            U = mean + stats.t.ppf(c, nu)*np.sqrt(V)
            if m[0] == 'eu': hb = np.interp((T - U)*16.83, tab[:, 1], tab[:, 0])
            else: hb = (T - U - m[0])/(m[2][key] if m[2] is not None and key != '*' else m[1])  # a strain's own median, or the pooled line
            print('("%s", %.1f, %.2f, %.10f, %.10f),' % (key, T, c, hb, U))
print('// nested coverage: season, lots, planner 80, planner 95, overall 80, overall 95')
for s in sorted(set(SE)):
    inner = idx[SE != s]; held = idx[SE == s]; _, li = analysis(inner); c = [0, 0, 0, 0]
    fits = {k: (fit(v[0], inner), v[1]) for k, v in li.items()}
    for i in held:
        for j, key in ((0, ST[i]), (2, '*')):
            m, (mean, V, nu) = fits[key]; p = float(np.atleast_1d(predict(m, np.array([B[i]]), [ST[i]]))[0])
            for q, L in ((0, 0.8), (1, 0.95)):
                h = stats.t.ppf((1 + L)/2, nu)*np.sqrt(V); c[j + q] += int(p + mean - h <= A[i] <= p + mean + h)
    print('(%d, %d, %d, %d, %d, %d),  // inner choices %s' % (s, len(held), *c, {k: v[0] for k, v in li.items()}))
print('// ten folds by lot: MAE over 2,000 random shuffles (numpy default_rng(1)): 0.5 %, 50 %, 99.5 % points')
r2 = np.random.default_rng(1); mt = {'pooled-huber-origin': [], 'pooled-theil-sen': []}
for _ in range(2000):
    perm = r2.permutation(len(lots)); fold = np.empty(len(lots), int); fold[perm] = np.arange(len(lots)) % 10
    for c in mt: mt[c].append(np.abs(backtest(c, idx, fold)[0]).mean())
for c, v in mt.items(): print('%s: %.6f %.6f %.6f' % (c, *np.quantile(v, [0.005, 0.5, 0.995])))
