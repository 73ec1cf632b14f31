// Package report words the outcome of the H test as a plain-language
// decision that an analyst can paste into a report.
package report

import (
	"fmt"
	"slices"
	"strings"

	"midrank/core/bootstrap"
	"midrank/core/display"
)

// SmallGroup is the group size below which the chi-square approximation is
// rough (common practice: at least 5 values per group; Kruskal & Wallis
// 1952, §6, give tables for smaller samples).
const SmallGroup = 5

// Facts are the figures the decision speaks of.
type Facts struct {
	Labels []string // group labels in group order
	Sizes  []int    // values per group
	// Medians and the quartiles of each group, in group order (none when
	// the decision need not name them)
	Medians, Q1, Q3 []float64
	Measure         string // what was measured, "" when the data does not say
	H               float64
	DF              int
	P               float64
	Method          string // how p was obtained: "asymptotic", "exact" or "monte-carlo"
	Alpha           float64
	Left            []string // groups left out of the data by request
	Epsilon         float64  // ε²
	Size            string   // ε² in words
	// EpsilonInterval is ε²'s bootstrap interval, nil when not computed
	EpsilonInterval *bootstrap.Interval

	// exact method: no arrangement of the ranks is rare enough for alpha
	Unreachable bool
	// Monte Carlo method: how p was estimated
	Resamples int
	Seed      uint64
	Low, High float64 // the 99% interval

	// the trend along the groups' order, when tested
	Trend *TrendFacts

	// pairwise comparisons, when made
	PairMethod  string // the procedure in words, "" when none was run
	Reference   string // the group every other was compared with, "" for every pair
	AdjustName  string // how the family was controlled, in words
	PairsTested int
	Differences []Difference // the significant pairs

	// protection of small groups in what is shared: the groups (by index)
	// spoken of without their figures, and how many pairs with them are
	// left out (none of them is among Differences)
	Withheld      []int
	PairsWithheld int
	// PairPWithheld: the pairs' p-values are not told (they come from the
	// ranks of all groups together, hidden ones included)
	PairPWithheld bool
}

// Difference is a pair that differs significantly.
type Difference struct {
	Higher, Lower string  // the group that tends higher, and the other
	PAdjusted     float64 //
	Superiority   float64 // P(higher > lower) + ½P(equal)
	Shift         float64 // the Hodges–Lehmann shift, higher − lower
}

// Straddles reports whether a Monte Carlo interval holds alpha, so that more
// resamples could change the decision.
func Straddles(low, high, alpha float64) bool { return low <= alpha && alpha <= high }

// Significant is the decision rule: p ≤ alpha, the rejection region of a
// level-alpha test.
func Significant(p, alpha float64) bool { return p <= alpha }

