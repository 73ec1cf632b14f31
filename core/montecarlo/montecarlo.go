// Package montecarlo estimates the permutation p-value of the
// Kruskal–Wallis statistic by dealing the observed scores into groups at
// random, for samples whose exact distribution is too large to compute.
//
// The estimate is p̂ = (b+1)/(B+1), b the number of the B resamples whose
// statistic reaches the observed one; counting the observed deal itself keeps
// p̂ above zero and makes the test exact at its level (Davison & Hinkley 1997,
// Bootstrap Methods and their Application, §4.2.1; North, Curtis & Sham 2002,
// AJHG 71(2), 439–441). The interval is the 99% Clopper–Pearson interval for
// the true permutation p-value given b of B.
//
// Resamples are drawn in chunks of ChunkSize, chunk c from its own stream
// random.New(seed, c) starting from the scores in their given order, so the
// answer depends only on the seed and the number of resamples, never on how
// many goroutines share the work.
package montecarlo

import (
	"context"
	"runtime"
	"sync"
	"sync/atomic"

	"midrank/core/dist"
	"midrank/core/random"
)

// ChunkSize is the number of resamples drawn from one stream.
const ChunkSize = 4096

// Level is the confidence level of the interval.
const Level = 0.99

// Result is a Monte Carlo estimate.
type Result struct {
	Resamples int     // B
	Seed      uint64  // the seed of the streams
	Exceed    int     // b, the resamples whose statistic reached the observed one
	P         float64 // (b+1)/(B+1)
	Low, High float64 // the 99% Clopper–Pearson interval for the permutation p-value
}

// Progress is told how many resamples are done.
type Progress func(done, total int)

// PValue estimates the probability that a random deal of the scores into
// groups of the given sizes (taking the scores in turn) has a statistic
// X = Σ sᵢ²/nᵢ at least that of the observed group sums, sᵢ the sum of the
// scores dealt to group i; X orders deals as H does, and the comparison is
// exact (see reach). It stops with ctx.
// A Farm in ctx shares the chunks (see EstimateJob).
func PValue(ctx context.Context, sizes []int, scores []int64, observedSums []int64, resamples int, seed uint64, progress Progress) (Result, error) {
	return EstimateJob(ctx, hJob(sizes, scores, observedSums, resamples, seed), progress)
}

// Chunk draws count random deals from g and says how many are at least as
// extreme as the observed one.
type Chunk func(g *random.Xoshiro, count int) int

// Estimate draws resamples random deals in chunks of ChunkSize, chunk c
// from its own stream random.New(seed, c), shared among the cores, each
// worker with its own Chunk from newChunk, and gives p̂ = (b+1)/(B+1) with
// its interval. It stops with ctx; progress, when not nil, is told the
// deals done.
func Estimate(ctx context.Context, resamples int, seed uint64, progress Progress, newChunk func() Chunk) (Result, error) {
	chunks := (resamples + ChunkSize - 1) / ChunkSize
	var next, exceed, done atomic.Int64
	var wg sync.WaitGroup
	var report sync.Mutex // progress is called by one worker at a time
	for range min(runtime.GOMAXPROCS(0), chunks) {
		wg.Go(func() {
			chunk := newChunk()
			for ctx.Err() == nil {
				c := int(next.Add(1) - 1)
				if c >= chunks {
					return
				}
				count := min(ChunkSize, resamples-c*ChunkSize)
				exceed.Add(int64(chunk(random.New(seed, uint64(c)), count)))
				finished := done.Add(int64(count))
				if progress != nil {
					report.Lock()
					progress(int(finished), resamples)
					report.Unlock()
				}
			}
		})
	}
	wg.Wait()
	if err := ctx.Err(); err != nil {
		return Result{}, err
	}
	return resultOf(resamples, seed, int(exceed.Load())), nil
}

// resultOf is the estimate from b of B resamples reaching the observed
// statistic.
func resultOf(resamples int, seed uint64, b int) Result {
	r := Result{Resamples: resamples, Seed: seed, Exceed: b, P: float64(b+1) / float64(resamples+1)}
	r.Low, r.High = dist.ClopperPearson(b, resamples, 1-Level)
	return r
}

// dealer holds one worker's two copies of the scores and their group sums.
type dealer struct {
	sizes        []int
	scores       []int64
	a, b         []int64
	sumsA, sumsB []int64
	total        int64
}

func newDealer(sizes []int, scores []int64, total int64) *dealer {
	n, k := len(scores), len(sizes)
	return &dealer{sizes: sizes, scores: scores, total: total,
		a: make([]int64, n), b: make([]int64, n), sumsA: make([]int64, k), sumsB: make([]int64, k)}
}

// chunk draws count deals from g and returns how many reach observed. Each
// deal is a partial Fisher–Yates shuffle (Knuth, TAOCP 3.4.2, algorithm P):
// position i takes a score drawn from positions i…N−1; the last group gets
// what is left, so it needs no draws. Deals are made two at a time on two
// copies of the scores, each 64-bit draw giving 32 bits to each (reduced to
// the range by Lemire's method written out, see random.Reject): the two
// chains of swaps do not wait for each other, so the processor overlaps
// them. When count is odd, the second deal of the last pair is made but not
// counted.
func (d *dealer) chunk(g *random.Xoshiro, count int, target *reach) int {
	copy(d.a, d.scores)
	copy(d.b, d.scores)
	a, b := d.a, d.b
	n := len(a)
	last := len(d.sizes) - 1
	hits := 0
	for done := 0; done < count; done += 2 {
		pos := 0
		restA, restB := d.total, d.total
		for gi, size := range d.sizes[:last] {
			var sa, sb int64
			for end := pos + size; pos < end; pos++ {
				x := g.Uint64()
				r := uint32(n - pos)
				p1, p2 := uint64(uint32(x>>32))*uint64(r), uint64(uint32(x))*uint64(r)
				if uint32(p1) < r {
					p1 = g.Reject(p1, r)
				}
				if uint32(p2) < r {
					p2 = g.Reject(p2, r)
				}
				j, k := pos+int(p1>>32), pos+int(p2>>32)
				a[pos], a[j] = a[j], a[pos]
				b[pos], b[k] = b[k], b[pos]
				sa += a[pos]
				sb += b[pos]
			}
			d.sumsA[gi], d.sumsB[gi] = sa, sb
			restA -= sa
			restB -= sb
		}
		d.sumsA[last], d.sumsB[last] = restA, restB
		if target.reaches(d.sumsA) {
			hits++
		}
		if done+1 < count && target.reaches(d.sumsB) {
			hits++
		}
	}
	return hits
}
