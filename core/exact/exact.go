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
//
// The states of a layer with the same counts form a bucket, held as a dense
// array in rows: the sums of all stored groups but the last one fix a row,
// which holds the sums of that one that bounds on the sums of every set of
// groups allow (see layout), so that hardly a cell goes unused and the work
// is a few passes over arrays; where the row tables would be too large, as
// with many small groups, the buckets are hash tables instead.
package exact

import (
	"context"
	"errors"
	"fmt"
	"maps"
	"math/bits"
	"slices"
	"sort"

	"midrank/core/dist"
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
	layer     func(*layer) // shown each layer when it is built, for tests
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
	s, err := newSpace(sizes, countsOf(blocks))
	if err != nil {
		return nil, err
	}
	if _, err := s.budget(lim, blocks); err != nil {
		return nil, err
	}
	s.maxStates, s.maxWork = lim.MaxStates, lim.MaxWork
	k := len(s.sizes)
	start := newLayer(s, 0)
	start.get(make([]int, k)).add(0, 1) // nothing dealt: every pair (0, 0)
	cur := start.list()
	dealt := 0
	st := s.scratch()
	for bi, b := range blocks {
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
				return nil, &TooLargeError{fmt.Sprintf("more than %d states after %d of %d observations", lim.MaxStates, dealt, s.n)}
			}
		}
		cur = next.list()
		if lim.layer != nil {
			lim.layer(next)
		}
		dealt += b.Count
		if progress != nil && (bi%8 == 7 || bi == len(blocks)-1) {
			progress(dealt, s.n)
		}
	}
	return s.finish(ctx, cur, st)
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
	s, err := newSpace(sizes, counts)
	if err != nil {
		return err
	}
	return s.screen(lim)
}

// budget decides, before any layer is built, whether arrays or hash tables
// hold the layers, and refuses with a *TooLargeError what lim does not allow;
// it returns the planned figures.
func (s *space) budget(lim Limits, blocks []Block) (figures, error) {
	if err := s.screen(lim); err != nil {
		return figures{}, err
	}
	if err := s.prepare(blocks); err != nil {
		return figures{}, err
	}
	// The boxes bound the arrays. When they do not settle the question, the
	// rows are laid out to count the cells, which costs about as much as a
	// few cells a row, so not beyond 2·MaxCells rows in all. Hash tables
	// hold the states reached, hardly fewer than the cells laid out, in four
	// cells' room each: they serve where the row tables are what is large,
	// as with many small groups.
	fig := s.plan(s.boxSize)
	if fig.peak >= tooMany {
		return fig, &TooLargeError{"the states cannot be numbered in 62 bits"}
	}
	laid := false
	layable := 2 * lim.MaxCells // rows, whose laying out costs a few cells' work each
	if lim.MaxWork > 0 {
		layable = min(layable, lim.MaxWork/rowCost)
	}
	if fig.rows <= layable && !fig.fit(lim) {
		sh := s.newShape()
		fig, laid = s.plan(func(counts []int, t int) (int, int) { return s.layout(counts, t, sh) }), true
	}
	switch {
	case fig.fit(lim):
		s.dense = true
	case fig.peak <= lim.MaxCells:
		return fig, &TooLargeError{fmt.Sprintf("about %d states in all, more than %d", fig.cells, lim.MaxWork)}
	case laid && fig.hashed > 2*lim.MaxStates:
		return fig, &TooLargeError{fmt.Sprintf("it would hold %d MB at once, more than %d MB", fig.peak*8/1e6, lim.MaxCells*8/1e6)} // 8 bytes a cell
	case len(s.cuts)*s.n > screenWork: // the estimate would take too long itself
		return fig, &TooLargeError{fmt.Sprintf("%d values in %d tie blocks are beyond hash tables here", s.n, len(s.cuts))}
	default:
		if est := EstimateStates(s.sizes, s.blocks); est > 20*float64(lim.MaxStates) {
			return fig, &TooLargeError{fmt.Sprintf("about %.2g states, more than %d", est, lim.MaxStates)}
		}
	}
	return fig, nil
}

// space describes the states: groups sorted by size, and the scores.
type space struct {
	n         int
	sizes     []int // ascending
	blocks    []Block
	class     []int     // first group of the size class of each group
	weight    []int64   // L/nᵢ
	prefix    []int64   // prefix[t]: the sum of the t smallest scores
	cuts      []int     // the number of scores dealt after each block
	countBits []uint    // bits of each group's count, in a bucket's key
	logFact   []float64 // log a! for a = 0 … n (see logChoose)
	subsets   []uint    // sets of the groups before group k−2 whose sums bound a row (bit i: group i)
	dense     bool      // buckets are arrays rather than hash tables
	lo, hi    []int64   // scratch for boxSize
	// bucketRoom is a bucket's own room in cells of 8 bytes: its header,
	// slices of k numbers and its place in the layer's map, about
	// 256 + 32k bytes (measured by TestPlanBoundsMemory); it matters where
	// buckets hold few states, as with yes/no data.
	bucketRoom int
	// fixedRoom is the room in cells that does not grow with the layers:
	// the batch of moves and their deals, four numbers a score (prefix sums,
	// log-factorials, cuts) and 64 KB for the rest.
	fixedRoom int
	maxStates int // of a layer in hash tables (Limits.MaxStates)
	maxWork   int // Limits.MaxWork
	work      int // done in hash tables, in cells' worth (see hashCost)
}

