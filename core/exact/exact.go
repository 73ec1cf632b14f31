// Package exact computes the permutation distribution of the Kruskal–Wallis
// statistic: every one of the N!/∏nᵢ! ways to deal the observed (mid)rank
// scores into groups of the observed sizes is equally likely, and the
// distribution of
//
//	T = Σᵢ (L/nᵢ)·sᵢ²,  sᵢ the score sum of group i, L = lcm(n₁…n_k),
//
// a whole number that orders the outcomes exactly as H does, is found
// without listing them.
//
// The scores are dealt in ascending order (or all but a few dealt last, see
// deferred.go), one tie block at a time; the state
// after a block is, for every group, how many scores it holds and their sum
// (the last group's pair follows from the totals and is not stored). A block
// of b equal scores goes to the groups with the multivariate hypergeometric
// probability ∏ C(rᵢ, dᵢ)/C(R, b), rᵢ the room left in group i and R their
// sum, so states carry probabilities in [0, 1] and nothing overflows. Groups
// of equal size are interchangeable, so each state is stored once in a
// canonical order (its pairs sorted within each size class), which divides
// the number of states by up to the factorial of the class sizes. This is the
// network algorithm of Mehta, Patel & Tsiatis (1984, Biometrics 40, 819–825)
// in its dynamic-programming form, with the symmetry reduction of Streitberg
// & Röhmel (1986) for equal sizes.
//
// The states of a layer with the same counts form a bucket, held as a dense
// array in rows: the sums of all stored groups but the last one fix a row,
// which holds the sums of that one that bounds on the sums of every set of
// groups allow (see layout), so that hardly a cell goes unused and the work
// is a few passes over arrays; where the row tables would be too large, as
// with many small groups, the buckets are hash tables instead.
//
// Reading order: exact.go, the API (Permutation, its limits and result);
// screen.go, the first and cheapest refusal, from the sizes and tie blocks
// alone; plan.go, the space of states, the order the scores are dealt in and
// the exact count of every layer's cells before any is made (boxes, settle);
// estimate.go, the bound on the states of hash tables; layout.go, how a
// bucket's rows are laid out; layer.go, buckets and layers; deal.go, dealing
// a tie block (moves and their weights); single.go, dealing a single score,
// the common case, specialised; table.go, the hash table for sparse buckets;
// deferred.go, the scores of tied pairs and other even-sized tie blocks dealt
// last, straight into the statistic, so that a few ties cost little more
// than none do; choose.go, the choice between dealing every score in place
// and the deferred plans, and the orders the others may be dealt in;
// finish.go, the last layer (and the deferred scores) turned into the
// distribution of T.
package exact

import (
	"context"
	"errors"
	"fmt"
	"math"
	"math/bits"
	"sort"

	"midrank/core/display"
)

// Block is a run of equal scores.
type Block struct {
	Score int64 // the score, a whole number ≥ 0
	Count int   // how many observations have it
}

// Distribution is the exact null distribution of T.
type Distribution struct {
	Stat []int64   // the attained values of T, ascending
	Prob []float64 // their probabilities, summing to 1
}

// Upper returns P(T ≥ t), summed from the top so that small tails keep
// their digits.
func (d *Distribution) Upper(t int64) float64 {
	i := sort.Search(len(d.Stat), func(i int) bool { return d.Stat[i] >= t })
	p := 0.0
	for j := len(d.Prob) - 1; j >= i; j-- {
		p += d.Prob[j]
	}
	return min(p, 1)
}

// Critical returns the smallest attained t with P(T ≥ t) ≤ alpha and that
// probability; ok is false when no outcome is that rare.
func (d *Distribution) Critical(alpha float64) (t int64, attained float64, ok bool) {
	tail := 0.0
	for j := len(d.Prob) - 1; j >= 0; j-- {
		if tail+d.Prob[j] > float64(alpha*(1+1e-12)) {
			break
		}
		tail += d.Prob[j]
		t, attained, ok = d.Stat[j], tail, true
	}
	return t, attained, ok
}

