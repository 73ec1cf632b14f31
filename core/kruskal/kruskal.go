// Package kruskal computes the Kruskal–Wallis H test of whether k independent
// samples come from the same distribution, with the correction for ties, its
// chi-square approximation and the usual effect sizes.
//
// Kruskal, W. H. & Wallis, W. A. (1952). Use of ranks in one-criterion
// variance analysis. Journal of the American Statistical Association 47(260),
// 583–621.
package kruskal

import (
	"fmt"
	"math"
	"strings"

	"midrank/core/dist"
)

// Test is the outcome of the H test.
type Test struct {
	N, K int
	// HUncorrected is the statistic without the tie correction:
	//
	//	H₀ = 12/(N(N+1)) · Σᵢ nᵢ (R̄ᵢ − (N+1)/2)²
	//
	// the deviation form of 12/(N(N+1)) Σ Rᵢ²/nᵢ − 3(N+1), which loses no
	// digits to cancellation.
	HUncorrected float64
	// TieCorrection is C = 1 − Σ(t³−t)/(N³−N) over the tie blocks (Kruskal &
	// Wallis 1952, eq. 1.4).
	TieCorrection float64
	H             float64 // H = H₀ / C
	DF            int     // k − 1
	P             float64 // P(χ²(k−1) ≥ H), the asymptotic p-value
}

// Compute runs the test from the group sizes, the groups' rank sums and the
// tie term Σ(t³−t). It needs k ≥ 2 groups and values that are not all tied
// (C > 0); the caller checks both.
func Compute(sizes []int, rankSums []float64, tieSum float64) Test {
	n := 0
	for _, s := range sizes {
		n += s
	}
	fn := float64(n)
	centre := (fn + 1) / 2
	var ss float64
	for i, s := range sizes {
		d := rankSums[i]/float64(s) - centre
		ss += float64(float64(s) * d * d)
	}
	t := Test{N: n, K: len(sizes), DF: len(sizes) - 1}
	t.HUncorrected = float64(12 / (float64(fn * (fn + 1))) * ss)
	t.TieCorrection = 1 - tieSum/(float64(fn*fn*fn)-fn)
	t.H = t.HUncorrected / t.TieCorrection
	// the upper tail itself, never 1 − CDF, so tiny p keep their digits
	t.P = dist.ChiSquared{K: float64(t.DF)}.Survival(t.H)
	return t
}

// CriticalValue is the h with P(χ²(df) ≥ h) = alpha.
func CriticalValue(alpha float64, df int) float64 {
	return dist.ChiSquared{K: float64(df)}.UpperQuantile(alpha)
}

// EpsilonSquared is the rank epsilon-squared effect size
//
//	ε² = H / ((N²−1)/(N+1)) = H/(N−1)
//
// which lies in [0, 1]. Tomczak, M. & Tomczak, E. (2014). The need to report
// effect size estimates revisited. Trends in Sport Sciences 21(1), 19–25.
func EpsilonSquared(h float64, n int) float64 {
	return h / float64(n-1)
}

// EtaSquared is the eta-squared based on H,
//
//	η²(H) = (H − k + 1)/(N − k)
//
// (Cohen 2008, Explaining Psychological Statistics, 3rd ed., as cited by
// Tomczak & Tomczak 2014). It can be slightly negative when H < k − 1, and is
// undefined (ok false) when N = k.
func EtaSquared(h float64, n, k int) (v float64, ok bool) {
	if n <= k {
		return math.NaN(), false
	}
	return (h - float64(k) + 1) / float64(n-k), true
}

// sizeBands are Cohen's benchmarks for a proportion of variance explained
// (Cohen 1988, Statistical Power Analysis for the Behavioral Sciences, 2nd
// ed., §8.2; the thresholds 0.01, 0.06 and 0.14 are common practice, quoted
// from memory): each word holds below its bound.
var sizeBands = []struct {
	below float64
	word  string
}{{0.01, "negligible"}, {0.06, "small"}, {0.14, "moderate"}, {math.Inf(1), "large"}}

// Size puts an effect size of the eta-squared family into words by
// sizeBands: below 0.01 negligible, below 0.06 small, below 0.14 moderate,
// else large.
func Size(v float64) string {
	for _, b := range sizeBands {
		if v < b.below {
			return b.word
		}
	}
	return sizeBands[len(sizeBands)-1].word
}

// SizeRule says how Size words an effect size, for readers.
func SizeRule() string {
	var parts []string
	for i, b := range sizeBands[:len(sizeBands)-1] {
		parts = append(parts, fmt.Sprintf("%s below %v", b.word, b.below))
		if i == len(sizeBands)-2 {
			parts = append(parts, fmt.Sprintf("%s from %v", sizeBands[i+1].word, b.below))
		}
	}
	return strings.Join(parts, ", ") + " (Cohen's benchmarks for a share of variance, common practice)"
}
