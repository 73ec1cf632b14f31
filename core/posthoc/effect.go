package posthoc

import (
	"math"

	"midrank/core/dist"
	"midrank/core/rank"
)

// Effect describes how far apart two groups are, without assumptions about
// their distributions.
type Effect struct {
	// ProbSuperiority is P(A > B) + ½·P(A = B) for a value drawn from each
	// group, the Vargha–Delaney A (Vargha & Delaney 2000, J. Educ. Behav.
	// Statist. 25(2), 101–132); 0.5 means no tendency either way.
	ProbSuperiority float64
	// CliffsDelta is P(A > B) − P(A < B) = 2A − 1 (Cliff 1993, Psychol.
	// Bull. 114(3), 494–509).
	CliffsDelta float64
	// Shift is the Hodges–Lehmann estimate of how much higher A lies than B,
	// the median of all differences a − b, with its distribution-free
	// confidence interval: the differences of order C and na·nb + 1 − C,
	// C = ⌊na·nb/2 − z·√(na·nb(na+nb+1)/12)⌋, z the normal quantile of the
	// confidence level (Hollander & Wolfe 1999, Nonparametric Statistical
	// Methods, 2nd ed., §4.3, large-sample form).
	Shift, ShiftLow, ShiftHigh float64
}

// sortedGroups returns each group's values in ascending order, from the
// global sort.
func sortedGroups(r rank.Ranking) [][]float64 {
	groups := make([][]float64, len(r.Sizes))
	for g, n := range r.Sizes {
		groups[g] = make([]float64, 0, n)
	}
	for i, g := range r.Groups {
		groups[g] = append(groups[g], r.Sorted[i])
	}
	return groups
}

func effects(a, b []float64, confidence float64) Effect {
	var greater, equal float64 // pairs with a > b, and with a = b
	j, k := 0, 0               // b[:j] < x, b[:k] ≤ x, for the current x of a
	for _, x := range a {
		for j < len(b) && b[j] < x {
			j++
		}
		for k < len(b) && b[k] <= x {
			k++
		}
		greater += float64(j)
		equal += float64(k - j)
	}
	m := float64(len(a)) * float64(len(b))
	e := Effect{ProbSuperiority: (greater + equal/2) / m}
	e.CliffsDelta = 2*e.ProbSuperiority - 1
	total := len(a) * len(b)
	if total%2 == 1 {
		e.Shift = kthDifference(a, b, total/2+1)
	} else {
		e.Shift = (kthDifference(a, b, total/2) + kthDifference(a, b, total/2+1)) / 2
	}
	z := dist.NormalQuantileUpper((1 - confidence) / 2)
	c := int(math.Floor(m/2 - z*math.Sqrt(m*float64(len(a)+len(b)+1)/12)))
	c = min(max(c, 1), total)
	e.ShiftLow = kthDifference(a, b, c)
	e.ShiftHigh = kthDifference(a, b, total+1-c)
	return e
}

// kthDifference returns the k-th smallest (from 1) of the differences
// a[i] − b[j] of two ascending slices, without forming them: a bisection
// over the ordered float64 values, each step counting the differences at or
// below a candidate in one merge-like pass. It ends after at most 64 steps
// on the one float64 value where the count reaches k, which is a difference.
func kthDifference(a, b []float64, k int) float64 {
	lo := rank.Key(a[0] - b[len(b)-1]) // the smallest difference
	hi := rank.Key(a[len(a)-1] - b[0]) // the largest
	for lo < hi {
		mid := lo + (hi-lo)/2
		if countAtMost(a, b, rank.FromKey(mid)) >= k {
			hi = mid
		} else {
			lo = mid + 1
		}
	}
	d := rank.FromKey(lo)
	if d == 0 {
		d = 0 // the search can stop on -0, which equals 0 in every count
	}
	return d
}

// countAtMost counts the pairs with a[i] − b[j] ≤ d. For ascending a the
// first j with a[i] − b[j] ≤ d only moves right.
func countAtMost(a, b []float64, d float64) int {
	count, j := 0, 0
	for _, x := range a {
		for j < len(b) && x-b[j] > d {
			j++
		}
		count += len(b) - j
	}
	return count
}
