"""The pandas side of `npm run bench`: the same batch as bench/run-bench.ts, written the way a
practitioner would in numpy and pandas, timed per phase, with the process's peak RSS.

Work: parse the wide daily file (pandas' C reader) and the risk-free file; daily (252/200) and
monthly (60/36) full-window statistics per security (OLS with pairwise-complete moments, Dimson k = 1
by batched normal equations, Blume 2/3, Vasicek with the cross-sectional prior); 252-day rolling OLS
betas ending at every day (window sums of cumulative sums); result CSVs and the rolling-beta CSV
(dates x securities). Conventions as in DESIGN.md: daily grid = the market's dates; monthly = last
price in each calendar month; simple returns between consecutive grid periods; per-period risk-free
(1 + y)^(1/P) - 1 with y the last yield at or before the end of the previous period.

Usage: /usr/bin/python3 bench/reference_batch.py --data DIR --out DIR
Writes OUT/reference-timing.json.
"""

import argparse
import json
import os
import resource
import sys
import time

import numpy as np
import pandas as pd
import scipy.stats

WINDOWS = {"daily": (252, 200), "monthly": (60, 36)}
PERIODS_PER_YEAR = {"daily": 252, "monthly": 12}
BLUME_WEIGHT = 2.0 / 3.0


class Clock:
    def __init__(self):
        self.phases = []

    def time(self, name, work):
        start = time.perf_counter()
        result = work()
        self.phases.append({"name": name, "seconds": time.perf_counter() - start})
        return result


def parse(data):
    prices = pd.read_csv(os.path.join(data, "prices-wide.csv"), index_col="date", parse_dates=["date"])
    rates = pd.read_csv(os.path.join(data, "risk-free.csv"), index_col="date", parse_dates=["date"])["rate_pct"]
    market = prices.pop("MKT")
    return prices, market, rates / 100.0


def excess_returns(prices, market, yields, frequency):
    """Security and market excess returns on the grid (row 0 has no return)."""
    if frequency == "daily":
        levels = market.dropna()
        sampled = prices.reindex(levels.index)
    else:
        levels = market.resample("M").last()
        sampled = prices.resample("M").last()
    previous_ends = levels.index[:-1]
    used = np.r_[np.nan, yields.dropna().asof(previous_ends).to_numpy()]
    rf = (1.0 + used) ** (1.0 / PERIODS_PER_YEAR[frequency]) - 1.0
    r = sampled.to_numpy()
    security = np.full(r.shape, np.nan)
    security[1:] = r[1:] / r[:-1] - 1.0 - rf[1:, None]
    m = levels.to_numpy()
    market_excess = np.r_[np.nan, m[1:] / m[:-1] - 1.0 - rf[1:]]
    return security, market_excess, levels.index


def inference(beta, se, df):
    t = beta / se
    p = 2.0 * scipy.stats.t.sf(np.abs(t), df)
    q = scipy.stats.t.ppf(0.975, df)
    return t, p, beta - q * se, beta + q * se


def ols_statistics(y, m, minimum, periods):
    """Pairwise-complete OLS of each column of y on m; NaN below the minimum."""
    mask = ~np.isnan(y) & ~np.isnan(m)[:, None]
    n = mask.sum(axis=0).astype(float)
    x = np.where(mask, m[:, None], 0.0)
    y0 = np.where(mask, y, 0.0)
    with np.errstate(invalid="ignore", divide="ignore"):
        mean_x, mean_y = x.sum(axis=0) / n, y0.sum(axis=0) / n
        dx, dy = np.where(mask, x - mean_x, 0.0), np.where(mask, y0 - mean_y, 0.0)
        sxx, syy, sxy = (dx * dx).sum(axis=0), (dy * dy).sum(axis=0), (dx * dy).sum(axis=0)
        beta = sxy / sxx
        ssr = (np.where(mask, dy - beta * dx, 0.0) ** 2).sum(axis=0)
        df = n - 2.0
        s2 = ssr / df
        beta_se = np.sqrt(s2 / sxx)
        t, p, low, high = inference(beta, beta_se, df)
        r2 = 1.0 - ssr / syy
        out = {
            "n": n, "beta": beta, "beta_se": beta_se, "beta_t": t, "beta_p": p, "beta_low_95": low, "beta_high_95": high,
            "alpha": mean_y - beta * mean_x, "alpha_se": np.sqrt(s2 * (1.0 / n + mean_x ** 2 / sxx)),
            "r_squared": r2, "adj_r_squared": 1.0 - (n - 1.0) / df * (1.0 - r2), "correlation": sxy / np.sqrt(sxx * syy),
            "residual_vol": np.sqrt(s2), "security_vol": np.sqrt(syy / (n - 1.0)), "market_vol": np.sqrt(sxx / (n - 1.0)),
            "covariance": sxy / (n - 1.0),
        }
    out["security_vol_annual"] = out["security_vol"] * np.sqrt(periods)
    out["market_vol_annual"] = out["market_vol"] * np.sqrt(periods)
    return finish(out, n >= minimum)


