package posthoc

import (
	"math"
	"slices"

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
		below := kthDifference(a, b, total/2)
		e.Shift = (below + nextDifference(a, b, below, total/2)) / 2
	}
	z := dist.NormalQuantileUpper((1 - confidence) / 2)
	c := int(math.Floor(m/2 - z*math.Sqrt(m*float64(len(a)+len(b)+1)/12)))
	c = min(max(c, 1), total)
	e.ShiftLow = kthDifference(a, b, c)
	e.ShiftHigh = kthDifference(a, b, total+1-c)
	return e
}

// kthDifference returns the k-th smallest (from 1) of the differences
// a[i] − b[j] of two ascending slices, without forming all of them. It
// bisects the values, each step counting the differences at or below a
// candidate in one merge-like pass, until at most a few thousand differences
// lie between the bounds (or, with ties, the upper bound is itself the
// answer); those are then listed and the answer picked from them. A few
// dozen passes replace the na·nb differences.
func kthDifference(a, b []float64, k int) float64 {
	lo := a[0] - b[len(b)-1] // the smallest difference
	hi := a[len(a)-1] - b[0] // the largest
	cLo, _ := countAtMost(a, b, lo)
	if cLo >= k {
		return lo
	}
	cHi := len(a) * len(b)
	// invariant: cLo = #(≤ lo) < k ≤ cHi = #(≤ hi)
	// sorting the listed differences costs about as much as one pass per
	// 40 of them, so list no more than a quarter of a pass's length
	listable := max(1024, (len(a)+len(b))/4)
	for step := 0; cHi-cLo > listable; step++ {
		// alternate a step that interpolates on the counts (fast where the
		// differences are spread smoothly) with a bisection (sure progress)
		mid := lo + (hi-lo)/2
		if step%2 == 0 {
			mid = lo + (hi-lo)*(float64(k-cLo)/float64(cHi-cLo))
		}
		if !(mid > lo && mid < hi) {
			mid = lo + (hi-lo)/2
			if !(mid > lo && mid < hi) {
				return hi // lo and hi are neighbours: every difference between is hi
			}
		}
		if c, top := countAtMost(a, b, mid); c >= k {
			// hi becomes the largest difference at or below mid; with tied
			// values one difference can repeat more often than the list
			// holds, so on bisection steps check whether the k-th is hi itself
			hi, cHi = top, c
			if step%2 == 1 && countBelow(a, b, hi) < k {
				return hi
			}
		} else {
			lo, cLo = mid, c
		}
	}
	between := make([]float64, 0, cHi-cLo)
	j, l := 0, 0 // for ascending x, a[i] − b[j] ≤ hi from j on, and ≤ lo from l on
	for _, x := range a {
		for j < len(b) && x-b[j] > hi {
			j++
		}
		for l < len(b) && x-b[l] > lo {
			l++
		}
		for _, y := range b[j:l] {
			between = append(between, x-y)
		}
	}
	slices.Sort(between)
	d := between[k-cLo-1]
	if d == 0 {
		d = 0 // never report -0
	}
	return d
}

// nextDifference is the (k+1)-th smallest difference given d, the k-th: d
// again if it repeats, else the smallest difference above d (one pass).
func nextDifference(a, b []float64, d float64, k int) float64 {
	if c, _ := countAtMost(a, b, d); c > k {
		return d
	}
	next := math.Inf(1)
	j := 0 // for ascending x, a[i] − b[j] > d exactly for j below a bound that only moves right
	for _, x := range a {
		for j < len(b) && x-b[j] > d {
			j++
		}
		if j > 0 {
			next = min(next, x-b[j-1])
		}
	}
	return next
}

// countBelow counts the pairs with a[i] − b[j] < d.
func countBelow(a, b []float64, d float64) int {
	count, j := 0, 0
	for _, x := range a {
		for j < len(b) && x-b[j] >= d {
			j++
		}
		count += len(b) - j
	}
	return count
}

// countAtMost counts the pairs with a[i] − b[j] ≤ d, and finds the largest
// such difference. For ascending a the first j with a[i] − b[j] ≤ d only
// moves right, and a[i] − b[j] is the largest for that a[i].
func countAtMost(a, b []float64, d float64) (count int, top float64) {
	top = math.Inf(-1)
	j := 0
	for _, x := range a {
		for j < len(b) && x-b[j] > d {
			j++
		}
		if j < len(b) {
			count += len(b) - j
			if v := x - b[j]; v > top { // no builtin max: it pays for NaN and -0, which cannot occur
				top = v
			}
		}
	}
	return count, top
}
