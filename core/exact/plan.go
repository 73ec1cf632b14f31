package exact

import (
	"fmt"
	"math/bits"
	"slices"
	"sort"

	"midrank/core/display"
	"midrank/core/dist"
)

// boxes works out the planned figures from the buckets' boxes alone, a
// cheap first measure (boxCells) by which plans are compared, refusing with a
// *TooLargeError what the screen or the numbering does not allow.
func (s *space) boxes(lim Limits, blocks, sorted []Block) (figures, error) {
	if err := s.screen(lim); err != nil {
		return figures{}, err
	}
	if err := s.prepare(blocks, sorted); err != nil {
		return figures{}, err
	}
	fig := s.plan(s.boxSize, nil)
	fig.boxCells = fig.cells
	if fig.peak >= tooMany {
		return fig, &TooLargeError{"the states cannot be numbered in 62 bits"}
	}
	return fig, nil
}

// settle decides, from the figures of boxes and before any layer is built,
// whether arrays or hash tables hold the layers, and refuses with a
// *TooLargeError what lim does not allow; it returns the planned figures.
func (s *space) settle(lim Limits, fig figures) (figures, error) {
	// The boxes bound the arrays. When they do not settle the question, the
	// rows are laid out to count the cells, which costs about as much as a
	// few cells a row, so not beyond 2·MaxCells rows in all. Hash tables
	// hold the states reached, hardly fewer than the cells laid out, in four
	// cells' room each: they serve where the row tables are what is large,
	// as with many small groups.
	laid := false
	layable := 2 * lim.MaxCells // rows, whose laying out costs a few cells' work each
	if lim.MaxWork > 0 {
		layable = min(layable, lim.MaxWork/rowCost)
	}
	if fig.rows <= layable && !fig.fit(lim) {
		// the states of hash tables do not depend on the layout: when they
		// are too many, laying out stops as soon as the arrays are too
		sh, boxCells, hashed := s.newShape(true), fig.boxCells, fig.hashed
		enough := func(f figures) bool { return hashed > 2*lim.MaxStates && f.peak > lim.MaxCells }
		fig, laid = s.plan(func(counts []int, t int) (int, int) { return s.layout(counts, t, sh) }, enough), true
		fig.boxCells, fig.hashed = boxCells, hashed
	}
	switch {
	case fig.fit(lim):
		s.dense = true
	case fig.peak <= lim.MaxCells:
		return fig, &TooLargeError{fmt.Sprintf("about %d states in all, more than %d", fig.cells, lim.MaxWork)}
	case laid && fig.hashed > 2*lim.MaxStates:
		return fig, &TooLargeError{fmt.Sprintf("it would hold at least %d MB at once, more than %d MB", fig.peak*8/1e6, lim.MaxCells*8/1e6)} // 8 bytes a cell
	case len(s.cuts)*s.n > screenWork: // the estimate would take too long itself
		return fig, &TooLargeError{fmt.Sprintf("%d values in %d tie blocks are beyond hash tables here", s.n, len(s.cuts))}
	default:
		if est := EstimateStates(s.sizes, s.sorted); est > float64(20*float64(lim.MaxStates)) {
			return fig, &TooLargeError{"about " + display.Rough(est) + " states, where " + display.Rough(float64(lim.MaxStates)) + " fit"}
		}
	}
	return fig, nil
}