func newSpace(sizes []int, counts []int) (*space, error) {
	s := &space{sizes: slices.Sorted(slices.Values(sizes))}
	for _, c := range counts {
		s.n += c
		s.cuts = append(s.cuts, s.n)
	}
	total := 0
	for _, n := range s.sizes {
		total += n
	}
	if total != s.n {
		return nil, fmt.Errorf("exact: sizes add to %d but there are %d scores", total, s.n)
	}
	k := len(s.sizes)
	if k < 2 {
		return nil, fmt.Errorf("exact: %d groups; there must be two or more", k)
	}
	s.bucketRoom = (256 + 32*k) / 8
	s.class = make([]int, k)
	for i, n := range s.sizes {
		if i > 0 && n == s.sizes[i-1] {
			s.class[i] = s.class[i-1]
		} else {
			s.class[i] = i
		}
	}
	return s, nil
}

// prepare takes the scores and works out what the planner and the dealing
// need, in time and memory linear in N: run only after the screen. It
// refuses scores whose statistic would not fit in 62 bits.
func (s *space) prepare(blocks []Block) error {
	k := len(s.sizes)
	s.blocks = blocks
	s.prefix = make([]int64, 1, s.n+1)
	for _, b := range blocks {
		for range b.Count {
			s.prefix = append(s.prefix, s.prefix[len(s.prefix)-1]+b.Score)
		}
	}
	s.countBits = make([]uint, k)
	s.lo, s.hi = make([]int64, k), make([]int64, k)
	s.fixedRoom = movesBatch*(k+5) + 4*(s.n+1) + 8192
	l, ok := lcmOf(s.sizes)
	if !ok {
		return &TooLargeError{"the sizes' least common multiple exceeds 62 bits"}
	}
	s.weight = make([]int64, k)
	var maxT float64
	for i, n := range s.sizes {
		s.weight[i] = l / int64(n)
		top := float64(s.prefix[s.n] - s.prefix[s.n-n])
		maxT += float64(s.weight[i]) * top * top
		s.countBits[i] = uint(bits.Len(uint(n)))
	}
	if maxT >= 1<<62 {
		return &TooLargeError{"the statistic would overflow 62 bits"}
	}
	s.logFact = make([]float64, s.n+1)
	for a := range s.logFact {
		s.logFact[a] = dist.LogFactorial(a)
	}
	// Every set of the groups that fix a row bounds it, or with many groups
	// (2^(k−2) sets) each one alone and all of them.
	if k <= 7 {
		for set := range uint(1) << (k - 2) {
			s.subsets = append(s.subsets, set)
		}
	} else {
		s.subsets = append(s.subsets, 0)
		for i := range k - 2 {
			s.subsets = append(s.subsets, 1<<i)
		}
		s.subsets = append(s.subsets, 1<<(k-2)-1)
	}
	return nil
}

// box gives, for groups with these counts after t scores are dealt, the
// least and greatest sum of each group: the c smallest and c largest
// scores dealt, narrowed by the sums of the other groups adding up to the
// total. It returns the number of combinations of the stored groups' sums
// in the box, which bounds the cells of its layout.
func (s *space) box(counts []int, t int, lo, hi []int64) int {
	k := len(s.sizes)
	var loSum, hiSum int64
	for i, c := range counts {
		lo[i], hi[i] = s.prefix[c], s.top(t, c)
		loSum += lo[i]
		hiSum += hi[i]
	}
	total := s.prefix[t]
	for i := range k {
		// the others hold at most hiSum − hi[i] and at least loSum − lo[i]
		lo[i], hi[i] = max(lo[i], total-(hiSum-hi[i])), min(hi[i], total-(loSum-lo[i]))
	}
	// In a run of L groups of one class with equal counts the sums ascend,
	// and they add up to R, the total less the other groups' sums. So the
	// q-th (from 0) is at most (R − q·lo)/(L − q), the q smaller ones being
	// at least lo, and at least (R − (L−1−q)·hi)/(q + 1), the larger ones
	// being at most hi.
	for a := 0; a < k; {
		b := a
		for b+1 < k && s.sameRun(counts, b) {
			b++
		}
		if L := int64(b - a + 1); L > 1 {
			rMax, rMin := total, total
			for j := range k {
				if j < a || j > b {
					rMax -= lo[j]
					rMin -= hi[j]
				}
			}
			runLo, runHi := lo[a], hi[a]
			for q := int64(0); q < L; q++ {
				i := a + int(q)
				hi[i] = min(hi[i], floorDiv(rMax-q*runLo, L-q))
				lo[i] = max(lo[i], ceilDiv(rMin-(L-1-q)*runHi, q+1))
			}
		}
		a = b + 1
	}
	cells := 1
	for i := range k - 1 {
		cells = product(cells, int(max(hi[i]-lo[i]+1, 0)))
	}
	return cells
}

// top is the sum of the c largest of the t smallest scores.
func (s *space) top(t, c int) int64 { return s.prefix[t] - s.prefix[t-c] }

// sameRun tells whether groups i and i+1 are of one class with equal
// counts, so that in canonical order sum i ≤ sum i+1.
func (s *space) sameRun(counts []int, i int) bool {
	return s.class[i+1] == s.class[i] && counts[i+1] == counts[i]
}

func floorDiv(a, b int64) int64 {
	q := a / b
	if a%b != 0 && (a < 0) != (b < 0) {
		q--
	}
	return q
}

func ceilDiv(a, b int64) int64 { return -floorDiv(-a, b) }

// tooMany is where cell counts saturate: a cell index must stay below it to
// serve as a hash key.
const tooMany = 1 << 62

func product(a, b int) int {
	if b != 0 && a > tooMany/b {
		return tooMany
	}
	return a * b
}