// ErrTooLarge reports that the exact computation would exceed its budget.
var ErrTooLarge = errors.New("the exact distribution is too large to compute here")

// TooLargeError says which limit an exact computation would exceed.
type TooLargeError struct{ What string }

func (e *TooLargeError) Error() string { return ErrTooLarge.Error() + ": " + e.What }
func (e *TooLargeError) Unwrap() error { return ErrTooLarge }

// Limits bound an exact computation. Two layers are alive at a time: the
// one being dealt and the next. Buckets are dense arrays of cells (8 bytes
// each, see bucket; a row takes the room of two cells) when any two
// consecutive layers hold at most MaxCells together, and then all layers
// may hold at most MaxWork cells (the time grows with it); otherwise hash
// tables of the states reached (about 32 bytes each), at most MaxStates a
// layer.
type Limits struct {
	MaxCells  int
	MaxWork   int // 0 for no limit
	MaxStates int
}

// Weights returns L/nᵢ for each group, the factors of T, for sizes whose
// least common multiple fits in 62 bits (as Permutation checks; it panics
// otherwise).
func Weights(sizes []int) []int64 {
	l, ok := lcmOf(sizes)
	if !ok {
		panic("exact: Weights of sizes whose least common multiple exceeds 62 bits")
	}
	w := make([]int64, len(sizes))
	for i, n := range sizes {
		w[i] = l / int64(n)
	}
	return w
}

// Statistic returns T = Σ (L/nᵢ) sᵢ² for group score sums.
func Statistic(sizes []int, sums []int64) int64 {
	var t int64
	for i, w := range Weights(sizes) {
		t += w * sums[i] * sums[i]
	}
	return t
}

// Scores turns tie blocks given by their doubled midranks (ascending) and
// sizes into the smallest whole-number scores that order outcomes as H does:
// x = (d − d₁)/g, with d₁ the smallest doubled midrank and g the gcd of the
// differences (a shift and a scale change T only by an increasing affine
// map). It returns the blocks, g and d₁.
func Scores(doubled []int64, counts []int) (blocks []Block, g, base int64) {
	base = doubled[0]
	for _, d := range doubled[1:] {
		g = gcd(g, d-base)
	}
	if g == 0 {
		g = 1 // one block only: every score is 0
	}
	for i, d := range doubled {
		blocks = append(blocks, Block{Score: (d - base) / g, Count: counts[i]})
	}
	return blocks, g, base
}

// lcmOf is the least common multiple of the sizes; ok is false when it
// exceeds 2⁶².
func lcmOf(sizes []int) (l int64, ok bool) {
	l = 1
	for _, n := range sizes {
		hi, lo := bits.Mul64(uint64(l/gcd(l, int64(n))), uint64(n))
		if hi != 0 || lo > 1<<62 {
			return 0, false
		}
		l = int64(lo)
	}
	return l, true
}

func gcd(a, b int64) int64 {
	for b != 0 {
		a, b = b, a%b
	}
	return a
}

// layerBuilt, when set (by tests only, see export_test.go), is shown each
// layer when it is built.
var layerBuilt func(*layer)

// Progress is told how many observations have been dealt out of all of them.
type Progress func(done, total int)

// Permutation computes the distribution of T for groups of the given sizes
// (each ≥ 1) and scores given as ascending blocks. It stops with ctx, and
// refuses with a *TooLargeError before starting when the layers it would
// build exceed lim.
//
// A layer is split into buckets by the groups' counts (in canonical order,
// which depends on the counts alone). A bucket holds the stored groups' sums
// that those counts allow, in rows (see bucket). All successors of a bucket
// under one deal of a block fall in one bucket of the next layer, so the
// work streams through a few arrays with no hashing.
func Permutation(ctx context.Context, sizes []int, blocks []Block, lim Limits, progress Progress) (*Distribution, error) {
	return permute(ctx, sizes, blocks, lim, progress, cheaper)
}

