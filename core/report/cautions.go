package report

import (
	"fmt"

	"midrank/core/display"
)

// Cautions are the facts the cautions of an answer speak of.
type Cautions struct {
	// Reading is why the text was read as it was, and OtherReadings the
	// other plausible readings ("" when there are none)
	Reading, OtherReadings string
	// OtherNumbers names cells whose marks could be read two ways, how they
	// were read and what to choose for the other way ("" when none)
	OtherNumbers string
	// Shared: the cautions go into what is shared, which names no cell of
	// the data (a cell is one person's value)
	Shared bool
	// SmallGroups are the groups with fewer than SmallGroup values, when
	// the chi-square approximation gave p
	SmallGroups []GroupSize
	// PairsSkipped: pairs were asked for but not compared, there being
	// Groups groups, more than MaxPairGroups
	PairsSkipped          bool
	Groups, MaxPairGroups int
	// PairsUndefined: the pairwise procedure, PairMethod, gives no test here
	// (no degrees of freedom left); PairsInfinite counts the pairs whose
	// statistic is infinite (groups each constant within, differing between)
	PairsUndefined bool
	PairsInfinite  int
	PairMethod     string
	// MonteCarlo is the 99% interval of an estimated p, nil otherwise
	MonteCarlo *Interval
	Alpha      float64
	// PZero: p is below the smallest positive double
	PZero bool
	// HeavyTies: the tie correction, TieCorrection, is below the threshold
	// where ties count as heavy
	HeavyTies     bool
	TieCorrection float64
}

// GroupSize is a group's label and its number of values.
type GroupSize struct {
	Label string
	N     int // 0: not told (a protected group)
}

// Interval is a confidence interval.
type Interval struct{ Low, High float64 }

// Warnings words the cautions, most specific first.
func Warnings(c Cautions) []string {
	w := []string{}
	if c.OtherReadings != "" {
		w = append(w, fmt.Sprintf("The text was read with %s. It could also be read with %s: if that is meant, choose the group and measure columns (on the command line --group and --measure).",
			c.Reading, c.OtherReadings))
	}
	switch {
	case c.OtherNumbers != "" && c.Shared:
		w = append(w, "Some numbers in the data could be read two ways (a comma or a point as the decimal mark or between thousands); the analyst chose how they were read.")
	case c.OtherNumbers != "":
		w = append(w, fmt.Sprintf("Some numbers could be read two ways: %s (on the command line --decimal or --thousands).", c.OtherNumbers))
	}
	if c.Groups == 2 {
		w = append(w, "Only two groups are compared: the Kruskal–Wallis p equals the two-sided Mann–Whitney p in the normal approximation without continuity correction. The Mann–Whitney figures (U, an exact p for small groups, the shift with its interval) are in the pairs table when the pairs are compared with Mann–Whitney (on the command line --posthoc mann-whitney).")
	}
	switch small := c.SmallGroups; {
	case len(small) > 3:
		w = append(w, fmt.Sprintf("%d groups (%q, %q and %d more) have fewer than %d values: the chi-square approximation is rough for groups this small.",
			len(small), small[0].Label, small[1].Label, len(small)-2, SmallGroup))
	default:
		for _, g := range small {
			has := fmt.Sprintf("has %d values, fewer than %d", g.N, SmallGroup)
			if g.N == 0 { // a protected group's size is not told
				has = fmt.Sprintf("has fewer than %d values", SmallGroup)
			}
			w = append(w, fmt.Sprintf("Group %q %s: the chi-square approximation is rough for groups this small.", g.Label, has))
		}
	}
	if c.PairsUndefined {
		w = append(w, fmt.Sprintf("The pairs have no statistic and no p: %s needs more values than groups (its degrees of freedom are the number of values less the number of groups, here 0). Compare the pairs with Dunn's test or Mann–Whitney instead.", c.PairMethod))
	}
	if c.PairsInfinite > 0 {
		w = append(w, fmt.Sprintf("In %s every group's values are all equal within the group while the groups differ: %s's statistic is infinite there (shown as undefined) and its p is 0.",
			countPairs(c.PairsInfinite), c.PairMethod))
	}
	if c.PairsSkipped {
		w = append(w, fmt.Sprintf("Pairs of groups were not compared: with %d groups there would be %d pairs, and pairwise comparisons are made for at most %d groups.",
			c.Groups, c.Groups*(c.Groups-1)/2, c.MaxPairGroups))
	}
	if mc := c.MonteCarlo; mc != nil && Straddles(mc.Low, mc.High, c.Alpha) {
		w = append(w, fmt.Sprintf("The Monte Carlo interval for p (%s to %s) includes the significance level %s: run more resamples for a firm decision.",
			display.PValue.Format(mc.Low), display.PValue.Format(mc.High), Number(c.Alpha)))
	}
	if c.PZero {
		w = append(w, "The p-value is below the smallest positive number a computer can hold (about 1e-308), so it is reported as 0; the true value is positive but vanishingly small.")
	}
	if c.HeavyTies {
		w = append(w, fmt.Sprintf("Ties are heavy (tie correction %s): many values are shared, as on rating scales; the correction is applied.", Number(c.TieCorrection)))
	}
	return w
}

// countPairs says "1 pair" or "3 pairs".
func countPairs(n int) string {
	if n == 1 {
		return "1 pair"
	}
	return fmt.Sprintf("%d pairs", n)
}
