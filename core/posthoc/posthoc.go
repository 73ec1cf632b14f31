// Package posthoc compares every pair of groups after a Kruskal–Wallis test,
// by one of four published procedures, and describes each pair by effect
// sizes that need no distributional assumption.
//
// All procedures work from one global sort (package rank): the groups' mean
// ranks for Dunn and Conover–Iman, and, for the procedures that rank each
// pair on its own (Dwass–Steel–Critchlow–Fligner, Mann–Whitney), one walk
// over the sorted values that keeps the two groups' members.
package posthoc

import (
	"context"
	"errors"
	"fmt"
	"math"
	"runtime"
	"sync"
	"sync/atomic"

	"midrank/core/dist"
	"midrank/core/exact"
	"midrank/core/rank"
)

// Method is a pairwise procedure, named by its request key.
type Method string

// The procedures.
const (
	Dunn        Method = "dunn"
	Conover     Method = "conover"
	DSCF        Method = "dscf"
	MannWhitney Method = "mann-whitney"
)

// Methods lists the procedures in the order they are offered.
var Methods = []Method{Dunn, Conover, DSCF, MannWhitney}

// words are each procedure's label in a menu, its name in prose, and the
// symbol of the statistic it reports for a pair.
var words = map[Method]struct{ label, prose, statistic string }{
	Dunn:        {"Dunn", "Dunn's test (Dunn 1964)", "z"},
	Conover:     {"Conover–Iman", "the Conover–Iman test (Conover & Iman 1979)", "t"},
	DSCF:        {"Dwass–Steel–Critchlow–Fligner", "the Dwass–Steel–Critchlow–Fligner test (Critchlow & Fligner 1991)", "W*"},
	MannWhitney: {"Mann–Whitney, pair by pair", "pairwise Wilcoxon–Mann–Whitney tests", "U"},
}

// Statistic is the symbol of the statistic the procedure reports for a
// pair: z (Dunn), t (Conover–Iman), W* (DSCF), U (Mann–Whitney).
func (m Method) Statistic() string { return words[m].statistic }

// Known tells whether m is one of Methods.
func (m Method) Known() bool { _, ok := words[m]; return ok }

// Label is the procedure's name in a menu.
func (m Method) Label() string { return words[m].label }

// Name is the procedure's name in prose.
func (m Method) Name() string { return words[m].prose }

// Pair is the comparison of groups A and B (indices: A before B in input
// order, or A the reference group). Statistic is signed, positive when A tends to be higher, except
// for Mann–Whitney, where it is U of A. P is two-sided.
type Pair struct {
	A, B      int
	Statistic float64
	P         float64
	Exact     bool // Mann–Whitney: p from the exact null distribution
	// Undefined: the procedure has no statistic and no p for this pair
	// (Conover–Iman with no degrees of freedom left); Infinite: the
	// statistic is infinite (a variance of 0 between groups that differ),
	// and P is 0
	Undefined, Infinite bool
	Effect
}

// Compare runs a procedure on every pair of groups of a ranking. h is the
// tie-corrected H (for Conover–Iman); confidence is the level of the
// Hodges–Lehmann interval.
func Compare(ctx context.Context, method Method, r rank.Ranking, h, confidence float64) ([]Pair, error) {
	k := len(r.Sizes)
	var pairs []Pair
	for a := 0; a < k; a++ {
		for b := a + 1; b < k; b++ {
			pairs = append(pairs, Pair{A: a, B: b})
		}
	}
	return run(ctx, method, r, h, confidence, pairs)
}

// Against runs a procedure on the pairs of the reference group with each
// other group, the reference as A; a procedure that holds only for all
// pairs together (ComparesAllPairs) is refused.
func Against(ctx context.Context, method Method, r rank.Ranking, h, confidence float64, reference int) ([]Pair, error) {
	if method.ComparesAllPairs() {
		return nil, fmt.Errorf("posthoc: %s compares every pair, not each group with a reference", method)
	}
	var pairs []Pair
	for b := range len(r.Sizes) {
		if b != reference {
			pairs = append(pairs, Pair{A: reference, B: b})
		}
	}
	return run(ctx, method, r, h, confidence, pairs)
}

// ComparesAllPairs tells a procedure whose p-values hold only for all pairs
// together: the Dwass–Steel–Critchlow–Fligner statistic is referred to the
// studentized range of all k groups.
func (m Method) ComparesAllPairs() bool { return m == DSCF }