// Decision writes the decision in full sentences: what was compared, the
// figures, what they mean and do not mean, and the cautions.
func Decision(f Facts) string {
	var b strings.Builder
	n := 0
	for _, s := range f.Sizes {
		n += s
	}
	on := ""
	if f.Measure != "" {
		on = fmt.Sprintf(" on %q", f.Measure)
	}
	fmt.Fprintf(&b, "%d groups (%s; %d values in all) were compared%s with the Kruskal–Wallis test, which works on ranks and so needs no assumption of normality. ",
		len(f.Labels), listLabels(f.Labels), n, on)
	if len(f.Medians) == len(f.Labels) {
		parts := make([]string, len(f.Labels))
		for g, label := range f.Labels {
			parts[g] = fmt.Sprintf("%s %s (%s to %s, n = %s)", label, Number(f.Medians[g]), Number(f.Q1[g]), Number(f.Q3[g]), thousands(int64(f.Sizes[g])))
			if slices.Contains(f.Withheld, g) {
				parts[g] = label + " not shown (protected)"
			}
		}
		fmt.Fprintf(&b, "Medians (lower to upper quartile): %s. ", strings.Join(parts, "; "))
	}
	if len(f.Labels) == 2 {
		b.WriteString("With two groups this is the two-sided Mann–Whitney (Wilcoxon rank-sum) test in its normal approximation, the name most reports use. ")
	}
	if len(f.Left) > 0 {
		fmt.Fprintf(&b, "Left out of this comparison by request: %s. ", listLabels(f.Left))
	}
	fmt.Fprintf(&b, "It gives H = %s with %d %s and %s (%s). ",
		display.Statistic.Format(f.H), f.DF, plural(f.DF, "degree of freedom", "degrees of freedom"), PValue(f.P), methodWords(f.Method))
	if f.Method == "monte-carlo" {
		fmt.Fprintf(&b, "That estimate comes from %s resamples, random reshuffles of the ranks among the groups (seed %d); the 99%% interval for p runs from %s to %s",
			thousands(int64(f.Resamples)), f.Seed, display.PValue.Format(f.Low), display.PValue.Format(f.High))
		if Straddles(f.Low, f.High, f.Alpha) {
			b.WriteString(", which includes the significance level, so the decision below is not firm: run more resamples")
		}
		b.WriteString(". ")
	}
	if f.Unreachable {
		fmt.Fprintf(&b, "With groups this small no arrangement of the ranks is rare enough to reach significance at %s, so the test cannot give a significant result here. ", Number(f.Alpha))
	}
	if Significant(f.P, f.Alpha) {
		fmt.Fprintf(&b, "At the chosen significance level of %s this is statistically significant: the groups do not all share one distribution, and at least one group tends to have higher or lower values than another. ",
			Number(f.Alpha))
		if f.PairMethod == "" {
			b.WriteString("The test alone does not say which groups differ; compare pairs of groups to find out. ")
		}
	} else {
		fmt.Fprintf(&b, "At the chosen significance level of %s this is not statistically significant: the data give no clear evidence that the groups' distributions differ. That is not proof that they are the same; small groups can miss real differences. ",
			Number(f.Alpha))
	}
	fmt.Fprintf(&b, "The effect size ε² = %s%s is %s by common benchmarks. ", display.Effect.Format(f.Epsilon), EpsilonInterval(f.EpsilonInterval), f.Size)
	if f.Trend != nil {
		b.WriteString(TrendSentence(*f.Trend, f.Alpha))
	}
	if f.PairMethod != "" {
		writePairs(&b, f)
	}
	if len(f.Withheld) > 0 {
		hidden := make([]string, len(f.Withheld))
		for i, g := range f.Withheld {
			hidden[i] = f.Labels[g]
		}
		fmt.Fprintf(&b, "To protect the people in small groups, the figures of %s and the pairs that include %s are not shown. ",
			listLabels(hidden), plural(len(hidden), "it", "them"))
	}
	b.WriteString("The test compares whole distributions; speak of a difference in medians only if the groups' distributions have a similar shape and spread. ")
	if small := smallGroups(f.Labels, f.Sizes); len(small) > 0 && f.Method == "asymptotic" {
		fmt.Fprintf(&b, "%s fewer than %d values, so the chi-square approximation behind p is rough; read p with care. ",
			small, SmallGroup)
	}
	b.WriteString(Caution)
	return b.String()
}

// BatterySummary says in plain words what a battery of measures found:
// how many measures were compared across the groups of which column, which
// of them differ at level alpha after their p-values were adjusted across
// the measures by the method named (across, in prose), and how many could
// not be analysed, followed by the Caution.
func BatterySummary(measures, analysed int, groupColumn string, differ []string, alpha float64, across string) string {
	var b strings.Builder
	fmt.Fprintf(&b, "%d measures compared across the groups of \u201c%s\u201d: ", measures, groupColumn)
	switch len(differ) {
	case 0:
		b.WriteString("none differs")
	case 1:
		fmt.Fprintf(&b, "one differs (%s)", differ[0])
	default:
		fmt.Fprintf(&b, "%d differ (%s)", len(differ), strings.Join(differ, ", "))
	}
	fmt.Fprintf(&b, " at the %s level after their p-values were adjusted across the measures by %s. ", Number(alpha), across)
	switch failed := measures - analysed; failed {
	case 0:
	case 1:
		b.WriteString("One measure could not be analysed (see the overview). ")
	default:
		fmt.Fprintf(&b, "%d measures could not be analysed (see the overview). ", failed)
	}
	b.WriteString("Read each measure in full before acting on it. ")
	return b.String() + Caution
}

// Caution is said wherever a result could inform a decision about people.
const Caution = "Statistical evidence is not a clinical, legal or employment decision: weigh it with the context, follow local rules, and consult qualified professionals."

