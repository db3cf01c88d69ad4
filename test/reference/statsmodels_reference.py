"""Reference betas for the live comparison, computed with pandas and statsmodels.

An independent implementation of the conventions in DESIGN.md ("Numerical conventions"), written the
way a practitioner would in pandas, then fitted with statsmodels OLS:

- grid: daily = the market's dates with a level; weekly = weeks ending Friday (pandas W-FRI bins,
  labelled by the Friday); monthly = calendar months (labelled YYYY-MM); a period is priced by the last
  available price in it at or before the as-of date; each security sampled on its own;
- simple returns between consecutive grid periods only (no filling of gaps);
- per-period risk-free rate (1 + y)^(1/P) - 1, y the last yield observed at or before the end of the
  previous period (previous market date; previous Friday; previous month's last calendar day);
- window: the W return periods ending at the as-of period; pairwise-complete observations;
- OLS with intercept of security excess on market excess; Dimson k = 1 as one regression on the
  market at t-1, t, t+1 (lag may precede the window, no lead after the as-of period), beta = sum of
  slopes, its standard error from the slopes' covariance matrix.

Usage: /usr/bin/python3 statsmodels_reference.py PRICES MARKET RATES --constant-yield 0.025
       [--as-of latest --as-of 2023-06-14]
Prints one JSON document on stdout (library versions included).
"""

import argparse
import json
import math
import sys

import numpy as np
import pandas as pd
import scipy
import scipy.special
import scipy.stats
import statsmodels
import statsmodels.api as sm

PERIODS_PER_YEAR = {"daily": 252, "weekly": 52, "monthly": 12}
WINDOWS = {"daily": (252, 200), "weekly": (156, 104), "monthly": (60, 36)}


def read_dated(path, column):
    frame = pd.read_csv(path, parse_dates=["date"], index_col="date", float_precision="round_trip")
    return frame[column] if column else frame


def sample(series, frequency, grid, as_of):
    """Price of each grid period: last available value in the period, at or before as_of."""
    s = series.dropna()
    s = s[s.index <= as_of]
    if frequency == "daily":
        return s.reindex(grid)
    rule = "W-FRI" if frequency == "weekly" else "M"
    sampled = s.resample(rule, closed="right", label="right").last()
    return sampled.reindex(grid)


def build_grid(market, frequency, as_of):
    levels = market.dropna()
    levels = levels[levels.index <= as_of]
    if frequency == "daily":
        return levels.index, list(levels.index)
    first = levels.index[0]
    if frequency == "weekly":
        ends = pd.date_range(first + pd.offsets.Week(0, weekday=4), as_of + pd.offsets.Week(0, weekday=4), freq="W-FRI")
        return ends, list(ends)
    ends = pd.date_range(first + pd.offsets.MonthEnd(0), as_of + pd.offsets.MonthEnd(0), freq="M")
    return ends, list(ends)


def labels_of(grid, frequency):
    fmt = "%Y-%m" if frequency == "monthly" else "%Y-%m-%d"
    return [d.strftime(fmt) for d in grid]


def per_period_rates(grid_ends, frequency, rates, constant_yield):
    """rf for period t from the yield at or before the end of period t-1; period 0 has none."""
    p = PERIODS_PER_YEAR[frequency]
    if constant_yield is not None:
        y = pd.Series(constant_yield, index=range(len(grid_ends)), dtype=float)
    else:
        observed = rates.dropna() / 100.0
        previous_ends = pd.DatetimeIndex(grid_ends[:-1])
        y = pd.Series(np.r_[np.nan, observed.asof(previous_ends).to_numpy()])
    y.iloc[0] = np.nan
    return ((1.0 + y) ** (1.0 / p) - 1.0).to_numpy()


def simple_returns(prices):
    values = prices.to_numpy(dtype=float)
    out = np.full(values.shape, np.nan)
    out[1:] = values[1:] / values[:-1] - 1.0
    return out


def t_quantile_975(df):
    """0.975 quantile of Student t with df degrees of freedom, to machine precision.

    scipy 1.10's t.ppf (cephes stdtrit) is good to about 1e-9 relative only (df 52: 2.0066468031022113
    against 2.0066468050616883 from mpmath at 40 digits), which moves an interval end near zero by
    far more than 1e-9 of itself. One Newton step on scipy's accurate t CDF (stdtr) fixes it.
    statsmodels' conf_int uses t.ppf as it is, so the intervals below are beta +/- q * se with this q.
    """
    q = scipy.stats.t.ppf(0.975, df)
    for _ in range(2):
        q -= (scipy.special.stdtr(df, q) - 0.975) / scipy.stats.t.pdf(q, df)
    return q


def finite(x):
    x = float(x)
    return x if math.isfinite(x) else None


def ols_statistics(y, x, periods_per_year):
    fit = sm.OLS(y, sm.add_constant(x)).fit()
    half_width = t_quantile_975(fit.df_resid) * fit.bse[1]
    low, high = fit.params[1] - half_width, fit.params[1] + half_width
    sd_y, sd_x = np.std(y, ddof=1), np.std(x, ddof=1)
    return {
        "alpha": fit.params[0], "alpha_se": fit.bse[0], "beta": fit.params[1], "beta_se": fit.bse[1],
        "beta_t": fit.tvalues[1], "beta_p": fit.pvalues[1], "beta_low_95": low, "beta_high_95": high,
        "r_squared": fit.rsquared, "adj_r_squared": fit.rsquared_adj, "residual_sd": math.sqrt(fit.scale),
        "correlation": np.corrcoef(y, x)[0, 1], "security_vol": sd_y, "market_vol": sd_x,
        "security_vol_annual": sd_y * math.sqrt(periods_per_year), "market_vol_annual": sd_x * math.sqrt(periods_per_year),
        "covariance": np.cov(y, x, ddof=1)[0, 1],
    }