// boxSize gives the cells of a bucket's box and its rows.
func (s *space) boxSize(counts []int, t int) (cells, rows int) {
	k := len(s.sizes)
	lo, hi := s.lo, s.hi
	cells = s.box(counts, t, lo, hi)
	if cells == 0 {
		return 0, 0
	}
	return cells, cells / int(hi[k-2]-lo[k-2]+1)
}

// figures are the sizes of the layers of a computation, in cells.
type figures struct {
	peak        int // the room two consecutive layers take and the room that the computation takes whatever its layers, fixedRoom (a row takes two cells, for its place in the row table, and as many again for the layer's scratch that lays out its widest bucket; a bucket takes bucketRoom)
	layer       int // the cells of the largest layer
	hashed      int // the largest layer held in hash tables: its states at most (see reachable), its buckets counted at hashBucket states each
	cells, rows int // of all layers
}

// fit tells whether arrays of these figures keep within lim.
func (f figures) fit(lim Limits) bool {
	return f.peak <= lim.MaxCells && (lim.MaxWork == 0 || f.cells <= lim.MaxWork)
}

// plan adds up size(counts, t), the cells and rows of a bucket, over the
// buckets of each layer.
func (s *space) plan(size func(counts []int, t int) (cells, rows int)) figures {
	k := len(s.sizes)
	counts := make([]int, k)
	var fig figures
	before := 0 // the room of the layer before
	for dealt, t := range s.cuts {
		inLayer, layerCells, layerStates, widest := 0, 0, 0.0, 0
		// every canonical count vector adding up to t: ascending within classes
		var walk func(i, left int)
		walk = func(i, left int) {
			if i == k-1 {
				if left > s.sizes[i] || (i > s.class[i] && left < counts[i-1]) {
					return
				}
				counts[i] = left
				c, r := size(counts, t)
				inLayer, layerCells = min(inLayer+c+2*r+s.bucketRoom, tooMany), min(layerCells+c, tooMany)
				layerStates, widest = layerStates+s.reachable(counts, t, dealt+1)+hashBucket, max(widest, r)
				fig.cells, fig.rows = min(fig.cells+c, tooMany), min(fig.rows+r, tooMany)
				return
			}
			from := 0
			if i > s.class[i] {
				from = counts[i-1]
			}
			for c := from; c <= min(s.sizes[i], left); c++ {
				counts[i] = c
				walk(i+1, left-c)
			}
		}
		walk(0, t)
		inLayer = min(inLayer+2*widest, tooMany) // the layer's scratch for laying out its widest bucket
		fig.peak, fig.layer = max(fig.peak, min(before+inLayer+s.fixedRoom, tooMany)), max(fig.layer, layerCells)
		fig.hashed = max(fig.hashed, int(min(layerStates, tooMany)))
		before = inLayer
	}
	return fig
}

// reachable bounds the states of a bucket: the stored groups' sums that its
// box allows, and for each group no more than the ways to hold its count of
// scores on the levels dealt so far, C(c + levels − 1, levels − 1). The
// second bound is what matters for data on a few levels with uneven tie
// blocks, whose sums are sparse in the box (a 3 × 3 table of 248 values has
// 670,000 states in boxes of 4·10⁹ cells).
func (s *space) reachable(counts []int, t, levels int) float64 {
	k := len(s.sizes)
	if s.box(counts, t, s.lo, s.hi) == 0 {
		return 0
	}
	states := 1.0
	for i := range k - 1 {
		states *= min(float64(s.hi[i]-s.lo[i]+1), compositions(counts[i], levels))
	}
	return min(states, tooMany)
}

// compositions is C(c + levels − 1, levels − 1), the ways to hold c scores on
// the levels, in float64 (it may be huge).
func compositions(c, levels int) float64 {
	w := 1.0
	for j := 1; j < levels && w < tooMany; j++ {
		w = w * float64(c+j) / float64(j)
	}
	return w
}

// shape is a dense bucket's layout as layout finds it, and its scratch.
type shape struct {
	lo, hi     []int64 // the box
	first, off []int   // see bucket
	sums       []int64
	part       []int64    // for each set of subsets: the sum of its groups but the first
	bound      [4][]int64 // and the least and greatest sum of its groups, then of them and group k−2
}

func (s *space) newShape() *shape {
	k := len(s.sizes)
	sh := &shape{lo: make([]int64, k), hi: make([]int64, k), sums: make([]int64, k), part: make([]int64, len(s.subsets))}
	for i := range sh.bound {
		sh.bound[i] = make([]int64, len(s.subsets))
	}
	return sh
}

// row adds a row whose group k−2 has the sums a … b (none when a > b).
func (sh *shape) row(a, b int64) {
	n := sh.first[len(sh.first)-1]
	if a > b {
		sh.off, sh.first = append(sh.off, n), append(sh.first, n)
		return
	}
	sh.off, sh.first = append(sh.off, n-int(a)), append(sh.first, n+int(b-a+1))
}

