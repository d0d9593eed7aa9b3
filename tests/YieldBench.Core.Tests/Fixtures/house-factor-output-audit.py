# The house-factor analysis (built-in candidates) and the nested season coverage recomputed from a review's outputs,
# written from docs/methods.md Part 3 (the same formulas as house-factor-audit.py), and compared with the review's
# data/house-factor.json: every built-in candidate's leave-one-season-out MAE and standard error, the per-strain
# choices, and the coverage counts per held-out season (the table in docs/methods.md, "Coverage, measured honestly").
# Produced with Debian 12 python3 3.11.2, numpy 1.24.2, scipy 1.10.1, pandas 1.5.3:
#   /usr/bin/python3 odd-lot-flags-audit.py --lots REVIEW/report.xlsx lots.csv
#   /usr/bin/python3 house-factor-output-audit.py REVIEW/data/house-factor.json lots.csv ../../../src/YieldBench.Core/Units/oiv-must-table.csv
# Demo (main 1fe9e40): every figure equal to the printed digits (MAEs and standard errors to 1e-9; coverage 80.0/97.1,
# 72.3/89.2, 86.7/97.6 %, overall band 80.0/94.3, 70.8/93.8, 94.0/100 %).
# from the methods text. Usage: coverage_check.py house-factor.json lots-from-workbook.csv oiv-must-table.csv
import json, sys, numpy as np, pandas as pd
from scipy import stats
from scipy.stats import theilslopes
hf = json.load(open(sys.argv[1])); lots = pd.read_csv(sys.argv[2]); lots['Lot'] = lots['Lot'].astype(str)
tab = np.loadtxt(sys.argv[3], delimiter=',', comments='#', skiprows=5, encoding='utf-8')
flag = {(f['season'], f['lot_id']) for f in hf['flagged_lots']}
d = lots[[(s, l) not in flag for s, l in zip(lots['Season'], lots['Lot'])]].reset_index(drop=True)
B = d['Starting sugar after additions (°Brix)'].values.astype(float); A = d['Final alcohol (% v/v)'].values.astype(float)
F = d['Alcohol per °Brix (% v/v per °Brix)'].values.astype(float); ST = d['Strain'].values; SE = d['Season'].values
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
    if len(ks) == 1: return {ks[0]: y[0]}, y[0]
    sw2 = sum(((fv[sv == k] - fv[sv == k].mean())**2).sum() for k in ks)/sum(n - 1)
    v = sw2/n; w = 1/v; yb = (w*y).sum()/w.sum(); Q = (w*(y - yb)**2).sum()
    tau2 = max(0, (Q - (len(ks) - 1))/(w.sum() - (w*w).sum()/w.sum()))
    mu = (y/(v + tau2)).sum()/(1/(v + tau2)).sum(); return dict(zip(ks, mu + tau2/(tau2 + v)*(y - mu))), mu
CANDS = [('fixed-0.55', 0), ('fixed-0.59', 0), ('eu-convention', 0), ('pooled-median', 1), ('pooled-huber-origin', 1), ('pooled-theil-sen', 2), ('strain-median', 3), ('strain-shrunk', 4)]
def fit(cid, tr):
    b, a, f, s = B[tr], A[tr], F[tr], ST[tr]
    if cid == 'fixed-0.55': return lambda bb, ss: 0.55*bb
    if cid == 'fixed-0.59': return lambda bb, ss: 0.59*bb
    if cid == 'eu-convention': return lambda bb, ss: sugar(bb)/16.83
    if cid == 'pooled-median': m = np.median(f); return lambda bb, ss: m*bb
    if cid == 'pooled-huber-origin': k = huber_origin(b, a); return lambda bb, ss: k*bb
    if cid == 'pooled-theil-sen':
        sl = theilslopes(a, b)[0]; ic = np.median(a) - sl*np.median(b); return lambda bb, ss: ic + sl*bb
    if cid == 'strain-median':
        pm = np.median(f); ms = {k: np.median(f[s == k]) for k in set(s)}
        return lambda bb, ss: np.array([ms.get(x, pm) for x in ss])*bb
    if cid == 'strain-shrunk':
        th, mu = shrunk(f, s); return lambda bb, ss: np.array([th.get(x, mu) for x in ss])*bb  # unseen strain: the overall mean (our assumption)
def loso(cid, idx):
    e = np.empty(len(idx)); seas = SE[idx]
    for s in sorted(set(seas)):
        te = idx[seas == s]; tr = idx[seas != s]; p = fit(cid, tr)(B[te], ST[te]); e[seas == s] = A[te] - p
    return e
def anova(e, keys):
    n = len(e); gs = {}
    for k, v in zip(keys, e): gs.setdefault(k, []).append(v)
    G = len(gs); ng = np.array([len(v) for v in gs.values()]); mg = np.array([np.mean(v) for v in gs.values()])
    if G < 2 or G == n: return None
    msw = sum(((np.array(v) - np.mean(v))**2).sum() for v in gs.values())/(n - G); msb = (ng*(mg - e.mean())**2).sum()/(G - 1)
    n0 = (n - (ng**2).sum()/n)/(G - 1); return msw, msb, n0, G, ng
