package exact

import (
	"context"
	"maps"
	"slices"
)

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
	return &layer{s: s, t: t, byKey: map[uint64]*bucket{}, shape: s.newShape(false)}
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
