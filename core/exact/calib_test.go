package exact

import (
	"context"
	"testing"
)

// TestEstimateStates: the estimate stays within a factor of 20 of the
// largest layer actually built, so the pre-check in Permutation (refuse at
// 20 × MaxStates) never refuses a feasible computation.
func TestEstimateStates(t *testing.T) {
	for _, c := range []struct {
		sizes  []int
		blocks []Block
	}{
		{[]int{10, 10, 10}, untied(30)}, {[]int{6, 6, 6, 6}, untied(24)}, {[]int{5, 5, 5}, untied(15)},
		{[]int{3, 6, 9}, untied(18)}, {[]int{6, 6, 6, 6}, distinct(24, 5)}, {[]int{8, 8, 8}, distinct(24, 3)},
		{[]int{3, 7, 12}, untied(22)},
	} {
		largest := 0
		// hash tables (no cells), so that the layers hold just the states reached
		lim := Limits{MaxStates: 1 << 24, layer: func(_, n int) { largest = max(largest, n) }}
		if _, err := Permutation(context.Background(), c.sizes, c.blocks, lim, nil); err != nil {
			t.Fatal(err)
		}
		est := EstimateStates(c.sizes, c.blocks)
		if r := est / float64(largest); r > 20 || r < 1.0/20 {
			t.Errorf("sizes %v, %d blocks: estimate %.0f, largest layer %d", c.sizes, len(c.blocks), est, largest)
		}
	}
}
