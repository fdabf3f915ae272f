"""Reference values from Debian's python3-scipy for the Plyledger statistics tests.

Reads one JSON batch on standard input and writes one JSON object on standard
output. Each section is computed with scipy's own public functions:
  tolerance:  scipy.stats.nct.ppf / nct.cdf (one-sided normal tolerance factors)
  normal:     sample mean and SD (ddof=1), scipy.stats.anderson(dist='norm'),
              basis = mean - k sd with k from scipy.stats.nct.ppf
  weibull:    scipy.stats.weibull_min.fit(floc=0), then polished with
              scipy.optimize.brentq on the profile-likelihood score equation
  adk:        scipy.stats.anderson_ksamp(midrank=True)
  levene:     scipy.stats.levene(center='median')
  quantiles:  scipy.stats.norm/t/chi2.ppf, scipy.special.gammaln/gammainc/betainc
"""
import json
import sys
import warnings

import numpy as np
import scipy
from scipy import optimize, special, stats

warnings.simplefilter("ignore")


def tolerance_factor(n, p, df=None, n_eff=None):
    n_eff = n if n_eff is None else n_eff
    df = n - 1 if df is None else df
    return float(stats.nct.ppf(0.95, df, stats.norm.ppf(p) * np.sqrt(n_eff)) / np.sqrt(n_eff))


def weibull_ml(x):
    x = np.asarray(x, dtype=float)
    c0, _, s0 = stats.weibull_min.fit(x, floc=0)
    u = np.log(x) - np.log(x).mean()

    def score(b):
        w = np.exp(b * (u - u.max()))
        return (w * u).sum() / w.sum() - 1.0 / b

    lo, hi = c0 / 2, c0 * 2
    while score(lo) > 0:
        lo /= 2
    while score(hi) < 0:
        hi *= 2
    c = optimize.brentq(score, lo, hi, xtol=1e-14, rtol=1e-15, maxiter=500)
    w = np.exp(c * (u - u.max()))
    scale = float(np.exp(np.log(x).mean() + u.max() + np.log(w.mean()) / c))
    polished_better = stats.weibull_min.nnlf((c, 0, scale), x) <= stats.weibull_min.nnlf((c0, 0, s0), x) + 1e-9
    return {"fitShape": float(c0), "fitScale": float(s0), "shape": float(c), "scale": scale, "polishedIsAtLeastAsLikely": bool(polished_better)}


def adk(samples):
    res = stats.anderson_ksamp([np.asarray(s, dtype=float) for s in samples], midrank=True)
    return {"standardised": float(res.statistic), "critical025": float(res.critical_values[3])}


def main():
    batch = json.load(sys.stdin)
    out = {"scipyVersion": scipy.__version__, "numpyVersion": np.__version__}
    out["tolerance"] = [
        {"kB": tolerance_factor(c["n"], 0.90, c.get("df"), c.get("nEffective")), "kA": tolerance_factor(c["n"], 0.99, c.get("df"), c.get("nEffective"))}
        for c in batch.get("tolerance", [])
    ]
    out["nctCdf"] = [float(stats.nct.cdf(c["t"], c["df"], c["nc"])) for c in batch.get("nctCdf", [])]
    normal = []
    for values in batch.get("normal", []):
        x = np.asarray(values, dtype=float)
        n = len(x)
        mean, sd = float(x.mean()), float(x.std(ddof=1))
        normal.append({
            "mean": mean, "sd": sd,
            "ad": float(stats.anderson(x, dist="norm").statistic),
            "bBasis": mean - tolerance_factor(n, 0.90) * sd,
            "aBasis": mean - tolerance_factor(n, 0.99) * sd,
        })
    out["normal"] = normal
    out["weibull"] = [weibull_ml(v) for v in batch.get("weibull", [])]
    out["adk"] = [adk(s) for s in batch.get("adk", [])]
    out["levene"] = []
    for groups in batch.get("levene", []):
        res = stats.levene(*[np.asarray(g, dtype=float) for g in groups], center="median")
        out["levene"].append({"statistic": float(res.statistic), "pValue": float(res.pvalue)})
    q = batch.get("quantiles", {})
    out["normalQuantile"] = [float(stats.norm.ppf(p)) for p in q.get("normal", [])]
    out["tQuantile"] = [float(stats.t.ppf(p, df)) for p, df in q.get("t", [])]
    # Upper tail at the engine's own t quantiles: a round trip that does not depend on t.ppf's accuracy.
    out["tSurvivalAtEngineQuantile"] = [float(stats.t.sf(t, df)) for t, df in q.get("tEngine", [])]
    out["chiSquareQuantile"] = [float(stats.chi2.ppf(p, df)) for p, df in q.get("chiSquare", [])]
    out["lnGamma"] = [float(special.gammaln(x)) for x in q.get("lnGamma", [])]
    out["gammaP"] = [float(special.gammainc(a, x)) for a, x in q.get("gammaP", [])]
    out["betaI"] = [float(special.betainc(a, b, x)) for a, b, x in q.get("betaI", [])]
    json.dump(out, sys.stdout)


if __name__ == "__main__":
    main()
