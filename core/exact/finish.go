package exact

import (
	"context"
	"slices"
)

// finish turns the last layer into the distribution of T, dealing the
// deferred scores into each state's room on the way (and telling progress
// as the buckets are done); minT and maxT bound T.
func (p *plan) finish(ctx context.Context, last []*bucket, st *scratch, minT, maxT float64, progress Progress) (*Distribution, error) {
	s := p.s
	k := len(s.sizes)
	// T's probabilities, in an array by T − minT when T's range is small
	// enough, else in a hash table (T < 2⁶² is never its empty key); each
	// T's probability is added up in the same order either way
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
	lowest := int64(minT)
	x := make([]int64, k)
	for j, b := range last {
		adds := ways[j]
		err := b.each(ctx, s.total(s.n), st.sum, func(q float64) {
			for i, y := range st.sum[:k] {
				x[i] = int64(b.counts[i])*p.base + p.g*y
			}
			// two loops, so that the array's holds no call (in WebAssembly a
			// call in a loop costs every turn); no fused multiply-add in
			// q·a.p: the same bytes on every platform
			if dense != nil {
				for _, a := range adds {
					dense[statistic(s.weight, x, a.sums)-lowest] += float64(q * a.p)
				}
				return
			}
			for _, a := range adds {
				mass.add(uint64(statistic(s.weight, x, a.sums)), float64(q*a.p))
			}
		})
		if err != nil {
			return nil, err
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
