package rank

import (
	"math/rand/v2"
	"testing"
)

func BenchmarkRank1M(b *testing.B) {
	rng := rand.New(rand.NewPCG(42, 7))
	values := make([]float64, 1_000_000)
	groups := make([]int32, len(values))
	for i := range values {
		values[i] = float64(int(rng.ExpFloat64()*300)) / 10
		groups[i] = int32(i % 5)
	}
	b.ReportAllocs()
	for b.Loop() {
		Rank(values, groups, 5)
	}
}