// JointRanks tells a procedure whose statistics come from the ranks of all
// groups ranked together (Dunn's z and the Conover–Iman t: differences of
// the groups' mean ranks), rather than from each pair ranked on its own.
func (m Method) JointRanks() bool { return m == Dunn || m == Conover }

// run fills in the pairs.
func run(ctx context.Context, method Method, r rank.Ranking, h, confidence float64, pairs []Pair) ([]Pair, error) {
	groups := tallies(r)
	if !method.Known() {
		return nil, fmt.Errorf("posthoc: unknown method %q", method)
	}
	// pairs are independent: share them among the cores, each result in
	// its own slot, so the answer does not depend on the sharing
	var next atomic.Int64
	errs := make([]error, len(pairs))
	var wg sync.WaitGroup
	for range min(runtime.GOMAXPROCS(0), len(pairs)) {
		wg.Go(func() {
			for {
				i := int(next.Add(1) - 1)
				if i >= len(pairs) || ctx.Err() != nil {
					return
				}
				errs[i] = compare(ctx, method, r, h, confidence, groups, &pairs[i])
			}
		})
	}
	wg.Wait()
	if err := ctx.Err(); err != nil {
		return nil, err
	}
	if err := errors.Join(errs...); err != nil {
		return nil, err
	}
	return pairs, nil
}

// compare fills in one pair.
func compare(ctx context.Context, method Method, r rank.Ranking, h, confidence float64, groups []tally, p *Pair) error {
	a, b := p.A, p.B
	switch method {
	case Dunn:
		p.Statistic, p.P = dunn(r, a, b)
	case Conover:
		p.Statistic, p.P, p.Undefined, p.Infinite = conover(r, h, a, b)
	case DSCF:
		p.Statistic, p.P = dscf(r, a, b)
	case MannWhitney:
		var err error
		if p.Statistic, p.P, p.Exact, err = mannWhitney(ctx, r, a, b); err != nil {
			return err
		}
	}
	p.Effect = effects(groups[a], groups[b], confidence)
	return nil
}

// dunn is Dunn's (1964) z for the difference of mean ranks, with the tie
// correction of the variance:
//
//	z = (R̄a − R̄b) / √((N(N+1)/12 − Σ(t³−t)/(12(N−1))) · (1/na + 1/nb)),  p = P(|Z| ≥ |z|).
//
// Dunn, O. J. (1964). Multiple comparisons using rank sums. Technometrics 6(3), 241–252.
func dunn(r rank.Ranking, a, b int) (float64, float64) {
	n := float64(len(r.Sorted))
	na, nb := float64(r.Sizes[a]), float64(r.Sizes[b])
	v := float64((n*(n+1)/12 - r.TieSum/(float64(12*(n-1)))) * (1/na + 1/nb))
	z := (r.RankSums[a]/na - r.RankSums[b]/nb) / math.Sqrt(v)
	return z, dist.NormalTwoSided(z)
}

// conover is the Conover–Iman t, a t test on the ranks whose variance comes
// from all groups:
//
//	S² = (Σr² − N(N+1)²/4)/(N−1),  t = (R̄a − R̄b) / √(S²·(N−1−H)/(N−k) · (1/na + 1/nb)),
//
// two-sided with N−k degrees of freedom, H tie-corrected. With no degrees of
// freedom left (N = k: one value per group) the test is undefined. When no
// rank varies within its group (H = N−1) the variance is 0: t is infinite
// with p = 0 if the mean ranks differ, and 0 with p = 1 if not.
//
// Conover, W. J. & Iman, R. L. (1979). On multiple-comparisons procedures.
// Technical report LA-7677-MS, Los Alamos Scientific Laboratory.
func conover(r rank.Ranking, h float64, a, b int) (t, p float64, undefined, infinite bool) {
	n := float64(len(r.Sorted))
	k := float64(len(r.Sizes))
	if n <= k {
		return 0, 0, true, false
	}
	na, nb := float64(r.Sizes[a]), float64(r.Sizes[b])
	s2 := (sumSquaredRanks(r) - n*(n+1)*(n+1)/4) / (n - 1)
	v := float64(s2 * (n - 1 - h) / (n - k) * (1/na + 1/nb))
	d := r.RankSums[a]/na - r.RankSums[b]/nb
	switch {
	case v > 0:
		t = d / math.Sqrt(v)
		return t, dist.StudentTwoSided(t, n-k), false, false
	case d == 0:
		return 0, 1, false, false
	}
	return 0, 0, false, true
}

