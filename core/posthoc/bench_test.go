package posthoc

import (
	"context"
	"math/rand/v2"
	"testing"

	"midrank/core/kruskal"
	"midrank/core/rank"
)

// All pairs of k = 10 groups with N = 100,000 values in all.
func BenchmarkCompareK10N100k(b *testing.B) {
	rng := rand.New(rand.NewPCG(5, 6))
	values := make([]float64, 100_000)
	groups := make([]int32, len(values))
	for i := range values {
		groups[i] = int32(i % 10)
		values[i] = float64(int((rng.NormFloat64()+float64(groups[i])/10)*100)) / 10
	}
	r := rank.Rank(values, groups, 10)
	h := kruskal.Compute(r.Sizes, r.RankSums, r.TieSum).H
	for _, method := range Methods {
		b.Run(string(method), func(b *testing.B) {
			for b.Loop() {
				if _, err := Compare(context.Background(), method, r, h, 0.95); err != nil {
					b.Fatal(err)
				}
			}
		})
	}
}
