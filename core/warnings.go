package core

import (
	"fmt"

	"midrank/core/report"
)

// warnings are the cautions an answer carries: small groups under the
// chi-square approximation, pairs not compared, a Monte Carlo interval that
// straddles alpha, a p-value below what a double holds, heavy ties.
func warnings(r *Result) []string {
	w := []string{}
	var small []Group
	for _, g := range r.Groups {
		if g.N < report.SmallGroup && r.PMethod == string(PValueAsymptotic) {
			small = append(small, g)
		}
	}
	switch {
	case len(small) > 3:
		w = append(w, fmt.Sprintf("%d groups (%q, %q and %d more) have fewer than %d values: the chi-square approximation is rough for groups this small.",
			len(small), small[0].Label, small[1].Label, len(small)-2, report.SmallGroup))
	default:
		for _, g := range small {
			w = append(w, fmt.Sprintf("Group %q has %d values, fewer than %d: the chi-square approximation is rough for groups this small.", g.Label, g.N, report.SmallGroup))
		}
	}
	if r.K > MaxPairGroups && r.PostHoc == nil && r.pairsAsked {
		w = append(w, fmt.Sprintf("Pairs of groups were not compared: with %d groups there would be %d pairs, and pairwise comparisons are made for at most %d groups.",
			r.K, r.K*(r.K-1)/2, MaxPairGroups))
	}
	if mc := r.MonteCarlo; mc != nil && report.Straddles(mc.CILow, mc.CIHigh, r.Alpha) {
		w = append(w, fmt.Sprintf("The Monte Carlo interval for p (%s to %s) includes the significance level %s: run more resamples for a firm decision.",
			report.Number(mc.CILow), report.Number(mc.CIHigh), report.Number(r.Alpha)))
	}
	if r.PValue == 0 {
		w = append(w, "The p-value is below the smallest positive number a computer can hold (about 1e-308), so it is reported as 0; the true value is positive but vanishingly small.")
	}
	if r.TieCorrection < HeavyTies {
		w = append(w, fmt.Sprintf("Ties are heavy (tie correction %s): many values are shared, as on rating scales; the correction is applied.", report.Number(r.TieCorrection)))
	}
	return w
}
