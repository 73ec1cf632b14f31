package exact

// shape is a dense bucket's layout as layout finds it, and its scratch.
type shape struct {
	lo, hi      []int64 // the box
	first, off  []int   // see bucket; not kept when counting
	cells, rows int     // laid out so far
	counting    bool    // only the cells and rows are wanted (planning): no row table
	sums        []int64
	part        []int64    // for each set of subsets: the sum of its groups but the first
	bound       [4][]int64 // and the least and greatest sum of its groups, then of them and group k−2
}

// newShape makes the scratch of layout; counting, it keeps no row table.
func (s *space) newShape(counting bool) *shape {
	k := len(s.sizes)
	sh := &shape{lo: make([]int64, k), hi: make([]int64, k), sums: make([]int64, k), part: make([]int64, len(s.subsets)), counting: counting}
	for i := range sh.bound {
		sh.bound[i] = make([]int64, len(s.subsets))
	}
	return sh
}

// row adds a row whose group k−2 has the sums a … b (none when a > b).
func (sh *shape) row(a, b int64) {
	n := sh.cells
	sh.rows++
	if a <= b {
		sh.cells += int(b - a + 1)
	} else {
		a = 0 // an empty row starts where the next one does
	}
	if !sh.counting {
		sh.off, sh.first = append(sh.off, n-int(a)), append(sh.first, sh.cells)
	}
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
	sh.first, sh.off, sh.cells, sh.rows = append(sh.first[:0], 0), sh.off[:0], 0, 0
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
		bound[0][j], bound[1][j] = s.least(t, c), s.most(t, c)
		bound[2][j], bound[3][j] = s.least(t, c+counts[q]), s.most(t, c+counts[q])
	}
	total := s.total(t)
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
	return sh.cells, sh.rows
}
