package exact

import (
	"context"
	"encoding/binary"
	"fmt"
	"slices"

	"midrank/core/dist"
)

// Deferring the scores of the rarer parity.
//
// Midranks on the doubled scale are even but for the members of tie blocks of
// even size (a tied pair at ranks 7 and 8 has the midrank 7½, doubled 15).
// One odd score among even ones makes the gcd of the differences 1 where it
// was 2, which doubles the range of every stored group's sum, and the states
// reached grow by up to 2^(k−1): measured 4–6 times with one tied pair in four
// groups. So the scores of the rarer parity can be left out of the layers,
// which then deal the others on their own scale, x = base + g·y with g ≥ 2,
// and dealt last, straight into the statistic: from each state of the last
// layer, every way to deal them into the room its groups have left, each with
// its multivariate hypergeometric probability (dealing them last is the same
// sequential draw without replacement as dealing them in their place). The
// ways depend on the room alone, so they are listed once for each bucket,
// deals that add the same to every group merged.
//
// Which of the two plans runs is decided from their planned work (see
// choose): deferring pays when the deferred scores are few, as with a few
// tied pairs, and not when they are many, as on a rating scale.

// plan is one way to run a computation: the space of its layers, the scores
// dealt in them (on their own scale) and the deferred ones.
type plan struct {
	s       *space
	blocks  []Block // dealt in the layers, y
	fig     figures
	late    []Block // dealt last, x
	base, g int64   // x = base + g·y for the scores of the layers
	work    int     // of the last step, in cells' worth (in fig.boxCells)
	// ways are the deals of the late blocks into each bucket of the last
	// layer, by its counts (see countsKey), listed when the plan is costed
	ways map[string][]addition
}

// countsKey is a map key of a bucket's counts.
func countsKey(counts []int) string {
	var key []byte
	for _, c := range counts {
		key = binary.AppendUvarint(key, uint64(c))
	}
	return string(key)
}

// planRule picks between the whole computation and the deferred ones.
type planRule int

const (
	cheaper   planRule = iota // the one with less planned work
	wholeOnly                 // never defer (tests)
	// deferredOnly and the rules above it defer whenever they may, and deal
	// the others in order rule − deferredOnly of windows, or its last
	// (tests)
	deferredOnly
)

// maxDeferred bounds the deferred scores: their deals into a bucket's room
// are listed one by one.
const maxDeferred = 12

// finishCost is what combining a state of the last layer with one way to
// deal the deferred scores costs against a cell of an array (k products and
// an entry in the distribution's table), for comparing plans and for Limits.MaxWork: measured here at
// 1 to 2 (the layers' cells cost more than their arithmetic, as each is
// dealt to every group).
const finishCost = 2

