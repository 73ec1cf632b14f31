// Package tables defines each table of results once: its columns (key,
// heading, unit, how the values are shown) and how a column's value is read
// from an analysis. Every renderer walks these definitions: the page and its
// CSV, HTML and Markdown downloads (through the JSON of Encode, which the
// WebAssembly module hands the page) and the command line's text. Adding a
// column is one line here.
//
// Reading order: this file (the tables), views.go (which tables an output
// shows: every figure, or the results as shared), overview.go (a battery's),
// encode.go (their JSON); the display policy is package display.
package tables

import (
	"fmt"
	"slices"
	"strings"

	"midrank/core"
	"midrank/core/adjust"
	"midrank/core/display"
	"midrank/core/kruskal"
	"midrank/core/report"
)

// Unit says what a column's numbers are measured in.
type Unit int

const (
	// NoUnit: counts, statistics, probabilities, ranks (their heading says so).
	NoUnit Unit = iota
	// MeasureUnit: the measure's own unit, e.g. a median or a shift; the
	// heading names the measure when the data does.
	MeasureUnit
)

// Column is one column of a table as people and files see it.
type Column struct {
	Key     string // the CSV header and JSON name, lower case with underscores
	Heading string // the words shown above the column
	Unit    Unit
	Show    display.Show
}

// Table is a table of results: its columns and, per row, one value a column
// (float64, int, string, bool or nil for undefined) and the value as shown.
type Table struct {
	Name    string // "figures", "trend", "groups", "levels" or "pairs"
	Title   string
	Note    string // what the reader needs to read the table, "" when nothing
	Columns []Column
	Rows    [][]Cell
	// List: one row of figures about one thing, which reads down the page
	// (heading, value) rather than across
	List bool
}

// Cell is one value of a table with the text that shows it.
type Cell struct {
	Value any
	Text  string
}

// column is a column with the way its value is read from one row's source.
type column[T any] struct {
	Column
	value func(T) any
}

// words is a value whose key goes to files and whose words go to people
// (p_method "exact", shown as "exact permutation").
type words struct{ key, text string }

// groupRow is one group with its letters from the pairwise comparisons.
type groupRow struct {
	core.Group
	letters string
}

// figureColumns are the test's figures: a table of one row, which the page
// and the reports show as a list of figures.
var figureColumns = []column[*core.Result]{
	{Column{"h", "H, corrected for ties", NoUnit, display.Statistic}, func(r *core.Result) any { return r.H }},
	{Column{"df", "Degrees of freedom", NoUnit, display.Count}, func(r *core.Result) any { return r.DF }},
	{Column{"p_value", "p-value", NoUnit, display.PValue}, func(r *core.Result) any { return r.PValue }},
	{Column{"p_method", "How p was found", NoUnit, display.Text}, func(r *core.Result) any { return words{r.PMethod, methodWords[r.PMethod]} }},
	{Column{"p_interval", "99% interval for p", NoUnit, display.PValue}, pInterval},
	{Column{"alpha", "Chosen level (alpha)", NoUnit, display.Figure}, func(r *core.Result) any { return r.Alpha }},
	{Column{"significant", "Significant at that level", NoUnit, display.Flag}, func(r *core.Result) any { return r.Significant }},
	{Column{"critical_value", "H needed for significance (chi-square)", NoUnit, display.Statistic}, func(r *core.Result) any { return r.CriticalValue }},
	{Column{"exact_critical_value", "H needed for significance (exact)", NoUnit, display.Statistic}, exactCritical},
	{Column{"epsilon_squared", "Effect size ε²", NoUnit, display.Effect}, func(r *core.Result) any { return r.EpsilonSquared }},
	{Column{"epsilon_squared_interval", "95% interval for ε² (bootstrap)", NoUnit, display.Effect}, epsilonInterval},
	{Column{"epsilon_squared_size", "ε² in words", NoUnit, display.Text}, func(r *core.Result) any { return r.EpsilonSquaredSize }},
	{Column{"eta_squared", "Effect size η²(H), the alternative", NoUnit, display.Effect}, func(r *core.Result) any { return optional(r.EtaSquared) }},
	{Column{"eta_squared_size", "η²(H) in words", NoUnit, display.Text}, func(r *core.Result) any { return optional(r.EtaSquaredSize) }},
	{Column{"tie_correction", "Tie correction C", NoUnit, display.Figure}, func(r *core.Result) any { return r.TieCorrection }},
	{Column{"h_uncorrected", "H before the correction", NoUnit, display.Statistic}, func(r *core.Result) any { return r.HUncorrected }},
}