// layout lays out the dense bucket with these counts after t scores are
// dealt: the box that box gives, and in each row (a combination of the sums of
// groups 0 … k−3 in the box) the sums of group k−2 that agree with every
// bound below, which the states reached meet. It returns the cells and the
// rows, and leaves the box and the row table in sh.
//
// The bounds: any set of groups holding C scores in all has a sum between
// the C smallest and the C largest scores dealt (the sets of groups before
// k−2, alone and with k−2, cover all sets, for the rest of a set holds the
// rest of the scores); in a run of groups of equal counts the sums ascend;
// the last group's sum, the total less the others, lies in its box. For
// scores without ties these leave hardly a cell that no state reaches.
func (s *space) layout(counts []int, t int, sh *shape) (cells, rows int) {
	k := len(s.sizes)
	q := k - 2 // the group whose sum runs along a row
	lo, hi, sums, part, bound := sh.lo, sh.hi, sh.sums, sh.part, &sh.bound
	sh.first, sh.off = append(sh.first[:0], 0), sh.off[:0]
	if s.box(counts, t, lo, hi) == 0 {
		return 0, 0
	}
	for j, set := range s.subsets {
		c := 0
		for i := range q {
			if set&(1<<i) != 0 {
				c += counts[i]
			}
		}
		bound[0][j], bound[1][j] = s.prefix[c], s.top(t, c)
		bound[2][j], bound[3][j] = s.prefix[c+counts[q]], s.top(t, c+counts[q])
	}
	total := s.prefix[t]
	below := q > 0 && s.sameRun(counts, q-1) // sum k−3 ≤ sum k−2
	above := s.sameRun(counts, q)            // sum k−2 ≤ the last sum
	from, to := int64(0), int64(0)           // the first group's sums, where it fixes rows
	if q > 0 {
		from, to = lo[0], hi[0]
	}
	copy(sums, lo[:q])
	for {
		// groups 1 … k−3 are fixed: the first group's sums that their
		// order and their sets allow
		outer := int64(0)
		for i := 1; i < q; i++ {
			outer += sums[i]
		}
		first, last := from, to
		for i := 1; i+1 < q; i++ {
			if s.sameRun(counts, i) && sums[i] > sums[i+1] {
				first = last + 1
			}
		}
		if q > 1 && s.sameRun(counts, 0) {
			last = min(last, sums[1])
		}
		for j, set := range s.subsets {
			in := int64(0)
			for i := 1; i < q; i++ {
				if set&(1<<i) != 0 {
					in += sums[i]
				}
			}
			part[j] = in
			if set&1 == 0 {
				if in < bound[0][j] || in > bound[1][j] {
					first = last + 1
				}
			} else {
				first, last = max(first, bound[0][j]-in), min(last, bound[1][j]-in)
			}
		}
		for s0 := from; s0 <= to; s0++ {
			if s0 < first || s0 > last {
				sh.row(1, 0)
				continue
			}
			rest := total - outer - s0 // group k−2's sum and the last group's
			a, b := max(lo[q], rest-hi[k-1]), min(hi[q], rest-lo[k-1])
			for j, set := range s.subsets {
				in := part[j]
				if set&1 != 0 {
					in += s0
				}
				a, b = max(a, bound[2][j]-in), min(b, bound[3][j]-in)
			}
			switch {
			case below && q == 1:
				a = max(a, s0)
			case below:
				a = max(a, sums[q-1])
			}
			if above {
				b = min(b, floorDiv(rest, 2))
			}
			sh.row(a, b)
		}
		// the next combination of groups 1 … k−3, the second group's fastest
		i := 1
		for ; i < q; i++ {
			if sums[i] < hi[i] {
				sums[i]++
				break
			}
			sums[i] = lo[i]
		}
		if i >= q {
			break
		}
	}
	return sh.first[len(sh.off)], len(sh.off)
}

// bucket holds the states of a layer whose groups have these counts: the
// probability of each combination of the stored groups' sums (all groups
// but the last, whose sum follows from the total). A row is the
// combinations that differ in the sum of group k−2, the last stored one,
// only; its index is Σ (sᵢ − loᵢ)·strideᵢ over groups 0 … k−3. In an array,
// each row holds the sums that layout allows, and a state's cell is
// off[row] + the sum of group k−2; in a hash table, the key is
// row·width + (s − lo) of group k−2.
type bucket struct {
	counts []int   // every group's count, canonical order
	lo     []int64 // each stored group's least sum
	width  []int   // and how many sums it can have
	stride []int   // row index step of the sums of groups 0 … k−3
	p      []float64
	first  []int // the index of each row's first cell, and len(p) at the end
	off    []int
	table  *table
}

func (b *bucket) add(idx int, p float64) {
	if b.table == nil {
		b.p[idx] += p
	} else {
		b.table.add(uint64(idx), p)
	}
}

// cell is the index of the state in row whose group k−2 has the sum v.
func (b *bucket) cell(row int, v int64) int {
	if b.table == nil {
		return b.off[row] + int(v)
	}
	q := len(b.lo) - 1
	return row*b.width[q] + int(v-b.lo[q])
}

// rowOf is the row of groups 0 … k−3 with these sums.
func (b *bucket) rowOf(sums []int64) int {
	row := 0
	for i, st := range b.stride {
		row += int(sums[i]-b.lo[i]) * st
	}
	return row
}

// index is the cell of the sums.
func (b *bucket) index(sums []int64) int { return b.cell(b.rowOf(sums), sums[len(b.lo)-1]) }

// states counts the states that have a probability.
func (b *bucket) states() int {
	if b.table != nil {
		return b.table.len()
	}
	n := 0
	for _, p := range b.p {
		if p != 0 {
			n++
		}
	}
	return n
}

