package core

import (
	"context"
	"errors"
	"fmt"
	"strings"

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
	ExactCells      = 40_000_000 // --pvalue exact: two layers of at most 320 MB together, under 512 MB at the peak
	ExactStates     = 4_000_000  // --pvalue exact: hash layers of at most about 200 MB
	AutoExactWork   = 25_000_000 // --pvalue auto: within about a second natively
	AutoExactStates = 1_000_000  // --pvalue auto: hash layers within this
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

// choosePValue fills in the p-value by the requested method, running the
// exact or Monte Carlo computation where needed.
func (r *Result) choosePValue(ctx context.Context, s settings, ranking rank.Ranking, progress Progress) error {
	method := s.pvalue
	var reasons []string
	if method == PValueAuto || method == PValueExact {
		limit := exact.Limits{MaxCells: ExactCells, MaxStates: ExactStates}
		if method == PValueAuto {
			limit.MaxWork, limit.MaxStates = AutoExactWork, AutoExactStates
		}
		// the screen needs only the sizes and the tie blocks: large samples
		// are refused before their scores are worked out
		err := exact.Screen(ranking.Sizes, blockCounts(ranking), limit)
		if err == nil {
			err = r.exactPValue(ctx, newProblem(ranking), s.alpha, limit, progress)
		}
		switch {
		case err == nil:
			r.PMethod = string(PValueExact)
			r.PMethodReason = fmt.Sprintf("Exact: every one of the %s equally likely ways to deal these ranks into groups of %s was accounted for.",
				dealCount(ranking.Sizes), sizesText(ranking.Sizes))
			if method == PValueAuto {
				r.PMethodReason = "Chosen automatically. " + r.PMethodReason
			}
			return nil
		case !errors.Is(err, exact.ErrTooLarge):
			return err
		case method == PValueExact:
			return &OptionError{Option: "pvalue", Value: "exact",
				Reason: fmt.Sprintf("the exact distribution for groups of %s is beyond the budget of this tool (%v); use monte-carlo, or auto", sizesText(ranking.Sizes), err)}
		}
		reasons = append(reasons, "the exact distribution is too large to compute here")
		method = PValueAsymptotic
		if smallest(ranking.Sizes) < report.SmallGroup || r.TieCorrection < HeavyTies {
			if draws := float64(float64(len(ranking.Sorted)) * float64(s.resamples)); draws <= AutoMonteCarloDraws {
				method = PValueMonteCarlo
			} else {
				reasons = append(reasons, fmt.Sprintf("Monte Carlo with %d resamples of %d values would take too long for an automatic choice (ask for monte-carlo to run it)", s.resamples, len(ranking.Sorted)))
			}
		}
	}
	switch method {
	case PValueAsymptotic:
		r.PMethod = string(PValueAsymptotic)
		r.PValue = r.PAsymptotic
		if len(reasons) == 0 {
			r.PMethodReason = "Chi-square approximation, as requested."
		} else if len(reasons) == 1 {
			r.PMethodReason = fmt.Sprintf("Chi-square approximation, chosen automatically: %s, and every group has at least %d values with few ties, where the approximation is good.",
				reasons[0], report.SmallGroup)
		} else {
			r.PMethodReason = fmt.Sprintf("Chi-square approximation, chosen automatically: %s, and %s; with %d values the approximation, with the tie correction, is usually close.",
				reasons[0], reasons[1], len(ranking.Sorted))
		}
	case PValueMonteCarlo:
		p := newProblem(ranking)
		var mcProgress montecarlo.Progress
		if progress != nil {
			mcProgress = func(done, total int) { progress("monte-carlo", done, total) }
		}
		mc, err := montecarlo.PValue(ctx, p.sizes, p.scores, p.sums, s.resamples, s.seed, mcProgress)
		if err != nil {
			return err
		}
		r.PMethod = string(PValueMonteCarlo)
		r.PValue = mc.P
		r.PMonteCarlo = &mc.P
		r.MonteCarlo = &MonteCarlo{Resamples: mc.Resamples, Seed: mc.Seed, Exceed: mc.Exceed, CILow: mc.Low, CIHigh: mc.High}
		if len(reasons) == 0 {
			r.PMethodReason = fmt.Sprintf("Monte Carlo, as requested: %d random deals of the ranks into the groups (seed %d).", mc.Resamples, mc.Seed)
		} else {
			r.PMethodReason = fmt.Sprintf("Monte Carlo, chosen automatically: %s, and small groups or heavy ties make the chi-square approximation unreliable; %d random deals (seed %d) estimate p.",
				reasons[0], mc.Resamples, mc.Seed)
		}
	}
	return nil
}

// exactPValue computes the exact p-value and critical value.
func (r *Result) exactPValue(ctx context.Context, p *permutationProblem, alpha float64, limit exact.Limits, progress Progress) error {
	var exProgress exact.Progress
	if progress != nil {
		exProgress = func(done, total int) { progress("exact", done, total) }
	}
	d, err := exact.Permutation(ctx, p.sizes, p.blocks, limit, exProgress)
	if err != nil {
		return err
	}
	// the exact method has checked that T of every deal fits in 62 bits
	pe := d.Upper(exact.Statistic(p.sizes, p.sums))
	r.PExact = &pe
	r.PValue = pe
	if t, attained, ok := d.Critical(alpha); ok {
		h := p.h(t, r.TieCorrection)
		r.ExactCriticalValue, r.ExactAttainedAlpha = &h, &attained
	}
	return nil
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

// dealCount is N!/∏nᵢ! in words-friendly digits ("34,650" or "5.6e+12").
func dealCount(sizes []int) string {
	count, n := 1.0, 0
	for _, s := range sizes {
		for i := 1; i <= s; i++ {
			n++
			count = count * float64(n) / float64(i)
		}
	}
	if count < 1e9 {
		return thousands(int64(count + 0.5))
	}
	return fmt.Sprintf("%.2g", count)
}

func thousands(v int64) string {
	s := fmt.Sprint(v)
	var b strings.Builder
	for i, c := range s {
		if i > 0 && (len(s)-i)%3 == 0 {
			b.WriteByte(',')
		}
		b.WriteRune(c)
	}
	return b.String()
}

func sizesText(sizes []int) string {
	parts := make([]string, len(sizes))
	for i, s := range sizes {
		parts[i] = fmt.Sprint(s)
	}
	if len(parts) == 1 {
		return parts[0]
	}
	return strings.Join(parts[:len(parts)-1], ", ") + " and " + parts[len(parts)-1]
}