// trendColumns are the trend test's figures, one row.
var trendColumns = []column[*core.Trend]{
	{Column{"order", "Order tested", NoUnit, display.Text}, func(t *core.Trend) any { return strings.Join(t.Order, ", then ") }},
	{Column{"alternative", "Trend looked for", NoUnit, display.Text}, func(t *core.Trend) any { return words{t.Alternative, trendWords[t.Alternative]} }},
	{Column{"statistic", "J (Jonckheere–Terpstra)", NoUnit, display.Figure}, func(t *core.Trend) any { return t.Statistic }},
	{Column{"expected", "J expected with no trend", NoUnit, display.Figure}, func(t *core.Trend) any { return t.Expected }},
	{Column{"z", "z, corrected for ties", NoUnit, display.Statistic}, func(t *core.Trend) any { return t.Z }},
	{Column{"p", "p-value", NoUnit, display.PValue}, func(t *core.Trend) any { return t.P }},
	{Column{"p_method", "How p was found", NoUnit, display.Text}, func(t *core.Trend) any { return words{t.PMethod, trendMethodWords[t.PMethod]} }},
	{Column{"p_interval", "99% interval for p", NoUnit, display.PValue}, func(t *core.Trend) any { return monteCarloInterval(t.MonteCarlo) }},
	{Column{"exact_critical_value", "J needed for significance (exact)", NoUnit, display.Figure}, trendCritical},
	{Column{"significant", "Significant at the chosen level", NoUnit, display.Flag}, func(t *core.Trend) any { return t.Significant }},
	{Column{"tau_b", "Kendall's tau-b, order with values", NoUnit, display.Effect}, func(t *core.Trend) any { return t.TauB }},
	{Column{"tau_b_size", "tau-b in words", NoUnit, display.Text}, func(t *core.Trend) any { return t.TauBSize }},
}

// trendCritical is the exact critical J, or why there is none.
func trendCritical(t *core.Trend) any { return critical(t.PMethod, t.CriticalExact) }

// trendCriticalHeadings say which side of the critical J is significant.
var trendCriticalHeadings = map[string]string{
	"increasing": "Significant when J is at least (exact)",
	"decreasing": "Significant when J is at most (exact)",
	"two-sided":  "Significant when J is at least (exact; or as far below the expected J)",
}

// trendWords and trendMethodWords put the trend test's keys into words.
var (
	trendWords       = map[string]string{"increasing": "rising along the order (one-sided)", "decreasing": "falling along the order (one-sided)", "two-sided": "rising or falling (two-sided)"}
	trendMethodWords = map[string]string{"exact": "exact permutation", "monte-carlo": "Monte Carlo", "asymptotic": "normal approximation"}
)

// groupColumns are the groups table's columns.
var groupColumns = []column[groupRow]{
	{Column{"group", "Group", NoUnit, display.Text}, func(g groupRow) any { return g.Label }},
	{Column{"values", "Values", NoUnit, display.Count}, func(g groupRow) any { return g.N }},
	{Column{"missing", "Missing", NoUnit, display.Count}, func(g groupRow) any { return g.Missing }},
	{Column{"median", "Median", MeasureUnit, display.Figure}, func(g groupRow) any { return g.Median }},
	{Column{"lower_quartile", "Lower quartile", MeasureUnit, display.Figure}, func(g groupRow) any { return g.Q1 }},
	{Column{"upper_quartile", "Upper quartile", MeasureUnit, display.Figure}, func(g groupRow) any { return g.Q3 }},
	{Column{"lowest", "Lowest", MeasureUnit, display.Figure}, func(g groupRow) any { return g.Min }},
	{Column{"highest", "Highest", MeasureUnit, display.Figure}, func(g groupRow) any { return g.Max }},
	{Column{"mean_rank", "Mean rank", NoUnit, display.Figure}, func(g groupRow) any { return g.MeanRank }},
	{Column{"rank_sum", "Rank sum", NoUnit, display.Figure}, func(g groupRow) any { return g.RankSum }},
	{Column{"letters", "Letters", NoUnit, display.Text}, func(g groupRow) any { return g.letters }},
}