// choose plans the computation by rule, refusing with a *TooLargeError when
// no plan keeps within lim.
//
// With deferred scores the layers may deal the others in any order in
// which the scores dealt are a run of the sorted ones (see windows): the
// states of a layer depend only on the scores dealt so far, and a tie block
// dealt last leaves a gap in them, whose cost (a wider spread of sums)
// starts at the layer where the gap is first bridged. So an order that
// bridges it later costs less: measured on four groups of 8 with one tied
// pair at ranks 10–11, 53 million cells ascending and 44 million from the
// top, against 39 million untied.
func choose(sizes []int, blocks []Block, lim Limits, rule planRule) (*plan, error) {
	whole, errWhole := newPlan(sizes, blocks, nil, 0, 1, lim, 0, rule)
	var plans []*plan
	if errWhole == nil && rule < deferredOnly {
		plans = append(plans, whole)
	}
	if kept, deferred, base, g, ok := splitParity(blocks); ok && rule != wholeOnly {
		// The plans are compared by their boxes' cells (see figures), a
		// deferred one's with its last step, before any is laid out; a
		// deferred plan is worked out only as far as it could still cost
		// less than the cheapest so far, or than the budget.
		limit := tooMany
		switch {
		case rule != cheaper:
		case errWhole == nil:
			limit = whole.fig.boxCells - 1
		case lim.MaxWork > 0:
			limit = lim.MaxWork
		default: // no bound on the work but memory's: as much as the layers could do in it
			limit = product(len(blocks), lim.MaxCells)
		}
		if part, err := newPlan(sizes, kept, deferred, base, g, lim, limit, rule); part != nil && err == nil {
			plans = append(plans, part)
		} else if part != nil && rule != cheaper {
			return part, err
		}
	}
	if len(plans) == 0 && errWhole == nil {
		plans = append(plans, whole) // no deferred plan costs less than the budget
	}
	// the first plan by its boxes' cells that keeps within lim runs
	for i := 1; i < len(plans); i++ { // at most three: sorted in place
		for j := i; j > 0 && plans[j].fig.boxCells < plans[j-1].fig.boxCells; j-- {
			plans[j], plans[j-1] = plans[j-1], plans[j]
		}
	}
	var first error
	for _, p := range plans {
		err := p.settle(lim)
		if err == nil {
			return p, nil
		}
		if p == whole {
			errWhole = err
		}
		if first == nil {
			first = err
		}
	}
	if errWhole != nil || first == nil {
		return whole, errWhole // the whole computation's reason, the usual one
	}
	return nil, first
}

// newPlan builds the space for the blocks dealt in layers and works out its
// boxes. With deferred scores it tries the orders of windows(blocks) (one of
// them under rules from deferredOnly on) and keeps the one whose boxes have
// the fewest cells;
// it gives up (nil) once its boxes' cells and its last step would cost
// more than limit.
func newPlan(sizes []int, blocks, deferred []Block, base, g int64, lim Limits, limit int, rule planRule) (*plan, error) {
	orders := [][]Block{blocks}
	if len(deferred) > 0 {
		orders = windows(blocks)
		if rule >= deferredOnly {
			i := min(int(rule-deferredOnly), len(orders)-1)
			orders = orders[i : i+1]
		}
	}
	var p *plan
	var err error
	for _, order := range orders {
		s, errSpace := newSpace(sizes, countsOf(order), sum(countsOf(deferred)))
		if errSpace != nil {
			return nil, errSpace
		}
		fig, errBoxes := s.boxes(lim, order, blocks)
		if p == nil || (errBoxes == nil && (err != nil || fig.boxCells < p.fig.boxCells)) {
			p, err = &plan{s: s, blocks: order, late: deferred, base: base, g: g, fig: fig}, errBoxes
		}
	}
	if err != nil || len(deferred) == 0 {
		return p, err
	}
	work, ok := p.finishWork(limit - p.fig.boxCells)
	if !ok {
		return nil, nil
	}
	p.work, p.fig.boxCells = work, p.fig.boxCells+work
	return p, nil
}

// windows lists orders in which to deal ascending blocks so that the scores
// dealt at each layer are a run of the sorted ones (see space.order): from
// each stretch of blocks whose scores follow one another without a gap, the
// stretch first, then the neighbouring stretches one by one, the longer of
// the two next to the run so far first. A gap (the scores of the tied pairs
// dealt last, or a tie block's) widens the spread of the sums of every
// layer that holds scores on both sides of it, so the orders differ in how
// late they bridge the gaps. The first order is the ascending one and the
// last the descending one's stretches.
func windows(blocks []Block) [][]Block {
	var starts, sizes []int // each stretch's first block, and its scores
	for i, b := range blocks {
		if i == 0 || b.Score-blocks[i-1].Score > 1 {
			starts, sizes = append(starts, i), append(sizes, 0)
		}
		sizes[len(sizes)-1] += b.Count
	}
	starts = append(starts, len(blocks))
	orders := make([][]Block, 0, len(sizes))
	for r := range sizes {
		order := make([]Block, 0, len(blocks))
		order = append(order, blocks[starts[r]:starts[r+1]]...)
		below, above := r-1, r+1 // the next stretches either side
		for below >= 0 || above < len(sizes) {
			if above < len(sizes) && (below < 0 || sizes[above] >= sizes[below]) {
				order = append(order, blocks[starts[above]:starts[above+1]]...)
				above++
				continue
			}
			for i := starts[below+1] - 1; i >= starts[below]; i-- {
				order = append(order, blocks[i])
			}
			below--
		}
		orders = append(orders, order)
	}
	return orders
}

