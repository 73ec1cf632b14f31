// Package rank gives observations their midranks: tied values share the mean
// of the positions they occupy, so the ranks of n values always sum to
// n(n+1)/2 (Kruskal & Wallis 1952, §1.3; common practice).
package rank

import (
	"math"
	"slices"
)

// Tie is a value shared by two or more observations.
type Tie struct {
	Value float64 `json:"value"`
	Count int     `json:"count"`
}

// Ranking holds the midranks of a set of values.
type Ranking struct {
	Ranks  []float64 // rank of each value, in input order
	Order  []int32   // indices of the values in ascending order, ties in input order
	Sorted []float64 // the values in ascending order: Sorted[i] = values[Order[i]]
	Ties   []Tie     // the tied values in ascending order
	// TieSum is Σ(t³−t) over the tie blocks, t the size of each block; it is
	// the term of the tie correction 1 − TieSum/(N³−N).
	TieSum float64
}

// Midranks ranks values in ascending order. Values must not be NaN; -0 and +0
// must already be the same value (the table reader stores both as +0).
//
// It runs in linear time: a least-significant-digit radix sort on the
// float64 bit patterns, made monotone by flipping (Herf 2001, "Radix
// tricks"), followed by one pass over the sorted order.
func Midranks(values []float64) Ranking {
	n := len(values)
	order, keys := sortedOrder(values)
	r := Ranking{Ranks: make([]float64, n), Order: order, Sorted: make([]float64, n)}
	for i, k := range keys {
		r.Sorted[i] = fromSortKey(k)
	}
	for i := 0; i < n; {
		j := i + 1
		for j < n && keys[j] == keys[i] {
			j++
		}
		// positions i+1 … j share their mean
		mid := float64(i+1+j) / 2
		for _, idx := range order[i:j] {
			r.Ranks[idx] = mid
		}
		if t := j - i; t > 1 {
			r.Ties = append(r.Ties, Tie{Value: r.Sorted[i], Count: t})
			ft := float64(t)
			r.TieSum += ft*ft*ft - ft
		}
		i = j
	}
	return r
}

// sortKey maps a float64 to a uint64 whose unsigned order is the numeric
// order: positive numbers get their sign bit set, negative ones all bits flipped.
func sortKey(v float64) uint64 {
	b := math.Float64bits(v)
	if b>>63 == 1 {
		return ^b
	}
	return b | 1<<63
}

// fromSortKey inverts sortKey.
func fromSortKey(k uint64) float64 {
	if k>>63 == 1 {
		return math.Float64frombits(k &^ (1 << 63))
	}
	return math.Float64frombits(^k)
}

const (
	digitBits = 11
	buckets   = 1 << digitBits
	passes    = (64 + digitBits - 1) / digitBits
	// below this many values a comparison sort beats the radix histograms
	smallSort = 256
)

// sortedOrder returns the indices of values in ascending order, equal values
// in index order (a stable sort), and the sort keys in that order.
func sortedOrder(values []float64) (order []int32, sortedKeys []uint64) {
	n := len(values)
	idx := make([]int32, n)
	for i := range idx {
		idx[i] = int32(i)
	}
	if n < smallSort {
		slices.SortStableFunc(idx, func(a, b int32) int {
			va, vb := values[a], values[b]
			switch {
			case va < vb:
				return -1
			case va > vb:
				return 1
			}
			return 0
		})
		keys := make([]uint64, n)
		for i, j := range idx {
			keys[i] = sortKey(values[j])
		}
		return idx, keys
	}
	keys := make([]uint64, n)
	var count [passes][buckets]int32
	for i, v := range values {
		k := sortKey(v)
		keys[i] = k
		for p := range passes {
			count[p][(k>>(p*digitBits))&(buckets-1)]++
		}
	}
	keys2 := make([]uint64, n)
	idx2 := make([]int32, n)
	for p := range passes {
		c := &count[p]
		shift := p * digitBits
		if c[(keys[0]>>shift)&(buckets-1)] == int32(n) {
			continue // every key has the same digit here: the pass changes nothing
		}
		var sum int32
		for d := range c {
			sum, c[d] = sum+c[d], sum
		}
		for i, k := range keys {
			d := (k >> shift) & (buckets - 1)
			at := c[d]
			c[d]++
			keys2[at] = k
			idx2[at] = idx[i]
		}
		keys, keys2 = keys2, keys
		idx, idx2 = idx2, idx
	}
	return idx, keys
}
