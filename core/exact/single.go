package exact

import (
	"context"
)

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
func (s *space) dealOne(ctx context.Context, from *bucket, score int64, dealt int, st *scratch, next *layer) error {
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
	total := s.total(dealt)
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
func (s *space) receive(st *scratch, score int64, cells []float64, from, rest int64) {
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
			addAlong(rc.p, rc.off, row, dRow, v, dv, cells[x:x+end], float64(float64(m)*rc.w))
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
				to[i] += float64(p * w)
			}
			return
		}
		for _, p := range cells {
			if p != 0 {
				dst[at] += float64(p * w)
			}
			at += step
		}
		return
	}
	for _, p := range cells {
		if p != 0 {
			dst[off[row]+int(v)] += float64(p * w)
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