// settle lays the plan out where its boxes do not settle whether it fits
// (see space.settle), and refuses it when it does not.
func (p *plan) settle(lim Limits) (err error) {
	if p.fig, err = p.s.settle(lim, p.fig); err != nil || !p.s.deferred {
		return err
	}
	p.fig.cells = min(p.fig.cells+p.work, tooMany)
	if lim.MaxWork > 0 && p.fig.cells > lim.MaxWork {
		return &TooLargeError{fmt.Sprintf("about %d states and deals in all, more than %d", p.fig.cells, lim.MaxWork)}
	}
	return nil
}

// splitParity splits the blocks by the parity of their scores: the rarer
// parity's (some, at most maxDeferred and at most a third of all) are
// deferred, the others are returned as y = (x − base)/g, g the gcd of their
// differences. (Untied ranks hold as many scores of either parity, and
// deferring half of them never pays: only costing it does.)
func splitParity(blocks []Block) (kept, deferred []Block, base, g int64, ok bool) {
	var odd int
	n := 0
	for _, b := range blocks {
		n += b.Count
		if b.Score%2 != 0 {
			odd += b.Count
		}
	}
	rare := int64(1)
	if odd > n-odd {
		rare = 0
	}
	if e := min(odd, n-odd); e == 0 || e > maxDeferred || 3*e > n {
		return nil, nil, 0, 0, false
	}
	for _, b := range blocks {
		if b.Score%2 == rare {
			deferred = append(deferred, b)
		} else {
			kept = append(kept, b)
		}
	}
	base = kept[0].Score
	for _, b := range kept[1:] {
		g = gcd(g, b.Score-base)
	}
	g = max(g, 1)
	for i := range kept {
		kept[i].Score = (kept[i].Score - base) / g
	}
	return kept, deferred, base, g, true
}

// addition is one way the deferred scores add to the groups' sums, x, and
// its probability.
type addition struct {
	sums []int64
	p    float64
}

// additions lists every way to deal the late blocks into groups with this
// room, which adds up to their count, deals that add the same to every group
// merged; it stops early, with nil, when more than stop ways are held at
// once. The blocks are dealt one at a time, ways that
// leave the same room and add the same merged after each: block j goes to
// the groups with the probability ∏ C(rᵢ, dᵢ)/C(R, b), rᵢ the room left in
// group i and R their sum.
func (p *plan) additions(room []int, stop int) []addition {
	k := len(room)
	type way struct {
		left []int
		addition
	}
	ways := []way{{slices.Clone(room), addition{make([]int64, k), 1}}}
	d := make([]int, k)
	var key []byte
	for _, b := range p.late {
		index := map[string]int{}
		var next []way
		r := sum(ways[0].left)
		for _, w := range ways {
			// every deal d of the block's scores that the room allows
			var walk func(i, rest int, num float64) bool
			walk = func(i, rest int, num float64) bool {
				if i == k-1 {
					if rest > w.left[i] {
						return true
					}
					d[i] = rest
					num *= p.s.choose(w.left[i], rest)
					key = key[:0]
					for j := range k {
						key = binary.AppendVarint(key, int64(w.left[j]-d[j]))
						key = binary.AppendVarint(key, w.sums[j]+int64(d[j])*b.Score)
					}
					prob := w.p * num / p.s.choose(r, b.Count)
					if at, seen := index[string(key)]; seen {
						next[at].p += prob
						return true
					}
					if len(next) == stop {
						return false
					}
					index[string(key)] = len(next)
					nw := way{make([]int, k), addition{make([]int64, k), prob}}
					for j := range k {
						nw.left[j], nw.sums[j] = w.left[j]-d[j], w.sums[j]+int64(d[j])*b.Score
					}
					next = append(next, nw)
					return true
				}
				for d[i] = 0; d[i] <= min(rest, w.left[i]); d[i]++ {
					if !walk(i+1, rest-d[i], num*p.s.choose(w.left[i], d[i])) {
						return false
					}
				}
				return true
			}
			if !walk(0, b.Count, 1) {
				return nil
			}
		}
		ways = next
	}
	out := make([]addition, len(ways))
	for i, w := range ways {
		out[i] = w.addition
	}
	return out
}

