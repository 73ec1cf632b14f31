package core

import (
	"midrank/core/protect"
	"midrank/core/report"
)

// warnings are the cautions an answer carries (worded in report): small
// groups under the chi-square approximation, pairs not compared, a Monte
// Carlo interval that straddles alpha, a p-value below what a double holds,
// heavy ties.
// For what is shared (shared), no cell of the data is named and a group
// that plan hides is named without its size.
func warnings(r *Result, plan protect.Plan, shared bool) []string {
	c := report.Cautions{
		Reading:       r.Input.Reason,
		PairsSkipped:  r.K > MaxPairGroups && r.PostHoc == nil && r.pairsAsked,
		Groups:        r.K,
		MaxPairGroups: MaxPairGroups,
		Alpha:         r.Alpha,
		PZero:         r.PValue == 0,
		HeavyTies:     r.TieCorrection < HeavyTies,
		TieCorrection: r.TieCorrection,
		Shared:        shared,
	}
	if r.PMethod == string(PValueAsymptotic) {
		for i, g := range r.Groups {
			if g.N < report.SmallGroup {
				size := report.GroupSize{Label: g.Label, N: g.N}
				if plan.Hidden(i) {
					size.N = 0
				}
				c.SmallGroups = append(c.SmallGroups, size)
			}
		}
	}
	if o := r.Input.OtherReadings; o != nil {
		c.OtherReadings = *o
	}
	if o := r.Input.OtherNumbers; o != nil {
		c.OtherNumbers = *o
	}
	if mc := r.MonteCarlo; mc != nil {
		c.MonteCarlo = &report.Interval{Low: mc.CILow, High: mc.CIHigh}
	}
	if ph := r.PostHoc; ph != nil {
		c.PairMethod, c.PairsUndefined, c.PairsInfinite = ph.Method.Name(), ph.Undefined, ph.Infinite
	}
	return report.Warnings(c)
}
