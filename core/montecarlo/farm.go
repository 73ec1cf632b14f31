package montecarlo

import (
	"cmp"
	"context"
	"errors"
	"strconv"

	"midrank/core/jsonlite"
	"midrank/core/random"
)

// A Farm runs parts of a Monte Carlo estimate elsewhere: in the page, the
// other Web Workers, each with its own copy of the module, where the one
// running the analysis has a single thread. Share hands over the chunks
// [from, to) of a job (as Job.JSON writes it) and returns a function that
// waits for the count of their deals that reach the observed statistic.
// Since chunk c always draws from stream random.New(seed, c), the estimate
// is the same to the last bit however the chunks are shared.
type Farm interface {
	Helpers() int // how many others can take a part
	Share(job []byte, from, to int) (wait func() (int, error))
}

type farmKey struct{}

// WithFarm gives PValue a farm to share its chunks with.
func WithFarm(ctx context.Context, f Farm) context.Context {
	return context.WithValue(ctx, farmKey{}, f)
}

// MinShared is the fewest chunks an estimate must have to be shared: below
// it, handing the work over costs more than it saves.
const MinShared = 8

// Job is what a part of PValue's estimate needs: the deal and the observed
// group sums, the seed and the resamples (which fix the chunks).
type Job struct {
	Sizes     []int
	Scores    []int64
	Observed  []int64
	Resamples int
	Seed      uint64
}

// JSON writes the job as {"sizes", "scores", "observed", "resamples", "seed"}.
func (j Job) JSON() []byte {
	var w jsonlite.Writer
	w.Grow(24 * len(j.Scores))
	w.BeginObject()
	w.Key("sizes")
	w.BeginArray()
	for _, s := range j.Sizes {
		w.Int(int64(s))
	}
	w.EndArray()
	for _, list := range []struct {
		name   string
		values []int64
	}{{"scores", j.Scores}, {"observed", j.Observed}} {
		w.Key(list.name)
		w.BeginArray()
		for _, v := range list.values {
			w.Int(v)
		}
		w.EndArray()
	}
	w.IntMember("resamples", j.Resamples)
	w.Key("seed")
	w.Uint(j.Seed)
	w.EndObject()
	return w.Bytes()
}

// ParseJob reads a job that JSON wrote.
func ParseJob(b []byte) (Job, error) {
	n, err := jsonlite.ParseTree(b, 2)
	if err != nil {
		return Job{}, err
	}
	var j Job
	whole := func(name string) (int64, error) {
		m, ok := n.Member(name)
		if !ok {
			return 0, errors.New("montecarlo: the job has no " + name)
		}
		return strconv.ParseInt(m.Text, 10, 64)
	}
	list := func(name string) ([]int64, error) {
		m, _ := n.Member(name)
		out := make([]int64, len(m.Items))
		for i, item := range m.Items {
			v, err := strconv.ParseInt(item.Text, 10, 64)
			if err != nil {
				return nil, errors.New("montecarlo: the job's " + name + " are not whole numbers")
			}
			out[i] = v
		}
		return out, nil
	}
	sizes, err := list("sizes")
	if err == nil {
		j.Scores, err = list("scores")
	}
	if err == nil {
		j.Observed, err = list("observed")
	}
	var resamples, seed int64
	if err == nil {
		resamples, err = whole("resamples")
	}
	if err == nil {
		seed, err = whole("seed")
	}
	if err != nil {
		return Job{}, err
	}
	total := 0
	for _, s := range sizes {
		if s < 1 || s > int64(len(j.Scores)) {
			return Job{}, errors.New("montecarlo: a group size of the job is out of range")
		}
		j.Sizes = append(j.Sizes, int(s))
		total += int(s)
	}
	if len(j.Sizes) < 2 || total != len(j.Scores) || len(j.Observed) != len(j.Sizes) || resamples < 1 || seed < 0 {
		return Job{}, errors.New("montecarlo: the job's sizes, scores and sums do not match")
	}
	j.Resamples, j.Seed = int(resamples), uint64(seed)
	return j, nil
}

// Part counts the deals of chunks [from, to) of a job that reach its
// observed sums: a farm's share of PValue's work.
func Part(ctx context.Context, j Job, from, to int) (int, error) {
	target, err := j.target()
	if err != nil {
		return 0, err
	}
	if from < 0 || to > j.chunks() || from > to {
		return 0, errors.New("montecarlo: chunks " + strconv.Itoa(from) + " to " + strconv.Itoa(to) + " are not among the job's " + strconv.Itoa(j.chunks()))
	}
	return run(ctx, j, j.newChunk(target), from, to, nil)
}

// shared runs PValue's chunks on the farm's helpers and here: equal runs
// of chunks, the first kept here, whose progress stands for all.
func shared(ctx context.Context, f Farm, j Job, target *reach, progress Progress) (Result, error) {
	chunks, parts := j.chunks(), f.Helpers()+1
	bound := func(i int) int { return chunks * i / parts }
	encoded := j.JSON()
	waits := make([]func() (int, error), 0, parts-1)
	for i := 1; i < parts; i++ {
		waits = append(waits, f.Share(encoded, bound(i), bound(i+1)))
	}
	var scaled Progress
	if progress != nil {
		scaled = func(done, _ int) { progress(min(done*parts, j.Resamples), j.Resamples) }
	}
	exceed, err := run(ctx, j, j.newChunk(target), 0, bound(1), scaled)
	for _, wait := range waits {
		n, werr := wait()
		exceed += n
		err = cmp.Or(err, werr)
	}
	if err != nil {
		return Result{}, err
	}
	if progress != nil {
		progress(j.Resamples, j.Resamples) // the helpers' parts are done too
	}
	return resultOf(j.Resamples, j.Seed, exceed), nil
}

// run counts the deals of chunks [from, to) that chunk finds extreme,
// telling progress the deals done; it stops with ctx.
func run(ctx context.Context, j Job, chunk Chunk, from, to int, progress Progress) (int, error) {
	exceed, done := 0, 0
	for c := from; c < to && ctx.Err() == nil; c++ {
		count := min(ChunkSize, j.Resamples-c*ChunkSize)
		exceed += chunk(random.New(j.Seed, uint64(c)), count)
		done += count
		if progress != nil {
			progress(done, j.Resamples)
		}
	}
	return exceed, ctx.Err()
}

// chunks is the number of chunks of the job's resamples.
func (j Job) chunks() int { return (j.Resamples + ChunkSize - 1) / ChunkSize }

// total is the sum of the scores.
func (j Job) total() int64 {
	var total int64
	for _, s := range j.Scores {
		total += s
	}
	return total
}

// target is the observed statistic, to compare deals with exactly.
func (j Job) target() (*reach, error) { return newReach(j.Sizes, j.Observed, j.total()) }

// newChunk is a Chunk of the job's deals with its own copies of the scores.
func (j Job) newChunk(target *reach) Chunk {
	d := newDealer(j.Sizes, j.Scores, j.total())
	return func(g *random.Xoshiro, count int) int { return d.chunk(g, count, target) }
}
