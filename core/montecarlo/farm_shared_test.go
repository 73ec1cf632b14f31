package montecarlo_test

import (
	"context"
	"testing"

	"midrank/core/internal/localfarm"
	"midrank/core/montecarlo"
)

// TestFarmGivesTheSameEstimate: shared among 1 to 4 helpers (with the
// chunks split unevenly), the estimate is the one computed alone, to the
// last bit, and progress reaches the total.
func TestFarmGivesTheSameEstimate(t *testing.T) {
	sizes := []int{7, 8, 9}
	scores := []int64{0, 1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12, 13, 14, 15, 16, 17, 18, 19, 20, 21, 22, 23}
	observed := []int64{60, 90, 126}
	alone, err := montecarlo.PValue(context.Background(), sizes, scores, observed, 50_000, 11, nil)
	if err != nil {
		t.Fatal(err)
	}
	for helpers := 1; helpers <= 4; helpers++ {
		last := 0
		r, err := montecarlo.PValue(montecarlo.WithFarm(context.Background(), localfarm.Farm{N: helpers}), sizes, scores, observed, 50_000, 11, func(done, total int) { last = done })
		if err != nil {
			t.Fatal(err)
		}
		if r != alone {
			t.Errorf("%d helpers: %+v, alone %+v", helpers, r, alone)
		}
		if last != 50_000 {
			t.Errorf("%d helpers: progress ended at %d", helpers, last)
		}
	}
	// too few chunks to share: the farm is not asked
	few, _ := montecarlo.PValue(montecarlo.WithFarm(context.Background(), panicFarm{}), sizes, scores, observed, montecarlo.ChunkSize*(montecarlo.MinShared-1), 11, nil)
	if few.Resamples != montecarlo.ChunkSize*(montecarlo.MinShared-1) {
		t.Errorf("%+v", few)
	}
}

// panicFarm fails the test if it is asked for anything but its helpers.
type panicFarm struct{}

func (panicFarm) Helpers() int { return 3 }
func (panicFarm) Share([]byte, int, int) func() (int, error) {
	panic("a run of too few chunks was shared")
}
