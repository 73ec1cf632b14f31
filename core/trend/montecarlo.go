package trend

import (
	"context"
	"runtime"
	"sync"
	"sync/atomic"

	"midrank/core/dist"
	"midrank/core/montecarlo"
	"midrank/core/random"
	"midrank/core/rank"
)

// MonteCarlo estimates the permutation p-value of an observed 2J for the
// alternative by dealing the values to the groups at random, resamples
// times: p̂ = (b+1)/(B+1), b the deals at least as extreme (increasing:
// 2J at least the observed; decreasing: at most; two-sided: at least as far
// from 2E(J) either way), with the 99% Clopper–Pearson interval, as the H
// test's Monte Carlo method does (package montecarlo). Chunk c of
// montecarlo.ChunkSize deals draws from its own stream random.New(seed, c)
// starting from the groups as observed, so the answer depends only on the
// seed and the number of resamples. It stops with ctx; progress, when not
// nil, is told the deals done.
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
	chunks := (resamples + montecarlo.ChunkSize - 1) / montecarlo.ChunkSize
	var next, exceed, done atomic.Int64
	var wg sync.WaitGroup
	var report sync.Mutex
	for range min(runtime.GOMAXPROCS(0), chunks) {
		wg.Go(func() {
			c := newCounter(r)
			groups := make([]int32, n)
			for ctx.Err() == nil {
				chunk := int(next.Add(1) - 1)
				if chunk >= chunks {
					return
				}
				count := min(montecarlo.ChunkSize, resamples-chunk*montecarlo.ChunkSize)
				g := random.New(seed, uint64(chunk))
				copy(groups, r.Groups)
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
				exceed.Add(int64(b))
				finished := done.Add(int64(count))
				if progress != nil {
					report.Lock()
					progress(int(finished), resamples)
					report.Unlock()
				}
			}
		})
	}
	wg.Wait()
	if err := ctx.Err(); err != nil {
		return montecarlo.Result{}, err
	}
	b := int(exceed.Load())
	res := montecarlo.Result{Resamples: resamples, Seed: seed, Exceed: b, P: float64(b+1) / float64(resamples+1)}
	res.Low, res.High = dist.ClopperPearson(b, resamples, 1-montecarlo.Level)
	return res, nil
}

func abs(x int64) int64 {
	if x < 0 {
		return -x
	}
	return x
}
