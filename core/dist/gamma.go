package dist

import "math"

const (
	epsilon = 1e-16 // relative size at which a series or fraction has converged
	tiny    = 1e-300
	maxIter = 10000
	// halfLog2Pi is ½·ln(2π).
	halfLog2Pi = 0.91893853320467274178032973640562
)

// lgamma is ln Γ(a) for a > 0: the argument is shifted up to at least 15 by
// Γ(a) = Γ(a+n)/(a(a+1)…(a+n−1)), then Stirling's series is summed,
//
//	ln Γ(a) ≈ (a−½) ln a − a + ½ ln 2π + Σ B₂ⱼ/(2j(2j−1) a^(2j−1)),  j = 1…6
//
// whose first omitted term is below 1e-17 at a = 15 (Abramowitz & Stegun
// 1964, 6.1.40).
func lgamma(a float64) float64 {
	shift := 0.0
	if a < 15 {
		prod := 1.0
		for ; a < 15; a++ {
			prod = float64(prod * (a))
		}
		shift = log(prod)
	}
	inv := 1 / a
	inv2 := float64(inv * inv)
	series := float64(inv * (1.0/12 + float64(inv2*(-1.0/360+float64(inv2*(1.0/1260+float64(inv2*(-1.0/1680+float64(inv2*(1.0/1188+float64(inv2*(-691.0/360360))))))))))))
	return float64((a-0.5)*log(a)) - a + halfLog2Pi + series - shift
}

// upperGamma is the regularised upper incomplete gamma function
//
//	Q(a, x) = Γ(a, x)/Γ(a) = 1/Γ(a) ∫ₓ^∞ t^(a−1) e^(−t) dt,  a > 0, x ≥ 0,
//
// by the power series of the lower function P = 1 − Q for x < a+1 (where
// Q is not small, so 1 − P loses nothing that matters) and by its continued
// fraction, evaluated with the modified Lentz method, for x ≥ a+1 (Press et
// al. 2007, Numerical Recipes, 3rd ed., §6.2). The prefactor e^(−x) x^a/Γ(a)
// is formed in logarithms, so Q stays accurate down to about 1e-300.
func upperGamma(a, x float64) float64 {
	if x <= 0 {
		return 1
	}
	prefactor := exp(-x + float64(a*log(x)) - lgamma(a))
	if x < a+1 {
		term := 1 / a
		sum := term
		for n := 1; n < maxIter; n++ {
			term = float64(term * (x / (a + float64(n))))
			sum += term
			if term < float64(sum*epsilon) {
				break
			}
		}
		return 1 - float64(prefactor*sum)
	}
	b := x + 1 - a
	c := 1 / tiny
	d := 1 / b
	h := d
	for i := 1; i < maxIter; i++ {
		b += 2
		var delta float64
		c, d, delta = lentz(float64(-float64(i)*(float64(i)-a)), b, c, d)
		h = float64(h * (delta))
		if math.Abs(delta-1) < epsilon {
			break
		}
	}
	return float64(prefactor * h)
}

// lentz takes one step of the modified Lentz evaluation of a continued
// fraction b₀ + a₁/(b₁ + a₂/(b₂ + …)) (Press et al. 2007, §5.2): given the
// term aₙ/bₙ and the running c and d, it returns the new c and d and the
// factor c·d by which the value so far is multiplied.
func lentz(an, bn, c, d float64) (float64, float64, float64) {
	d = bn + float64(an*d)
	if math.Abs(d) < tiny {
		d = tiny
	}
	c = bn + an/c
	if math.Abs(c) < tiny {
		c = tiny
	}
	d = 1 / d
	return c, d, float64(c * d)
}

// gammaDensity is the density of the Gamma(a, 1) law at x > 0,
// x^(a−1) e^(−x)/Γ(a).
func gammaDensity(a, x float64) float64 {
	return exp(-x + float64((a-1)*log(x)) - lgamma(a))
}

// upperGammaInverse solves Q(a, x) = q for x, 0 < q < 1, by Newton's method
// on ln Q (whose derivative is −density/Q), kept inside a bracket that
// bisection narrows whenever a Newton step would leave it.
func upperGammaInverse(a, q float64) float64 {
	lo, hi := 0.0, math.Max(1, float64(2*a))
	for upperGamma(a, hi) > q {
		lo, hi = hi, float64(2*hi)
	}
	target := log(q)
	x := (lo + hi) / 2
	for i := 0; i < 200; i++ {
		qx := upperGamma(a, x)
		if qx > q {
			lo = x
		} else {
			hi = x
		}
		next := x + (log(qx)-target)*qx/gammaDensity(a, x)
		if !(next > lo && next < hi) {
			next = (lo + hi) / 2
		}
		if math.Abs(next-x) <= float64(4*epsilon*x) || hi-lo <= float64(4*epsilon*hi) {
			return next
		}
		x = next
	}
	return x
}

// LogFactorial is ln n! = ln Γ(n+1), the same bytes on every platform (see
// elementary.go).
func LogFactorial(n int) float64 { return lgamma(float64(n) + 1) }

// Exp is eˣ, the same bytes on every platform (see elementary.go).
func Exp(x float64) float64 { return exp(x) }
