package trend

import (
	"context"

	"midrank/core/montecarlo"
	"midrank/core/random"
	"midrank/core/rank"
)

// MonteCarlo estimates the permutation p-value of an observed 2J for the
// alternative by dealing the values to the groups at random, resamples
// times: p̂ = (b+1)/(B+1), b the deals at least as extreme (increasing:
// 2J at least the observed; decreasing: at most; two-sided: at least as far
// from 2E(J) either way), with the 99% Clopper–Pearson interval, drawn in
// seeded chunks by montecarlo.Estimate as the H test's Monte Carlo method
// is, so the answer depends only on the seed and the number of resamples.
func MonteCarlo(ctx context.Context, r rank.Ranking, observed int64, alt Alternative, resamples int, seed uint64, progress montecarlo.Progress) (montecarlo.Result, error) {
	n := len(r.Sorted)
	var across int64 // 2·Σ_{i<j} nᵢnⱼ = 4E(J)
	for _, s := range r.Sizes {
		across += int64(s) * int64(n-s)
	}
	extreme := func(x int64) bool {
		switch alt {
		case Increasing:
			return x >= observed
		case Decreasing:
			return x <= observed
		}
		// two-sided: |2J − 2E(J)| ≥ |observed − 2E(J)|, in units of ½ to stay whole
		return abs(2*x-across) >= abs(2*observed-across)
	}
	return montecarlo.Estimate(ctx, resamples, seed, progress, func() montecarlo.Chunk {
		c := newCounter(r)
		groups := make([]int32, n)
		return func(g *random.Xoshiro, count int) int {
			copy(groups, r.Groups) // each chunk starts from the groups as observed
			b := 0
			for range count {
				for i := n - 1; i > 0; i-- { // Fisher–Yates
					j := int(g.Below(uint32(i + 1)))
					groups[i], groups[j] = groups[j], groups[i]
				}
				if extreme(c.doubled(groups)) {
					b++
				}
			}
			return b
		}
	})
}

func abs(x int64) int64 {
	if x < 0 {
		return -x
	}
	return x
}
