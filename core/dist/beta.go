package dist

import "math"

// Beta is the beta law with shape parameters A, B > 0, on [0, 1]:
//
//	P(X ≤ x) = I_x(A, B), the regularised incomplete beta function.
type Beta struct {
	A, B float64
}

// CDF is I_x(A, B), by the continued fraction of Press et al. (2007,
// Numerical Recipes, 3rd ed., §6.4), evaluated with the modified Lentz
// method on whichever side of the mean converges fast, using
// I_x(a, b) = 1 − I_(1−x)(b, a) on the other.
func (d Beta) CDF(x float64) float64 {
	switch {
	case x <= 0:
		return 0
	case x >= 1:
		return 1
	}
	a, b := d.A, d.B
	front := exp(lgamma(a+b) - lgamma(a) - lgamma(b) + float64(a*log(x)) + float64(b*math.Log1p(-x)))
	if x < (a+1)/(a+b+2) {
		return front * betaFraction(a, b, x) / a
	}
	return 1 - front*betaFraction(b, a, 1-x)/b
}

// Quantile is the x with P(X ≤ x) = p, 0 ≤ p ≤ 1, found by bisection,
// which needs nothing but the CDF and ends within 1e-17 of the answer.
func (d Beta) Quantile(p float64) float64 {
	lo, hi := 0.0, 1.0
	for i := 0; i < 64 && hi-lo > 1e-17; i++ {
		mid := (lo + hi) / 2
		if d.CDF(mid) < p {
			lo = mid
		} else {
			hi = mid
		}
	}
	return (lo + hi) / 2
}

// betaFraction is the continued fraction for I_x(a, b) (Numerical Recipes
// §6.4, betacf).
func betaFraction(a, b, x float64) float64 {
	qab, qap, qam := a+b, a+1, a-1
	c := 1.0
	d := 1 - qab*x/qap
	if math.Abs(d) < tiny {
		d = tiny
	}
	d = 1 / d
	h := d
	for m := 1; m < maxIter; m++ {
		fm := float64(m)
		m2 := float64(2 * fm)
		var even, odd float64
		c, d, even = lentz(fm*(b-fm)*x/(float64((qam+m2)*(a+m2))), 1, c, d)
		c, d, odd = lentz(-(a+fm)*(qab+fm)*x/(float64((a+m2)*(qap+m2))), 1, c, d)
		h = float64(h * (float64(even * odd)))
		if math.Abs(odd-1) < epsilon {
			break
		}
	}
	return h
}

// ClopperPearson is the exact two-sided confidence interval, at level
// 1 − alpha, for a binomial probability after x successes in n trials
// (Clopper & Pearson 1934, Biometrika 26(4), 404–413):
//
//	lower = B⁻¹(alpha/2; x, n−x+1),  upper = B⁻¹(1−alpha/2; x+1, n−x)
//
// with lower 0 when x = 0 and upper 1 when x = n.
func ClopperPearson(x, n int, alpha float64) (lower, upper float64) {
	lower, upper = 0, 1
	if x > 0 {
		lower = Beta{float64(x), float64(n - x + 1)}.Quantile(alpha / 2)
	}
	if x < n {
		upper = Beta{float64(x + 1), float64(n - x)}.Quantile(1 - alpha/2)
	}
	return lower, upper
}
