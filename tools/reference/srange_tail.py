"""Far upper tail of the studentized range with infinite df, by 40-digit
quadrature in mpmath (Debian's python3-mpmath) of
P(Q > q) = k ∫ φ(z) [Φ(z)^(k−1) − (Φ(z) − Φ(z−q))^(k−1)] dz,
and scipy.stats.studentized_range.sf where it is defined. R's ptukey is
inaccurate below about 1e-8, so these values check the far tail.
Argument: output TSV path."""
import sys

import mpmath as mp
import scipy
from scipy import stats

mp.mp.dps = 40


def upper(q, k):
    q = mp.mpf(q)
    phi = lambda z: mp.npdf(z)
    Phi = lambda z: mp.ncdf(z)
    f = lambda z: k * phi(z) * (Phi(z) ** (k - 1) - (Phi(z) - Phi(z - q)) ** (k - 1))
    return mp.quad(f, [-mp.inf, -8, 0, q / 2, q, q + 8, mp.inf])


with open(sys.argv[1], "w") as out:
    out.write("q\tk\tupper\tsource\n")
    for k in (2, 3, 5, 10):
        for q in (3, 6, 9, 12):
            out.write(f"{q}\t{k}\t{mp.nstr(upper(q, k), 17)}\tmpmath {mp.__version__} 40-digit quadrature\n")


def upper_finite(q, k, nu):
    """The same with df = nu: the infinite-df tail averaged over s."""
    nu = mp.mpf(nu)
    log_c = nu / 2 * mp.log(nu) - mp.loggamma(nu / 2) - (nu / 2 - 1) * mp.log(2)
    g = lambda s: mp.exp(log_c + (nu - 1) * mp.log(s) - nu * s * s / 2) * upper(q * s, k)
    return mp.quad(g, [0, 0.5, 1, 1.5, 2, 3, 6])


mp.mp.dps = 20
with open(sys.argv[1].replace("srange_tail", "srange_finite"), "w") as out:
    out.write("q\tk\tdf\tupper\tsource\n")
    for q, k, nu in ((4, 3, 5), (6, 3, 5), (3, 5, 10), (5, 10, 20)):
        out.write(f"{q}\t{k}\t{nu}\t{mp.nstr(upper_finite(q, k, nu), 15)}\tmpmath {mp.__version__} 20-digit double quadrature\n")
