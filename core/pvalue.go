package core

import (
	"context"
	"errors"

	"midrank/core/exact"
	"midrank/core/montecarlo"
	"midrank/core/rank"
	"midrank/core/report"
)

// Budgets of the exact method (see exact.Limits). Dense layers take 8 bytes
// a cell, two layers at a time; the time grows with the cells of all layers,
// about 20–50 ns each natively (more with more groups) and three to four
// times that in the module. Hash tables take about 48 bytes a state at the
// peak. An explicit request may use more than the automatic choice, which
// must leave time for a fallback.
const (
	ExactCells  = 40_000_000 // --pvalue exact: two layers of at most 320 MB together, under 512 MB at the peak
	ExactStates = 4_000_000  // --pvalue exact: hash layers of at most about 200 MB
	// AutoExactWork is the automatic choice's budget of work for four or
	// more groups, within about a second natively. A cell costs less with
	// fewer groups to deal it to (BenchmarkPermutation, natively: about 8 ns
	// with three groups of 15, 15 with four of 8, 35 with five of 5), so
	// two or three groups get half as much again (autoExactWork).
	AutoExactWork   = 25_000_000
	AutoExactStates = 1_000_000 // --pvalue auto: hash layers within this
	// AutoMonteCarloDraws bounds the random draws (values × resamples)
	// that the automatic choice spends on Monte Carlo: about 0.2 s natively
	// on one core (2.5·10⁸ draws a second, BenchmarkResamplesN100K4) and
	// under a second in the module. Beyond it the samples are large, and
	// chi-square is chosen.
	AutoMonteCarloDraws = 50_000_000
	// HeavyTies is the tie correction below which ties are heavy: the
	// automatic choice does not trust the chi-square approximation then,
	// even for groups of 5 or more, and the answer warns of them. 0.95 is
	// this project's own line (a correction of 5% in H), not an outside value.
	HeavyTies = 0.95
)

// Progress is told how far a long computation is: stage is "exact" or
// "monte-carlo", done of total units.
type Progress func(stage string, done, total int)

// MonteCarlo describes a Monte Carlo p-value.
type MonteCarlo struct {
	Resamples int     `json:"resamples"`
	Seed      uint64  `json:"seed"`
	Exceed    int     `json:"exceed"`  // resamples whose H reached the observed H
	CILow     float64 `json:"ci_low"`  // 99% Clopper–Pearson interval
	CIHigh    float64 `json:"ci_high"` // for the permutation p-value
}

// permutationProblem is the data in the integer form that the exact and
// Monte Carlo methods work on (exact.Scores).
type permutationProblem struct {
	sizes  []int
	blocks []exact.Block
	scores []int64 // every observation's score, ascending
	sums   []int64 // each group's sum of scores in the data
	// for turning T back into H
	gcd, base int64 // g and 2r₁
	total     int64 // Σ scores
}

func newProblem(ranking rank.Ranking) *permutationProblem {
	n := len(ranking.Sorted)
	p := &permutationProblem{sizes: ranking.Sizes}
	// doubled midranks of each tie block, 2·(i+1+j)/2
	var doubled []int64
	var counts []int
	for i, j := range ranking.Blocks() {
		doubled = append(doubled, int64(i+1+j))
		counts = append(counts, j-i)
	}
	p.blocks, p.gcd, p.base = exact.Scores(doubled, counts)
	p.scores = make([]int64, 0, n)
	for _, b := range p.blocks {
		for range b.Count {
			p.scores = append(p.scores, b.Score)
		}
	}
	p.sums = make([]int64, len(p.sizes))
	for i, g := range ranking.Groups {
		p.sums[g] += p.scores[i]
	}
	for _, s := range p.scores {
		p.total += s
	}
	return p
}

// h turns the integer statistic T into H (with the tie correction c):
// group rank sums are Rᵢ = (g·sᵢ + b·nᵢ)/2, so
//
//	Σ Rᵢ²/nᵢ = (g²/4)·T/L + (g·b/2)·Σx + b²N/4,  H = (12/(N(N+1))·Σ Rᵢ²/nᵢ − 3(N+1))/C.
func (p *permutationProblem) h(t int64, c float64) float64 {
	n := float64(len(p.scores))
	l := float64(float64(exact.Weights(p.sizes)[0]) * float64(p.sizes[0]))
	g, b := float64(p.gcd), float64(p.base)
	ss := g*g/4*float64(t)/l + float64(g*b/2*float64(p.total)) + b*b*n/4
	return (float64(12/(float64(n*(n+1)))*ss) - float64(3*(n+1))) / c
}

// autoExactWork is the automatic choice's budget of work for k groups (see
// AutoExactWork).
func autoExactWork(k int) int {
	if k <= 3 {
		return AutoExactWork * 3 / 2
	}
	return AutoExactWork
}