// each calls fn with every state of b that has a probability, sums holding
// every group's sum.
func (b *bucket) each(ctx context.Context, total int64, sums []int64, fn func(p float64)) error {
	m := len(b.lo) // stored groups
	q := m - 1
	if b.table != nil {
		for j, e := range b.table.slots {
			if e.key == empty {
				continue
			}
			if j&0xffff == 0xffff && ctx.Err() != nil {
				return ctx.Err()
			}
			row := int(e.key) / b.width[q]
			sums[q] = b.lo[q] + int64(int(e.key)%b.width[q])
			stored := sums[q]
			for i := q - 1; i >= 0; i-- {
				sums[i] = b.lo[i] + int64(row/b.stride[i])
				row %= b.stride[i]
				stored += sums[i]
			}
			sums[m] = total - stored
			fn(e.p)
		}
		return nil
	}
	for w := b.walk(total, sums); w.more(); w.next() {
		if w.row&0xffff == 0 && ctx.Err() != nil {
			return ctx.Err()
		}
		cells, v := w.cells()
		for x, p := range cells {
			if p != 0 {
				sums[q] = v + int64(x)
				sums[m] = w.rest - sums[q]
				fn(p)
			}
		}
	}
	return nil
}

// rows walks a dense bucket row by row. At each row sums holds the sums of
// groups 0 … k−3.
type rows struct {
	b    *bucket
	sums []int64
	rest int64 // the sum of group k−2 and the last group's
	row  int
}

func (b *bucket) walk(total int64, sums []int64) *rows {
	w := &rows{b: b, sums: sums, rest: total}
	for i, lo := range b.lo[:len(b.lo)-1] {
		sums[i] = lo
		w.rest -= lo
	}
	return w
}

func (w *rows) more() bool { return w.row < len(w.b.off) }

// cells gives the row's cells and the sum of group k−2 in the first.
func (w *rows) cells() ([]float64, int64) {
	b := w.b
	first := b.first[w.row]
	return b.p[first:b.first[w.row+1]], int64(first - b.off[w.row])
}

// next steps to the next row: the sums turn like an odometer, the first
// group's fastest.
func (w *rows) next() {
	b, sums := w.b, w.sums
	w.row++
	for i, lo := range b.lo[:len(b.lo)-1] {
		if sums[i]-lo+1 < int64(b.width[i]) {
			sums[i]++
			w.rest--
			return
		}
		w.rest += sums[i] - lo
		sums[i] = lo
	}
}

// layer is a layer being built: its buckets by their counts.
type layer struct {
	s       *space
	t       int // scores dealt
	byKey   map[uint64]*bucket
	cells   int    // in arrays
	reached int    // states in hash tables
	shape   *shape // scratch
}

func newLayer(s *space, t int) *layer {
	return &layer{s: s, t: t, byKey: map[uint64]*bucket{}, shape: s.newShape()}
}

// get returns the bucket for counts (in canonical order), made when new.
func (l *layer) get(counts []int) *bucket {
	var key uint64
	var off uint
	for i, c := range counts {
		key |= uint64(c) << off
		off += l.s.countBits[i]
	}
	if b := l.byKey[key]; b != nil {
		return b
	}
	k, sh := len(counts), l.shape
	b := &bucket{counts: slices.Clone(counts), lo: make([]int64, k-1), width: make([]int, k-1), stride: make([]int, k-2)}
	if l.s.dense {
		cells, _ := l.s.layout(counts, l.t, sh)
		b.p, b.first, b.off = make([]float64, cells), slices.Clone(sh.first), slices.Clone(sh.off)
		l.cells += cells
	} else {
		l.s.box(counts, l.t, sh.lo, sh.hi)
		b.table = newTable(16, &l.reached) // most buckets hold few states; a table grows as it fills
	}
	copy(b.lo, sh.lo)
	step := 1
	for i := range k - 1 {
		b.width[i] = int(sh.hi[i] - sh.lo[i] + 1)
		if i < k-2 {
			b.stride[i] = step
			step *= b.width[i]
		}
	}
	l.byKey[key] = b
	return b
}

// states counts the states reached.
func (l *layer) states() int {
	n := 0
	for _, b := range l.byKey {
		n += b.states()
	}
	return n
}

// list gives the buckets in a fixed order.
func (l *layer) list() []*bucket {
	keys := slices.Sorted(maps.Keys(l.byKey))
	out := make([]*bucket, len(keys))
	for i, key := range keys {
		out[i] = l.byKey[key]
	}
	return out
}

// state is scratch space.
type state struct {
	sum    []int64    // a state's sums
	d      []int      // a block's deal, during enumeration
	c2     []int      // counts after a deal
	s2     []int64    // sums after a deal
	recv   []receiver // for a single score: what each group does when it receives
	slope  []int64    // how each group's sum changes along a row
	slope2 []int64    // and each of a successor's, in its order
	kept   []bool     // which of a successor's pairs were dealt nothing
	after  []int      // the room of the groups from each on, during enumeration
	moves  []move     // the last list of moves, and their deals side by side
	deals  []int
}

func (s *space) scratch() *state {
	k := len(s.sizes)
	slope := make([]int64, k)
	slope[k-2], slope[k-1] = 1, -1
	return &state{sum: make([]int64, k), d: make([]int, k), c2: make([]int, k), s2: make([]int64, k), recv: make([]receiver, k), slope: slope, slope2: make([]int64, k), kept: make([]bool, k), after: make([]int, k+1)}
}

// arrange puts counts and sums into canonical order within each size class:
// ascending by count, then by sum.
func (s *space) arrange(count []int, sum []int64) {
	for i := 1; i < len(s.sizes); i++ {
		for j := i; j > s.class[i] && less(count[j], sum[j], count[j-1], sum[j-1]); j-- {
			count[j], count[j-1] = count[j-1], count[j]
			sum[j], sum[j-1] = sum[j-1], sum[j]
		}
	}
}

func less(c1 int, s1 int64, c2 int, s2 int64) bool {
	return c1 < c2 || (c1 == c2 && s1 < s2)
}

// move is one way to deal a block to the states of a bucket: d[i] of its
// scores to group i, with probability w, into bucket to.
type move struct {
	d  []int
	w  float64
	to *bucket
}

