"""Checks that Clinometer's batch outputs and the pandas reference's agree: for each result CSV the
status, the counts and every compared statistic (betas, standard errors, R^2, ...) to relative 1e-9
or absolute 1e-12, whichever is looser; the rolling-beta CSVs cell by cell to the same tolerance,
with the same empty cells. Prints a JSON summary on stdout; exits 1 on any disagreement.

Usage: /usr/bin/python3 bench/compare_outputs.py OURS_DIR REFERENCE_DIR
"""

import json
import os
import sys

import numpy as np
import pandas as pd

RELATIVE, ABSOLUTE = 1e-9, 1e-12
RESULT_FILES = ("daily-ols.csv", "daily-dimson.csv", "monthly-ols.csv", "monthly-dimson.csv")
# Our column -> the reference's column. The t quantile behind the 95% interval differs in scipy by
# about 1e-9 relative (test/reference/statsmodels_reference.py), so the interval is not compared here.
STATISTICS = {
    "beta": "beta", "beta_se": "beta_se", "r_squared": "r_squared", "adj_r_squared": "adj_r_squared",
    "alpha": "alpha", "alpha_se": "alpha_se", "beta_t": "beta_t", "residual_vol": "residual_vol",
    "blume_beta": "blume_beta", "vasicek_beta": "vasicek_beta",
}
OLS_ONLY = {
    "correlation": "correlation", "covariance": "covariance", "security_vol": "security_vol", "market_vol": "market_vol",
    "security_vol_annual": "security_vol_annual", "market_vol_annual": "market_vol_annual",
}


def read(path, index):
    return pd.read_csv(path, index_col=index, float_precision="round_trip", keep_default_na=False, na_values=[""])


def compare_values(ours, reference):
    """(cells compared, mismatching cells, worst relative difference where the relative tolerance governs)."""
    ours, reference = np.asarray(ours, dtype=float), np.asarray(reference, dtype=float)
    both_empty = np.isnan(ours) & np.isnan(reference)
    difference = np.abs(ours - reference)
    allowed = np.maximum(RELATIVE * np.abs(reference), ABSOLUTE)
    with np.errstate(invalid="ignore"):
        bad = ~both_empty & ~(difference <= allowed)
        governed = np.isfinite(reference) & (RELATIVE * np.abs(reference) >= ABSOLUTE)
        relative = np.where(governed, difference / np.abs(reference), 0.0)
    worst = float(np.nanmax(relative)) if relative.size else 0.0
    return int(ours.size), int(bad.sum()), worst


def compare_results(ours_dir, reference_dir, name):
    ours, reference = read(os.path.join(ours_dir, name), "security"), read(os.path.join(reference_dir, name), "security")
    reference = reference.reindex(ours.index)
    summary = {"securities": len(ours), "compared": 0, "mismatches": {}, "worstRelative": 0.0}
    if not (ours["status"] == reference["status"]).all():
        summary["mismatches"]["status"] = int((ours["status"] != reference["status"]).sum())
    # Dimson: its own sample size, which Clinometer reports (as base_n) only for estimated securities.
    estimated = (ours["status"] == "ok").to_numpy() if name.endswith("dimson.csv") else np.ones(len(ours), bool)
    counts = (ours["base_n"] if name.endswith("dimson.csv") else ours["n"]).to_numpy(dtype=float)[estimated]
    differing = int((counts != reference["n"].to_numpy(dtype=float)[estimated]).sum())
    if differing:
        summary["mismatches"]["n"] = differing
    columns = dict(STATISTICS, **(OLS_ONLY if name.endswith("ols.csv") else {}))
    for our_column, reference_column in columns.items():
        compared, bad, worst = compare_values(ours[our_column], reference[reference_column])
        summary["compared"] += compared
        summary["worstRelative"] = max(summary["worstRelative"], worst)
        if bad:
            summary["mismatches"][our_column] = bad
    return summary


def compare_rolling(ours_dir, reference_dir):
    name = "rolling-betas-daily.csv"
    ours, reference = read(os.path.join(ours_dir, name), "date"), read(os.path.join(reference_dir, name), "date")
    summary = {"rows": len(ours), "columns": ours.shape[1], "compared": 0, "mismatches": {}, "worstRelative": 0.0}
    if list(ours.index) != list(reference.index) or list(ours.columns) != list(reference.columns):
        summary["mismatches"]["shape"] = f"ours {ours.shape}, reference {reference.shape}"
        return summary
    compared, bad, worst = compare_values(ours.to_numpy(), reference.to_numpy())
    summary.update(compared=compared, worstRelative=worst, filled=int(np.isfinite(ours.to_numpy()).sum()))
    if bad:
        summary["mismatches"]["beta"] = bad
    return summary


def main():
    ours_dir, reference_dir = sys.argv[1], sys.argv[2]
    report = {name: compare_results(ours_dir, reference_dir, name) for name in RESULT_FILES}
    report["rolling-betas-daily.csv"] = compare_rolling(ours_dir, reference_dir)
    agree = all(not part["mismatches"] for part in report.values())
    json.dump({"agree": agree, "tolerance": {"relative": RELATIVE, "absolute": ABSOLUTE}, "files": report}, sys.stdout, indent=2)
    sys.stdout.write("\n")
    sys.exit(0 if agree else 1)


if __name__ == "__main__":
    main()
