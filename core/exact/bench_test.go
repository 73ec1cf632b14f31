package exact

import (
	"context"
	"errors"
	"fmt"
	"slices"
	"testing"
)

// untied returns blocks of the scores 0 … n−1.
func untied(n int) []Block {
	b := make([]Block, n)
	for i := range b {
		b[i] = Block{int64(i), 1}
	}
	return b
}

// distinct returns n scores spread over v equal-sized tied values, as on a
// rating scale.
func distinct(n, v int) []Block {
	b := make([]Block, v)
	for i := range b {
		b[i] = Block{int64(i), n / v}
	}
	for i := 0; i < n%v; i++ {
		b[i].Count++
	}
	return b
}

// tiedPairs returns the scores of ranks 1 … n (as Scores makes them from
// doubled midranks) with a tied pair at each rank in at and the one after it,
// as when a few values are recorded to whole minutes.
func tiedPairs(n int, at ...int) []Block { return tiedRuns(n, 2, at...) }

// tiedRuns returns the scores of ranks 1 … n with a tie of size equal values
// from each rank in at.
func tiedRuns(n, size int, at ...int) []Block {
	var doubled []int64
	var counts []int
	for r := 1; r <= n; r++ {
		if slices.Contains(at, r) {
			doubled, counts = append(doubled, int64(2*r+size-1)), append(counts, size)
			r += size - 1
			continue
		}
		doubled, counts = append(doubled, int64(2*r)), append(counts, 1)
	}
	b, _, _ := Scores(doubled, counts)
	return b
}

// benchLimits are the budgets of an explicit request (core.ExactCells and
// core.ExactStates), so that each case runs as it would for a user.
var benchLimits = Limits{MaxCells: 40_000_000, MaxStates: 4_000_000}

func BenchmarkPermutation(b *testing.B) {
	cases := []struct {
		sizes  []int
		blocks []Block
		name   string
	}{
		{[]int{10, 10, 10}, untied(30), ""},
		{[]int{15, 15, 15}, untied(45), ""},
		{[]int{6, 6, 6, 6}, untied(24), ""},
		{[]int{8, 8, 8, 8}, untied(32), ""},
		{[]int{4, 4, 4, 4, 4}, untied(20), ""},
		{[]int{5, 5, 5, 5, 5}, untied(25), ""},
		{[]int{6, 6, 6, 6}, distinct(24, 5), "-5-tied-values"},
		// a few tied pairs (issue: within 1.5× of untied data)
		{[]int{6, 6, 6, 6}, tiedPairs(24, 10), "-1-pair"},
		{[]int{6, 6, 6, 6}, tiedPairs(24, 3, 11), "-2-pairs"},
		{[]int{6, 6, 6, 6}, tiedPairs(24, 3, 7, 11, 15, 19), "-5-pairs"},
		{[]int{8, 8, 8, 8}, tiedPairs(32, 10), "-1-pair"},
		{[]int{8, 8, 8, 8}, tiedPairs(32, 3, 21), "-2-pairs"},
		{[]int{15, 15, 15}, tiedPairs(45, 20), "-1-pair"},
		{[]int{15, 15, 15}, tiedPairs(45, 9, 30), "-2-pairs"},
		{[]int{15, 15, 15}, tiedPairs(45, 3, 9, 20, 30, 40), "-5-pairs"},
		{[]int{8, 8, 8, 8}, tiedPairs(32, 3, 9, 15, 21, 27), "-5-pairs"},
		{[]int{5, 5, 5, 5, 5}, tiedPairs(25, 10), "-1-pair"},
		{[]int{5, 5, 5, 5, 5}, tiedPairs(25, 3, 21), "-2-pairs"},
		{[]int{5, 5, 5, 5, 5}, tiedPairs(25, 3, 7, 11, 15, 19), "-5-pairs"},
		// a few triples
		{[]int{6, 6, 6, 6}, tiedRuns(24, 3, 8, 16), "-2-triples"},
		{[]int{8, 8, 8, 8}, tiedRuns(32, 3, 8, 20), "-2-triples"},
		{[]int{5, 5, 5, 5, 5}, tiedRuns(25, 3, 8, 16), "-2-triples"},
		{[]int{15, 15, 15}, tiedRuns(45, 3, 10, 30), "-2-triples"},
	}
	for _, c := range cases {
		b.Run(fmt.Sprint(c.sizes, c.name), func(b *testing.B) {
			b.ReportAllocs()
			for b.Loop() {
				_, err := Permutation(context.Background(), c.sizes, c.blocks, benchLimits, nil)
				var tooLarge *TooLargeError
				if errors.As(err, &tooLarge) {
					b.Skip("refused:", err) // (8,8,8,8) and (5,5,5,5,5) with five tied pairs: beyond the budget
				}
				if err != nil {
					b.Fatal(err)
				}
			}
		})
	}
}
