// Package rank gives observations their midranks: tied values share the mean
// of the positions they occupy, so the ranks of n values always sum to
// n(n+1)/2 (Kruskal & Wallis 1952, §1.3; common practice).
//
// The values are sorted once, each carrying the number of its group, and
// everything else (rank sums, the tie table, any value's rank) is read from
// that sorted sequence, so no pass jumps about in memory.
package rank

import (
	"iter"
	"math"
	"runtime"
	"slices"
	"sort"
	"unsafe"

	"midrank/core/internal/cores"
)

// Tie is a value shared by two or more observations.
type Tie struct {
	Value float64 `json:"value"`
	Count int     `json:"count"`
}

// Ranking is a ranked sample of k groups.
type Ranking struct {
	Sorted []float64 // the values in ascending order
	Groups []int32   // the group of each sorted value; equal values keep input order
	Sizes  []int     // values per group
	// RankSums are the groups' sums of midranks.
	RankSums []float64
	Ties     []Tie // the tied values in ascending order
	// TieSum is Σ(t³−t) over the tie blocks, t the size of each block; it is
	// the term of the tie correction 1 − TieSum/(N³−N).
	TieSum float64
}

// Rank ranks values that belong to groups 0 … k−1. Values must not be NaN;
// -0 and +0 must already be the same value (the table reader stores both as
// +0).
//
// It runs in linear time: a least-significant-digit radix sort on the
// float64 bit patterns, made monotone by flipping (Herf 2001, "Radix
// tricks"), followed by one pass over the sorted sequence.
func Rank(values []float64, groups []int32, k int) Ranking {
	r := Ranking{Sizes: make([]int, k), RankSums: make([]float64, k)}
	r.Sorted, r.Groups = sortTagged(values, groups)
	for i, j := range r.Blocks() {
		mid := Midrank(i, j)
		for _, g := range r.Groups[i:j] {
			r.Sizes[g]++
			r.RankSums[g] += mid
		}
		if t := j - i; t > 1 {
			r.Ties = append(r.Ties, Tie{Value: r.Sorted[i], Count: t})
			ft := float64(t)
			r.TieSum += float64(ft*ft*ft) - ft
		}
	}
	return r
}

// Blocks yields the tie blocks of the sorted values, in ascending order:
// positions i … j−1 (from 0) hold one value.
func (r Ranking) Blocks() iter.Seq2[int, int] {
	return func(yield func(int, int) bool) {
		n := len(r.Sorted)
		for i := 0; i < n; {
			j := i + 1
			for j < n && r.Sorted[j] == r.Sorted[i] {
				j++
			}
			if !yield(i, j) {
				return
			}
			i = j
		}
	}
}

// Midrank is the rank shared by positions i … j−1 (from 0): the mean of the
// ranks i+1 … j.
func Midrank(i, j int) float64 { return float64(i+1+j) / 2 }

// Midranks returns the midrank of each value, in input order.
func Midranks(values []float64) []float64 {
	r := Rank(values, make([]int32, len(values)), 1)
	ranks := make([]float64, len(values))
	for i, v := range values {
		ranks[i], _ = r.RankOf(v)
	}
	return ranks
}

// RankOf returns the midrank of a value of the sample and how many values
// share it (1 if it is untied), by binary search in the sorted values.
func (r Ranking) RankOf(v float64) (rank float64, shared int) {
	lo := sort.SearchFloat64s(r.Sorted, v)
	hi := lo
	for hi < len(r.Sorted) && hi-lo < 64 && r.Sorted[hi] == v {
		hi++
	}
	if hi-lo == 64 { // a long tie block: search for its end
		hi = lo + sort.Search(len(r.Sorted)-lo, func(i int) bool { return r.Sorted[lo+i] > v })
	}
	return float64(lo+1+hi) / 2, hi - lo
}

// Key maps a float64 (not NaN) to a uint64 whose unsigned order is the
// numeric order: positive numbers get their sign bit set, negative ones all
// bits flipped. -0 sorts just below +0.
func Key(v float64) uint64 {
	b := math.Float64bits(v)
	if b>>63 == 1 {
		return ^b
	}
	return b | 1<<63
}

