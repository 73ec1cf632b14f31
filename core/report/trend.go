package report

import (
	"fmt"
	"strings"

	"midrank/core/display"
)

// TrendFacts are the figures of the Jonckheere–Terpstra test that the
// decision speaks of.
type TrendFacts struct {
	Order       []string // the groups' labels in the order tested
	Alternative string   // increasing, decreasing or two-sided
	J, Z, P     float64
	Method      string // how p was found: "exact", "monte-carlo" or "asymptotic"
	Tau         float64
	Size        string // τ_b in words
}

// The reasons given for how the trend test's p was found.
const (
	TrendExact    = "Exact: every deal of the values to the groups, in their order, was accounted for, ties included."
	TrendNormal   = "Normal approximation to J, with its variance corrected for ties (Hollander, Wolfe & Chicken 2014, §6.2)."
	TrendTooLarge = TrendNormal + " The exact distribution is beyond this tool's budget for groups this large."
)

// TrendMonteCarlo is the reason given for a trend test's p found by Monte
// Carlo, automatically (the exact distribution being too large) or as asked.
func TrendMonteCarlo(resamples int, seed uint64, automatic bool) string {
	why := "Monte Carlo, as asked"
	if automatic {
		why = "Monte Carlo, chosen automatically: the exact distribution is beyond this tool's budget, and with a group under " +
			fmt.Sprint(SmallGroup) + " values or heavy ties the normal approximation is rough"
	}
	return fmt.Sprintf("%s: %s random deals of the values to the groups (seed %d); p̂ = (b+1)/(B+1) with b the deals at least as extreme.",
		why, thousands(int64(resamples)), seed)
}

// TrendOrderCaution is what a trend test asks of the order of the groups.
const TrendOrderCaution = "A trend test is only as good as its order: it must come from what the groups are (bands, grades, doses), set before looking at the results."

// directionWords say what each alternative looks for, in prose.
var directionWords = map[string]string{"increasing": "rising", "decreasing": "falling", "two-sided": "rising or falling"}

// TrendSentence words the trend test: whether the values tend to rise or
// fall along the groups' order, its figures and effect size, and what the
// order must be.
func TrendSentence(t TrendFacts, alpha float64) string {
	var b strings.Builder
	order := strings.Join(t.Order, ", then ")
	sided := "one-sided"
	if t.Alternative == "two-sided" {
		sided = "two-sided"
	}
	figures := fmt.Sprintf("J = %s, z = %s, %s %s (%s); Kendall's tau-b between the order and the values is %s (%s)",
		Number(t.J), display.Statistic.Format(t.Z), sided, PValue(t.P), trendMethod(t.Method), display.Effect.Format(t.Tau), t.Size)
	if Significant(t.P, alpha) {
		way := "rise"
		if t.Z < 0 {
			way = "fall"
		}
		fmt.Fprintf(&b, "Along the groups' order (%s) the values tend to %s: the Jonckheere–Terpstra test for a %s trend gives %s. ", order, way, directionWords[t.Alternative], figures)
	} else {
		fmt.Fprintf(&b, "The Jonckheere–Terpstra test finds no clear %s trend along the groups' order (%s) at the %s level: %s. ", directionWords[t.Alternative], order, Number(alpha), figures)
	}
	b.WriteString(TrendOrderCaution + " ")
	return b.String()
}

func trendMethod(m string) string {
	switch m {
	case "exact":
		return "exact"
	case "monte-carlo":
		return "Monte Carlo"
	}
	return "normal approximation"
}
