package trend

import (
	"context"
	"fmt"
	"testing"
)

// BenchmarkExact: the exact distribution of J for four groups of 15
// (issue target: untied within 1 s natively, 3× that in the module), untied
// four groups of 10 and three of 30 on a five-point scale, and five groups
// of 8 on a seven-point scale (four groups of 15 on a five-point scale are
// beyond the budget: the normal approximation or Monte Carlo serve).
func BenchmarkExact(b *testing.B) {
	for _, c := range []struct {
		sizes  []int
		levels int // 0: untied
	}{{[]int{15, 15, 15, 15}, 0}, {[]int{10, 10, 10, 10}, 5}, {[]int{30, 30, 30}, 5}, {[]int{8, 8, 8, 8, 8}, 7}} {
		var values []float64
		var groups []int32
		for g, n := range c.sizes {
			for i := range n {
				v := float64(len(values))
				if c.levels > 0 {
					v = float64((len(values)*7 + i) % c.levels)
				}
				values, groups = append(values, v), append(groups, int32(g))
			}
		}
		r := ranked(values, groups, len(c.sizes))
		b.Run(fmt.Sprint(c.sizes, "-", c.levels, "-levels"), func(b *testing.B) {
			for b.Loop() {
				if _, err := Exact(context.Background(), r); err != nil {
					b.Fatal(err)
				}
			}
		})
	}
}

// BenchmarkMonteCarlo: 200,000 deals of 100 values in four groups on a
// ten-point scale, as resamples per second.
func BenchmarkMonteCarlo(b *testing.B) {
	var values []float64
	var groups []int32
	for i := range 100 {
		values, groups = append(values, float64((i*37)%10+i%4)), append(groups, int32(i%4))
	}
	r := ranked(values, groups, 4)
	const resamples = 200_000
	for b.Loop() {
		if _, err := MonteCarlo(context.Background(), r, 5000, Increasing, resamples, 1, nil); err != nil {
			b.Fatal(err)
		}
	}
	b.ReportMetric(resamples*float64(b.N)/b.Elapsed().Seconds(), "resamples/s")
}
