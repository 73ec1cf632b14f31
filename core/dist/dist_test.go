package dist

import (
	"math"
	"strconv"
	"strings"
	"testing"

	"gonum.org/v1/gonum/stat/distuv"
)

// TestChiSquaredSurvivalMpmath holds the upper tail to 50-digit mpmath
// values (testdata/reference/chi2_tail.tsv, made by
// tools/reference/chi2_tail.py), down to 1e-284.
func TestChiSquaredSurvivalMpmath(t *testing.T) {
	checked := 0
	for _, c := range readRows(t, "chi2_tail.tsv") {
		if !strings.HasPrefix(c[3], "mpmath") {
			continue
		}
		x, _ := strconv.ParseFloat(c[0], 64)
		df, _ := strconv.ParseFloat(c[1], 64)
		want, _ := strconv.ParseFloat(c[2], 64)
		if got := (ChiSquared{df}).Survival(x); math.Abs(got-want) > 1e-13*want {
			t.Errorf("ChiSquared{%v}.Survival(%v) = %.17g, want %.17g (%s)", df, x, got, want, c[3])
		}
		checked++
	}
	if checked != 35 {
		t.Fatalf("checked %d values, want 35", checked)
	}
}

// TestChiSquaredAgainstGonum compares a grid with gonum v0.17.0's
// distuv.ChiSquared, a general-purpose reference library.
func TestChiSquaredAgainstGonum(t *testing.T) {
	for _, k := range []float64{1, 2, 3, 4, 5, 7, 9, 15, 30, 99, 500} {
		ref := distuv.ChiSquared{K: k}
		for _, x := range []float64{0.01, 0.3, 1, 2.5, 5, 10, 20, 40, 80, 160, 320, 640, 1000} {
			want := ref.Survival(x)
			if want < 1e-290 {
				continue
			}
			if got := (ChiSquared{k}).Survival(x); math.Abs(got-want) > 1e-12*want {
				t.Errorf("ChiSquared{%v}.Survival(%v) = %.17g, gonum %.17g", k, x, got, want)
			}
		}
		// gonum has no upper quantile: Quantile(1−p) loses digits for small p
		for _, p := range []float64{0.5, 0.1, 0.05, 0.01, 1e-3, 1e-4} {
			want := ref.Quantile(1 - p)
			if got := (ChiSquared{k}).UpperQuantile(p); math.Abs(got-want) > 1e-12*want {
				t.Errorf("ChiSquared{%v}.UpperQuantile(%v) = %.17g, gonum %.17g", k, p, got, want)
			}
		}
	}
}

// TestUpperQuantileRoundTrip: Survival(UpperQuantile(p)) = p far into the tail.
func TestUpperQuantileRoundTrip(t *testing.T) {
	for _, k := range []float64{1, 2, 3, 6, 10, 40} {
		for _, p := range []float64{0.9, 0.5, 0.05, 0.01, 1e-4, 1e-8, 1e-15, 1e-50} {
			c := ChiSquared{k}
			if got := c.Survival(c.UpperQuantile(p)); math.Abs(got-p) > 1e-12*p {
				t.Errorf("ChiSquared{%v}: Survival(UpperQuantile(%v)) = %v", k, p, got)
			}
		}
	}
}

// TestElementary: the portable exp, log and lgamma agree with the standard
// library to within a few units in the last place.
func TestElementary(t *testing.T) {
	for _, x := range []float64{-700, -30, -1, -1e-9, 0, 1e-10, 0.5, 1, 2, 10, 300, 709} {
		if got, want := exp(x), math.Exp(x); math.Abs(got-want) > 2e-16*want {
			t.Errorf("exp(%v) = %v, math.Exp %v", x, got, want)
		}
	}
	for _, x := range []float64{1e-300, 1e-5, 0.5, 1, 2, math.E, 1e5, 1e300} {
		if got, want := log(x), math.Log(x); math.Abs(got-want) > 2e-16*math.Max(1, math.Abs(want)) {
			t.Errorf("log(%v) = %v, math.Log %v", x, got, want)
		}
	}
	for _, a := range []float64{0.5, 1, 1.5, 2, 3.5, 7, 14.5, 15, 50, 1234.5, 1e6} {
		want, _ := math.Lgamma(a)
		if got := lgamma(a); math.Abs(got-want) > 1e-14*math.Max(1, math.Abs(want)) {
			t.Errorf("lgamma(%v) = %.17g, math.Lgamma %.17g", a, got, want)
		}
	}
}

