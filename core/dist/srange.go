package dist

import "math"

// StudentizedRange is the law of the range of K ≥ 2 independent standard
// normal values divided by an independent estimate of their standard
// deviation with DF degrees of freedom (DF = +Inf for a known deviation):
// the law behind Tukey's and the Dwass–Steel–Critchlow–Fligner procedures.
//
// For DF = ∞ the upper tail is
//
//	P(Q > q) = K ∫ φ(z) [Φ(z)^(K−1) − (Φ(z) − Φ(z−q))^(K−1)] dz,
//
// the complement of Hartley's (1942) integral written so that nothing is
// subtracted from 1: with a = Φ(z) and b = Φ(z−q) the bracket is
// −a^(K−1)·expm1((K−1)·log1p(−b/a)), exact to rounding however small it is.
// For finite DF the tail is averaged over the law of s = √(χ²_DF/DF):
//
//	P(Q > q; DF) = ∫ g_DF(s) P(Q > q·s; ∞) ds,  g_DF(s) ∝ s^(DF−1) e^(−DF·s²/2),
//
// as in Copenhaver & Holland (1988, J. Statist. Comput. Simul. 30, 1–15). Both
// integrals are composite Gauss–Legendre rules on fixed panels around where
// the integrand lives (Lund & Lund 1983, Applied Statistics 32, 204–210, use
// the same formulation).
type StudentizedRange struct {
	K  float64
	DF float64
}

// Survival is P(Q > q).
func (d StudentizedRange) Survival(q float64) float64 {
	if q <= 0 {
		return 1
	}
	if math.IsInf(d.DF, 1) {
		return rangeSurvivalInf(d.K, q)
	}
	nu := d.DF
	// log of the normalising constant of g: ν^(ν/2) / (Γ(ν/2) 2^(ν/2−1))
	logC := float64(nu/2*log(nu)) - lgamma(nu/2) - float64((nu/2-1)*log(2))
	// s lives around 1 with spread about 1/√(2ν); the tail for large q comes
	// from small s, so the rule starts at 0 and reaches far above the peak.
	hi := 1 + 12/math.Sqrt(float64(2*nu))
	g := func(s float64) float64 {
		if s <= 0 {
			return 0
		}
		return float64(exp(logC+float64((nu-1)*log(s))-nu*s*s/2) * rangeSurvivalInf(d.K, float64(q*s)))
	}
	return min(1, gaussLegendre(g, 0, hi, 24))
}

// CDF is P(Q ≤ q) = 1 − Survival(q).
func (d StudentizedRange) CDF(q float64) float64 { return 1 - d.Survival(q) }

func rangeSurvivalInf(k, q float64) float64 {
	m := k - 1
	f := func(z float64) float64 {
		a := NormalUpper(-z) // Φ(z)
		if a == 0 {
			return 0
		}
		var logA float64
		if z > 0 {
			logA = math.Log1p(-NormalUpper(z))
		} else {
			logA = log(a)
		}
		b := NormalUpper(q - z) // Φ(z − q)
		bracket := float64(-exp(float64(m*logA)) * math.Expm1(float64(m*math.Log1p(-b/a))))
		return float64(k * exp(-z*z/2-halfLog2Pi) * bracket)
	}
	// the integrand lives between about −8 and q + 8; panels of width 1
	panels := int(math.Ceil(q + 16))
	return min(1, gaussLegendre(f, -8, q+8, panels))
}

// gaussLegendre integrates f over [a, b] with the 16-point Gauss–Legendre
// rule on each of the given number of equal panels.
func gaussLegendre(f func(float64) float64, a, b float64, panels int) float64 {
	h := (b - a) / float64(panels)
	sum := 0.0
	for p := range panels {
		mid := a + float64((float64(p)+0.5)*h)
		half := h / 2
		part := 0.0
		for i, x := range glNodes {
			part += float64(glWeights[i] * (f(mid-float64(half*x)) + f(mid+float64(half*x))))
		}
		sum += float64(part * half)
	}
	return sum
}

// 16-point Gauss–Legendre nodes (positive half) and weights (Abramowitz &
// Stegun 1964, table 25.4).
var (
	glNodes = [8]float64{
		0.0950125098376374401853193, 0.2816035507792589132304605, 0.4580167776572273863424194,
		0.6178762444026437484466718, 0.7554044083550030338951012, 0.8656312023878317438804679,
		0.9445750230732325760779884, 0.9894009349916499325961542,
	}
	glWeights = [8]float64{
		0.1894506104550684962853967, 0.1826034150449235888667637, 0.1691565193950025381893121,
		0.1495959888165767320815017, 0.1246289712555338720524763, 0.0951585116824927848099251,
		0.0622535239386478928628438, 0.0271524594117540948517806,
	}
)