// moves hands every way to deal block b to the states of bucket from to
// use, a batch of at most movesBatch at a time (a block of many equal scores,
// as in yes/no data, has hundreds of thousands), with the multivariate
// hypergeometric probability ∏ C(rᵢ, dᵢ)/C(R, b) of dealing dᵢ of its scores
// to group i, rᵢ the room left in group i and R their sum. All states of the
// bucket lead under one deal to one bucket of next: the counts, raised by
// the deal, in canonical order. Only deals that the rooms allow are visited:
// group i takes at least what groups i+1 … cannot hold.
func (s *space) moves(from *bucket, b Block, st *state, next *layer, use func([]move) error) error {
	k := len(s.sizes)
	after := st.after[:k+1] // after[i]: the room of groups i …
	after[k] = 0
	for i := k - 1; i >= 0; i-- {
		after[i] = after[i+1] + s.sizes[i] - from.counts[i]
	}
	if b.Count > after[0] {
		return nil
	}
	list, flat := st.moves[:0], st.deals[:0]
	flush := func() error {
		for i := range list {
			list[i].d = flat[i*k : (i+1)*k : (i+1)*k]
		}
		err := use(list)
		clear(list) // no bucket is kept alive by a stale pointer
		list, flat = list[:0], flat[:0]
		return err
	}
	var walk func(i, left int, logW float64) error
	walk = func(i, left int, logW float64) error {
		r := s.sizes[i] - from.counts[i]
		if i < k-1 {
			for d := max(0, left-after[i+1]); d <= min(r, left); d++ {
				st.d[i] = d
				if err := walk(i+1, left-d, logW+s.logChoose(r, d)); err != nil {
					return err
				}
			}
			return nil
		}
		st.d[i] = left
		for i := range k {
			st.c2[i] = from.counts[i] + st.d[i]
		}
		for i := 1; i < k; i++ { // the counts in canonical order
			for j := i; j > s.class[j] && st.c2[j] < st.c2[j-1]; j-- {
				st.c2[j], st.c2[j-1] = st.c2[j-1], st.c2[j]
			}
		}
		flat = append(flat, st.d...)
		list = append(list, move{w: dist.Exp(logW + s.logChoose(r, left)), to: next.get(st.c2)})
		if len(list) == movesBatch {
			return flush()
		}
		return nil
	}
	err := walk(0, b.Count, -s.logChoose(after[0], b.Count))
	if err == nil && len(list) > 0 {
		err = flush()
	}
	st.moves, st.deals = list, flat // kept for the next call
	return err
}

// movesBatch is how many moves are handed on at once: enough that a row's
// cells are read from cache by many, few enough that the list stays in cache.
const movesBatch = 4096

// logChoose is log C(a, b) = log a! − log b! − log (a−b)!, from log-gamma, so
// that no coefficient overflows (C(1030, 515) already exceeds float64); the
// logarithms and their exponential are package dist's, which give the same
// bytes on every platform. Each
// log a! carries a relative error of about 2⁻⁵³, so a deal's probability, a
// difference of such logs, is off by about (k+1)·2⁻⁵³·log N! relatively:
// 10⁻¹⁴ at N = 20, 10⁻¹¹ at N = 3,000.
func (s *space) logChoose(a, b int) float64 {
	return s.logFact[a] - s.logFact[b] - s.logFact[a-b]
}

// deal adds to next every way of dealing block b to every state of bucket
// from, weighted by its probability; dealt scores have been dealt before.
func (s *space) deal(ctx context.Context, from *bucket, b Block, dealt int, st *state, next *layer) error {
	if b.Count == 1 && s.dense {
		return s.dealOne(ctx, from, b.Score, dealt, st, next)
	}
	total := s.prefix[dealt]
	if !s.dense {
		k := len(s.sizes)
		return s.moves(from, b, st, next, func(moves []move) error {
			if next.reached > s.maxStates {
				return &TooLargeError{fmt.Sprintf("more than %d states after %d of %d observations", s.maxStates, dealt, s.n)}
			}
			// a hash table's work is its states times their moves: bounded as it goes
			if s.work += hashCost * len(moves) * from.states(); s.maxWork > 0 && s.work > s.maxWork {
				return &TooLargeError{fmt.Sprintf("more than %d moves of states after %d of %d observations", s.maxWork/hashCost, dealt, s.n)}
			}
			for _, mv := range moves {
				err := from.each(ctx, total, st.sum, func(p float64) {
					for i := range k {
						st.c2[i] = from.counts[i] + mv.d[i]
						st.s2[i] = st.sum[i] + int64(mv.d[i])*b.Score
					}
					s.arrange(st.c2, st.s2)
					mv.to.add(mv.to.index(st.s2), p*mv.w)
				})
				if err != nil {
					return err
				}
			}
			return nil
		})
	}
	return s.moves(from, b, st, next, func(moves []move) error {
		// row by row, so that a row's cells are read from cache by every move
		for w := from.walk(total, st.sum); w.more(); w.next() {
			if w.row&0xffff == 0 && ctx.Err() != nil {
				return ctx.Err()
			}
			cells, v := w.cells()
			if len(cells) == 0 {
				continue
			}
			s.spread(st, from.counts, moves, b.Score, cells, v, w.rest)
		}
		return nil
	})
}

