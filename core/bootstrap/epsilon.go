// Package bootstrap gives the percentile bootstrap interval of the rank
// effect size ε² of the Kruskal–Wallis test.
//
// Each resample draws, within every group, as many values as the group has,
// with replacement, from that group's own values (a stratified bootstrap:
// the design's group sizes are kept; Davison & Hinkley 1997, Bootstrap
// Methods and their Application, §3.2), ranks the N values drawn together
// with midranks and computes ε² = H/(N − 1) with the tie correction. The
// interval runs between the (1−level)/2 and (1+level)/2 quantiles of the B
// values of ε², by linear interpolation between order statistics (Hyndman
// & Fan 1996, type 7; the percentile method, Efron & Tibshirani 1993, An
// Introduction to the Bootstrap, §13.3).
//
// Resample b is drawn from its own stream random.New(seed, Stream+b), so the
// interval depends only on the data, the seed and B, not on how many
// goroutines share the work, and differs from the Monte Carlo p-value's
// streams of the same seed.
package bootstrap

import (
	"context"
	"runtime"
	"slices"
	"sync"
	"sync/atomic"

	"midrank/core/describe"
	"midrank/core/kruskal"
	"midrank/core/random"
	"midrank/core/rank"
)

// Stream is the first stream of the bootstrap's resamples, far from the
// Monte Carlo p-value's streams 0, 1, 2, … of the same seed.
const Stream = 1 << 62

// Level is the interval's confidence level.
const Level = 0.95

// Interval is a percentile bootstrap interval of ε².
type Interval struct {
	Low       float64 `json:"low"`
	High      float64 `json:"high"`
	Level     float64 `json:"level"`
	Resamples int     `json:"resamples"`
	Seed      uint64  `json:"seed"`
}

// sample is the ranked data as the resamples need it: for each group, the
// tie block (distinct value, in ascending order) of each of its values.
type sample struct {
	blocks  int
	members [][]int32
	n       int
}

func newSample(r rank.Ranking) sample {
	s := sample{members: make([][]int32, len(r.Sizes)), n: len(r.Sorted)}
	for i, j := range r.Blocks() {
		for _, g := range r.Groups[i:j] {
			s.members[g] = append(s.members[g], int32(s.blocks))
		}
		s.blocks++
	}
	return s
}

// resampler holds one goroutine's working memory.
type resampler struct {
	s      sample
	counts []int32
	mid    []float64
	drawn  []int32
	sums   []float64
	sizes  []int
}

func newResampler(s sample) *resampler {
	sizes := make([]int, len(s.members))
	for g, m := range s.members {
		sizes[g] = len(m)
	}
	return &resampler{s: s, counts: make([]int32, s.blocks), mid: make([]float64, s.blocks),
		drawn: make([]int32, s.n), sums: make([]float64, len(s.members)), sizes: sizes}
}

// epsilon draws one resample from g and returns its ε².
func (r *resampler) epsilon(g *random.Xoshiro) float64 {
	clear(r.counts)
	at := 0
	for _, m := range r.s.members {
		n := uint32(len(m))
		// two draws from each 64 random bits, each by Lemire's method
		for k := 0; k < len(m); k += 2 {
			bits := g.Uint64()
			for j, half := range [2]uint32{uint32(bits >> 32), uint32(bits)} {
				if k+j == len(m) {
					break
				}
				prod := uint64(half) * uint64(n) // Lemire's method, written out as random.Reject asks
				if uint32(prod) < n {
					prod = g.Reject(prod, n)
				}
				d := m[prod>>32]
				r.drawn[at] = d
				r.counts[d]++
				at++
			}
		}
	}
	var below, tieSum float64
	for d, c := range r.counts {
		fc := float64(c)
		r.mid[d] = below + (fc+1)/2
		below += fc
		tieSum += fc*fc*fc - fc
	}
	n := float64(r.s.n)
	if tieSum == n*n*n-n { // every value drawn is the same: no difference to see
		return 0
	}
	at = 0
	for g, m := range r.s.members {
		r.sums[g] = 0
		for range m {
			r.sums[g] += r.mid[r.drawn[at]]
			at++
		}
	}
	return kruskal.EpsilonSquared(kruskal.Compute(r.sizes, r.sums, tieSum).H, r.s.n)
}

// EpsilonSquared draws B resamples of the ranked data and returns the
// percentile interval of ε² at Level. It stops with ctx.
func EpsilonSquared(ctx context.Context, r rank.Ranking, resamples int, seed uint64) (Interval, error) {
	s := newSample(r)
	values := make([]float64, resamples)
	var next atomic.Int64
	var wg sync.WaitGroup
	for range min(runtime.GOMAXPROCS(0), resamples) {
		wg.Go(func() {
			rs := newResampler(s)
			for ctx.Err() == nil {
				b := int(next.Add(1) - 1)
				if b >= resamples {
					return
				}
				values[b] = rs.epsilon(random.New(seed, Stream+uint64(b)))
			}
		})
	}
	wg.Wait()
	if err := ctx.Err(); err != nil {
		return Interval{}, err
	}
	slices.Sort(values)
	return Interval{Low: describe.Quantile(values, (1-Level)/2), High: describe.Quantile(values, (1+Level)/2),
		Level: Level, Resamples: resamples, Seed: seed}, nil
}
