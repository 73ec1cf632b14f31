package exact

import "midrank/core/display"

// plan is one way to run a computation: the space of its layers (which
// holds the scores dealt in them, in order, on their own scale) and the
// deferred ones.
type plan struct {
	s       *space
	fig     figures
	late    []Block // dealt last, x
	base, g int64   // x = base + g·y for the scores of the layers
	work    int     // of the last step, in cells' worth (in fig.boxCells)
	// ways are the deals of the late blocks into each bucket of the last
	// layer, by its counts (see countsKey), listed when the plan is costed
	ways map[string][]addition
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

// choose plans the computation by rule, refusing with a *TooLargeError when
// no plan keeps within lim.
//
// With deferred scores the layers may deal the others in any order in
// which the scores dealt are a run of the sorted ones (see windows): the
// states of a layer depend only on the scores dealt so far, and a tie block
// dealt last leaves a gap in them, whose cost (a wider spread of sums)
// starts at the layer where the gap is first bridged. So an order that
// bridges it later costs less: measured on four groups of 8 with one tied
// pair at ranks 10–11, 52 million states reached ascending and 43 million
// from the top, against 39 million untied.
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
	if len(plans) == 2 && plans[1].fig.boxCells < plans[0].fig.boxCells {
		plans[0], plans[1] = plans[1], plans[0]
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
// them under rules from deferredOnly on), keeps the one whose boxes have the
// fewest cells, and gives up (nil) once its boxes' cells and its last step
// would cost more than limit.
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
			p, err = &plan{s: s, late: deferred, base: base, g: g, fig: fig}, errBoxes
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
// a stretch of blocks whose scores follow one another without a gap (the
// first, the longest, the last), the stretch first, then the neighbouring
// stretches one by one, the longer of the two next to the run so far first.
// A gap (the scores of the tied pairs dealt last, or a tie block's) widens
// the spread of the sums of every layer that holds scores on both sides of
// it, so the orders differ in how late they bridge the gaps. The first order
// is the ascending one. (At most three, each costed by its boxes: data with
// gaps everywhere, as on a scale, has as many stretches as blocks.)
func windows(blocks []Block) [][]Block {
	var starts, sizes []int // each stretch's first block, and its scores
	longest := 0
	for i, b := range blocks {
		if i == 0 || b.Score-blocks[i-1].Score > 1 {
			starts, sizes = append(starts, i), append(sizes, 0)
		}
		if sizes[len(sizes)-1] += b.Count; sizes[len(sizes)-1] > sizes[longest] {
			longest = len(sizes) - 1
		}
	}
	starts = append(starts, len(blocks))
	orders := make([][]Block, 0, 3)
	for i, r := range []int{0, longest, len(sizes) - 1} {
		if i > 0 && (r == 0 || (i == 2 && r == longest)) {
			continue // already listed
		}
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
		return &TooLargeError{"about " + display.Rough(float64(p.fig.cells)) + " states and deals in all, where " + display.Rough(float64(lim.MaxWork)) + " fit"}
	}
	return nil
}
