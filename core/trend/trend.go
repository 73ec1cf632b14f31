// Package trend tests for a trend across ordered groups: the
// Jonckheere–Terpstra test (Terpstra 1952; Jonckheere 1954), with
// Kendall's τ_b between the groups' order and the values as its effect size.
//
// For groups 1 … k in their order,
//
//	J = Σ_{i<j} U_ij,  U_ij = #{(a, b): a in group i, b in group j, a < b} + ½·#{a = b},
//
// the Mann–Whitney counts of every pair of groups taken in order: large J
// says the values rise along the order. Under the null hypothesis (every
// deal of the values to groups of these sizes equally likely)
//
//	E(J) = (N² − Σ nᵢ²)/4
//	Var(J) = [N(N−1)(2N+5) − Σ nᵢ(nᵢ−1)(2nᵢ+5) − Σ t(t−1)(2t+5)]/72
//	       + [Σ nᵢ(nᵢ−1)(nᵢ−2)]·[Σ t(t−1)(t−2)]/[36 N(N−1)(N−2)]
//	       + [Σ nᵢ(nᵢ−1)]·[Σ t(t−1)]/[8 N(N−1)],
//
// t the sizes of the blocks of tied values (Hollander, Wolfe & Chicken 2014,
// Nonparametric Statistical Methods, 3rd ed., §6.2; Lehmann 1975, §5.3): the
// variance of Kendall's S between the values and the group numbers, divided
// by 4, as J = (S + Σ_{i<j} nᵢnⱼ)/2. So z = (J − E(J))/√Var(J) is Kendall's
// z with ties (R's cor.test(method = "kendall", exact = FALSE)), and
//
//	τ_b = S/√[(N(N−1)/2 − Σ t(t−1)/2)·(N(N−1)/2 − Σ nᵢ(nᵢ−1)/2)].
package trend

import (
	"errors"
	"math"

	"midrank/core/dist"
	"midrank/core/rank"
)

// Alternative is the direction of the trend tested.
type Alternative string

// The alternatives: values rising along the groups' order, falling, or
// either.
const (
	Increasing Alternative = "increasing"
	Decreasing Alternative = "decreasing"
	TwoSided   Alternative = "two-sided"
)

// Alternatives lists them, the default first.
var Alternatives = []Alternative{Increasing, Decreasing, TwoSided}

// Test is the statistic and its large-sample figures.
type Test struct {
	J        float64 // Σ_{i<j} U_ij
	Expected float64 // E(J)
	Variance float64 // Var(J), corrected for ties
	Z        float64 // (J − E(J))/√Var(J); 0 when the variance is 0
	TauB     float64 // Kendall's τ_b between group order and value
	// Doubled is 2J, a whole number, which the exact distribution counts in.
	Doubled int64
}

// ErrNoSpread reports data whose J cannot vary: every value tied, or every
// value in one group.
var ErrNoSpread = errors.New("trend: every value is tied or in one group")

// Compute works out J and its figures from a ranking whose groups are
// numbered in their order.
func Compute(r rank.Ranking) (Test, error) {
	var ties []int
	for i, j := range r.Blocks() {
		if j-i > 1 {
			ties = append(ties, j-i)
		}
	}
	doubled := newCounter(r).doubled(r.Groups)
	n := float64(len(r.Sorted))
	var sumN2, nTerm, nCube, nPair float64
	for _, s := range r.Sizes {
		x := float64(s)
		sumN2 += float64(x * x)
		nTerm += float64(x * (x - 1) * (2*x + 5))
		nCube += float64(x * (x - 1) * (x - 2))
		nPair += float64(x * (x - 1))
	}
	var tTerm, tCube, tPair float64
	for _, t := range ties {
		x := float64(t)
		tTerm += float64(x * (x - 1) * (2*x + 5))
		tCube += float64(x * (x - 1) * (x - 2))
		tPair += float64(x * (x - 1))
	}
	// products are rounded before they are added (float64(…)), so that no
	// platform fuses them into one step: the same bytes everywhere
	across := float64(n*n) - sumN2 // 2·Σ_{i<j} nᵢnⱼ
	test := Test{J: float64(doubled) / 2, Doubled: doubled, Expected: across / 4}
	test.Variance = (float64(n*(n-1)*(2*n+5)) - nTerm - tTerm) / 72
	if n > 1 { // the other terms count pairs and triples of values
		test.Variance += nPair * tPair / (8 * n * (n - 1))
	}
	if n > 2 {
		test.Variance += nCube * tCube / (36 * n * (n - 1) * (n - 2))
	}
	pairs := n * (n - 1) / 2
	untiedPairs, acrossPairs := pairs-tPair/2, pairs-nPair/2
	if test.Variance <= 0 || untiedPairs == 0 || acrossPairs == 0 {
		return test, ErrNoSpread
	}
	test.Z = (test.J - test.Expected) / math.Sqrt(test.Variance)
	s := float64(doubled) - across/2 // Kendall's S: concordant less discordant pairs
	test.TauB = s / math.Sqrt(untiedPairs*acrossPairs)
	return test, nil
}

// counter works out 2J of the groups of sorted values, block by block.
type counter struct {
	ends      []int   // where each block of tied values ends
	below, in []int64 // values of each group below the current block, and in it
}

func newCounter(r rank.Ranking) *counter {
	c := &counter{below: make([]int64, len(r.Sizes)), in: make([]int64, len(r.Sizes))}
	for _, j := range r.Blocks() {
		c.ends = append(c.ends, j)
	}
	return c
}

// doubled is 2J of the values in ascending order with these groups: a value
// of group h adds 2 for every value below it in the groups before h, and 1
// for every tied one there.
func (c *counter) doubled(groups []int32) int64 {
	clear(c.below)
	var doubled int64
	start := 0
	for _, end := range c.ends {
		clear(c.in)
		for _, g := range groups[start:end] {
			c.in[g]++
		}
		var lower, lowerIn int64 // values of the groups before g: below the block, in it
		for g, n := range c.in {
			doubled += n * (2*lower + lowerIn)
			lower += c.below[g]
			lowerIn += n
			c.below[g] += n
		}
		start = end
	}
	return doubled
}

// Normal is the p-value of the normal approximation for the alternative,
// from the upper tail of the standard normal (so that tiny p-values keep
// their digits).
func (t Test) Normal(alt Alternative) float64 {
	switch alt {
	case Increasing:
		return dist.NormalUpper(t.Z)
	case Decreasing:
		return dist.NormalUpper(-t.Z)
	}
	return dist.NormalTwoSided(t.Z)
}
