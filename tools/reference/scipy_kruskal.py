"""Kruskal–Wallis reference values from scipy.stats.kruskal for the CSV files
written by datasets.R. Run by generate.sh with Debian's python3.
Arguments: the folder that holds the CSV files."""
import csv
import math
import pathlib
import sys

import scipy
from scipy import stats

folder = pathlib.Path(sys.argv[1])
rows = []
for path in sorted(folder.glob("*.csv")):
    groups = {}
    with path.open() as f:
        for rec in csv.DictReader(f):
            groups.setdefault(rec["group"], [])
            if rec["value"] != "NA":
                groups[rec["group"]].append(float(rec["value"]))
    h, p = stats.kruskal(*groups.values())
    src = f"scipy {scipy.__version__} scipy.stats.kruskal"
    rows.append((path.stem, "h", h, src))
    rows.append((path.stem, "p", p, src))
    n = sum(len(v) for v in groups.values())
    # chi-square critical value at alpha = 0.05 with k-1 df
    crit = stats.chi2.isf(0.05, len(groups) - 1)
    rows.append((path.stem, "critical_value_0.05", crit, f"scipy {scipy.__version__} scipy.stats.chi2.isf(0.05, k-1)"))
with (folder / "scipy.tsv").open("w") as f:
    f.write("dataset\tquantity\tvalue\tsource\n")
    for name, q, v, src in rows:
        f.write(f"{name}\t{q}\t{v!r}\t{src}\n")
