package trend

import (
	"context"
	"errors"
	"slices"

	"midrank/core/montecarlo"
	"midrank/core/random"
	"midrank/core/rank"
)

// MonteCarlo estimates the permutation p-value of an observed 2J for the
// alternative by dealing the values to the groups at random, resamples
// times: p̂ = (b+1)/(B+1), b the deals at least as extreme (increasing:
// 2J at least the observed; decreasing: at most; two-sided: at least as far
// from 2E(J) either way), with the 99% Clopper–Pearson interval, drawn in
// seeded chunks by montecarlo.EstimateJob as the H test's Monte Carlo method
// is (shared with a farm's helpers when ctx has one), so the answer depends
// only on the seed and the number of resamples.
func MonteCarlo(ctx context.Context, r rank.Ranking, observed int64, alt Alternative, resamples int, seed uint64, progress montecarlo.Progress) (montecarlo.Result, error) {
	groups := make([]int64, len(r.Groups))
	for i, g := range r.Groups {
		groups[i] = int64(g)
	}
	var ends []int64
	for _, j := range r.Blocks() {
		ends = append(ends, int64(j))
	}
	job := montecarlo.Job{Kind: jobKind, Resamples: resamples, Seed: seed, Lists: map[string][]int64{
		"groups": groups, "ends": ends, "params": {observed, int64(slices.Index(Alternatives, alt)), int64(len(r.Sizes))}}}
	return montecarlo.EstimateJob(ctx, job, progress)
}

// jobKind is the kind of MonteCarlo's jobs for a farm: lists "groups" (the
// group of each value, smallest value first), "ends" (where each block of
// tied values ends) and "params" (the observed 2J, the alternative's place
// in Alternatives, the number of groups).
const jobKind = "trend"

func init() { montecarlo.Register(jobKind, chunks) }

// chunks is the montecarlo.Maker of MonteCarlo's jobs.
func chunks(lists map[string][]int64) (func() montecarlo.Chunk, error) {
	observed, params, ends := lists["groups"], lists["params"], lists["ends"]
	if len(params) != 3 || params[1] < 0 || params[1] >= int64(len(Alternatives)) || params[2] < 2 || params[2] > int64(len(observed)) {
		return nil, errors.New("trend: the job's parameters are out of range")
	}
	k, n := int(params[2]), len(observed)
	sizes := make([]int64, k)
	groups := make([]int32, n)
	for i, g := range observed {
		if g < 0 || g >= int64(k) {
			return nil, errors.New("trend: a value of the job is in no group")
		}
		groups[i] = int32(g)
		sizes[g]++
	}
	var blockEnds []int
	last := 0
	for _, e := range ends {
		if e <= int64(last) || e > int64(n) {
			return nil, errors.New("trend: the job's blocks of ties are out of order")
		}
		last = int(e)
		blockEnds = append(blockEnds, last)
	}
	if last != n {
		return nil, errors.New("trend: the job's blocks of ties do not cover its values")
	}
	var across int64 // 2·Σ_{i<j} nᵢnⱼ = 4E(J)
	for _, s := range sizes {
		across += s * (int64(n) - s)
	}
	extreme := extremeness(params[0], Alternatives[params[1]], across)
	return func() montecarlo.Chunk {
		c := &counter{ends: blockEnds, below: make([]int64, k), in: make([]int64, k)}
		dealt := make([]int32, n)
		return func(g *random.Xoshiro, count int) int {
			copy(dealt, groups) // each chunk starts from the groups as observed
			b := 0
			for range count {
				for i := n - 1; i > 0; i-- { // Fisher–Yates
					// Lemire's method, written out as random.Reject asks
					prod, r := (g.Uint64()>>32)*uint64(i+1), uint32(i+1)
					if uint32(prod) < r {
						prod = g.Reject(prod, r)
					}
					j := int(prod >> 32)
					dealt[i], dealt[j] = dealt[j], dealt[i]
				}
				if extreme(c.doubled(dealt)) {
					b++
				}
			}
			return b
		}
	}, nil
}

// extremeness tells a 2J at least as extreme as the observed one for the
// alternative; across is 4E(J).
func extremeness(observed int64, alt Alternative, across int64) func(int64) bool {
	return func(x int64) bool {
		switch alt {
		case Increasing:
			return x >= observed
		case Decreasing:
			return x <= observed
		}
		// two-sided: |2J − 2E(J)| ≥ |observed − 2E(J)|, in units of ½ to stay whole
		return abs(2*x-across) >= abs(2*observed-across)
	}
}

func abs(x int64) int64 {
	if x < 0 {
		return -x
	}
	return x
}
