"""Upper-tail chi-square probabilities, far into the tail, with mpmath at 50
digits (Debian's python3-mpmath) and scipy.stats.chi2.sf for comparison.
Argument: output TSV path."""
import sys

import mpmath
import scipy
from scipy import stats

mpmath.mp.dps = 50
rows = []
for df in (1, 2, 3, 4, 9):
    for x in (0.5, 3.84, 10, 50, 200, 700, 1300):
        sf = mpmath.gammainc(mpmath.mpf(df) / 2, mpmath.mpf(x) / 2, mpmath.inf, regularized=True)
        rows.append((x, df, float(sf), f"mpmath {mpmath.__version__} gammainc(df/2, x/2, inf, regularized=True)"))
        rows.append((x, df, float(stats.chi2.sf(x, df)), f"scipy {scipy.__version__} scipy.stats.chi2.sf(x, df)"))
with open(sys.argv[1], "w") as f:
    f.write("x\tdf\tupper_tail\tsource\n")
    for x, df, p, src in rows:
        f.write(f"{x!r}\t{df}\t{p!r}\t{src}\n")
