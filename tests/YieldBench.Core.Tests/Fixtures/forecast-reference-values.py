# Reference values for tests/YieldBench.Core.Tests/Forecast/NormalMixtureTests.cs, and the information bound quoted in
# docs/performance.md ("How far three readings can take a white"). Produced with:
#   apt-get install -y python3-scipy   (Debian 12: scipy 1.10.1, numpy 1.24.2)
#   /usr/bin/python3 forecast-reference-values.py
import numpy as np
from scipy.stats import norm
from scipy.optimize import brentq

# 1. The normal distribution function and density (NormalMixtureTests).
for z in [-9, -6, -3, -1.5, 0, 0.5, 2, 6]:
    print("norm", z, repr(norm.cdf(z)), repr(norm.pdf(z)))
F = lambda x: 0.3 * norm.cdf(x, 10, 2) + 0.7 * norm.cdf(x, 15, 3)
for q in (0.1, 0.5, 0.9):
    print("mixture quantile", q, repr(brentq(lambda x: F(x) - q, -100, 100, xtol=1e-13)))
print("ppf 0.625", repr(norm.ppf(0.625)), "ppf 0.9", repr(norm.ppf(0.9)))

# 2. The linearised (Fisher-information) bound on the one-third and dry times. A lot follows the modified Gompertz of
# Zwietering et al. (1990) in the forecast's form, Brix(t) = S0 - (S0 - F) h(t); the prior on (log mu_m, log lambda,
# S0, F) has the spreads the forecast learnt from the demo history (log mu_m 0.124, lag 0.249 relative, S0 0.31,
# F 0.23 Brix); sugar readings every 12 h from 5 h after inoculation with noise sigma. The posterior covariance of the
# linearised model is (P0 + J'J / sigma^2)^-1, and the time's sd is sqrt(g' C g) with g its gradient. It leaves out
# what the temperatures and the other lots of the season add, and what the model does not know about itself, so it
# is a guide to the scale of what is possible, not an exact floor.
def G(A, mu, lam, t):
    return A * np.exp(-np.exp(mu * np.e / A * (lam - t) + 1))

def one_third(th, rec):
    lm, ll, s0, f = th
    return brentq(lambda t: s0 - G(s0 - f, np.exp(lm), np.exp(ll), t) - rec * 2 / 3, 0, 5000)

def dry(th, rec):
    lm, ll, s0, f = th
    return brentq(lambda t: s0 - G(s0 - f, np.exp(lm), np.exp(ll), t), 0, 20000)

def posterior_sd(th, prior_sd, times, sigma, fn, rec):
    eps = 1e-5
    def y(th):
        lm, ll, s0, f = th
        return np.array([s0 - G(s0 - f, np.exp(lm), np.exp(ll), t) for t in times])
    e = np.eye(4)
    J = np.array([(y(th + eps * e[k]) - y(th - eps * e[k])) / (2 * eps) for k in range(4)]).T
    P0 = np.diag(1 / np.array(prior_sd) ** 2)
    C = np.linalg.inv(P0 + J.T @ J / sigma ** 2)
    g = np.array([(fn(th + eps * e[k], rec) - fn(th - eps * e[k], rec)) / (2 * eps) for k in range(4)])
    return np.sqrt(g @ np.linalg.inv(P0) @ g), np.sqrt(g @ C @ g)

prior = [0.124, 0.249, 0.31, 0.23]
for name, mu, lam, s0 in [("white 0.066 Brix/h lag 20 h", 0.066, 20, 22.0), ("white 0.050 Brix/h lag 28 h", 0.050, 28, 22.0),
                          ("slow red 0.146 Brix/h lag 30 h", 0.146, 30, 24.5), ("red 0.20 Brix/h lag 14 h", 0.20, 14, 24.5)]:
    th = np.array([np.log(mu), np.log(lam), s0, -1.8])
    print(name, "one-third at %.0f h, dry at %.0f h" % (one_third(th, s0), dry(th, s0)))
    for n in (2, 3, 4, 6):
        times = [5 + 12 * k for k in range(n)]
        p, hand = posterior_sd(th, prior, times, 0.156, one_third, s0)
        _, unrounded = posterior_sd(th, prior, times, 0.137, one_third, s0)
        _, probe = posterior_sd(th, prior, times, 0.03, one_third, s0)
        pd, qd = posterior_sd(th, prior, times, 0.156, dry, s0)
        print("  %d readings: one-third sd %.1f h (prior) -> %.1f h (hand readings, 0.156), %.1f h (no SG rounding, 0.137),"
              " %.1f h (probe, 0.03); dry sd %.1f -> %.1f h" % (n, p, hand, unrounded, probe, pd, qd))
