package exact

import (
	"fmt"
	"slices"
	"testing"
)

// TestCountVectors: V(t) from the product of polynomials (kept up to the
// middle and read backwards beyond it) against every count vector
// enumerated, for odd and even totals.
func TestCountVectors(t *testing.T) {
	for _, sizes := range [][]int{{1, 1}, {2, 3}, {3, 3, 3}, {1, 2, 3, 4}, {5, 1, 4}, {6, 6, 6, 6}, {7, 2, 2, 1, 3}} {
		all := 0
		for _, n := range sizes {
			all += n
		}
		want := make([]float64, all+1)
		var walk func(i, sum int)
		walk = func(i, sum int) {
			if i == len(sizes) {
				want[sum]++
				return
			}
			for c := 0; c <= sizes[i]; c++ {
				walk(i+1, sum+c)
			}
		}
		walk(0, 0)
		got := countVectors(sizes)
		for total := range want {
			if got(total) != want[total] {
				t.Errorf("%v: V(%d) = %v, want %v", sizes, total, got(total), want[total])
			}
		}
	}
}

func ExampleScreen() {
	lim := Limits{MaxCells: 1 << 26, MaxStates: 1 << 22, MaxWork: 1e9}
	// three groups of 5, untied: within reach
	fmt.Println(Screen([]int{5, 5, 5}, slices.Repeat([]int{1}, 15), lim))
	// five groups of 200,000 values on 2,000 tied values: refused before any layer is planned (checked by
	// hand: the cuts, every 500 values, take about a 500th of all 200,001⁵ ≈ 3.2·10²⁶ count vectors)
	fmt.Println(Screen(slices.Repeat([]int{200_000}, 5), slices.Repeat([]int{500}, 2000), lim))
	// Output:
	// <nil>
	// the exact distribution is too large to compute here: at least 6.4e+23 deals of tie blocks, where 20 million fit
}