def mae_se(ae, keys):
    a = anova(ae, keys)
    if a is None: return ae.std(ddof=1)/np.sqrt(len(ae))
    msw, msb, n0, G, ng = a; sb2 = max(0, (msb - msw)/n0); n = len(ae)
    return np.sqrt(msw/n + sb2*(ng**2).sum()/n**2)
def err_model(e, keys, S):
    n = len(e); a = anova(e, keys)
    if S < 2 or a is None:
        return e.mean(), e.std(ddof=1)**2*(1 + 1/n), n - 1
    msw, msb, n0, G, ng = a; sb2 = max(0, (msb - msw)/n0); tau2 = sb2*((S - 1)/S)**2
    V = msw*(1 + 1/n) + tau2*(1 + 1/S)
    if sb2 == 0: return e.mean(), V, n - G
    bq = ((S - 1)/S)**2*(1 + 1/S)/n0; aq = 1 + 1/n - bq
    return e.mean(), V, V**2/(aq*aq*msw*msw/(n - G) + bq*bq*msb*msb/(G - 1))
def one_se(errs, keys):
    m = {c: np.abs(errs[c]).mean() for c, _ in CANDS}
    best = min(CANDS, key=lambda c: (m[c[0]], CANDS.index(c)))[0]
    lim = m[best] + mae_se(np.abs(errs[best]), keys)
    ok = [c for c in CANDS if m[c[0]] <= lim]
    return min(ok, key=lambda c: (c[1], m[c[0]], CANDS.index(c)))[0], best, lim
def analysis(idx, with_mv=None):
    seas = SE[idx]; S = len(set(seas)); ck = [(x, y) for x, y in zip(seas, ST[idx])]
    errs = {c: loso(c, idx) for c, _ in CANDS}
    overall, best, lim = one_se(errs, ck)
    lines = {}
    e = errs[overall]; lines['*'] = (overall, err_model(e, ck, S))
    for s in sorted(set(ST[idx])):
        k = ST[idx] == s
        if k.sum() >= 15:
            sub = {c: errs[c][k] for c, _ in CANDS}; ch, _, _ = one_se(sub, list(seas[k]))
            lines[s] = (ch, err_model(errs[ch][k], list(seas[k]), S))
        else:
            lines[s] = (overall, lines['*'][1])
    return errs, overall, best, lim, lines
if __name__ == '__main__':
    idx = np.arange(len(B))
    errs, overall, best, lim, lines = analysis(idx)
    print('outer (built-in candidates only): overall', overall, 'best', best, 'limit %.6f' % lim)
    for c in hf['candidates']:
        if c['id'] in errs:
            print('  %-20s MAE %.9f tool %.9f  SE %.9f tool %.9f' % (c['id'], np.abs(errs[c['id']]).mean(), c['by_season']['mae_abv'], mae_se(np.abs(errs[c['id']]), list(zip(SE, ST))), c['by_season']['mae_standard_error_abv']))
    for b in hf['by_strain']:
        print('  strain %s: mine %s, tool %s (best tool %s)' % (b['strain'], lines[b['strain']][0], b['candidate_id'], b['best_candidate_id']))
    # nested coverage
    tot = dict(n=0, p80=0, p95=0, o80=0, o95=0); seasons = sorted(set(SE))
    cov_tool = {c['season']: c for c in hf['interval_coverage']['seasons']}
    for s in seasons:
        inner = idx[SE != s]; held = idx[SE == s]
        errs_i, ov, _, _, lines_i = analysis(inner)
        preds = {}
        for key, (cid, em) in lines_i.items():
            preds[key] = (fit(cid, inner), em)
        c = dict(n=len(held), p80=0, p95=0, o80=0, o95=0)
        for i in held:
            for key, tag in ((ST[i] if ST[i] in preds else '*', 'p'), ('*', 'o')):
                f_, (mean, V, nu) = preds[key]; p = float(np.atleast_1d(f_(np.array([B[i]]), np.array([ST[i]])))[0])
                for L in (0.8, 0.95):
                    h = stats.t.ppf((1 + L)/2, nu)*np.sqrt(V)
                    if p + mean - h <= A[i] <= p + mean + h: c[tag + ('80' if L == 0.8 else '95')] += 1
        t = cov_tool[s]
        print('held out %s: %d lots; planner 80 %.4f (tool %.4f) 95 %.4f (tool %.4f); overall band 80 %.4f (tool %.4f) 95 %.4f (tool %.4f); inner overall %s, strains %s' % (
            s, c['n'], c['p80']/c['n'], t['share80'], c['p95']/c['n'], t['share95'], c['o80']/c['n'], t['overall_share80'], c['o95']/c['n'], t['overall_share95'], ov,
            {k: v[0] for k, v in lines_i.items() if k != '*'}))
        for k in tot: tot[k] += c[k]
    a = hf['interval_coverage']['all']
    print('all: planner 80 %.4f (tool %.4f) 95 %.4f (tool %.4f); overall 80 %.4f (tool %.4f) 95 %.4f (tool %.4f)' % (
        tot['p80']/tot['n'], a['share80'], tot['p95']/tot['n'], a['share95'], tot['o80']/tot['n'], a['overall_share80'], tot['o95']/tot['n'], a['overall_share95']))
