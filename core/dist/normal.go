package dist

import "math"

// NormalUpper is P(Z ≥ z) = ½·erfc(z/√2) for a standard normal Z, the upper
// tail itself, so that it keeps its digits far out (to about z = 37).
func NormalUpper(z float64) float64 {
	return float64(0.5 * erfc(z/math.Sqrt2))
}

// NormalTwoSided is P(|Z| ≥ |z|) = erfc(|z|/√2).
func NormalTwoSided(z float64) float64 {
	return erfc(math.Abs(z) / math.Sqrt2)
}

// NormalQuantileUpper is the z with P(Z ≥ z) = p, 0 < p < 1.
func NormalQuantileUpper(p float64) float64 {
	if p > 0.5 {
		return -NormalQuantileUpper(1 - p)
	}
	return math.Sqrt(float64(2 * upperGammaInverse(0.5, float64(2*p))))
}

// StudentTwoSided is P(|T| ≥ |t|) for Student's t with df > 0 degrees of
// freedom, I_{df/(df+t²)}(df/2, ½) (Abramowitz & Stegun 1964, 26.7.1 and
// 26.5.27), computed without subtracting from 1.
func StudentTwoSided(t, df float64) float64 {
	return Beta{df / 2, 0.5}.CDF(df / (df + float64(t*t)))
}