// choose is C(a, b) as a float64, from the log-factorials.
func (s *space) choose(a, b int) float64 { return dist.Exp(s.logChoose(a, b)) }

func sum(xs []int) int {
	t := 0
	for _, x := range xs {
		t += x
	}
	return t
}

// finishWork is the planned work of combining the last layer's states with
// the deferred scores' deals, in cells' worth, keeping the deals of each
// bucket for finish; it stops counting, and says so with false, beyond
// limit.
func (p *plan) finishWork(limit int) (work int, ok bool) {
	s := p.s
	if limit < 0 {
		return 0, false
	}
	room := make([]int, len(s.sizes))
	ok = true
	p.ways = map[string][]addition{}
	s.countVectors(s.n, func(counts []int) bool {
		for i, c := range counts {
			room[i] = s.sizes[i] - c
		}
		cells, _ := s.boxSize(counts, s.n)
		adds := p.additions(room, (limit-work)/max(cells*finishCost, 1)+1)
		if work = min(work+product(product(cells, len(adds)), finishCost), tooMany); adds == nil || work > limit {
			ok = false
		}
		p.ways[countsKey(counts)] = adds
		return ok
	})
	return work, ok
}

// finish turns the last layer into the distribution of T, dealing the
// deferred scores into each state's room on the way (and telling progress
// as the buckets are done).
func (p *plan) finish(ctx context.Context, last []*bucket, st *scratch, progress Progress) (*Distribution, error) {
	s := p.s
	k := len(s.sizes)
	mass := newTable(1024, nil) // T's probabilities: T < 2⁶² is never the empty key
	x := make([]int64, k)
	for j, b := range last {
		adds := []addition{{sums: make([]int64, k), p: 1}}
		if s.deferred {
			adds = p.ways[countsKey(b.counts)] // listed for every count vector of the last layer when the plan was costed
		}
		err := b.each(ctx, s.total(s.n), st.sum, func(q float64) {
			for i, y := range st.sum[:k] {
				x[i] = int64(b.counts[i])*p.base + p.g*y
			}
			for _, a := range adds {
				var t int64
				for i, w := range s.weight {
					v := x[i] + a.sums[i]
					t += w * v * v
				}
				mass.add(uint64(t), float64(q*a.p)) // no fused multiply-add: the same bytes on every platform
			}
		})
		if err != nil {
			return nil, err
		}
		if progress != nil && s.deferred {
			progress(s.n+(s.all-s.n)*(j+1)/len(last), s.all)
		}
	}
	keys := make([]uint64, 0, mass.len()) // sorted as the layers' keys are, one sort in the module
	for _, e := range mass.slots {
		if e.key != empty {
			keys = append(keys, e.key)
		}
	}
	slices.Sort(keys)
	d := &Distribution{Stat: make([]int64, len(keys)), Prob: make([]float64, len(keys))}
	for i, t := range keys {
		d.Stat[i], d.Prob[i] = int64(t), mass.get(t)
	}
	return d, nil
}