// spread adds the successors under every move of the states of a row with
// these probabilities: st.sum holds the sums of groups 0 … k−3, the first
// state's group k−2 has the sum from, and that sum and the last group's add
// up to rest.
//
// Along a row the sum of group k−2 rises by one a cell and the last group's
// falls by one. The successor's pairs (count, sum) are put in canonical
// order by comparing sums, each linear in the cell; so the row falls into
// stretches in which none of the comparisons changes sign, and in a stretch
// the successor's row and sum step by fixed amounts from cell to cell: a
// straight loop of adds, since WebAssembly makes branches dear. (Single
// scores go through dealOne instead, whose receivers know in advance which
// pairs a new one can pass: measured 20–30% faster than sorting.)
func (s *space) spread(st *state, counts []int, moves []move, score int64, cells []float64, from, rest int64) {
	k := len(s.sizes)
	q := k - 2 // the group whose sum runs along a row
	// slices of length k, so that the compiler can drop most index checks
	sums, slope, class := st.sum[:k], st.slope[:k], s.class[:k]
	pc, ps, pd, pk := st.c2[:k], st.s2[:k], st.slope2[:k], st.kept[:k] // the successor's pairs, their slopes, and which are as they were
	n := len(cells)
	for m := range moves {
		mv := &moves[m]
		d, to := mv.d[:k], mv.to
		stride, lo := to.stride[:q], to.lo[:q]
		for x, end := startAt(cells, 0, sums, from, rest), 0; x < n; x = startAt(cells, x+end, sums, from, rest) {
			end = n - x // where the stretch ends, from x
			// insertion sort within classes: the pairs stand sorted but for
			// those dealt to, so two that are not need no comparing
			for i := range k {
				c, sum, sl, kept := counts[i]+d[i], sums[i]+int64(d[i])*score, slope[i], d[i] == 0
				j := i
				for ; j > class[i] && !(kept && pk[j-1]) && pc[j-1] >= c; j-- {
					if pc[j-1] == c {
						diff := ps[j-1] - sum
						end = min(end, until(diff, pd[j-1]-sl))
						if diff <= 0 {
							break
						}
					}
					pc[j], ps[j], pd[j], pk[j] = pc[j-1], ps[j-1], pd[j-1], pk[j-1]
				}
				pc[j], ps[j], pd[j], pk[j] = c, sum, sl, kept
			}
			// the successor's row and group k−2's sum at x, and their steps
			row, dRow := 0, 0
			for i := range q {
				row += int(ps[i]-lo[i]) * stride[i]
				dRow += int(pd[i]) * stride[i]
			}
			v, dv := ps[q], pd[q]
			addAlong(to.p, to.off, row, dRow, v, dv, cells[x:x+end], mv.w)
		}
	}
}

// receiver describes, for the states of one bucket, what a group that
// receives a single score does. Its class holds, after it, first the rest of
// its run (groups of its count, ascending sums) up to group run, then groups
// of one count more up to group up: its new pair moves past the run, then
// past those of the others whose sums are smaller.
type receiver struct {
	to      *bucket // the successors' bucket; nil when the group is full
	p       []float64
	off     []int   // to's
	stride  []int   // to's
	w       float64 // the probability that it receives: (its room)/(all room)
	row     int     // the row of the states' sums, as they stand, in to
	first   bool    // it starts its run
	run, up int
}

// dealOne deals a single score to the states of a dense bucket: to each
// group with room, with probability (its room)/(all room). Groups of one
// class with equal counts and sums lead to one successor, made once and
// weighted by their number.
func (s *space) dealOne(ctx context.Context, from *bucket, score int64, dealt int, st *state, next *layer) error {
	k := len(s.sizes)
	c := from.counts
	room := 0
	for i := range k {
		room += s.sizes[i] - c[i]
	}
	// A receiver of count c leads to the bucket whose counts have one c of
	// its class raised to c+1: the last of the run of c's, which keeps the
	// counts sorted.
	for i := range k {
		rc := &st.recv[i]
		*rc = receiver{w: float64(s.sizes[i]-c[i]) / float64(room), first: i == s.class[i] || c[i-1] != c[i], run: i}
		for rc.run+1 < k && s.sameRun(c, rc.run) {
			rc.run++
		}
		rc.up = rc.run
		for rc.up+1 < k && s.class[rc.up+1] == s.class[i] && c[rc.up+1] == c[i]+1 {
			rc.up++
		}
		switch {
		case c[i] == s.sizes[i]:
		case !rc.first:
			rc.to = st.recv[i-1].to
		default:
			copy(st.c2, c)
			st.c2[rc.run]++
			rc.to = next.get(st.c2)
		}
		if rc.to != nil {
			rc.p, rc.off, rc.stride = rc.to.p, rc.to.off, rc.to.stride
		}
	}
	total := s.prefix[dealt]
	sums := st.sum
	// Along a row only the sums of group k−2 and the last group change, so
	// the rows of the successors in which no sums change place stay; those
	// of the others follow from the sums that do. (Plain loops and a direct
	// call a row: WebAssembly makes calls dear.)
	for w := from.walk(total, sums); w.more(); w.next() {
		if w.row&0xffff == 0 && ctx.Err() != nil {
			return ctx.Err()
		}
		cells, v := w.cells()
		if len(cells) == 0 {
			continue
		}
		for i := range st.recv {
			if rc := &st.recv[i]; rc.to != nil {
				rc.row = rc.to.rowOf(sums)
			}
		}
		s.receive(st, score, cells, v, w.rest)
	}
	return nil
}

