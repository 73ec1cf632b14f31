package kruskal

import (
	"fmt"
	"math"
	"testing"
)

func TestCriticalValue(t *testing.T) {
	// common practice: the familiar chi-square table (e.g. 3.841 for 1 df at
	// 0.05), here to the digits of scipy 1.10.1 scipy.stats.chi2.isf(alpha, df)
	tests := []struct {
		alpha float64
		df    int
		want  float64
	}{
		{0.05, 1, 3.8414588206941285},
		{0.05, 2, 5.991464547107983},
		{0.01, 3, 11.344866730144368},
		{0.001, 4, 18.466826952903173},
	}
	for _, tt := range tests {
		if got := CriticalValue(tt.alpha, tt.df); math.Abs(got-tt.want) > 1e-9*tt.want {
			t.Errorf("CriticalValue(%v, %d) = %.16g, want %.16g", tt.alpha, tt.df, got, tt.want)
		}
	}
}

func TestCompute(t *testing.T) {
	// Hollander & Wolfe (1973), p. 116 (as in R's kruskal.test help): sizes
	// 5, 4, 5 with rank sums 36, 36, 33 from R 4.2.2 tapply(rank(x), g, sum); H = 0.77142857142857224
	// and p = 0.67996477357889... from R's kruskal.test (testdata/reference/r_stats.tsv).
	got := Compute([]int{5, 4, 5}, []float64{36, 36, 33}, 0)
	if math.Abs(got.H-0.77142857142857224) > 1e-13 || math.Abs(got.P-0.6799647735788936) > 1e-12 || got.DF != 2 {
		t.Errorf("Compute = %+v, want H 0.7714285714, p 0.6799647736, df 2", got)
	}
	if got.TieCorrection != 1 || got.H != got.HUncorrected {
		t.Errorf("no ties: C = %v, H %v vs %v", got.TieCorrection, got.H, got.HUncorrected)
	}
}

func TestEffectSizes(t *testing.T) {
	// values worked by hand from the formulas: ε² = 9/(10−1) = 1,
	// η²(H) = (5 − 3 + 1)/(23 − 3) = 0.15; the size words by the Cohen (1988)
	// thresholds in the doc comment
	if got := EpsilonSquared(9, 10); got != 1 {
		t.Errorf("EpsilonSquared(9, 10) = %v, want 1", got)
	}
	if got, ok := EtaSquared(5, 23, 3); !ok || math.Abs(got-0.15) > 1e-15 {
		t.Errorf("EtaSquared(5, 23, 3) = %v, %v; want 0.15", got, ok)
	}
	if _, ok := EtaSquared(2, 3, 3); ok {
		t.Errorf("EtaSquared with N = k is defined, want undefined")
	}
	for v, want := range map[float64]string{0: "negligible", 0.01: "small", 0.059: "small", 0.06: "moderate", 0.14: "large"} {
		if got := Size(v); got != want {
			t.Errorf("Size(%v) = %q, want %q", v, got, want)
		}
	}
}

func ExampleCompute() {
	// three groups of three with no ties, fully separated; R 4.2.2
	// kruskal.test(list(1:3, 4:6, 7:9)) gives 7.2, df 2, p 0.02732
	t := Compute([]int{3, 3, 3}, []float64{6, 15, 24}, 0)
	fmt.Printf("H = %.4f, df = %d, p = %.4f\n", t.H, t.DF, t.P)
	// Output: H = 7.2000, df = 2, p = 0.0273
}
