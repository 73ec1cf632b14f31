package bootstrap

import (
	"context"
	"fmt"
	"runtime"
	"testing"

	"midrank/core/rank"
)

// plantGrowth is R's PlantGrowth (datasets package): weight by group.
var plantGrowth = [][]float64{
	{4.17, 5.58, 5.18, 6.11, 4.50, 4.61, 5.17, 4.53, 5.33, 5.14},
	{4.81, 4.17, 4.41, 3.59, 5.87, 3.83, 6.03, 4.89, 4.32, 4.69},
	{6.31, 5.12, 5.54, 5.50, 5.37, 5.29, 4.92, 6.15, 5.80, 5.26},
}

func ranked(groups [][]float64) rank.Ranking {
	var values []float64
	var labels []int32
	for g, vs := range groups {
		for _, v := range vs {
			values, labels = append(values, v), append(labels, int32(g))
		}
	}
	return rank.Rank(values, labels, len(groups))
}

// The interval depends on the seed and the resamples only, not on how many
// goroutines draw them.
func TestSameOnAnyNumberOfWorkers(t *testing.T) {
	r := ranked(plantGrowth)
	many, err := EpsilonSquared(context.Background(), r, 500, 7)
	if err != nil {
		t.Fatal(err)
	}
	defer runtime.GOMAXPROCS(runtime.GOMAXPROCS(1))
	one, err := EpsilonSquared(context.Background(), r, 500, 7)
	if err != nil {
		t.Fatal(err)
	}
	if one != many {
		t.Errorf("one worker %+v, several %+v", one, many)
	}
}

func TestIntervals(t *testing.T) {
	for _, c := range []struct {
		name           string
		groups         [][]float64
		low, high, max float64 // the interval lies in [low, high] and is at most max wide
	}{
		// every group constant and different: every resample is the data itself, ε² = H/(N−1) = 1
		{"separated constant groups", [][]float64{{1, 1, 1}, {2, 2, 2}, {3, 3, 3}}, 1, 1, 0},
		// one value shared by all but one: resamples that draw only the shared value give 0
		{"one odd value", [][]float64{{5, 5, 5}, {5, 5, 9}, {5, 5, 5}}, 0, 1, 1},
		{"R's PlantGrowth", plantGrowth, 0, 1, 0.7},
	} {
		ci, err := EpsilonSquared(context.Background(), ranked(c.groups), 1000, 1)
		if err != nil {
			t.Fatal(err)
		}
		if ci.Low < c.low || ci.High > c.high || ci.Low > ci.High || ci.High-ci.Low > c.max {
			t.Errorf("%s: %+v", c.name, ci)
		}
	}
}

func TestStops(t *testing.T) {
	ctx, cancel := context.WithCancel(context.Background())
	cancel()
	if _, err := EpsilonSquared(ctx, ranked(plantGrowth), 1000, 1); err == nil {
		t.Error("a cancelled run gave an interval")
	}
}

// ExampleEpsilonSquared: R's PlantGrowth; the independent numpy/scipy
// implementation gives 0.068 to 0.633 at 20,000 resamples
// (testdata/reference/epsilon_bootstrap.tsv).
func ExampleEpsilonSquared() {
	ci, err := EpsilonSquared(context.Background(), ranked(plantGrowth), 2000, 1)
	if err != nil {
		panic(err)
	}
	fmt.Printf("%.0f%% interval for ε² from %d resamples: %.2f to %.2f\n", 100*ci.Level, ci.Resamples, ci.Low, ci.High)
	// Output: 95% interval for ε² from 2000 resamples: 0.07 to 0.63
}

// BenchmarkTenThousand: the interval of the largest sample that gets all
// 2,000 resamples (10,000 values in 5 groups, values to 2 decimals).
func BenchmarkTenThousand(b *testing.B) {
	groups := make([][]float64, 5)
	for i := range 10_000 {
		g := i % 5
		groups[g] = append(groups[g], float64((i*7919)%3000)/100+float64(g))
	}
	r := ranked(groups)
	for b.Loop() {
		if _, err := EpsilonSquared(context.Background(), r, 2000, 1); err != nil {
			b.Fatal(err)
		}
	}
}
