package montecarlo

import (
	"cmp"
	"context"
	"errors"
	"maps"
	"slices"
	"strconv"

	"midrank/core/jsonlite"
	"midrank/core/random"
)

// A Farm runs parts of a Monte Carlo estimate elsewhere: in the page, the
// other Web Workers, each with its own copy of the module, where the one
// running the analysis has a single thread. Share hands over the chunks
// [from, to) of a job (as Job.JSON writes it) and returns a function that
// waits for the count of their deals at least as extreme as the observed
// one. Since chunk c always draws from stream random.New(seed, c), the
// estimate is the same to the last bit however the chunks are shared.
type Farm interface {
	Helpers() int // how many others can take a part
	Share(job []byte, from, to int) (wait func() (int, error))
}

type farmKey struct{}

// WithFarm gives the estimates made with ctx a farm to share their chunks
// with.
func WithFarm(ctx context.Context, f Farm) context.Context {
	return context.WithValue(ctx, farmKey{}, f)
}

// MinShared is the fewest chunks an estimate must have to be shared: below
// it, handing the work over costs more than it saves.
const MinShared = 8

// Job is an estimate as a farm's part needs it: the kind of deal, the
// numbers that kind deals and compares (by name), the seed and the
// resamples (which fix the chunks).
type Job struct {
	Kind      string
	Lists     map[string][]int64
	Resamples int
	Seed      uint64
}

// A Maker makes, from a job's lists, the Chunk of its kind of deal (one
// for each worker that calls it), or says why the lists do not hold
// together.
type Maker func(lists map[string][]int64) (newChunk func() Chunk, err error)

// makers are the kinds of job: the H test's deals (PValue), and those other
// packages register.
var makers = map[string]Maker{hKind: hChunks}

// Register adds a kind of job (from an init function).
func Register(kind string, m Maker) { makers[kind] = m }

// EstimateJob estimates p as Estimate does for the job, sharing its chunks
// in equal runs with the farm in ctx (the first run kept here) when it has
// helpers and the job at least MinShared chunks.
func EstimateJob(ctx context.Context, j Job, progress Progress) (Result, error) {
	newChunk, err := j.maker()
	if err != nil {
		return Result{}, err
	}
	if f, ok := ctx.Value(farmKey{}).(Farm); ok && f.Helpers() > 0 && j.chunks() >= MinShared {
		return shared(ctx, f, j, newChunk(), progress)
	}
	return Estimate(ctx, j.Resamples, j.Seed, progress, newChunk)
}

// Part counts the extreme deals of chunks [from, to) of a job: a farm's
// share of an estimate.
func Part(ctx context.Context, j Job, from, to int) (int, error) {
	newChunk, err := j.maker()
	if err != nil {
		return 0, err
	}
	if from < 0 || to > j.chunks() || from > to {
		return 0, errors.New("montecarlo: chunks " + strconv.Itoa(from) + " to " + strconv.Itoa(to) + " are not among the job's " + strconv.Itoa(j.chunks()))
	}
	return run(ctx, j, newChunk(), from, to, nil)
}

// maker checks the job's kind and lists and gives its chunks' maker.
func (j Job) maker() (func() Chunk, error) {
	m, ok := makers[j.Kind]
	if !ok {
		return nil, errors.New("montecarlo: no job of kind " + strconv.Quote(j.Kind))
	}
	if j.Resamples < 1 {
		return nil, errors.New("montecarlo: a job needs resamples")
	}
	return m(j.Lists)
}

// shared runs a job's chunks on the farm's helpers and here: equal runs of
// chunks, the first kept here, whose progress stands for all.
func shared(ctx context.Context, f Farm, j Job, chunk Chunk, progress Progress) (Result, error) {
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
	exceed, err := run(ctx, j, chunk, 0, bound(1), scaled)
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

// JSON writes the job as {"kind", "resamples", "seed", "lists": {name: [numbers], …}}.
func (j Job) JSON() []byte {
	var w jsonlite.Writer
	w.BeginObject()
	w.StringMember("kind", j.Kind)
	w.IntMember("resamples", j.Resamples)
	w.Key("seed")
	w.Uint(j.Seed)
	w.Key("lists")
	w.BeginObject()
	for _, name := range slices.Sorted(maps.Keys(j.Lists)) {
		w.Key(name)
		w.BeginArray()
		for _, v := range j.Lists[name] {
			w.Int(v)
		}
		w.EndArray()
	}
	w.EndObject()
	w.EndObject()
	return w.Bytes()
}

// ParseJob reads a job that JSON wrote; its lists are checked by its kind
// when it runs.
func ParseJob(b []byte) (Job, error) {
	n, err := jsonlite.ParseTree(b, 3)
	if err != nil {
		return Job{}, err
	}
	bad := errors.New("montecarlo: not a job")
	kind, _ := n.Member("kind")
	resamples, _ := n.Member("resamples")
	seed, _ := n.Member("seed")
	lists, _ := n.Member("lists")
	j := Job{Kind: kind.Text, Lists: map[string][]int64{}}
	r, err1 := strconv.ParseInt(resamples.Text, 10, 32)
	s, err2 := strconv.ParseUint(seed.Text, 10, 64)
	if kind.Kind != jsonlite.String || lists.Kind != jsonlite.Object || err1 != nil || err2 != nil || r < 1 {
		return Job{}, bad
	}
	j.Resamples, j.Seed = int(r), s
	for i, name := range lists.Names {
		items := lists.Members[i].Items
		values := make([]int64, len(items))
		for k, item := range items {
			if values[k], err = strconv.ParseInt(item.Text, 10, 64); err != nil || item.Kind != jsonlite.Number {
				return Job{}, bad
			}
		}
		j.Lists[name] = values
	}
	return j, nil
}

// hKind is the kind of PValue's jobs: lists "sizes" (of the groups),
// "scores" (dealt in turn) and "observed" (the observed group sums).
const hKind = "h"

// hJob is the job of PValue's estimate.
func hJob(sizes []int, scores, observedSums []int64, resamples int, seed uint64) Job {
	s := make([]int64, len(sizes))
	for i, n := range sizes {
		s[i] = int64(n)
	}
	return Job{Kind: hKind, Resamples: resamples, Seed: seed,
		Lists: map[string][]int64{"sizes": s, "scores": scores, "observed": observedSums}}
}

// hChunks is the Maker of PValue's jobs.
func hChunks(lists map[string][]int64) (func() Chunk, error) {
	scores, observed := lists["scores"], lists["observed"]
	var sizes []int
	total := 0
	for _, s := range lists["sizes"] {
		if s < 1 || s > int64(len(scores)) {
			return nil, errors.New("montecarlo: a group size of the job is out of range")
		}
		sizes = append(sizes, int(s))
		total += int(s)
	}
	if len(sizes) < 2 || total != len(scores) || len(observed) != len(sizes) {
		return nil, errors.New("montecarlo: the job's sizes, scores and sums do not match")
	}
	var sum int64
	for _, s := range scores {
		sum += s
	}
	target, err := newReach(sizes, observed, sum)
	if err != nil {
		return nil, err
	}
	return func() Chunk {
		d := newDealer(sizes, scores, sum)
		return func(g *random.Xoshiro, count int) int { return d.chunk(g, count, target) }
	}, nil
}