// permute is Permutation with the plans chosen by rule.
func permute(ctx context.Context, sizes []int, blocks []Block, lim Limits, progress Progress, rule planRule) (*Distribution, error) {
	minT, maxT, err := fits(sizes, blocks)
	if err != nil {
		return nil, err
	}
	p, err := choose(sizes, blocks, lim, rule)
	if err != nil {
		return nil, err
	}
	s := p.s
	s.maxStates, s.maxWork = lim.MaxStates, lim.MaxWork
	k := len(s.sizes)
	start := newLayer(s, 0)
	start.get(make([]int, k)).add(0, 1) // nothing dealt: every pair (0, 0)
	cur := start.list()
	dealt := 0
	st := s.newScratch()
	for bi, b := range s.blocks {
		if err := ctx.Err(); err != nil {
			return nil, err
		}
		next := newLayer(s, dealt+b.Count)
		for _, from := range cur {
			if err := s.deal(ctx, from, b, dealt, st, next); err != nil {
				return nil, err
			}
			from.p, from.table = nil, nil // free it as soon as it is used
			if !s.dense && next.reached > lim.MaxStates {
				return nil, &TooLargeError{fmt.Sprintf("more than %s states after %d of %d values", display.Rough(float64(lim.MaxStates)), dealt, s.all)}
			}
		}
		cur = next.list()
		if layerBuilt != nil {
			layerBuilt(next)
		}
		dealt += b.Count
		if progress != nil && (bi%8 == 7 || bi == len(s.blocks)-1) {
			progress(dealt, s.all)
		}
	}
	if blocks[0].Score < 0 { // the bounds hold only for scores of at least 0, as Scores makes them
		minT, maxT = 0, math.Inf(1)
	}
	return p.finish(ctx, cur, st, minT, maxT, progress)
}

// fits refuses scores whose statistic T = Σ (L/nᵢ)·sᵢ² could exceed 2⁶²,
// and otherwise returns bounds on T, for scores of at least 0: each group's
// sum sᵢ is at most that of the nᵢ largest scores, and by Cauchy–Schwarz
// T ≥ S²/Σ(nᵢ/L) = S²·L/N, S the sum of all scores (the sums in proportion
// to the sizes), less a margin for rounding.
func fits(sizes []int, blocks []Block) (lo, hi float64, err error) {
	l, ok := lcmOf(sizes)
	if !ok {
		return 0, 0, &TooLargeError{"the sizes' least common multiple exceeds 62 bits"}
	}
	var all, n float64
	for _, b := range blocks {
		all += float64(float64(b.Count) * float64(b.Score))
		n += float64(b.Count)
	}
	for _, n := range sizes {
		var top float64 // the sum of the n largest scores
		for j, left := len(blocks)-1, n; j >= 0 && left > 0; j-- {
			c := min(left, blocks[j].Count)
			top += float64(float64(c) * float64(blocks[j].Score))
			left -= c
		}
		hi += float64(float64(l/int64(n)) * top * top)
	}
	if hi >= 1<<62 {
		return 0, 0, &TooLargeError{"the statistic would overflow 62 bits"}
	}
	lo = max(0, math.Floor(float64(float64(all*all)*float64(l)/n)*(1-1e-12))-1)
	return lo, hi, nil
}

// countsOf lists how many scores each block holds.
func countsOf(blocks []Block) []int {
	counts := make([]int, len(blocks))
	for i, b := range blocks {
		counts[i] = b.Count
	}
	return counts
}

// Screen tells, from the groups' sizes and the sizes of the tie blocks alone
// (in ascending order of score) and in time linear in k·N, whether
// Permutation would refuse at once for lim (see screen): a cheap first
// question before the scores are worked out.
func Screen(sizes []int, counts []int, lim Limits) error {
	s, err := newSpace(sizes, counts, 0)
	if err != nil {
		return err
	}
	return s.screen(lim)
}