def dimson_statistics(y, m, first, minimum, ols_n):
    """Dimson k = 1 per column: y on [1, m(t-1), m(t), m(t+1)] over rows first..T-2 (no lead past the end)."""
    rows = np.arange(first, len(m) - 1)
    z = np.column_stack([np.ones(len(rows)), m[rows - 1], m[rows], m[rows + 1]])
    yw = y[rows]
    valid = ~np.isnan(yw) & ~np.isnan(z).any(axis=1)[:, None]
    w = valid.astype(float)
    z0, y0 = np.nan_to_num(z), np.where(valid, yw, 0.0)
    gram = np.einsum("tn,ti,tj->nij", w, z0, z0)
    rhs = np.einsum("tn,ti->ni", w * y0, z0)
    n = w.sum(axis=0)
    ok = ols_n >= minimum
    gram[~ok] = np.eye(4)
    coef = np.linalg.solve(gram, rhs[..., None])[..., 0]
    residual = np.where(valid, y0 - z0 @ coef.T, 0.0)
    ssr = (residual ** 2).sum(axis=0)
    df = n - 4.0
    with np.errstate(invalid="ignore", divide="ignore"):
        cov = (ssr / df)[:, None, None] * np.linalg.inv(gram)
        beta, beta_se = coef[:, 1:].sum(axis=1), np.sqrt(cov[:, 1:, 1:].sum(axis=(1, 2)))
        t, p, low, high = inference(beta, beta_se, df)
        mean_y = y0.sum(axis=0) / n
        r2 = 1.0 - ssr / (np.where(valid, y0 - mean_y, 0.0) ** 2).sum(axis=0)
        out = {
            "n": n, "beta": beta, "beta_se": beta_se, "beta_t": t, "beta_p": p, "beta_low_95": low, "beta_high_95": high,
            "alpha": coef[:, 0], "alpha_se": np.sqrt(cov[:, 0, 0]), "r_squared": r2,
            "adj_r_squared": 1.0 - (n - 1.0) / df * (1.0 - r2), "residual_vol": np.sqrt(ssr / df),
        }
    return finish(out, ok)


def finish(out, ok):
    for key in out:
        if key != "n":
            out[key] = np.where(ok, out[key], np.nan)
    out["status"] = np.where(ok, "ok", "insufficient")
    return out


def adjust(out):
    """Blume (w = 2/3) and Vasicek with the cross-sectional prior of the ok betas (sample variance)."""
    beta, se = out["beta"], out["beta_se"]
    ok = np.isfinite(beta) & np.isfinite(se)
    prior_mean, prior_var = beta[ok].mean(), beta[ok].var(ddof=1)
    out["blume_beta"] = BLUME_WEIGHT * beta + (1.0 - BLUME_WEIGHT)
    out["vasicek_beta"] = (prior_var * beta + se ** 2 * prior_mean) / (prior_var + se ** 2)
    return out


def statistics(prices, market, yields, frequency):
    y, m, _ = excess_returns(prices, market, yields, frequency)
    length, minimum = WINDOWS[frequency]
    first = max(1, len(m) - length)
    ols = adjust(ols_statistics(y[first:], m[first:], minimum, PERIODS_PER_YEAR[frequency]))
    dimson = adjust(dimson_statistics(y, m, first, minimum, ols["n"]))
    ids = prices.columns
    return {f"{frequency}-ols.csv": pd.DataFrame(ols, index=ids), f"{frequency}-dimson.csv": pd.DataFrame(dimson, index=ids)}


def rolling_betas(prices, market, yields):
    """252-day OLS betas ending at every day from the first full window on (pairwise-complete), from
    window sums of cumulative sums. Twice as fast here as DataFrame.rolling().cov() / .var(), which
    loops over the columns; values shifted by their means first, so the sums cancel little."""
    y, m, dates = excess_returns(prices, market, yields, "daily")
    length, minimum = WINDOWS["daily"]
    mask = ~np.isnan(y) & ~np.isnan(m)[:, None]
    x = np.where(mask, m[:, None] - np.nanmean(m), 0.0)
    y = np.where(mask, y - np.nanmean(y, axis=0), 0.0)

    def window_sums(values):
        running = np.cumsum(values, axis=0)
        return running[length:] - running[:-length]

    n = window_sums(mask.astype(float))
    sx, sy = window_sums(x), window_sums(y)
    sxx, sxy = window_sums(x * x), window_sums(x * y)
    with np.errstate(invalid="ignore", divide="ignore"):
        beta = (sxy - sx * sy / n) / (sxx - sx * sx / n)
    beta[n < minimum] = np.nan
    return pd.DataFrame(beta, index=dates[length:], columns=prices.columns)


def write(out, results, rolling):
    for name, frame in results.items():
        frame.to_csv(os.path.join(out, name), index_label="security")
    rolling.to_csv(os.path.join(out, "rolling-betas-daily.csv"), index_label="date", date_format="%Y-%m-%d")


def main():
    parser = argparse.ArgumentParser()
    parser.add_argument("--data", required=True)
    parser.add_argument("--out", required=True)
    args = parser.parse_args()
    os.makedirs(args.out, exist_ok=True)
    clock = Clock()
    prices, market, yields = clock.time("parse", lambda: parse(args.data))
    results = {}
    for frequency in ("daily", "monthly"):
        results.update(clock.time(f"{frequency} statistics", lambda: statistics(prices, market, yields, frequency)))
    rolling = clock.time("rolling betas", lambda: rolling_betas(prices, market, yields))
    clock.time("write results", lambda: write(args.out, results, rolling))
    report = {
        "engine": "pandas", "pandas": pd.__version__, "numpy": np.__version__, "phases": clock.phases,
        "totalSeconds": sum(p["seconds"] for p in clock.phases),
        "peakRssMb": resource.getrusage(resource.RUSAGE_SELF).ru_maxrss / 1024.0,
    }
    with open(os.path.join(args.out, "reference-timing.json"), "w") as f:
        json.dump(report, f, indent=2)
    for phase in clock.phases:
        print(f"  {phase['name']:<20} {phase['seconds']:8.2f} s", file=sys.stderr)
    print(f"  {'total':<20} {report['totalSeconds']:8.2f} s\n  peak RSS {report['peakRssMb']:.0f} MB", file=sys.stderr)


if __name__ == "__main__":
    main()
