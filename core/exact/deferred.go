package exact

import (
	"context"
	"encoding/binary"
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

// countsKey is a map key of a bucket's counts.
func countsKey(counts []int) string {
	var key []byte
	for _, c := range counts {
		key = binary.AppendUvarint(key, uint64(c))
	}
	return string(key)
}

// maxDeferred bounds the deferred scores: their deals into a bucket's room
// are listed one by one.
const maxDeferred = 12

// finishCost is what combining a state of the last layer with one way to
// deal the deferred scores costs against a cell of an array (k products and
// an entry in the distribution's table), for comparing plans and for Limits.MaxWork: measured here at
// 1 to 2 (the layers' cells cost more than their arithmetic, as each is
// dealt to every group).
const finishCost = 2

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
// as the buckets are done); minT and maxT bound T.
func (p *plan) finish(ctx context.Context, last []*bucket, st *scratch, minT, maxT float64, progress Progress) (*Distribution, error) {
	s := p.s
	k := len(s.sizes)
	// T's probabilities, in an array by T − minT when T's range is small
	// enough, else in a hash table (T < 2⁶² is never its empty key); each
	// T's probability is added up in the same order either way
	var dense []float64
	var mass *table
	if span := maxT - minT + 1; span < denseMass && span < float64(4*(p.finishes(last)+1024)) {
		dense = make([]float64, int(span))
	} else {
		mass = newTable(1024, nil)
	}
	lowest := int64(minT)
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
				if pt := float64(q * a.p); dense != nil { // no fused multiply-add: the same bytes on every platform
					dense[t-lowest] += pt
				} else {
					mass.add(uint64(t), pt)
				}
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

// finishes counts the sums finish adds up: each state of the last layer
// with each way to deal the deferred scores into its bucket's room.
func (p *plan) finishes(last []*bucket) int {
	n := 0
	for _, b := range last {
		cells := len(b.p)
		if b.table != nil {
			cells = b.table.len()
		}
		ways := 1
		if p.s.deferred {
			ways = len(p.ways[countsKey(b.counts)])
		}
		n += cells * ways
	}
	return n
}
