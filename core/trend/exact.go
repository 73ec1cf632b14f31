package trend

import (
	"context"
	"errors"
	"maps"
	"slices"

	"midrank/core/dist"
	"midrank/core/rank"
)

// ErrTooLarge reports that the exact distribution would exceed its budget.
var ErrTooLarge = errors.New("trend: the exact distribution is too large to compute here")

// Distribution is the exact null distribution of 2J: Prob[x] = P(2J = x),
// x = 0 … 2·Σ_{i<j} nᵢnⱼ.
type Distribution struct{ Prob []float64 }

// Upper is P(2J ≥ x), summed from the top so that a small tail keeps its
// digits.
func (d Distribution) Upper(x int64) float64 {
	p := 0.0
	for i := int64(len(d.Prob)) - 1; i >= max(x, 0); i-- {
		p += d.Prob[i]
	}
	return min(p, 1)
}

// Lower is P(2J ≤ x), summed from the bottom.
func (d Distribution) Lower(x int64) float64 {
	p := 0.0
	for i := int64(0); i <= min(x, int64(len(d.Prob))-1); i++ {
		p += d.Prob[i]
	}
	return min(p, 1)
}

// P is the exact p-value of an observed 2J for the alternative; two-sided,
// twice the smaller tail (at most 1), common practice.
func (d Distribution) P(doubled int64, alt Alternative) float64 {
	switch alt {
	case Increasing:
		return d.Upper(doubled)
	case Decreasing:
		return d.Lower(doubled)
	}
	return min(1, 2*min(d.Upper(doubled), d.Lower(doubled)))
}

// Critical is, for the alternative, the least extreme 2J whose tail
// probability is at most alpha, and that probability; ok is false when no
// outcome is that rare. Two-sided, the upper critical value at alpha/2 is
// given (the distribution is symmetric).
func (d Distribution) Critical(alpha float64, alt Alternative) (doubled int64, attained float64, ok bool) {
	if alt == TwoSided {
		alpha /= 2
	}
	tail := 0.0
	for x := len(d.Prob) - 1; x >= 0; x-- {
		if tail+d.Prob[x] > float64(alpha*(1+1e-12)) {
			break
		}
		tail += d.Prob[x]
		doubled, attained, ok = int64(x), tail, true
	}
	if ok && alt == Decreasing {
		doubled = int64(len(d.Prob)-1) - doubled // the distribution is symmetric about its middle
	}
	return doubled, attained, ok
}

// Limits of the exact computation: the cells of probability visited
// (time), and those held by one layer of the dealing (memory: 8 bytes each,
// two layers alive, so at most about 256 MB).
const (
	MaxWork  = 200_000_000
	MaxCells = 16_000_000
)

// Exact computes the null distribution of 2J for a ranking whose groups are
// numbered in their order. Untied values take the sum of independent
// Mann–Whitney counts (each group against all before it; Jonckheere 1954);
// with ties, the values are dealt block by block (see dealt). It refuses
// with ErrTooLarge beyond MaxWork, and stops with ctx.
func Exact(ctx context.Context, r rank.Ranking) (Distribution, error) {
	if len(r.Ties) == 0 {
		return untied(ctx, r.Sizes)
	}
	return dealt(ctx, r)
}

// untied convolves the distributions of W_j, the Mann–Whitney count of
// group j against groups 1 … j−1 together, which are independent for untied
// values. W for m values against n has, by whether the largest of the m+n
// belongs to the m (adding nothing) or to the n (adding m),
//
//	P_{m,n}(w) = m/(m+n)·P_{m−1,n}(w) + n/(m+n)·P_{m,n−1}(w − m),
//
// probabilities only, so that nothing cancels. The counts are whole; 2J
// doubles them.
func untied(ctx context.Context, sizes []int) (Distribution, error) {
	work, before := 0.0, 0.0 // in float64: with a million values the count passes 2⁶³
	for _, n := range sizes {
		cells := before * float64(n)
		work += float64(cells * (cells + 1)) // the recursion's cells, and more than it holds at once
		before += float64(n)
	}
	if work > MaxWork {
		return Distribution{}, ErrTooLarge
	}
	j := []float64{1}
	for i, n := range sizes {
		if err := ctx.Err(); err != nil {
			return Distribution{}, err
		}
		if earlier := sum(sizes[:i]); earlier > 0 {
			j = convolve(j, mannWhitney(earlier, n))
		}
	}
	prob := make([]float64, 2*len(j)-1)
	for w, p := range j {
		prob[2*w] = p
	}
	return Distribution{prob}, nil
}