// TestClopperPearson holds 99% intervals to scipy's beta quantiles
// (testdata/reference/clopper_pearson.tsv, made by
// tools/reference/clopper_pearson.py) to 1e-10 relative: for n near 1e5 the
// difference lgamma(a+b) − lgamma(b) loses about five digits, which is far
// below anything a Monte Carlo interval is read to.
func TestClopperPearson(t *testing.T) {
	checked := 0
	for _, c := range readRows(t, "clopper_pearson.tsv") {
		x, _ := strconv.Atoi(c[0])
		n, _ := strconv.Atoi(c[1])
		lo, _ := strconv.ParseFloat(c[2], 64)
		hi, _ := strconv.ParseFloat(c[3], 64)
		gotLo, gotHi := ClopperPearson(x, n, 0.01)
		if math.Abs(gotLo-lo) > 1e-10*math.Max(lo, 1e-300) || math.Abs(gotHi-hi) > 1e-10*hi {
			t.Errorf("ClopperPearson(%d, %d, 0.01) = [%.17g, %.17g], want [%.17g, %.17g] (%s)", x, n, gotLo, gotHi, lo, hi, c[4])
		}
		checked++
	}
	if checked != 9 {
		t.Fatalf("checked %d intervals, want 9", checked)
	}
}

// TestBetaAgainstGonum compares the CDF with gonum v0.17.0's distuv.Beta.
func TestBetaAgainstGonum(t *testing.T) {
	for _, ab := range [][2]float64{{0.5, 0.5}, {1, 1}, {2, 5}, {30, 70}, {500, 3}, {1, 99999}} {
		ref := distuv.Beta{Alpha: ab[0], Beta: ab[1]}
		for _, x := range []float64{1e-6, 0.001, 0.1, 0.3, 0.5, 0.7, 0.9, 0.999} {
			want := ref.CDF(x)
			if got := (Beta{ab[0], ab[1]}).CDF(x); math.Abs(got-want) > 1e-12*math.Max(want, 1e-200) && math.Abs(got-want) > 1e-15 {
				t.Errorf("Beta%v.CDF(%v) = %.17g, gonum %.17g", ab, x, got, want)
			}
		}
	}
}

// TestNormal: the upper tail against math.Erfc, and far out against
// 50-digit mpmath values via the identity erfc(x) = Q(½, x²) on the tested
// chi-square tail (P(χ²(1) ≥ z²) = 2·P(Z ≥ z)).
func TestNormal(t *testing.T) {
	for _, z := range []float64{-3, -0.5, 0, 0.3, 1.96, 4, 8, 20, 35} {
		if got, want := NormalUpper(z), 0.5*math.Erfc(z/math.Sqrt2); math.Abs(got-want) > 1e-15*want {
			t.Errorf("NormalUpper(%v) = %v, math.Erfc gives %v", z, got, want)
		}
	}
	for _, z := range []float64{2, 5, 20, 36} {
		if got, want := NormalTwoSided(z), (ChiSquared{1}).Survival(z*z); math.Abs(got-want) > 1e-12*want {
			t.Errorf("NormalTwoSided(%v) = %v, chi-square(1) tail %v", z, got, want)
		}
	}
	if z := NormalQuantileUpper(0.025); math.Abs(z-1.959963984540054) > 1e-12 {
		t.Errorf("NormalQuantileUpper(0.025) = %v, want 1.959963984540054 (common practice)", z)
	}
}
