package tables

import (
	"fmt"
	"strings"

	"midrank/core"
	"midrank/core/display"
	"midrank/core/kruskal"
	"midrank/core/report"
)

// overviewColumns are the battery's overview: one row per measure.
var overviewColumns = []column[core.Measured]{
	{Column{"measure", "Measure", NoUnit, display.Text}, func(m core.Measured) any { return m.Measure }},
	{Column{"values", "Values", NoUnit, display.Count}, ofResult(func(r *core.Result) any { return r.N })},
	{Column{"groups", "Groups", NoUnit, display.Count}, ofResult(func(r *core.Result) any { return r.K })},
	{Column{"h", "H", NoUnit, display.Statistic}, ofResult(func(r *core.Result) any { return r.H })},
	{Column{"df", "Degrees of freedom", NoUnit, display.Count}, ofResult(func(r *core.Result) any { return r.DF })},
	{Column{"p_value", "p", NoUnit, display.PValue}, ofResult(func(r *core.Result) any { return r.PValue })},
	{Column{"p_method", "How p was found", NoUnit, display.Text}, ofResult(func(r *core.Result) any { return words{r.PMethod, methodWords[r.PMethod]} })},
	{Column{"p_adjusted_across", "p adjusted across measures", NoUnit, display.PValue}, func(m core.Measured) any { return optional(m.PAdjustedAcross) }},
	{Column{"epsilon_squared", "Effect size ε²", NoUnit, display.Effect}, ofResult(func(r *core.Result) any { return r.EpsilonSquared })},
	{Column{"epsilon_squared_size", "ε² in words", NoUnit, display.Text}, ofResult(func(r *core.Result) any { return r.EpsilonSquaredSize })},
	{Column{"highest", "Highest group (mean rank)", NoUnit, display.Text}, ofResult(func(r *core.Result) any { return byMeanRank(r, true) })},
	{Column{"lowest", "Lowest group (mean rank)", NoUnit, display.Text}, ofResult(func(r *core.Result) any { return byMeanRank(r, false) })},
	{Column{"flags", "Take note", NoUnit, display.Text}, flags},
}

// ofResult reads a column from a measure's result; a measure that could not
// be analysed has no value there.
func ofResult(value func(*core.Result) any) func(core.Measured) any {
	return func(m core.Measured) any {
		if m.Result == nil {
			return nil
		}
		return value(m.Result)
	}
}

// byMeanRank is the label of the group with the highest (or lowest) mean
// rank, the first in the groups' order on a tie.
func byMeanRank(r *core.Result, highest bool) string {
	best := 0
	for i, g := range r.Groups {
		if highest && g.MeanRank > r.Groups[best].MeanRank || !highest && g.MeanRank < r.Groups[best].MeanRank {
			best = i
		}
	}
	return r.Groups[best].Label
}

// flags are what to take note of in a measure's row: why it was not
// analysed, a group under report.SmallGroup values, heavy ties.
func flags(m core.Measured) any {
	if m.Result == nil {
		return words{"not_analysed", "not analysed: " + core.Detail(m.Err).Message}
	}
	var notes []string
	for _, g := range m.Result.Groups {
		if g.N < report.SmallGroup {
			notes = append(notes, fmt.Sprintf("a group under %d values", report.SmallGroup))
			break
		}
	}
	if m.Result.TieCorrection < core.HeavyTies {
		notes = append(notes, "heavy ties")
	}
	joined := strings.Join(notes, "; ")
	return words{joined, joined}
}

// Overview is the table of a battery of measures, one row per measure.
func Overview(b *core.Battery) Table {
	note := fmt.Sprintf("Each measure compared across the groups of %q by the Kruskal–Wallis test, as on its own; the p-values adjusted across the %d measures by %s (separate from the adjustment across pairs within a measure). ε² in words %s.",
		b.GroupColumn, len(b.Measures), b.AdjustAcross.Name(), kruskal.SizeRule())
	return build("overview", "Measures at a glance", note, "", overviewColumns, b.Measures)
}

// SharedOverview is the overview as shared (see Shared): on a measure where
// small groups are protected, the groups with the highest and lowest mean
// rank are not named, as no mean rank is shown.
func SharedOverview(b *core.Battery) Table {
	t := Overview(b)
	withhold(t, func(i int) bool { return b.Measures[i].Result != nil && b.Measures[i].Result.Plan().Any() }, "highest", "lowest")
	return t
}
