package exact

import (
	"context"
	"fmt"
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
	}
	for _, c := range cases {
		b.Run(fmt.Sprint(c.sizes, c.name), func(b *testing.B) {
			b.ReportAllocs()
			for b.Loop() {
				if _, err := Permutation(context.Background(), c.sizes, c.blocks, benchLimits, nil); err != nil {
					b.Fatal(err)
				}
			}
		})
	}
}