// pvalueOf finds the p-value by the requested method, running the exact or
// Monte Carlo computation where needed; c is the tie correction.
func pvalueOf(ctx context.Context, s settings, ranking rank.Ranking, pAsymptotic, c float64, progress Progress) (pvalue, error) {
	choice := report.Choice{Method: string(s.pvalue), Automatic: s.pvalue == PValueAuto, Sizes: ranking.Sizes,
		Resamples: s.resamples, Seed: s.seed}
	method := s.pvalue
	if method == PValueAuto || method == PValueExact {
		limit := exact.Limits{MaxCells: ExactCells, MaxStates: ExactStates}
		if method == PValueAuto {
			limit.MaxWork, limit.MaxStates = autoExactWork(len(ranking.Sizes)), AutoExactStates
		}
		// the screen needs only the sizes and the tie blocks: large samples
		// are refused before their scores are worked out
		err := exact.Screen(ranking.Sizes, blockCounts(ranking), limit)
		var pv pvalue
		if err == nil {
			pv, err = exactPValue(ctx, newProblem(ranking), s.alpha, c, limit, progress)
		}
		switch {
		case err == nil:
			choice.Method = string(PValueExact)
			pv.method, pv.reason, pv.choice = PValueExact, report.MethodReason(choice), choice
			return pv, nil
		case !errors.Is(err, exact.ErrTooLarge):
			return pvalue{}, err
		case method == PValueExact:
			return pvalue{}, &OptionError{Option: "pvalue", Value: string(PValueExact), Reason: report.ExactRefused(ranking.Sizes, err),
				Instead: []string{string(PValueMonteCarlo), string(PValueAuto)}}
		}
		choice.ExactTooLarge = true
		method = PValueAsymptotic
		if rough, fits := monteCarloInstead(ranking, c, s.resamples); rough && fits {
			method = PValueMonteCarlo
		} else if rough {
			choice.MonteCarloTooLong = true
		}
	}
	choice.Method = string(method)
	if method == PValueAsymptotic {
		return pvalue{method: method, p: pAsymptotic, reason: report.MethodReason(choice), choice: choice}, nil
	}
	p := newProblem(ranking)
	var mcProgress montecarlo.Progress
	if progress != nil {
		mcProgress = func(done, total int) { progress("monte-carlo", done, total) }
	}
	mc, err := montecarlo.PValue(ctx, p.sizes, p.scores, p.sums, s.resamples, s.seed, mcProgress)
	if err != nil {
		return pvalue{}, err
	}
	choice.Resamples, choice.Seed = mc.Resamples, mc.Seed
	return pvalue{method: method, p: mc.P, reason: report.MethodReason(choice), choice: choice,
		monteCarlo: &MonteCarlo{Resamples: mc.Resamples, Seed: mc.Seed, Exceed: mc.Exceed, CILow: mc.Low, CIHigh: mc.High}}, nil
}

// monteCarloInstead tells, when the exact distribution is too large for an
// automatic choice, whether the large-sample approximation is rough (a group
// under report.SmallGroup values, or heavy ties: the tie correction c below
// HeavyTies), so that Monte Carlo should take its place, and whether the
// Monte Carlo draws (values × resamples) fit AutoMonteCarloDraws.
func monteCarloInstead(ranking rank.Ranking, c float64, resamples int) (rough, fits bool) {
	rough = smallest(ranking.Sizes) < report.SmallGroup || c < HeavyTies
	fits = float64(float64(len(ranking.Sorted))*float64(resamples)) <= AutoMonteCarloDraws
	return rough, fits
}

// pvalue is what pvalueOf finds.
type pvalue struct {
	method     PValueMethod
	p          float64
	reason     string
	choice     report.Choice // what reason says, kept to say it again without the sizes
	exact      *float64      // the exact p-value, when computed
	critical   *float64      // exact_critical_value and exact_attained_alpha
	attained   *float64
	monteCarlo *MonteCarlo
}

// exactPValue computes the exact p-value and critical value; c is the tie
// correction.
func exactPValue(ctx context.Context, p *permutationProblem, alpha, c float64, limit exact.Limits, progress Progress) (pvalue, error) {
	var exProgress exact.Progress
	if progress != nil {
		exProgress = func(done, total int) { progress("exact", done, total) }
	}
	d, err := exact.Permutation(ctx, p.sizes, p.blocks, limit, exProgress)
	if err != nil {
		return pvalue{}, err
	}
	// the exact method has checked that T of every deal fits in 62 bits
	pe := d.Upper(exact.Statistic(p.sizes, p.sums))
	pv := pvalue{p: pe, exact: &pe}
	if t, attained, ok := d.Critical(alpha); ok {
		h := p.h(t, c)
		pv.critical, pv.attained = &h, &attained
	}
	return pv, nil
}

// blockCounts lists the sizes of the tie blocks, in ascending order of value.
func blockCounts(ranking rank.Ranking) []int {
	var counts []int
	for i, j := range ranking.Blocks() {
		counts = append(counts, j-i)
	}
	return counts
}

func smallest(sizes []int) int {
	m := sizes[0]
	for _, s := range sizes {
		m = min(m, s)
	}
	return m
}
