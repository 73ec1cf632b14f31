package random

import (
	"fmt"
	"testing"
)

// TestSplitMix64: the first outputs for seed 1234567, from the reference C
// code by Vigna (prng.di.unimi.it/splitmix64.c), as quoted in many
// implementations' tests (from memory; they are also pinned below so that a
// change of stream cannot go unnoticed).
func TestSplitMix64(t *testing.T) {
	x := uint64(1234567)
	want := []uint64{6457827717110365317, 3203168211198807973, 9817491932198370423, 4593380528125082431, 16408922859458223821}
	for i, w := range want {
		if got := SplitMix64(&x); got != w {
			t.Errorf("output %d = %d, want %d", i, got, w)
		}
	}
}

// TestStreamsArePinned: the generator's outputs are part of Midrank's promise
// (same seed, same p-value, everywhere). These values were recorded from this
// implementation when it was written; a change of stream must be deliberate.
func TestStreamsArePinned(t *testing.T) {
	g := New(1, 0)
	got := fmt.Sprint(g.Uint64(), g.Uint64(), g.Below(10), g.Below(1000), New(1, 7).Uint64())
	if want := "12966619160104079557 9600361134598540522 5 391 10061699674684240062"; got != want {
		t.Errorf("streams = %s, want %s", got, want)
	}
}

// TestBelowIsUniform: a chi-square check of 600,000 draws in [0, 6).
func TestBelowIsUniform(t *testing.T) {
	g := New(42, 0)
	var counts [6]float64
	const draws = 600000
	for range draws / 2 {
		x := g.Uint64()
		counts[g.Bounded(uint32(x>>32), 6)]++
		counts[g.Bounded(uint32(x), 6)]++
	}
	chi := 0.0
	for _, c := range counts {
		chi += (c - draws/6) * (c - draws/6) / (draws / 6)
	}
	// P(χ²(5) > 20.5) ≈ 0.001 (common practice: chi-square table)
	if chi > 20.5 {
		t.Errorf("chi-square %v over 6 cells: not uniform", chi)
	}
}
