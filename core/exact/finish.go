package exact

import (
	"context"
	"slices"
)

// finish turns the last layer into the distribution of T, dealing the
// deferred scores into each state's room on the way (and telling progress
// as the buckets are done); minT and maxT bound T.
//
// T's probabilities are added up in an array by T − minT when T's range is
// small enough (see denseMass), else in a hash table (T < 2⁶² is never its
// empty key); each T's probability is added up in the same order either
// way, so the distribution is the same to the last bit.
func (p *plan) finish(ctx context.Context, last []*bucket, st *scratch, minT, maxT float64, progress Progress) (*Distribution, error) {
	s := p.s
	k := len(s.sizes)
	// each bucket's ways to deal the deferred scores (without them, one way
	// that adds nothing), and the sums to add up: its cells times its ways
	none := []addition{{sums: make([]int64, k), p: 1}}
	ways := make([][]addition, len(last))
	sums := 0
	for j, b := range last {
		ways[j] = none
		if s.deferred {
			ways[j] = p.ways[countsKey(b.counts)] // listed for every count vector of the last layer when the plan was costed
		}
		cells := len(b.p)
		if b.table != nil {
			cells = b.table.len()
		}
		sums += cells * len(ways[j])
	}
	var dense []float64
	var mass *table
	// (below 2⁵⁰ the bound on T is worked out without rounding)
	if span := maxT - minT + 1; maxT < 1<<50 && span < denseMass && span < float64(4*(sums+1024)) {
		dense = make([]float64, int(span))
	} else {
		mass = newTable(1024, nil)
	}
	x := make([]int64, k)
	var along alongRow
	lowest := int64(minT)
	for j, b := range last {
		adds := ways[j]
		if b.table != nil {
			err := b.each(ctx, s.total(s.n), st.sum, func(q float64) {
				for i, y := range st.sum[:k] {
					x[i] = int64(b.counts[i])*p.base + p.g*y
				}
				for _, a := range adds {
					if t := statistic(s.weight, x, a.sums); dense != nil {
						dense[t-lowest] += float64(q * a.p)
					} else {
						mass.add(uint64(t), float64(q*a.p))
					}
				}
			})
			if err != nil {
				return nil, err
			}
		}
		for w := b.walk(s.total(s.n), st.sum); b.table == nil && w.more(); w.next() {
			if w.row&0xffff == 0 && ctx.Err() != nil {
				return nil, ctx.Err()
			}
			cells, v := w.cells()
			along.start(p, b, w, v, adds)
			// two loops, so that the array's holds no call (in WebAssembly a
			// call in a loop costs every turn); no fused multiply-add in
			// q·a.p: the same bytes on every platform
			if dense != nil {
				for j, q := range cells {
					if q != 0 {
						c, cc := int64(j), int64(j)*int64(j)*along.m-lowest
						for i, a := range adds {
							dense[along.k[i]+c*along.l[i]+cc] += float64(q * a.p)
						}
					}
				}
				continue
			}
			for j, q := range cells {
				if q != 0 {
					c, cc := int64(j), int64(j)*int64(j)*along.m
					for i, a := range adds {
						mass.add(uint64(along.k[i]+c*along.l[i]+cc), float64(q*a.p))
					}
				}
			}
		}
		if progress != nil && s.deferred {
			progress(s.n+(s.all-s.n)*(j+1)/len(last), s.all)
		}
	}
	d := &Distribution{}
	if dense != nil { // every probability added is above 0, so the Ts reached are those above 0
		reached := 0
		for _, q := range dense {
			if q != 0 {
				reached++
			}
		}
		d.Stat, d.Prob = make([]int64, 0, reached), make([]float64, 0, reached)
		for t, q := range dense {
			if q != 0 {
				d.Stat, d.Prob = append(d.Stat, lowest+int64(t)), append(d.Prob, q)
			}
		}
		return d, nil
	}
	keys := make([]uint64, 0, mass.len()) // sorted as the layers' keys are, one sort in the module
	for _, e := range mass.slots {
		if e.key != empty {
			keys = append(keys, e.key)
		}
	}
	slices.Sort(keys)
	d.Stat, d.Prob = make([]int64, len(keys)), make([]float64, len(keys))
	for i, t := range keys {
		d.Stat[i], d.Prob[i] = int64(t), mass.get(t)
	}
	return d, nil
}

// denseMass bounds T's range for its probabilities to be added up in an
// array by T (8 bytes a value of T, 8 MB at most): an array's cell costs a
// few times less than a hash table's probe while the array stays in the
// processor's caches (with 2²² values, 32 MB, three groups of 15 with two
// tied pairs took 1.0–1.5 times as long as with the table). The range is
// also kept below four times the states and deals to be added up, so that
// small computations do not pay for walking a large array. A variable so
// that tests can turn the arrays off.
var denseMass = float64(1 << 20)

// statistic is T = Σ wᵢ·(xᵢ + aᵢ)².
func statistic(w, x, a []int64) (t int64) {
	for i, wi := range w {
		v := x[i] + a[i]
		t += wi * v * v
	}
	return t
}

// alongRow holds T along a row of an array bucket, for each way a to deal
// the deferred scores: at the row's cell c, where group k−2 holds u + g·c
// and the last group z − g·c (u and z with a's additions, on the scale of
// the scores), T = K_a + c·L_a + c²·M, with
//
//	K_a = Σ_{i<k−2} wᵢ(xᵢ + aᵢ)² + w_{k−2}·u² + w_{k−1}·z²,
//	L_a = 2g·(w_{k−2}·u − w_{k−1}·z),  M = g²·(w_{k−2} + w_{k−1}),
//
// so that a cell costs a product and two sums a way. (The terms may wrap
// around 2⁶⁴ on their own; T, below 2⁶², comes out right, as Go's integers
// wrap.)
type alongRow struct {
	k, l []int64
	m    int64
}

// start works out the terms for the row w walks, whose first cell holds v
// in group k−2.
func (r *alongRow) start(p *plan, b *bucket, w *rows, v int64, adds []addition) {
	s := p.s
	n := len(s.sizes)
	q, last := n-2, n-1
	wq, wl := s.weight[q], s.weight[last]
	r.k, r.l = r.k[:0], r.l[:0]
	r.m = p.g * p.g * (wq + wl)
	u0 := int64(b.counts[q])*p.base + p.g*v
	z0 := int64(b.counts[last])*p.base + p.g*(w.rest-v)
	for _, a := range adds {
		var c int64
		for i := range q {
			xi := int64(b.counts[i])*p.base + p.g*w.sums[i] + a.sums[i]
			c += s.weight[i] * xi * xi
		}
		u, z := u0+a.sums[q], z0+a.sums[last]
		r.k = append(r.k, c+wq*u*u+wl*z*z)
		r.l = append(r.l, 2*p.g*(wq*u-wl*z))
	}
}
