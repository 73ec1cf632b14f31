"""Exact Jonckheere-Terpstra p-values of small subsets of R datasets with
ordered groups and of the worked example in Hollander & Wolfe (section 6.2,
from memory), by scipy.stats.permutation_test in exact mode (every
assignment of the values to the groups: 17,153,136 for the worked example,
some minutes) with J counted pair by pair (ties counting half). Reads the subsets' values from testdata/trend/*.csv (the
first rows of each group, as listed in SUBSETS) and writes
testdata/trend/scipy_exact.tsv.
Run: /usr/bin/python3 tools/reference/trend_exact.py testdata/trend
"""
import csv
import sys

import numpy as np
import scipy
from scipy import stats

# dataset, group levels in order, values taken from the start of each group
SUBSETS = [("warpbreaks", ["L", "M", "H"], 3), ("toothgrowth", ["0.5", "1", "2"], 3),
           ("esoph", ["25-34", "35-44", "45-54"], 3), ("warpbreaks", ["L", "M", "H"], 4),
           ("hollander_wolfe", ["none", "rough", "accurate"], 6)]


def jonckheere(*groups, axis=-1):
    """J over the last axis of each group's array (many resamples at once)."""
    j = 0.0
    for a in range(len(groups)):
        for b in range(a + 1, len(groups)):
            x = np.moveaxis(np.asarray(groups[a]), axis, -1)[..., :, None]
            y = np.moveaxis(np.asarray(groups[b]), axis, -1)[..., None, :]
            j = j + np.sum(x < y, axis=(-2, -1)) + 0.5 * np.sum(x == y, axis=(-2, -1))
    return j


def main(out):
    rows = []
    for name, levels, take in SUBSETS:
        by = {level: [] for level in levels}
        with open(f"{out}/{name}.csv") as f:
            for row in csv.DictReader(f):
                if row["group"] in by and len(by[row["group"]]) < take:
                    by[row["group"]].append(float(row["value"]))
        groups = [by[level] for level in levels]
        for alternative, scipy_alt in [("increasing", "greater"), ("decreasing", "less")]:
            res = stats.permutation_test(groups, jonckheere, permutation_type="independent", vectorized=True,
                                         n_resamples=np.inf, alternative=scipy_alt)
            rows.append([name, "|".join(levels), take, alternative, repr(float(jonckheere(*groups))), repr(res.pvalue),
                         " ".join(repr(v) for g in groups for v in g)])
    with open(f"{out}/scipy_exact.tsv", "w") as f:
        f.write(f"# scipy {scipy.__version__} permutation_test, exact, J pair by pair; values listed group by group\n")
        f.write("dataset\tlevels\tper_group\talternative\tj\tp\tvalues\n")
        for r in rows:
            f.write("\t".join(str(c) for c in r) + "\n")


if __name__ == "__main__":
    main(sys.argv[1])
