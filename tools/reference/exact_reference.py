"""Exact Kruskal–Wallis references, computed outside the project:

1. exact_tables.tsv: for untied samples of small equal and unequal sizes, the
   exact critical value (smallest attained H with P(H >= h) <= alpha) and its
   attained level, by complete enumeration of all group splits (itertools),
   to confirm the published table values quoted from memory (Iman, Quade &
   Alexander 1975; Meyer & Seaman's exact tables).
2. exact_pvalues.tsv: exact permutation p-values of small samples drawn from
   open datasets of R's `datasets` package, from
   scipy.stats.permutation_test(..., n_resamples=inf) with the statistic of
   scipy.stats.kruskal.

Arguments: output folder. Uses Debian's python3 with python3-scipy."""
import itertools
import math
import pathlib
import sys

import numpy as np
import scipy
from scipy import stats

out = pathlib.Path(sys.argv[1])


def splits(n, sizes):
    """Every way to split range(n) into groups of the given sizes (ordered)."""
    if len(sizes) == 1:
        yield (tuple(range(n)),) if n == sizes[0] else ()
        return
    def rec(items, sizes):
        if len(sizes) == 1:
            yield (items,)
            return
        for first in itertools.combinations(items, sizes[0]):
            rest = tuple(i for i in items if i not in first)
            for tail in rec(rest, sizes[1:]):
                yield (first,) + tail
    yield from rec(tuple(range(n)), list(sizes))


def h_of(groups, ranks, n):
    s = sum(sum(ranks[i] for i in g) ** 2 / len(g) for g in groups)
    return 12 / (n * (n + 1)) * s - 3 * (n + 1)


rows = []
for sizes in [(2, 2, 2), (3, 3, 3), (4, 4, 4), (5, 5, 5), (3, 3, 2), (4, 3, 3), (5, 4, 3), (2, 2, 2, 2), (3, 3, 3, 3)]:
    n = sum(sizes)
    ranks = list(range(1, n + 1))
    hs = np.array(sorted(round(h_of(g, ranks, n), 10) for g in splits(n, sizes)))
    total = len(hs)
    values, counts = np.unique(hs, return_counts=True)
    upper = np.cumsum(counts[::-1])[::-1] / total  # P(H >= value)
    for alpha in (0.05, 0.01):
        ok = upper <= alpha * (1 + 1e-12)
        if ok.any():
            i = int(np.argmax(ok))
            rows.append((sizes, alpha, repr(float(values[i])), repr(float(upper[i])), total))
        else:
            rows.append((sizes, alpha, "none", "none", total))
with (out / "exact_tables.tsv").open("w") as f:
    f.write("sizes\talpha\tcritical_h\tattained_alpha\tsplits\tsource\n")
    for sizes, alpha, h, a, total in rows:
        f.write(f"{','.join(map(str, sizes))}\t{alpha}\t{h}\t{a}\t{total}\t"
                f"complete enumeration of all {total} splits, tools/reference/exact_reference.py\n")

# Small samples of open datasets (R's datasets package, exported by datasets.R):
def read(name):
    groups = {}
    import csv
    with (out / f"{name}.csv").open() as f:
        for rec in csv.DictReader(f):
            if rec["value"] != "NA":
                groups.setdefault(rec["group"], []).append(float(rec["value"]))
    return groups


def statistic(*samples, axis):
    return stats.kruskal(*samples, axis=axis).statistic


samples = {
    "plantgrowth_first4": [v[:4] for v in read("plantgrowth").values()],
    "insectsprays_abc_first4": [read("insectsprays")[g][:4] for g in ("A", "B", "C")],
    "hollander_wolfe": list(read("hollander_wolfe").values()),
    "chickwts_first3_of4": [v[:3] for v in list(read("chickwts").values())[:4]],
    # two tied pairs among 15 values: the plans that deal the pairs last
    "airquality_ozone_jun_aug_sep_first5": [read("airquality_ozone")[m][:5] for m in ("month6", "month8", "month9")],
    "insectsprays_bcd_first5": [read("insectsprays")[g][:5] for g in ("B", "C", "D")],
}
with (out / "exact_pvalues.tsv").open("w") as f:
    f.write("sample\tgroups\tp_exact\tsource\n")
    for name, groups in samples.items():
        res = stats.permutation_test(groups, statistic, permutation_type="independent", vectorized=True,
                                     batch=50_000, n_resamples=np.inf, alternative="greater")
        text = ";".join(",".join(repr(x) for x in g) for g in groups)
        f.write(f"{name}\t{text}\t{res.pvalue!r}\tscipy {scipy.__version__} scipy.stats.permutation_test("
                f"permutation_type='independent', n_resamples=inf, alternative='greater') of scipy.stats.kruskal\n")