// FromKey inverts Key.
func FromKey(k uint64) float64 {
	if k>>63 == 1 {
		return math.Float64frombits(k &^ (1 << 63))
	}
	return math.Float64frombits(^k)
}

const (
	digitBits = 11
	buckets   = 1 << digitBits
	passes    = (64 + digitBits - 1) / digitBits // 6, unrolled in sortTagged
	// below this many values a comparison sort beats the radix histograms
	smallSort = 256
)

// sortTagged sorts values ascending, carrying each value's tag along;
// equal values keep their input order (the sort is stable).
func sortTagged(values []float64, tags []int32) ([]float64, []int32) {
	n := len(values)
	if n < smallSort {
		idx := make([]int32, n)
		for i := range idx {
			idx[i] = int32(i)
		}
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
		sorted, sortedTags := make([]float64, n), make([]int32, n)
		for i, j := range idx {
			sorted[i], sortedTags[i] = values[j], tags[j]
		}
		return sorted, sortedTags
	}
	keys, keys2 := make([]uint64, n), make([]uint64, n)
	tags, tags2 := slices.Clone(tags), make([]int32, n)
	if cores.Several && n >= halvesFrom && runtime.GOMAXPROCS(0) >= 2 {
		return sortInHalves(values, keys, keys2, tags, tags2)
	}
	var count [passes][buckets]int32
	histogram(values, keys, &count)
	keys, tags = radix(keys, keys2, tags, tags2, &count, trivial(keys[0], &count, nil, n))
	return decode(keys), tags
}

// histogram fills keys with the values' keys and count with how many keys
// have each digit in each pass.
func histogram(values []float64, keys []uint64, count *[passes][buckets]int32) {
	for i, v := range values {
		k := Key(v)
		keys[i] = k
		// unrolled, with constant shifts: the masks prove every index in
		// range, so the compiler drops the bounds checks
		count[0][k&(buckets-1)]++
		count[1][(k>>digitBits)&(buckets-1)]++
		count[2][(k>>(2*digitBits))&(buckets-1)]++
		count[3][(k>>(3*digitBits))&(buckets-1)]++
		count[4][(k>>(4*digitBits))&(buckets-1)]++
		count[5][(k>>(5*digitBits))&(buckets-1)]++
	}
}

// trivial tells, for each pass, whether every one of the n keys has the
// digit of key there (counted in count, and in more when it is not nil):
// such a pass changes nothing and is skipped.
func trivial(key uint64, count, more *[passes][buckets]int32, n int) (skip [passes]bool) {
	for p := range passes {
		d := (key >> (p * digitBits)) & (buckets - 1)
		c := count[p][d]
		if more != nil {
			c += more[p][d]
		}
		skip[p] = c == int32(n)
	}
	return skip
}

// radix sorts keys, carrying tags, by the passes not skipped, using keys2
// and tags2 as the other side of each pass; it returns the side that holds
// the result, which count (turned into offsets) no longer describes.
func radix(keys, keys2 []uint64, tags, tags2 []int32, count *[passes][buckets]int32, skip [passes]bool) ([]uint64, []int32) {
	for p := range passes {
		if skip[p] {
			continue
		}
		c := &count[p]
		shift := p * digitBits
		var sum int32
		for d := range c {
			sum, c[d] = sum+c[d], sum
		}
		for i, k := range keys {
			d := (k >> shift) & (buckets - 1)
			at := c[d]
			c[d]++
			keys2[at] = k
			tags2[at] = tags[i]
		}
		keys, keys2 = keys2, keys
		tags, tags2 = tags2, tags
	}
	return keys, tags
}

// decode turns sorted keys back into their values, in place: the float64s
// reuse the keys' memory.
func decode(keys []uint64) []float64 {
	sorted := unsafe.Slice((*float64)(unsafe.Pointer(unsafe.SliceData(keys))), len(keys))
	for i, k := range keys {
		sorted[i] = FromKey(k)
	}
	return sorted
}
