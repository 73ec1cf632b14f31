package exact

import (
	"context"
	"fmt"

	"midrank/core/display"
	"midrank/core/dist"
)

// scratch holds what the dealing works in, made once for a computation.
type scratch struct {
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

func (s *space) newScratch() *scratch {
	k := len(s.sizes)
	slope := make([]int64, k)
	slope[k-2], slope[k-1] = 1, -1
	return &scratch{sum: make([]int64, k), d: make([]int, k), c2: make([]int, k), s2: make([]int64, k), recv: make([]receiver, k), slope: slope, slope2: make([]int64, k), kept: make([]bool, k), after: make([]int, k+1)}
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
func (s *space) moves(from *bucket, b Block, st *scratch, next *layer, use func([]move) error) error {
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
func (s *space) deal(ctx context.Context, from *bucket, b Block, dealt int, st *scratch, next *layer) error {
	if b.Count == 1 && s.dense {
		return s.dealOne(ctx, from, b.Score, dealt, st, next)
	}
	total := s.total(dealt)
	if !s.dense {
		k := len(s.sizes)
		return s.moves(from, b, st, next, func(moves []move) error {
			if next.reached > s.maxStates {
				return &TooLargeError{fmt.Sprintf("more than %s states after %d of %d values", display.Rough(float64(s.maxStates)), dealt, s.n)}
			}
			// a hash table's work is its states times their moves: bounded as it goes
			if s.work += hashCost * len(moves) * from.states(); s.maxWork > 0 && s.work > s.maxWork {
				return &TooLargeError{fmt.Sprintf("more than %s moves of states after %d of %d values", display.Rough(float64(s.maxWork/hashCost)), dealt, s.n)}
			}
			for _, mv := range moves {
				err := from.each(ctx, total, st.sum, func(p float64) {
					for i := range k {
						st.c2[i] = from.counts[i] + mv.d[i]
						st.s2[i] = st.sum[i] + int64(mv.d[i])*b.Score
					}
					s.arrange(st.c2, st.s2)
					mv.to.add(mv.to.index(st.s2), float64(p*mv.w))
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
func (s *space) spread(st *scratch, counts []int, moves []move, score int64, cells []float64, from, rest int64) {
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
