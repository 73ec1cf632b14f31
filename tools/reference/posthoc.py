"""Pairwise reference values written independently with numpy/scipy, for the
post-hoc procedures of core/posthoc, on open datasets of R's `datasets`
package (CSV files written by datasets.R). Formulas:

  Dunn (1964):  z = (Ra - Rb) / sqrt((N(N+1)/12 - sum(t^3-t)/(12(N-1))) (1/na + 1/nb)),
                p = 2 norm.sf(|z|)
  Conover & Iman (1979): S2 = (sum r^2 - N(N+1)^2/4)/(N-1),
                t = (Ra - Rb) / sqrt(S2 (N-1-H)/(N-k) (1/na + 1/nb)), p = 2 t.sf(|t|, N-k)
  DSCF (Critchlow & Fligner 1991): pair ranked alone, W rank sum of a,
                W* = sqrt(2) (W - na(n+1)/2) / sqrt(na nb/12 (n+1 - sum(t^3-t)/(n(n-1)))),
                p = studentized_range.sf(|W*|, k, df) with a very large df
  Vargha-Delaney A = P(a > b) + P(a = b)/2; Hodges-Lehmann = median of all a - b.

Argument: the folder with the CSV files; writes posthoc.tsv there."""
import csv
import itertools
import pathlib
import sys

import numpy as np
import scipy
from scipy import stats

folder = pathlib.Path(sys.argv[1])
src = f"numpy {np.__version__} / scipy {scipy.__version__}, tools/reference/posthoc.py"


def read(name):
    groups = {}
    with (folder / f"{name}.csv").open() as f:
        for rec in csv.DictReader(f):
            groups.setdefault(rec["group"], [])
            if rec["value"] != "NA":
                groups[rec["group"]].append(float(rec["value"]))
    return list(groups.items())


def tie_sum(x):
    _, t = np.unique(x, return_counts=True)
    return float(np.sum(t.astype(float) ** 3 - t))


rows = []
for name in ("insectsprays", "chickwts", "plantgrowth", "airquality_ozone"):
    groups = read(name)
    values = np.concatenate([np.array(v) for _, v in groups])
    n, k = len(values), len(groups)
    ranks = stats.rankdata(values)
    bounds = np.cumsum([0] + [len(v) for _, v in groups])
    mean_rank = [ranks[bounds[i]:bounds[i + 1]].mean() for i in range(k)]
    h = stats.kruskal(*[v for _, v in groups]).statistic
    ts = tie_sum(values)
    s2 = (np.sum(ranks ** 2) - n * (n + 1) ** 2 / 4) / (n - 1)
    for a, b in itertools.combinations(range(k), 2):
        la, xa = groups[a]
        lb, xb = groups[b]
        na, nb = len(xa), len(xb)
        d = mean_rank[a] - mean_rank[b]
        z = d / np.sqrt((n * (n + 1) / 12 - ts / (12 * (n - 1))) * (1 / na + 1 / nb))
        rows.append((name, "dunn", la, lb, z, 2 * stats.norm.sf(abs(z))))
        tt = d / np.sqrt(s2 * (n - 1 - h) / (n - k) * (1 / na + 1 / nb))
        rows.append((name, "conover", la, lb, tt, 2 * stats.t.sf(abs(tt), n - k)))
        pair = np.concatenate([xa, xb])
        pr = stats.rankdata(pair)
        w = pr[:na].sum()
        m = na + nb
        wstar = np.sqrt(2) * (w - na * (m + 1) / 2) / np.sqrt(na * nb / 12 * (m + 1 - tie_sum(pair) / (m * (m - 1))))
        rows.append((name, "dscf", la, lb, wstar, stats.studentized_range.sf(abs(wstar), k, 1e7)))
        diff = np.subtract.outer(np.array(xa), np.array(xb))
        rows.append((name, "superiority", la, lb, (np.sum(diff > 0) + 0.5 * np.sum(diff == 0)) / (na * nb), float("nan")))
        rows.append((name, "hodges_lehmann", la, lb, float(np.median(diff)), float("nan")))

with (folder / "posthoc.tsv").open("w") as f:
    f.write("dataset\tmethod\ta\tb\tstatistic\tp\tsource\n")
    for r in rows:
        f.write(f"{r[0]}\t{r[1]}\t{r[2]}\t{r[3]}\t{r[4]!r}\t{r[5]!r}\t{src}\n")
