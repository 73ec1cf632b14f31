package exact

import (
	"fmt"

	"midrank/core/display"
)

// screenWork bounds the work of the screen itself, k·N additions: beyond it
// (say 10,000 groups, or 50 groups of 20,000 values) the exact method is out
// of reach anyway, and refusing at once keeps the refusal cheap.
const screenWork = 50_000_000

// saturate caps the counts of the screen: far beyond any budget, and far
// from overflowing float64.
const saturate = 1e30

// hashCost is what a move of a state in a hash table costs in time against a
// cell of an array (a probe and a scattered write against a step of a
// straight loop), for the budget Limits.MaxWork; measured here at 8 to 12.
const hashCost = 10

// dealCost is what a deal of a tie block to a bucket costs in time against a
// cell of an array (working out its weight and its bucket, a look-up in a
// map), for each group, for the budget Limits.MaxWork; measured here at 8 to
// 12 a group.
const dealCost = 10

// rowCost is what laying out a row to count its cells costs in time against
// a cell of an array, for the budget Limits.MaxWork; measured here at 5 to 8.
const rowCost = 8

// hashBucket is what a bucket of hash tables costs in memory, in states (a
// state takes about 48 bytes at the peak): its header, slices and map entry,
// and a table of 16 slots, about 600 bytes in all.
const hashBucket = 12

// planBuckets bounds the count vectors that the planner may walk over all
// layers (each takes it about 50 to 100 ns natively): 20 million is one to two
// seconds.
const planBuckets = 20_000_000

// bucketCost is what the planner's visit to a bucket costs in time against
// a cell of an array, for the budget Limits.MaxWork; measured here at 3 to 5.
const bucketCost = 4

// screen refuses, in time linear in k·N and before any layer is planned, a
// computation whose layers must exceed lim: a layer after t scores holds at
// least one state for each canonical count vector, and there are at least
//
//	V(t)/∏ mⱼ!
//
// of them, V(t) the number of count vectors (c₁ … c_k), 0 ≤ cᵢ ≤ nᵢ, adding
// up to t — the coefficient of xᵗ in ∏ᵢ (1 + x + … + x^nᵢ) — and mⱼ the
// number of groups of each size, whose orders canonical order merges. The
// planner walks these vectors one by one, so without this screen it alone
// could run for minutes on large samples.
func (s *space) screen(lim Limits) error {
	k := len(s.sizes)
	if k*s.n > screenWork {
		return &TooLargeError{fmt.Sprintf("%d groups and %d values are beyond the exact method here", k, s.n)}
	}
	vectors := countVectors(s.sizes)
	merged := 1.0
	for i := range s.sizes {
		if i > 0 && s.class[i] != i {
			merged = float64(merged * (float64(i - s.class[i] + 1)))
		}
	}
	var peak, largest, total, before, deals float64
	for _, t := range s.cuts {
		layer := vectors(t) / merged
		peak, largest, total = max(peak, before+layer), max(largest, layer), total+layer
		before = layer
		deals += vectors(t) // each count vector is reached by a deal of its own, before canonical order merges it
	}
	if cost := float64(dealCost * k); lim.MaxWork > 0 && float64(deals*cost) > float64(lim.MaxWork) {
		return &TooLargeError{"at least " + display.Rough(deals) + " deals of tie blocks, where " + display.Rough(float64(lim.MaxWork)/cost) + " fit"}
	}
	room := float64(1 + s.bucketRoom) // a bucket of arrays: at least a cell, and its own room
	walk := float64(planBuckets)
	if lim.MaxWork > 0 {
		walk = min(walk, float64(lim.MaxWork)/bucketCost)
	}
	if total > walk {
		return &TooLargeError{"at least " + display.Rough(total) + " states in all, where " + display.Rough(walk) + " fit"}
	}
	arrays := float64(peak*room) <= float64(lim.MaxCells) && (lim.MaxWork == 0 || total <= float64(lim.MaxWork))
	tables := float64(largest*(1+hashBucket)) <= float64(2*float64(lim.MaxStates)) && (lim.MaxWork == 0 || float64(total*hashCost) <= float64(lim.MaxWork))
	if !arrays && !tables {
		return &TooLargeError{"at least " + display.Rough(largest) + " states in the largest layer and " + display.Rough(total) + " in all"}
	}
	return nil
}

// countVectors gives V(t), the number of count vectors (c₁ … c_k), 0 ≤ cᵢ ≤
// nᵢ, adding up to t: the coefficient of xᵗ in ∏ᵢ (1 + x + … + x^nᵢ),
// capped at saturate. The product is built one group at a time, multiplying
// by 1 + … + x^n being a moving sum over a window of n+1 coefficients. Each
// factor reads the same backwards, so their product does, V(t) = V(N − t)
// with N = Σ nᵢ: only the coefficients up to the middle are made (the
// coefficient at t is made of those below it alone), which halves the
// screen's time and memory (16 MB for a million values before).
func countVectors(sizes []int) func(t int) float64 {
	all := 0
	for _, n := range sizes {
		all += n
	}
	half := all / 2
	v := make([]float64, half+1)
	next := make([]float64, half+1)
	v[0] = 1
	degree := 0
	for _, n := range sizes {
		degree += n
		window := 0.0
		for t := 0; t <= min(degree, half); t++ {
			window += v[t]
			if t > n {
				window -= v[t-n-1]
			}
			next[t] = min(window, saturate)
		}
		v, next = next, v
	}
	return func(t int) float64 {
		if t > half {
			t = all - t
		}
		return v[t]
	}
}