def dimson_statistics(frame):
    """Dimson k = 1: y on m(t-1), m(t), m(t+1) with an intercept; beta = sum of slopes."""
    rows = frame.dropna(subset=["y", "m_lag", "m", "m_lead"])
    if len(rows) < 5:
        return {"n": int(len(rows))}
    fit = sm.OLS(rows["y"].to_numpy(), sm.add_constant(rows[["m_lag", "m", "m_lead"]].to_numpy())).fit()
    cov = fit.cov_params()[1:, 1:]
    ones = np.ones(3)
    # The sum of the slopes as a linear hypothesis: statsmodels' own t, p and interval (n - 4 df).
    total = fit.t_test(np.array([[0.0, 1.0, 1.0, 1.0]]))
    beta, beta_se = float(np.squeeze(total.effect)), float(np.squeeze(total.sd))
    half_width = t_quantile_975(fit.df_resid) * beta_se
    return {
        "n": int(fit.nobs), "alpha": fit.params[0], "alpha_se": fit.bse[0], "beta": beta, "beta_se": beta_se,
        "beta_t": float(np.squeeze(total.tvalue)), "beta_p": float(np.squeeze(total.pvalue)),
        "beta_low_95": beta - half_width, "beta_high_95": beta + half_width,
        "slope_sum": fit.params[1:].sum(), "slope_sum_se": math.sqrt(ones @ cov @ ones),
        "r_squared": fit.rsquared, "adj_r_squared": fit.rsquared_adj, "residual_sd": math.sqrt(fit.scale),
    }


def security_result(y_all, m_all, window, minimum, labels, periods_per_year):
    first, last = window
    frame = pd.DataFrame({"y": y_all, "m": m_all, "m_lag": np.r_[np.nan, m_all[:-1]], "m_lead": np.r_[m_all[1:], np.nan]})
    frame = frame.iloc[first:last + 1]
    pairs = frame.dropna(subset=["y", "m"])
    n = len(pairs)
    result = {
        "n": n, "minimum": minimum, "status": "ok" if n >= minimum else "insufficient",
        "first_period": labels[pairs.index[0]] if n else None, "last_period": labels[pairs.index[-1]] if n else None,
    }
    if n < minimum:
        return result
    result["ols"] = {k: finite(v) for k, v in ols_statistics(pairs["y"].to_numpy(), pairs["m"].to_numpy(), periods_per_year).items()}
    result["dimson"] = {k: (v if k == "n" else finite(v)) for k, v in dimson_statistics(frame).items()}
    return result


def run_case(prices, market, rates, frequency, as_of_text, constant_yield):
    as_of = market.dropna().index[-1] if as_of_text == "latest" else pd.Timestamp(as_of_text)
    grid, ends = build_grid(market, frequency, as_of)
    labels = labels_of(grid, frequency)
    rf = per_period_rates(ends, frequency, rates, constant_yield)
    market_excess = simple_returns(sample(market, frequency, grid, as_of)) - rf
    length, minimum = WINDOWS[frequency]
    as_of_index = len(grid) - 1
    window = (max(1, as_of_index - length + 1), as_of_index)
    securities = {}
    for code in prices.columns:
        security_excess = simple_returns(sample(prices[code], frequency, grid, as_of)) - rf
        securities[code] = security_result(security_excess, market_excess, window, minimum, labels, PERIODS_PER_YEAR[frequency])
    return {
        "frequency": frequency, "as_of": as_of_text, "risk_free": "constant" if constant_yield is not None else "file",
        "window": length, "minimum": minimum, "grid_periods": len(grid), "as_of_period": labels[-1],
        "as_of_date": as_of.strftime("%Y-%m-%d"), "securities": securities,
    }


def main():
    parser = argparse.ArgumentParser()
    parser.add_argument("prices")
    parser.add_argument("market")
    parser.add_argument("rates")
    parser.add_argument("--constant-yield", type=float, required=True)
    parser.add_argument("--as-of", action="append", default=None)
    args = parser.parse_args()
    prices = read_dated(args.prices, None)
    market = read_dated(args.market, "level")
    rates = read_dated(args.rates, "rate_pct")
    cases = []
    for as_of in args.as_of or ["latest"]:
        for frequency in ("daily", "weekly", "monthly"):
            for constant in (None, args.constant_yield):
                cases.append(run_case(prices, market, rates, frequency, as_of, constant))
    versions = {
        "python": sys.version.split()[0], "statsmodels": statsmodels.__version__, "pandas": pd.__version__,
        "numpy": np.__version__, "scipy": scipy.__version__,
    }
    json.dump({"versions": versions, "constant_yield": args.constant_yield, "cases": cases}, sys.stdout, allow_nan=False)
    sys.stdout.write("\n")


if __name__ == "__main__":
    main()