// sumSquaredRanks is Σr² over all midranks, block by block.
func sumSquaredRanks(r rank.Ranking) float64 {
	sum := 0.0
	for i, j := range r.Blocks() {
		mid := rank.Midrank(i, j)
		sum += float64(float64(j-i) * mid * mid)
	}
	return sum
}

// pairRanking ranks groups a and b together, on their own: their rank sum
// W of a, their sizes and the tie term of the pair. It walks the global sort
// once, keeping the two groups' members.
func pairRanking(r rank.Ranking, a, b int) (w float64, na, nb int, tieSum float64) {
	pos := 0 // positions taken so far in the pair's own order
	for i, j := range r.Blocks() {
		inA, inB := 0, 0
		for _, g := range r.Groups[i:j] {
			switch int(g) {
			case a:
				inA++
			case b:
				inB++
			}
		}
		if t := inA + inB; t > 0 {
			w += float64(float64(inA) * rank.Midrank(pos, pos+t))
			ft := float64(t)
			tieSum += float64(ft*ft*ft) - ft
			pos += t
			na += inA
			nb += inB
		}
	}
	return w, na, nb, tieSum
}

// dscf is the Dwass–Steel–Critchlow–Fligner statistic: each pair ranked on
// its own, W the rank sum of a,
//
//	W* = √2 (W − na(n+1)/2) / √(na·nb/12 · (n+1 − Σ(t³−t)/(n(n−1)))),  n = na+nb,
//
// referred to the studentized range with k groups and infinite df:
// p = P(Q ≥ |W*|).
//
// Critchlow, D. E. & Fligner, M. A. (1991). On distribution-free multiple
// comparisons in the one-way analysis of variance. Communications in
// Statistics — Theory and Methods 20(1), 127–139.
func dscf(r rank.Ranking, a, b int) (float64, float64) {
	w, na, nb, ties := pairRanking(r, a, b)
	n := float64(na + nb)
	fa, fb := float64(na), float64(nb)
	v := float64(fa * fb / 12 * (n + 1 - ties/(float64(n*(n-1)))))
	if !(v > 0) {
		return 0, 1
	}
	stat := math.Sqrt2 * (w - fa*(n+1)/2) / math.Sqrt(v)
	return stat, dist.StudentizedRange{K: float64(len(r.Sizes)), DF: math.Inf(1)}.Survival(math.Abs(stat))
}

// ExactLimit is the largest group for which Mann–Whitney uses its exact
// null distribution (when the pair has no ties).
const ExactLimit = 50

// mannWhitney is the Wilcoxon–Mann–Whitney test of a pair: U of a (the
// pairs with a higher, plus half the ties) and a two-sided p, exact when
// the pair has no ties and neither group has more than ExactLimit values
// (the two-group permutation distribution of package exact, which for two
// groups orders outcomes by |U − na·nb/2|), otherwise normal with the tie
// correction and a continuity correction of ½, as R's wilcox.test does.
//
// Mann, H. B. & Whitney, D. R. (1947). On a test of whether one of two random
// variables is stochastically larger than the other. Ann. Math. Statist.
// 18(1), 50–60.
func mannWhitney(ctx context.Context, r rank.Ranking, a, b int) (u, p float64, isExact bool, err error) {
	w, na, nb, ties := pairRanking(r, a, b)
	fa, fb := float64(na), float64(nb)
	n := fa + fb
	u = w - fa*(fa+1)/2
	if ties == 0 && na <= ExactLimit && nb <= ExactLimit {
		blocks := make([]exact.Block, na+nb)
		for i := range blocks {
			blocks[i] = exact.Block{Score: int64(i), Count: 1}
		}
		d, err := exact.Permutation(ctx, []int{na, nb}, blocks, exact.Limits{MaxStates: 1 << 22}, nil)
		if err != nil {
			return 0, 0, false, err
		}
		// rank sums minus one per value: scores 0 … n−1
		sa := int64(w) - int64(na)
		sb := int64((na+nb)*(na+nb-1)/2) - sa
		return u, d.Upper(exact.Statistic([]int{na, nb}, []int64{sa, sb})), true, nil
	}
	sigma := math.Sqrt(float64(fa * fb / 12 * (n + 1 - ties/(float64(n*(n-1))))))
	d := u - fa*fb/2
	if sigma == 0 {
		return u, 1, false, nil
	}
	correction := 0.5
	if d < 0 {
		correction = -0.5
	} else if d == 0 {
		correction = 0
	}
	z := (d - correction) / sigma
	return u, min(1, dist.NormalTwoSided(z)), false, nil
}
