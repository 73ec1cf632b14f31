package exact

import (
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