// levelRow is one level of one group of a table of counts.
type levelRow struct {
	group, level string
	count        int
	share, upTo  float64 // the share of the group at this level, and at this level or below
	median       bool    // the group's median falls at this level
}

// levelColumns are the levels table's columns.
var levelColumns = []column[levelRow]{
	{Column{"group", "Group", NoUnit, display.Text}, func(l levelRow) any { return l.group }},
	{Column{"level", "Level", NoUnit, display.Text}, func(l levelRow) any { return l.level }},
	{Column{"values", "Values", NoUnit, display.Count}, func(l levelRow) any { return l.count }},
	{Column{"share", "Share of the group", NoUnit, display.Share}, func(l levelRow) any { return l.share }},
	{Column{"share_up_to", "Share at this level or below", NoUnit, display.Share}, func(l levelRow) any { return l.upTo }},
	{Column{"median_here", "Median here", NoUnit, display.Flag}, func(l levelRow) any { return l.median }},
}

// pairColumns are the pairs table's columns.
var pairColumns = []column[core.PairResult]{
	{Column{"first", "First", NoUnit, display.Text}, func(p core.PairResult) any { return p.A }},
	{Column{"second", "Second", NoUnit, display.Text}, func(p core.PairResult) any { return p.B }},
	{Column{"statistic", "Statistic", NoUnit, display.Statistic}, func(p core.PairResult) any { return optional(p.Statistic) }},
	{Column{"p", "p", NoUnit, display.PValue}, func(p core.PairResult) any { return optional(p.P) }},
	{Column{"p_adjusted", "Adjusted p", NoUnit, display.PValue}, func(p core.PairResult) any { return optional(p.PAdjusted) }},
	{Column{"significant", "Differ", NoUnit, display.Flag}, func(p core.PairResult) any { return p.Significant }},
	{Column{"probability_of_superiority", "Chance first is higher", NoUnit, display.Effect}, func(p core.PairResult) any { return p.ProbSuperiority }},
	{Column{"cliffs_delta", "Cliff's δ", NoUnit, display.Effect}, func(p core.PairResult) any { return p.CliffsDelta }},
	{Column{"hodges_lehmann", "Shift", MeasureUnit, display.Figure}, func(p core.PairResult) any { return p.Shift }},
	{Column{"hodges_lehmann_low", "Interval from", MeasureUnit, display.Figure}, func(p core.PairResult) any { return p.ShiftLow }},
	{Column{"hodges_lehmann_high", "Interval to", MeasureUnit, display.Figure}, func(p core.PairResult) any { return p.ShiftHigh }},
}

// methodWords name the ways of finding p for people.
var methodWords = map[string]string{"asymptotic": "chi-square approximation", "exact": "exact permutation", "monte-carlo": "Monte Carlo"}

// exactCritical is the exact critical value, or why there is none.
func exactCritical(r *core.Result) any { return critical(r.PMethod, r.ExactCriticalValue) }

// critical is an exact critical value, or why there is none: p was not
// found exactly, or no outcome is rare enough for alpha.
func critical(method string, value *float64) any {
	switch {
	case method != "exact":
		return words{"", "not computed"}
	case value == nil:
		return words{"", "none reachable"}
	}
	return *value
}

// epsilonInterval is ε²'s bootstrap interval, or why there is none.
func epsilonInterval(r *core.Result) any {
	if ci := r.EpsilonSquaredInterval; ci != nil {
		return words{"", display.Effect.Format(ci.Low) + " to " + display.Effect.Format(ci.High)}
	}
	return words{"", fmt.Sprintf("not computed (more than %s values)", display.Thousands(core.EffectBudget/core.MinEffectResamples))}
}

