// Package localfarm is a montecarlo.Farm of goroutines in this process,
// each part going through the job's JSON as the page's workers receive it:
// for the tests that check that a shared estimate is the one made alone.
package localfarm

import (
	"context"

	"midrank/core/montecarlo"
)

// Farm has N helpers.
type Farm struct{ N int }

// Helpers is N.
func (f Farm) Helpers() int { return f.N }

// Share runs the part in a goroutine.
func (f Farm) Share(job []byte, from, to int) func() (int, error) {
	done := make(chan struct{})
	var n int
	var err error
	go func() {
		defer close(done)
		var j montecarlo.Job
		if j, err = montecarlo.ParseJob(job); err == nil {
			n, err = montecarlo.Part(context.Background(), j, from, to)
		}
	}()
	return func() (int, error) { <-done; return n, err }
}
