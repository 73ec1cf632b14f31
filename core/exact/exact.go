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
// The scores are dealt in ascending order, one tie block at a time; the state
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
package exact

import (
	"context"
	"errors"
	"fmt"
	"math/bits"
	"slices"
	"sort"
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
		if tail+d.Prob[j] > alpha*(1+1e-12) {
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

// Limits bound an exact computation.
type Limits struct {
	// MaxStates is the most states one layer may hold; each costs about 24
	// bytes in each of the two live layers.
	MaxStates int
	layer     func(states int) // told each layer's size, for tests
}

// Weights returns L/nᵢ for each group, the factors of T.
func Weights(sizes []int) []int64 {
	l := lcmOf(sizes)
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

func lcmOf(sizes []int) int64 {
	l := int64(1)
	for _, n := range sizes {
		l = l / gcd(l, int64(n)) * int64(n)
	}
	return l
}

func gcd(a, b int64) int64 {
	for b != 0 {
		a, b = b, a%b
	}
	return a
}

// Progress is told how many observations have been dealt out of all of them.
type Progress func(done, total int)

// Permutation computes the distribution of T for groups of the given sizes
// (each ≥ 1) and scores given as ascending blocks. It stops with ctx and
// with a *TooLargeError when a layer would exceed lim.
func Permutation(ctx context.Context, sizes []int, blocks []Block, lim Limits, progress Progress) (*Distribution, error) {
	s, err := newSpace(sizes, blocks)
	if err != nil {
		return nil, err
	}
	if est := EstimateStates(sizes, blocks); est > 20*float64(lim.MaxStates) {
		return nil, &TooLargeError{fmt.Sprintf("about %.2g states, more than %d", est, lim.MaxStates)}
	}
	cur := newLayer(1024)
	cur.add(0, 1) // nothing dealt: every pair (0, 0)
	next := newLayer(1024)
	dealt, dealtSum := 0, int64(0)
	st := s.scratch()
	for bi, b := range blocks {
		if err := ctx.Err(); err != nil {
			return nil, err
		}
		next.reset(cur.len())
		for j, e := range cur.slots {
			if e.key == empty {
				continue
			}
			if j&0xffff == 0xffff && ctx.Err() != nil {
				return nil, ctx.Err()
			}
			s.decode(e.key, dealt, dealtSum, st)
			s.deal(st, b, e.p, next)
			if next.len() > lim.MaxStates {
				return nil, &TooLargeError{fmt.Sprintf("more than %d states after %d of %d observations", lim.MaxStates, dealt, s.n)}
			}
		}
		cur, next = next, cur
		if lim.layer != nil {
			lim.layer(cur.len())
		}
		dealt += b.Count
		dealtSum += b.Score * int64(b.Count)
		if progress != nil && (bi%8 == 7 || bi == len(blocks)-1) {
			progress(dealt, s.n)
		}
	}
	return s.finish(cur, dealtSum, st), nil
}

// space describes the states: groups sorted by size, and how each stored
// pair (count, sum) is packed into a uint64 key.
type space struct {
	n       int
	sizes   []int     // ascending
	class   []int     // first group of the size class of each group
	shift   []uint    // bit offset of each stored group's pair
	sumBits []uint    // bits of each group's sum field
	weight  []int64   // L/nᵢ
	binom   []float64 // binomial coefficients C(a, b) at a*(n+1)+b
}

func newSpace(sizes []int, blocks []Block) (*space, error) {
	s := &space{sizes: slices.Sorted(slices.Values(sizes))}
	for _, b := range blocks {
		s.n += b.Count
	}
	total := 0
	for _, n := range s.sizes {
		total += n
	}
	if total != s.n {
		return nil, fmt.Errorf("exact: sizes add to %d but there are %d scores", total, s.n)
	}
	k := len(s.sizes)
	s.class = make([]int, k)
	s.shift = make([]uint, k)
	s.sumBits = make([]uint, k)
	s.weight = Weights(s.sizes)
	var off uint
	var maxT float64
	for i, n := range s.sizes {
		if i > 0 && n == s.sizes[i-1] {
			s.class[i] = s.class[i-1]
		} else {
			s.class[i] = i
		}
		top := topSum(blocks, n)
		s.sumBits[i] = uint(bits.Len64(uint64(top)))
		maxT += float64(s.weight[i]) * float64(top) * float64(top)
		if i < k-1 {
			s.shift[i] = off
			off += uint(bits.Len(uint(n))) + s.sumBits[i]
		}
	}
	if off > 63 { // the top bit stays clear, so no key is the empty marker
		return nil, &TooLargeError{fmt.Sprintf("a state needs %d bits, more than 63", off)}
	}
	if maxT >= 1<<62 {
		return nil, &TooLargeError{"the statistic would overflow 62 bits"}
	}
	s.binom = make([]float64, (s.n+1)*(s.n+1))
	for a := 0; a <= s.n; a++ {
		s.binom[a*(s.n+1)] = 1
		for b := 1; b <= a; b++ {
			s.binom[a*(s.n+1)+b] = s.binom[(a-1)*(s.n+1)+b-1] + s.binom[(a-1)*(s.n+1)+b]
		}
	}
	return s, nil
}

// topSum is the sum of the n largest scores, the most a group's sum can reach.
func topSum(blocks []Block, n int) int64 {
	var sum int64
	for i := len(blocks) - 1; i >= 0 && n > 0; i-- {
		take := min(n, blocks[i].Count)
		sum += int64(take) * blocks[i].Score
		n -= take
	}
	return sum
}

// state is a decoded state: every group's count and sum.
type state struct {
	count []int
	sum   []int64
	d     []int // a block's deal, during enumeration
	c2    []int
	s2    []int64
}

func (s *space) scratch() *state {
	k := len(s.sizes)
	return &state{count: make([]int, k), sum: make([]int64, k), d: make([]int, k), c2: make([]int, k), s2: make([]int64, k)}
}

func (s *space) decode(key uint64, dealt int, dealtSum int64, st *state) {
	k := len(s.sizes)
	c, sum := dealt, dealtSum
	for i := 0; i < k-1; i++ {
		pair := key >> s.shift[i]
		sb := s.sumBits[i]
		st.sum[i] = int64(pair & (1<<sb - 1))
		st.count[i] = int((pair >> sb) & (1<<uint(bits.Len(uint(s.sizes[i]))) - 1))
		c -= st.count[i]
		sum -= st.sum[i]
	}
	st.count[k-1], st.sum[k-1] = c, sum
}

// encode puts counts and sums into canonical order within each size class
// and packs all groups but the last.
func (s *space) encode(count []int, sum []int64) uint64 {
	k := len(s.sizes)
	// insertion sort of pairs within classes: classes are small
	for i := 1; i < k; i++ {
		for j := i; j > s.class[i] && less(count[j], sum[j], count[j-1], sum[j-1]); j-- {
			count[j], count[j-1] = count[j-1], count[j]
			sum[j], sum[j-1] = sum[j-1], sum[j]
		}
	}
	var key uint64
	for i := 0; i < k-1; i++ {
		key |= (uint64(count[i])<<s.sumBits[i] | uint64(sum[i])) << s.shift[i]
	}
	return key
}

func less(c1 int, s1 int64, c2 int, s2 int64) bool {
	return c1 < c2 || (c1 == c2 && s1 < s2)
}

// deal adds to next every way of dealing block b from state st, weighted.
func (s *space) deal(st *state, b Block, p float64, next *layer) {
	k := len(s.sizes)
	room := 0
	for i := range k {
		room += s.sizes[i] - st.count[i]
	}
	if b.Count == 1 {
		for i := range k {
			r := s.sizes[i] - st.count[i]
			if r == 0 {
				continue
			}
			// groups of one class in the same state lead to the same successor
			if i > s.class[i] && st.count[i] == st.count[i-1] && st.sum[i] == st.sum[i-1] {
				continue
			}
			m := 1
			for j := i + 1; j < k && s.class[j] == s.class[i] && st.count[j] == st.count[i] && st.sum[j] == st.sum[i]; j++ {
				m++
			}
			copy(st.c2, st.count)
			copy(st.s2, st.sum)
			st.c2[i]++
			st.s2[i] += b.Score
			next.add(s.encode(st.c2, st.s2), p*float64(m*r)/float64(room))
		}
		return
	}
	total := s.binom[room*(s.n+1)+b.Count]
	s.dealRest(st, b, 0, b.Count, p/total, next)
}

// dealRest enumerates the deals of left scores to groups i… recursively.
func (s *space) dealRest(st *state, b Block, i, left int, w float64, next *layer) {
	k := len(s.sizes)
	if i == k-1 {
		r := s.sizes[i] - st.count[i]
		if left > r {
			return
		}
		st.d[i] = left
		w *= s.binom[r*(s.n+1)+left]
		for j := range k {
			st.c2[j] = st.count[j] + st.d[j]
			st.s2[j] = st.sum[j] + int64(st.d[j])*b.Score
		}
		next.add(s.encode(st.c2, st.s2), w)
		return
	}
	r := s.sizes[i] - st.count[i]
	for d := 0; d <= min(r, left); d++ {
		st.d[i] = d
		s.dealRest(st, b, i+1, left-d, w*s.binom[r*(s.n+1)+d], next)
	}
}

// finish turns the last layer, where every group is full, into the
// distribution of T.
func (s *space) finish(last *layer, total int64, st *state) *Distribution {
	mass := map[int64]float64{}
	for _, e := range last.slots {
		if e.key == empty {
			continue
		}
		s.decode(e.key, s.n, total, st)
		var t int64
		for i := range s.sizes {
			t += s.weight[i] * st.sum[i] * st.sum[i]
		}
		mass[t] += e.p
	}
	d := &Distribution{Stat: make([]int64, 0, len(mass))}
	for t := range mass {
		d.Stat = append(d.Stat, t)
	}
	slices.Sort(d.Stat)
	d.Prob = make([]float64, len(d.Stat))
	for i, t := range d.Stat {
		d.Prob[i] = mass[t]
	}
	return d
}

// EstimateStates bounds the size of the largest layer from the sizes and the
// scores, without computing it: after t scores are dealt, a stored group can
// hold c of them with a sum anywhere between the c smallest and the c
// largest, and groups of one size class are counted once per arrangement.
// The product over the stored groups is divided by the number of group counts
// that add up to t, a correction measured against real layers (it stays
// within a factor of a few of them; see the tests).
func EstimateStates(sizes []int, blocks []Block) float64 {
	sorted := slices.Sorted(slices.Values(sizes))
	var scores []int64
	for _, b := range blocks {
		for range b.Count {
			scores = append(scores, b.Score)
		}
	}
	n := len(scores)
	prefix := make([]int64, n+1)
	for i, x := range scores {
		prefix[i+1] = prefix[i] + x
	}
	k := len(sorted)
	worst := 1.0
	for t := 1; t < n; t++ {
		est := 1.0
		for i := 0; i < k-1; i++ {
			pairs := 0.0
			for c := max(0, t-(n-sorted[i])); c <= min(sorted[i], t); c++ {
				lo := prefix[c]
				hi := prefix[t] - prefix[t-c]
				pairs += float64(hi-lo) + 1
			}
			est *= pairs
		}
		// arrangements within classes, and the constraint on the counts
		for i, run := 0, 1; i < k-1; i++ {
			if i > 0 && sorted[i] == sorted[i-1] {
				run++
				est /= float64(run)
			} else {
				run = 1
			}
		}
		est /= float64(min(t, sorted[k-1]) + 1)
		worst = max(worst, est)
	}
	return worst
}
