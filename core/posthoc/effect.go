package posthoc

import (
	"math"
	"sort"

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

// tally is a group's values as its distinct values, ascending, and how many
// values lie at or above each: a tied value is handled once, which makes
// the passes below as long as the number of distinct values.
type tally struct {
	v     []float64 // distinct values, ascending
	w     []int     // how often each occurs
	above []int     // above[i] = w[i] + w[i+1] + …; above[len(v)] = 0
	n     int       // all values
}

// tallies returns each group's tally, from the global sort.
func tallies(r rank.Ranking) []tally {
	sorted := make([][]float64, len(r.Sizes))
	for g, n := range r.Sizes {
		sorted[g] = make([]float64, 0, n)
	}
	for i, g := range r.Groups {
		sorted[g] = append(sorted[g], r.Sorted[i])
	}
	ts := make([]tally, len(sorted))
	for g, values := range sorted {
		ts[g] = tallyOf(values)
	}
	return ts
}

// tallyOf tallies ascending values.
func tallyOf(sorted []float64) tally {
	var t tally
	for _, x := range sorted {
		if len(t.v) > 0 && t.v[len(t.v)-1] == x {
			t.w[len(t.w)-1]++
		} else {
			t.v = append(t.v, x)
			t.w = append(t.w, 1)
		}
	}
	t.above = make([]int, len(t.v)+1)
	for i := len(t.v) - 1; i >= 0; i-- {
		t.above[i] = t.above[i+1] + t.w[i]
	}
	t.n = t.above[0]
	return t
}

func effects(a, b tally, confidence float64) Effect {
	var greater, equal float64 // pairs with a > b, and with a = b
	j := 0                     // b.v[:j] < x for the current x of a
	for i, x := range a.v {
		for j < len(b.v) && b.v[j] < x {
			j++
		}
		w := float64(a.w[i])
		greater += float64(w * float64(b.n-b.above[j]))
		if j < len(b.v) && b.v[j] == x {
			equal += float64(w * float64(b.w[j]))
		}
	}
	m := float64(float64(a.n) * float64(b.n))
	e := Effect{ProbSuperiority: (greater + equal/2) / m}
	e.CliffsDelta = float64(2*e.ProbSuperiority) - 1
	total := a.n * b.n
	if total%2 == 1 {
		e.Shift = kthDifference(a, b, total/2+1)
	} else {
		below := kthDifference(a, b, total/2)
		e.Shift = (below + nextDifference(a, b, below, total/2)) / 2
	}
	z := dist.NormalQuantileUpper((1 - confidence) / 2)
	c := int(math.Floor(m/2 - float64(z*math.Sqrt(m*float64(a.n+b.n+1)/12))))
	c = min(max(c, 1), total)
	e.ShiftLow = kthDifference(a, b, c)
	e.ShiftHigh = kthDifference(a, b, total+1-c)
	return e
}

// weighted is a difference and how many pairs of values have it.
type weighted struct {
	d float64
	w int
}

// byDifference orders weighted differences ascending (a sort.Interface
// rather than a generic sort: the module holds one sort less).
type byDifference []weighted

func (b byDifference) Len() int           { return len(b) }
func (b byDifference) Less(i, j int) bool { return b[i].d < b[j].d }
func (b byDifference) Swap(i, j int)      { b[i], b[j] = b[j], b[i] }

// kthDifference returns the k-th smallest (from 1) of the differences
// x − y, x from a and y from b, without forming all of them. It bisects the
// values, each step counting the differences at or below a candidate in one
// merge-like pass over the distinct values, until at most a few thousand
// pairs of distinct values lie between the bounds (or, with ties, the upper
// bound is itself the answer); those are then listed with their
// multiplicities and the answer picked from them. A few dozen passes
// replace the na·nb differences.
func kthDifference(a, b tally, k int) float64 {
	lo := a.v[0] - b.v[len(b.v)-1] // the smallest difference
	hi := a.v[len(a.v)-1] - b.v[0] // the largest
	cLo, pLo, _ := countAtMost(a, b, lo)
	if cLo >= k {
		return lo
	}
	cHi, pHi := a.n*b.n, len(a.v)*len(b.v)
	// invariant: cLo = #(≤ lo) < k ≤ cHi = #(≤ hi); pLo, pHi count pairs of
	// distinct values. Sorting the listed pairs costs about as much as one
	// pass per 40 of them, so list no more than a quarter of a pass's length
	listable := max(1024, (len(a.v)+len(b.v))/4)
	for step := 0; pHi-pLo > listable; step++ {
		// alternate a step that interpolates on the counts (fast where the
		// differences are spread smoothly) with a bisection (sure progress)
		mid := lo + (hi-lo)/2
		if step%2 == 0 {
			mid = lo + float64((hi-lo)*(float64(k-cLo)/float64(cHi-cLo)))
		}
		if !(mid > lo && mid < hi) {
			mid = lo + (hi-lo)/2
			if !(mid > lo && mid < hi) {
				return hi // lo and hi are neighbours: every difference between is hi
			}
		}
		if c, pairs, top := countAtMost(a, b, mid); c >= k {
			// hi becomes the largest difference at or below mid; one
			// difference can come from more pairs than the list holds, so on
			// bisection steps check whether the k-th is hi itself
			hi, cHi, pHi = top, c, pairs
			if step%2 == 1 && countBelow(a, b, hi) < k {
				return hi
			}
		} else {
			lo, cLo, pLo = mid, c, pairs
		}
	}
	between := make([]weighted, 0, pHi-pLo)
	j, l := 0, 0 // for ascending x, x − b.v[j] ≤ hi from j on, and ≤ lo from l on
	for i, x := range a.v {
		for j < len(b.v) && x-b.v[j] > hi {
			j++
		}
		for l < len(b.v) && x-b.v[l] > lo {
			l++
		}
		for m := j; m < l; m++ {
			between = append(between, weighted{x - b.v[m], a.w[i] * b.w[m]})
		}
	}
	sort.Sort(byDifference(between))
	d := hi
	for _, p := range between {
		if cLo += p.w; cLo >= k {
			d = p.d
			break
		}
	}
	if d == 0 {
		d = 0 // never report -0
	}
	return d
}

// nextDifference is the (k+1)-th smallest difference given d, the k-th: d
// again if it repeats, else the smallest difference above d (one pass).
func nextDifference(a, b tally, d float64, k int) float64 {
	if c, _, _ := countAtMost(a, b, d); c > k {
		return d
	}
	next := math.Inf(1)
	j := 0 // for ascending x, x − b.v[j] > d exactly for j below a bound that only moves right
	for _, x := range a.v {
		for j < len(b.v) && x-b.v[j] > d {
			j++
		}
		if j > 0 {
			next = min(next, x-b.v[j-1])
		}
	}
	return next
}

// countBelow counts the differences x − y < d.
func countBelow(a, b tally, d float64) int {
	count, j := 0, 0
	for i, x := range a.v {
		for j < len(b.v) && x-b.v[j] >= d {
			j++
		}
		count += a.w[i] * b.above[j]
	}
	return count
}

// countAtMost counts the differences x − y ≤ d, and the pairs of distinct
// values among them, and finds the largest such difference. For ascending x
// the first j with x − b.v[j] ≤ d only moves right, and x − b.v[j] is the
// largest for that x.
func countAtMost(a, b tally, d float64) (count, pairs int, top float64) {
	top = math.Inf(-1)
	j := 0
	for i, x := range a.v {
		for j < len(b.v) && x-b.v[j] > d {
			j++
		}
		if j < len(b.v) {
			count += a.w[i] * b.above[j]
			pairs += len(b.v) - j
			if v := x - b.v[j]; v > top { // no builtin max: it pays for NaN and -0, which cannot occur
				top = v
			}
		}
	}
	return count, pairs, top
}