// pInterval is the Monte Carlo estimate's 99% interval, or why there is none.
func pInterval(r *core.Result) any { return monteCarloInterval(r.MonteCarlo) }

// monteCarloInterval is a Monte Carlo estimate's interval for p, in words.
func monteCarloInterval(mc *core.MonteCarlo) any {
	if mc != nil {
		return words{"", display.PValue.Format(mc.CILow) + " to " + display.PValue.Format(mc.CIHigh)}
	}
	return words{"", "not estimated (only Monte Carlo estimates p)"}
}

func optional[T any](v *T) any {
	if v == nil {
		return nil
	}
	return *v
}

// Figures is the table of the test's figures, one row.
func Figures(r *core.Result) Table {
	note := "ε² is the headline effect size, in words " + kruskal.SizeRule() + "; η²(H) is the alternative some reports use."
	if ci := r.EpsilonSquaredInterval; ci != nil {
		note += fmt.Sprintf(" ε²'s interval is a percentile bootstrap (%s resamples within each group, seed %d). With small groups it is narrower than it should be: in a simulation of three groups of 10 values the 95%% interval held the true ε² in only 85%% of samples.",
			display.Thousands(int64(ci.Resamples)), ci.Seed)
	}
	t := build("figures", "Test figures", note, r.Input.Measure, figureColumns, []*core.Result{r})
	t.List = true
	return t
}

// Trend is the table of the trend test's figures, one row; call it only
// when r.Trend is not nil.
func Trend(r *core.Result) Table {
	note := r.Trend.Reason + " Tau-b in words " + core.TauSizeRule() + ". " + report.TrendOrderCaution
	t := build("trend", "Trend along the groups' order", note, "", trendColumns, []*core.Trend{r.Trend})
	t.List = true
	for i := range t.Columns {
		if t.Columns[i].Key == "exact_critical_value" {
			t.Columns[i].Heading = trendCriticalHeadings[r.Trend.Alternative]
		}
	}
	return t
}

// withheld is the text of a figure not shown, in the row of a hidden group.
const withheld = "not shown"

// groups is the table of the groups.
func groups(r *core.Result, v view) Table {
	rows := make([]groupRow, len(r.Groups))
	for i, g := range r.Groups {
		rows[i].Group = g
		if r.PostHoc != nil {
			rows[i].letters = r.PostHoc.Letters[g.Label]
		}
	}
	note := "Quartiles: " + r.QuantileMethod + "."
	if l := r.Levels; l != nil && l.Values[0] == 1 && l.Names[0] != "1" {
		note += fmt.Sprintf(" Values are the levels' places on the scale: 1 (%s) to %d (%s).", l.Names[0], len(l.Names), l.Names[len(l.Names)-1])
	}
	left := map[string]bool{"letters": r.PostHoc == nil || r.PostHoc.Reference != nil, // letters come only from comparing every pair
		"lowest": v.shared, "highest": v.shared, "rank_sum": v.plan.Any(), "mean_rank": v.plan.Any()}
	if v.plan.Any() {
		left["letters"] = true // they would tell which shown groups a hidden one differs from
		note += " " + r.ProtectionNote()
	}
	columns := slices.DeleteFunc(slices.Clone(groupColumns), func(c column[groupRow]) bool { return left[c.Key] })
	t := build("groups", "Groups", note, r.Input.Measure, columns, rows)
	for g, row := range t.Rows {
		if !v.plan.Hidden(g) {
			continue
		}
		for j, c := range t.Columns {
			switch c.Key {
			case "group":
			case "values":
				row[j] = Cell{Value: v.plan.Size(g), Text: v.plan.Size(g)}
			default:
				row[j] = Cell{Text: withheld}
			}
		}
	}
	return t
}

// levels is the table of a table of counts' groups level by level, without
// the hidden groups; call it only when r.Levels is not nil.
func levels(r *core.Result, v view) Table {
	var rows []levelRow
	for i, g := range r.Levels.Groups {
		if v.plan.Hidden(i) {
			continue
		}
		upTo := 0.0
		for c, name := range r.Levels.Names {
			upTo += g.Shares[c]
			rows = append(rows, levelRow{group: g.Label, level: name, count: g.Counts[c], share: g.Shares[c], upTo: upTo,
				median: c == g.MedianFrom || c == g.MedianTo})
		}
	}
	return build("levels", "Groups level by level", "Shares of each group's values; the median falls at the level marked, or between the two marked.", "", levelColumns, rows)
}