// mannWhitney is the distribution of the Mann–Whitney count of m untied
// values against n, w = 0 … mn, by the recursion above over m.
func mannWhitney(m, n int) []float64 {
	// row[b] holds P_{a,b} for the current a, b = 0 … n
	row := make([][]float64, n+1)
	for b := range row {
		row[b] = []float64{1} // a = 0: nothing to count
	}
	for a := 1; a <= m; a++ {
		row[0] = []float64{1}
		for b := 1; b <= n; b++ {
			next := make([]float64, a*b+1)
			pa, pb := float64(a)/float64(a+b), float64(b)/float64(a+b)
			for w, p := range row[b] { // P_{a−1,b}
				next[w] += float64(pa * p)
			}
			for w, p := range row[b-1] { // P_{a,b−1}, shifted by a
				next[w+a] += float64(pb * p)
			}
			row[b] = next
		}
	}
	return row[n]
}

func sum(xs []int) int {
	t := 0
	for _, x := range xs {
		t += x
	}
	return t
}

func convolve(a, b []float64) []float64 {
	out := make([]float64, len(a)+len(b)-1)
	for i, x := range a {
		if x == 0 {
			continue
		}
		for j, y := range b {
			out[i+j] += float64(x * y)
		}
	}
	return out
}

// dealt deals the tied values block by block, in ascending order, to the
// groups, with the multivariate hypergeometric probability
// ∏ C(rᵢ, dᵢ)/C(R, b) of dᵢ of a block's b values going to group i, rᵢ its
// room left and R their sum. A state is the groups' counts and 2J so far:
// a value joining group h adds 2 for every value below it in the groups
// before h, and a tied one 1.
func dealt(ctx context.Context, r rank.Ranking) (Distribution, error) {
	k, n := len(r.Sizes), len(r.Sorted)
	top := 0 // 2·Σ_{i<j} nᵢnⱼ
	radix := make([]int, k)
	vectors := 1
	for i, s := range r.Sizes {
		top += s * (n - s)
		radix[i] = vectors
		vectors *= s + 1
		if vectors > MaxWork {
			return Distribution{}, ErrTooLarge
		}
	}
	if float64(vectors)*float64(top+1) > 4*MaxWork { // a bound on the layers' cells, cheaply refused first
		return Distribution{}, ErrTooLarge
	}
	logFact := make([]float64, n+1)
	for a := range logFact {
		logFact[a] = dist.LogFactorial(a)
	}
	type state struct {
		counts []int
		p      []float64 // over 2J
	}
	layer := map[uint64]*state{0: {counts: make([]int, k), p: []float64{1}}} // uint64 keys: sorted as package exact's are, one sort in the module
	work, dealtSoFar := 0, 0
	d := make([]int, k)
	for i, j := range r.Blocks() {
		if err := ctx.Err(); err != nil {
			return Distribution{}, err
		}
		b := j - i
		next := map[uint64]*state{}
		held := 0                                                              // the cells of next
		logAll := logFact[n-dealtSoFar] - logFact[b] - logFact[n-dealtSoFar-b] // log C(R, b)
		for _, key := range slices.Sorted(maps.Keys(layer)) {                  // in one order, so that sums are the same bytes each run
			st := layer[key]
			// every deal d of the block that the room allows
			var walk func(g, rest int, logW float64) error
			walk = func(g, rest int, logW float64) error {
				if g == k {
					if rest > 0 {
						return nil
					}
					var add, lower, lowerD int
					key := uint64(0)
					for h := range k {
						add += d[h] * (2*lower + lowerD)
						lower += st.counts[h]
						lowerD += d[h]
						key += uint64((st.counts[h] + d[h]) * radix[h])
					}
					to := next[key]
					if to == nil {
						to = &state{counts: make([]int, k)}
						for h := range k {
							to.counts[h] = st.counts[h] + d[h]
						}
						next[key] = to
					}
					if need := len(st.p) + add; len(to.p) < need {
						if held += need - len(to.p); held > MaxCells {
							return ErrTooLarge
						}
						to.p = append(to.p, make([]float64, need-len(to.p))...)
					}
					w := dist.Exp(logW - logAll)
					for x, p := range st.p {
						to.p[x+add] += float64(w * p)
					}
					if work += len(st.p); work > MaxWork {
						return ErrTooLarge
					}
					return nil
				}
				room := r.Sizes[g] - st.counts[g]
				for d[g] = 0; d[g] <= min(room, rest); d[g]++ {
					if err := walk(g+1, rest-d[g], logW+logFact[room]-logFact[d[g]]-logFact[room-d[g]]); err != nil {
						return err
					}
				}
				return nil
			}
			if err := walk(0, b, 0); err != nil {
				return Distribution{}, err
			}
		}
		layer = next
		dealtSoFar += b
	}
	for _, st := range layer { // one state: every group full
		prob := make([]float64, top+1)
		copy(prob, st.p)
		return Distribution{prob}, nil
	}
	return Distribution{}, errors.New("trend: no values")
}
