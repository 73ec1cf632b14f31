"""99% Clopper–Pearson intervals from scipy.stats.beta.ppf, and a few beta
CDF values, for core/dist's tests. Argument: output TSV path."""
import sys

import scipy
from scipy import stats

src = f"scipy {scipy.__version__} scipy.stats.beta.ppf"
with open(sys.argv[1], "w") as f:
    f.write("x\tn\tlower\tupper\tsource\n")
    for x, n in [(0, 100), (1, 100), (5, 1000), (50, 100), (99, 100), (100, 100), (1234, 100000), (3, 100000), (0, 100000)]:
        lo = 0.0 if x == 0 else stats.beta.ppf(0.005, x, n - x + 1)
        hi = 1.0 if x == n else stats.beta.ppf(0.995, x + 1, n - x)
        f.write(f"{x}\t{n}\t{lo!r}\t{hi!r}\t{src}(0.005, x, n-x+1), (0.995, x+1, n-x)\n")
