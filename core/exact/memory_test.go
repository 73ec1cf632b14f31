package exact

import (
	"context"
	"runtime"
	"testing"
)

// TestPlanBoundsMemory: the heap that a layer takes once it is built (after
// a collection, less what was in use before) stays within the room that the
// plan counts for it: 8 bytes a cell, two cells a row and two more a row of
// its widest bucket, bucketRoom cells a bucket and fixedRoom cells whatever
// the layers. The cases are the shapes of real data: untied scores, a five-point
// rating scale and yes/no answers, where buckets hold a state or two each
// and their own room is most of the cost. The rule checked is this
// project's own budget, not an outside value.
func TestPlanBoundsMemory(t *testing.T) {
	cases := []struct {
		name   string
		sizes  []int
		blocks []Block
	}{
		{"untied (12,12,12)", []int{12, 12, 12}, untied(36)},
		{"rating scale (20,20,20)", []int{20, 20, 20}, distinct(60, 5)},
		{"rating scale (8,8,8,8)", []int{8, 8, 8, 8}, distinct(32, 5)},
		{"yes/no (300,300,300)", []int{300, 300, 300}, distinct(900, 2)},
		{"yes/no (60,70,80,90)", []int{60, 70, 80, 90}, distinct(300, 2)},
	}
	for _, c := range cases {
		s, err := newSpace(c.sizes, countsOf(c.blocks), 0)
		if err != nil {
			t.Fatal(err)
		}
		lim := Limits{MaxCells: 40_000_000, MaxStates: 4_000_000}
		if fig, err := s.boxes(lim, c.blocks, c.blocks); err != nil {
			t.Fatal(err)
		} else if _, err := s.settle(lim, fig); err != nil || !s.dense {
			t.Fatalf("%s: %v, arrays %v", c.name, err, s.dense)
		}
		var m runtime.MemStats
		runtime.GC()
		runtime.ReadMemStats(&m)
		base := m.HeapAlloc
		worst := 0.0
		watchLayers(t, func(l *layer) {
			planned, widest := l.cells+s.fixedRoom, 0
			for _, b := range l.byKey {
				rows := len(b.first) - 1
				planned, widest = planned+2*rows+s.bucketRoom, max(widest, rows)
			}
			planned += 2 * widest
			runtime.GC()
			runtime.ReadMemStats(&m)
			used := float64(m.HeapAlloc) - float64(base)
			worst = max(worst, used/(8*float64(planned)))
		})
		if _, err := Permutation(context.Background(), c.sizes, c.blocks, lim, nil); err != nil {
			t.Fatal(err)
		}
		if worst > 1 {
			t.Errorf("%s: a layer took %.2f times the room planned for it", c.name, worst)
		}
		t.Logf("%s: at most %.2f of the planned room", c.name, worst)
	}
}