// pairs is the table of the pairwise comparisons, without those of the
// hidden groups; call it only when pairs were compared.
func pairs(r *core.Result, v view) Table {
	ph := r.PostHoc
	adjusted := "adjusted by " + ph.Adjust.Name() + " for the whole family of comparisons"
	if ph.Adjust == adjust.None {
		adjusted = "not adjusted for the number of comparisons"
	}
	intervals := fmt.Sprintf("with its %s%% interval, at the level where the intervals of all %d pairs hold together at %s%%", display.Figure.Format(100*ph.Confidence),
		len(ph.Pairs), display.Figure.Format(100*(1-r.Alpha)))
	if !ph.Together {
		intervals = fmt.Sprintf("with its %s%% interval, which holds for its pair alone (no interval for all pairs together matches this adjustment)", display.Figure.Format(100*ph.Confidence))
	}
	compared := "Compared"
	if ph.Reference != nil {
		compared = fmt.Sprintf("Each other group compared with the reference group \u201c%s\u201d only (%d comparisons, not every pair; so the groups get no letters)", *ph.Reference, len(ph.Pairs))
	}
	note := fmt.Sprintf("%s by %s, whose statistic is %s; p two-sided, %s. Chance first is higher: the probability that a value of the first group is higher than one of the second, a tie counting half (the probability of superiority). Shift: the Hodges–Lehmann estimate of how much higher the first group lies, %s.",
		compared, ph.Method.Name(), ph.Method.Statistic(), adjusted, intervals)
	columns, shown := pairColumns, ph.Pairs
	if v.plan.Any() {
		hidden := map[string]bool{}
		for g, group := range r.Groups {
			hidden[group.Label] = v.plan.Hidden(g)
		}
		shown = slices.DeleteFunc(slices.Clone(shown), func(p core.PairResult) bool { return hidden[p.A] || hidden[p.B] })
		note += fmt.Sprintf(" The %d pairs that include a protected group are not shown.", len(ph.Pairs)-len(shown))
		if ph.Method.JointRanks() {
			columns = slices.DeleteFunc(slices.Clone(columns), func(c column[core.PairResult]) bool {
				return c.Key == "statistic" || c.Key == "p" || c.Key == "p_adjusted"
			})
			note += " Nor are the statistics and p-values: " + ph.Method.Name() + " works on the ranks of all groups together, so they would give the protected groups' ranks away; Differ gives each pair's decision."
		}
	}
	t := build("pairs", "Pairs of groups", note, r.Input.Measure, columns, shown)
	for i := range t.Columns {
		if t.Columns[i].Key == "statistic" {
			t.Columns[i].Heading = "Statistic " + ph.Method.Statistic()
		}
	}
	return t
}

func build[T any](name, title, note, measure string, columns []column[T], rows []T) Table {
	t := Table{Name: name, Title: title, Note: note, Columns: make([]Column, len(columns)), Rows: make([][]Cell, len(rows))}
	var inMeasure []string
	for i, c := range columns {
		t.Columns[i] = c.Column
		if c.Unit == MeasureUnit {
			inMeasure = append(inMeasure, strings.ToLower(c.Heading))
		}
	}
	if len(inMeasure) > 0 && measure != "" {
		t.Note = strings.TrimSpace(t.Note + " In the units of \u201c" + measure + "\u201d: " + strings.Join(inMeasure, ", ") + ".")
	}
	for i, row := range rows {
		cells := make([]Cell, len(columns))
		for j, c := range columns {
			v := c.value(row)
			if w, ok := v.(words); ok {
				cells[j] = Cell{Value: w.key, Text: w.text}
				if w.key == "" {
					cells[j].Value = nil
				}
				continue
			}
			cells[j] = Cell{Value: v, Text: c.Show.Format(v)}
		}
		t.Rows[i] = cells
	}
	return t
}
