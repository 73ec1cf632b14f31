package core

import (
	"midrank/core/protect"
	"midrank/core/report"
)

// facts are the figures the decision speaks of, with the groups that plan
// hides spoken of without their figures (an empty plan hides none).
func (r *Result) facts(plan protect.Plan) report.Facts {
	f := report.Facts{
		Measure: r.Input.Measure, Left: r.Input.LeftLabels(),
		H: r.H, DF: r.DF, P: r.PValue, Method: r.PMethod, Alpha: r.Alpha,
		Epsilon: r.EpsilonSquared, Size: r.EpsilonSquaredSize, EpsilonInterval: r.EpsilonSquaredInterval,
		Unreachable: r.PMethod == string(PValueExact) && r.ExactCriticalValue == nil,
	}
	hidden := map[string]bool{}
	for g, group := range r.Groups {
		f.Labels, f.Sizes = append(f.Labels, group.Label), append(f.Sizes, group.N)
		if plan.Hidden(g) {
			hidden[group.Label] = true
			f.Withheld = append(f.Withheld, g)
		}
	}
	if len(r.Groups) <= MaxNamedGroups {
		for _, g := range r.Groups {
			f.Medians, f.Q1, f.Q3 = append(f.Medians, g.Median), append(f.Q1, g.Q1), append(f.Q3, g.Q3)
		}
	}
	if tr := r.Trend; tr != nil {
		f.Trend = &report.TrendFacts{Order: tr.Order, Alternative: tr.Alternative, J: tr.Statistic, Z: tr.Z, P: tr.P, Method: tr.PMethod, Tau: tr.TauB, Size: tr.TauBSize}
	}
	if mc := r.MonteCarlo; mc != nil {
		f.Resamples, f.Seed, f.Low, f.High = mc.Resamples, mc.Seed, mc.CILow, mc.CIHigh
	}
	if ph := r.PostHoc; ph != nil {
		f.PairMethod, f.AdjustName, f.PairsTested = ph.Method.Name(), ph.Adjust.Name(), len(ph.Pairs)
		f.PairPWithheld = plan.Any() && ph.Method.JointRanks()
		if ph.Reference != nil {
			f.Reference = *ph.Reference
		}
		for _, p := range ph.Pairs {
			if hidden[p.A] || hidden[p.B] {
				f.PairsWithheld++
				continue
			}
			if !p.Significant {
				continue
			}
			d := report.Difference{Higher: p.A, Lower: p.B, PAdjusted: *p.PAdjusted, Superiority: p.ProbSuperiority, Shift: p.Shift}
			if p.ProbSuperiority < 0.5 {
				d.Higher, d.Lower, d.Superiority, d.Shift = p.B, p.A, 1-p.ProbSuperiority, -p.Shift
			}
			f.Differences = append(f.Differences, d)
		}
	}
	return f
}