// space describes the states: groups sorted by size, and the scores.
type space struct {
	n         int // the scores dealt in the layers
	all       int // the groups' sizes added up: n, or more when some scores are dealt last (see deferred.go)
	deferred  bool
	sizes     []int     // ascending
	blocks    []Block   // in the order dealt
	sorted    []Block   // in ascending order of score
	class     []int     // first group of the size class of each group
	weight    []int64   // L/nᵢ
	prefix    []int64   // prefix[i]: the sum of the i smallest scores
	from      []int     // from[t]: the scores dealt when t are, are the (from[t]+1)-th to the (from[t]+t)-th smallest (see order)
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

// newSpace describes the states of groups of these sizes dealt scores in
// tie blocks of these counts, late more scores being dealt after the layers.
func newSpace(sizes []int, counts []int, late int) (*space, error) {
	s := &space{sizes: ascending(sizes), deferred: late > 0}
	for _, c := range counts {
		s.n += c
		s.cuts = append(s.cuts, s.n)
	}
	for _, n := range s.sizes {
		s.all += n
	}
	if s.all != s.n+late {
		return nil, fmt.Errorf("exact: sizes add to %d but there are %d scores", s.all, s.n+late)
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
// need, in time and memory linear in N: run only after the screen.
func (s *space) prepare(blocks, sorted []Block) error {
	k := len(s.sizes)
	s.blocks, s.sorted = blocks, sorted
	s.order()
	s.countBits = make([]uint, k)
	s.lo, s.hi = make([]int64, k), make([]int64, k)
	s.fixedRoom = movesBatch*(k+5) + 4*(s.n+1) + 8192
	l, ok := lcmOf(s.sizes)
	if !ok {
		return &TooLargeError{"the sizes' least common multiple exceeds 62 bits"}
	}
	s.weight = make([]int64, k)
	for i, n := range s.sizes {
		s.weight[i] = l / int64(n)
		s.countBits[i] = uint(bits.Len(uint(n)))
	}
	s.logFact = make([]float64, s.all+1)
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
		lo[i], hi[i] = s.least(t, c), s.most(t, c)
		loSum += lo[i]
		hiSum += hi[i]
	}
	total := s.total(t)
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

// order notes the order in which the blocks are dealt: the scores dealt at
// any layer must be a run of the sorted scores, the first ones or any other
// (a window that grows at either end, see windows), so that the sums of
// the c smallest and largest of them bound the sums of c of them.
func (s *space) order() {
	sorted := s.sorted
	s.prefix = make([]int64, 1, s.n+1)
	starts := make([]int, len(sorted)) // the scores below each sorted block
	for i, b := range sorted {
		starts[i] = len(s.prefix) - 1
		for range b.Count {
			s.prefix = append(s.prefix, s.prefix[len(s.prefix)-1]+b.Score)
		}
	}
	s.from = make([]int, s.n+1)
	lo, hi, t := s.n, 0, 0
	for _, b := range s.blocks {
		start := starts[sort.Search(len(sorted), func(i int) bool { return sorted[i].Score >= b.Score })]
		lo, hi, t = min(lo, start), max(hi, start+b.Count), t+b.Count
		if hi-lo != t {
			panic("exact: blocks not dealt as a growing run of the sorted scores")
		}
		s.from[t] = lo
	}
}

// least, most and total are the sums of the c smallest, of the c largest
// and of all the scores dealt when t are.
func (s *space) least(t, c int) int64 { return s.prefix[s.from[t]+c] - s.prefix[s.from[t]] }
func (s *space) most(t, c int) int64  { return s.prefix[s.from[t]+t] - s.prefix[s.from[t]+t-c] }
func (s *space) total(t int) int64    { return s.prefix[s.from[t]+t] - s.prefix[s.from[t]] }

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

// ascending returns the sizes sorted, by insertion: k is small, and a
// generic sort of ints would be one more in the module.
func ascending(sizes []int) []int {
	out := slices.Clone(sizes)
	for i := 1; i < len(out); i++ {
		for j := i; j > 0 && out[j] < out[j-1]; j-- {
			out[j], out[j-1] = out[j-1], out[j]
		}
	}
	return out
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
	boxCells    int // the cells of all layers by their boxes alone, laid out or not: a measure of work that every plan has (see choose)
}

// fit tells whether arrays of these figures keep within lim.
func (f figures) fit(lim Limits) bool {
	return f.peak <= lim.MaxCells && (lim.MaxWork == 0 || f.cells <= lim.MaxWork)
}

// plan adds up size(counts, t), the cells and rows of a bucket, over the
// buckets of each layer; it stops after a layer when enough, if not nil,
// says the figures so far settle the question.
func (s *space) plan(size func(counts []int, t int) (cells, rows int), enough func(figures) bool) figures {
	var fig figures
	before := 0 // the room of the layer before
	for dealt, t := range s.cuts {
		if enough != nil && enough(fig) {
			break
		}
		inLayer, layerCells, layerStates, widest := 0, 0, 0.0, 0
		s.countVectors(t, func(counts []int) bool {
			c, r := size(counts, t)
			inLayer, layerCells = min(inLayer+c+2*r+s.bucketRoom, tooMany), min(layerCells+c, tooMany)
			layerStates, widest = layerStates+s.reachable(counts, t, dealt+1)+hashBucket, max(widest, r)
			fig.cells, fig.rows = min(fig.cells+c, tooMany), min(fig.rows+r, tooMany)
			return true
		})
		inLayer = min(inLayer+2*widest, tooMany) // the layer's scratch for laying out its widest bucket
		fig.peak, fig.layer = max(fig.peak, min(before+inLayer+s.fixedRoom, tooMany)), max(fig.layer, layerCells)
		fig.hashed = max(fig.hashed, int(min(layerStates, tooMany)))
		before = inLayer
	}
	return fig
}

// countVectors calls fn with every canonical count vector adding up to t
// (counts ascending within size classes), until fn says false.
func (s *space) countVectors(t int, fn func(counts []int) bool) {
	k := len(s.sizes)
	counts := make([]int, k)
	var walk func(i, left int) bool
	walk = func(i, left int) bool {
		from := 0
		if i > s.class[i] {
			from = counts[i-1]
		}
		if i == k-1 {
			if left > s.sizes[i] || left < from {
				return true
			}
			counts[i] = left
			return fn(counts)
		}
		for c := from; c <= min(s.sizes[i], left); c++ {
			counts[i] = c
			if !walk(i+1, left-c) {
				return false
			}
		}
		return true
	}
	walk(0, t)
}
