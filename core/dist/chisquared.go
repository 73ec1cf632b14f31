// Package dist holds the probability laws behind Midrank's p-values and
// critical values, computed the same way, bit for bit, on every platform
// (see elementary.go for why), and checked against gonum, scipy and
// 50-digit mpmath values in the tests.
package dist

// ChiSquared is the chi-square law with K degrees of freedom, K > 0, the
// large-sample law of the Kruskal–Wallis H under the null hypothesis
// (Kruskal & Wallis 1952, §1.2). It is the Gamma(K/2, scale 2) law:
//
//	P(X ≥ x) = Q(K/2, x/2)
type ChiSquared struct {
	K float64
}

// Survival is the upper tail P(X ≥ x), computed directly as Q(K/2, x/2),
// never as 1 − CDF, so that p-values near 1e-300 keep their digits.
func (c ChiSquared) Survival(x float64) float64 {
	if x <= 0 {
		return 1
	}
	return upperGamma(c.K/2, x/2)
}

// UpperQuantile is the x with P(X ≥ x) = p, for 0 < p < 1: the critical value
// of a level-p test.
func (c ChiSquared) UpperQuantile(p float64) float64 {
	return float64(2 * upperGammaInverse(c.K/2, p))
}