// writePairs says how the pairs were compared and which differ.
func writePairs(b *strings.Builder, f Facts) {
	switch {
	case f.PairsTested == 1:
		fmt.Fprintf(b, "The two groups were also compared as a pair with %s, with a two-sided p-value (with one pair, %s changes nothing). ",
			f.PairMethod, f.AdjustName)
	case f.Reference != "":
		fmt.Fprintf(b, "Each of the other %d groups was compared with the reference group %s (not with one another) with %s, with two-sided p-values; the family of these %d comparisons was controlled with %s. ",
			f.PairsTested, f.Reference, f.PairMethod, f.PairsTested, f.AdjustName)
	default:
		fmt.Fprintf(b, "All %d pairs of groups were compared with %s, with two-sided p-values; the family of comparisons was controlled with %s. ",
			f.PairsTested, f.PairMethod, f.AdjustName)
	}
	if !Significant(f.P, f.Alpha) {
		b.WriteString("Because the overall test is not significant, the pairwise results are shown for completeness and should not be read as findings. ")
		return
	}
	switch {
	case len(f.Differences) == 0 && f.Reference != "":
		fmt.Fprintf(b, "No group differs significantly from %s after the adjustment; the overall difference may lie between groups that were not compared with one another. ", f.Reference)
		return
	case len(f.Differences) == 0 && f.PairsWithheld > 0:
		b.WriteString("No pair shown here differs significantly after the adjustment. ")
		return
	case len(f.Differences) == 0:
		b.WriteString("No pair differs significantly after the adjustment, so the overall difference cannot be pinned on particular groups. ")
		return
	}
	named := false // the shift's estimator is named at its first mention
	for _, d := range f.Differences {
		by := ""
		if d.Shift != 0 { // a shift of 0 (most differences are 0, as on a short scale) says nothing of the direction
			by = ", by " + Number(d.Shift)
			if !named {
				by, named = by+" (the Hodges–Lehmann estimate of the shift)", true
			}
		}
		p := "adjusted " + PValue(d.PAdjusted) + ", "
		if f.PairPWithheld {
			p = ""
		}
		fmt.Fprintf(b, "Values in %s tend to be higher than in %s%s: %sprobability of superiority %s. ",
			d.Higher, d.Lower, by, p, display.Effect.Format(d.Superiority))
	}
	switch rest := f.PairsTested - f.PairsWithheld - len(f.Differences); {
	case rest == 1 && f.Reference != "":
		fmt.Fprintf(b, "The other group shows no significant difference from %s. ", f.Reference)
	case rest > 1 && f.Reference != "":
		fmt.Fprintf(b, "The other %d groups show no significant difference from %s. ", rest, f.Reference)
	case rest == 1:
		b.WriteString("The other pair shows no significant difference. ")
	case rest > 1:
		fmt.Fprintf(b, "The other %d pairs show no significant difference. ", rest)
	}
}

// EpsilonInterval writes ε²'s interval after the figure, " (95% bootstrap
// interval 0.34 to 0.71)", or "" when there is none.
func EpsilonInterval(ci *bootstrap.Interval) string {
	if ci == nil {
		return ""
	}
	return fmt.Sprintf(" (%s%% bootstrap interval %s to %s)", display.Figure.Format(100*ci.Level), display.Effect.Format(ci.Low), display.Effect.Format(ci.High))
}

// ResultLine is the result in one line, as reports write it:
//
//	H(2) = 7.99, p = .018, ε² = 0.28, N = 30
//
// H to two decimals, p as PValue writes it, named as exact or Monte Carlo
// when it is not the chi-square approximation, ε² to two decimals.
func ResultLine(f Facts) string {
	n := 0
	for _, s := range f.Sizes {
		n += s
	}
	method := ""
	switch f.Method {
	case "exact":
		method = " (exact)"
	case "monte-carlo":
		method = " (Monte Carlo)"
	}
	return fmt.Sprintf("H(%d) = %s, %s%s, ε² = %s, N = %s", f.DF, display.Statistic.Format(f.H), PValue(f.P), method,
		display.Effect.Format(f.Epsilon), thousands(int64(n)))
}

func plural(n int, one, many string) string {
	if n == 1 {
		return one
	}
	return many
}

func methodWords(m string) string {
	switch m {
	case "exact":
		return "exact permutation p-value"
	case "monte-carlo":
		return "Monte Carlo estimate of the permutation p-value"
	}
	return "chi-square approximation"
}

// smallGroups lists the groups under SmallGroup values as a sentence subject.
func smallGroups(labels []string, sizes []int) string {
	var small []string
	for i, s := range sizes {
		if s < SmallGroup {
			small = append(small, labels[i])
		}
	}
	switch len(small) {
	case 0:
		return ""
	case 1:
		return fmt.Sprintf("Group %s has", small[0])
	}
	return fmt.Sprintf("Groups %s have", listLabels(small))
}

// listLabels joins labels as "A, B and C", each as written.
func listLabels(labels []string) string {
	if len(labels) == 1 {
		return labels[0]
	}
	return strings.Join(labels[:len(labels)-1], ", ") + " and " + labels[len(labels)-1]
}

// Number shows a figure in prose as everywhere else (display.Figure: four
// significant digits, powers of ten below 0.0001 and from a million up).
func Number(v float64) string { return display.Figure.Format(v) }

// PValue writes "p = .018", "p < .001" or "p > .999": p as display.PValue
// shows it (APA 7), after "p" in prose and in the result line.
func PValue(p float64) string {
	shown := display.PValue.Format(p)
	if strings.HasPrefix(shown, "<") || strings.HasPrefix(shown, ">") {
		return "p " + shown
	}
	return "p = " + shown
}