// receive adds the successors, when a single score is dealt, of the states
// of a row with these probabilities: st.sum holds the sums of groups
// 0 … k−3, the first state's group k−2 has the sum from, and that sum and
// the last group's add up to rest. A receiver's row and cell follow from
// the row of the states' sums in its bucket by the sums that change place.
//
// Along a row the sum of group k−2 rises by one a cell and the last group's
// falls by one, and what a receiver does (whether it is the last of a run of
// equal pairs, how many share its pair, past which pairs its new one moves)
// rests on the signs of differences of sums, each linear in the cell. So
// the row falls into stretches in which none of those signs changes, and
// in a stretch the successor's row and sum step by fixed amounts from cell
// to cell: a straight loop of adds, since WebAssembly makes branches dear.
func (s *space) receive(st *state, score int64, cells []float64, from, rest int64) {
	k := len(s.sizes)
	q := k - 2 // the group whose sum runs along a row
	// slices of length k, so that the compiler can drop most index checks
	sums, slope, recv := st.sum[:k], st.slope[:k], st.recv[:k]
	n := len(cells)
	for r := range recv {
		rc := &recv[r]
		if rc.to == nil {
			continue
		}
		for x, end := startAt(cells, 0, sums, from, rest), 0; x < n; x = startAt(cells, x+end, sums, from, rest) {
			end = n - x // where the stretch ends, from x
			// only the last of a run of equal pairs receives, for them all
			if rc.run > r {
				d := sums[r+1] - sums[r]
				end = min(end, until(d, slope[r+1]-slope[r]))
				if d == 0 {
					continue
				}
			}
			m := 1 // how many groups of its run share its pair
			for i := r; i > 0 && !recv[i].first; i-- {
				d := sums[i] - sums[i-1]
				end = min(end, until(d, slope[i]-slope[i-1]))
				if d != 0 {
					break
				}
				m++
			}
			// the new pair moves right past the smaller pairs of its class:
			// those between take one place to the left
			sum := sums[r] + score
			j := rc.run
			for j < rc.up {
				d := sums[j+1] - sum
				end = min(end, until(d, slope[j+1]-slope[r]))
				if d >= 0 {
					break
				}
				j++
			}
			// the successor's row and group k−2's sum at x, and their steps
			stride := rc.stride[:q]
			row, dRow, v, dv := rc.row, 0, sums[q], slope[q]
			for i := r; i < min(j, q); i++ {
				row += int(sums[i+1]-sums[i]) * stride[i]
				dRow += int(slope[i+1]-slope[i]) * stride[i]
			}
			switch {
			case j < q:
				row += int(sum-sums[j]) * stride[j]
				dRow += int(slope[r]-slope[j]) * stride[j]
			case j == q:
				v, dv = sum, slope[r]
			case r <= q: // j is the last group
				v, dv = sums[q+1], slope[q+1]
			}
			addAlong(rc.p, rc.off, row, dRow, v, dv, cells[x:x+end], float64(m)*rc.w)
		}
	}
}

// startAt gives the first cell from x on that holds a probability, where a
// stretch starts (an empty cell's successor may lie outside the arrays), and
// sets in sums the two that change along the row to that cell's: group
// k−2's, from + the cell, and the last group's, the rest.
func startAt(cells []float64, x int, sums []int64, from, rest int64) int {
	for x < len(cells) && cells[x] == 0 {
		x++
	}
	q := len(sums) - 2
	sums[q] = from + int64(x)
	sums[q+1] = rest - sums[q]
	return x
}

// addAlong adds w times each probability of a stretch of cells that is not
// 0 to its successor's cell in dst, a bucket's array with row table off:
// the first successor's row and group k−2's sum are row and v, and they
// step by dRow and dv from cell to cell.
func addAlong(dst []float64, off []int, row, dRow int, v, dv int64, cells []float64, w float64) {
	if dRow == 0 {
		at, step := off[row]+int(v), int(dv)
		if step == 1 && at+len(cells) <= len(dst) {
			// a cell that is 0 adds 0 where its successor would be: no harm
			// once the stretch's cells all lie in dst
			to := dst[at : at+len(cells)]
			for i, p := range cells {
				to[i] += p * w
			}
			return
		}
		for _, p := range cells {
			if p != 0 {
				dst[at] += p * w
			}
			at += step
		}
		return
	}
	for _, p := range cells {
		if p != 0 {
			dst[off[row]+int(v)] += p * w
		}
		row, v = row+dRow, v+dv
	}
}

// until gives the least t ≥ 1 at which d + s·t differs in sign (negative,
// zero or positive) from d, or a number beyond any row when there is none.
func until(d, s int64) int {
	switch {
	case s == 0 || (d != 0 && (d > 0) == (s > 0)):
		return 1 << 62
	case d == 0:
		return 1
	}
	t := -d / s // d and s have opposite signs: d + s·t has d's sign or is 0
	if d+s*t != 0 {
		t++
	}
	return int(t)
}

// finish turns the last layer, where every group is full, into the
// distribution of T.
func (s *space) finish(ctx context.Context, last []*bucket, st *state) (*Distribution, error) {
	mass := map[int64]float64{}
	for _, b := range last {
		err := b.each(ctx, s.prefix[s.n], st.sum, func(p float64) {
			var t int64
			for i := range s.sizes {
				t += s.weight[i] * st.sum[i] * st.sum[i]
			}
			mass[t] += p
		})
		if err != nil {
			return nil, err
		}
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
	return d, nil
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
	t := 0
	for levels, b := range blocks[:len(blocks)-1] { // layers exist after each block but the last
		t += b.Count
		est := 1.0
		for i := 0; i < k-1; i++ {
			pairs := 0.0
			for c := max(0, t-(n-sorted[i])); c <= min(sorted[i], t); c++ {
				lo := prefix[c]
				hi := prefix[t] - prefix[t-c]
				pairs += min(float64(hi-lo)+1, compositions(c, levels+1)) // the sums a count can have (see reachable)
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
