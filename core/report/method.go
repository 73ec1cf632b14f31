package report

import (
	"fmt"
	"strings"

	"midrank/core/display"
)

// Choice is how the p-value was found, for the sentence that explains it.
type Choice struct {
	Method    string // "asymptotic", "exact" or "monte-carlo"
	Automatic bool   // chosen by the automatic rule rather than asked for
	Sizes     []int  // the groups' sizes
	// SizesWithheld: the sizes are not told (small groups are protected)
	SizesWithheld bool
	// why the automatic rule passed over a method
	ExactTooLarge     bool // the exact distribution is beyond the budget
	MonteCarloTooLong bool // values × resamples beyond the automatic budget
	Resamples         int
	Seed              uint64
}

// MethodReason says how the p-value was found and, when it was chosen
// automatically, why.
func MethodReason(c Choice) string {
	n := 0
	for _, s := range c.Sizes {
		n += s
	}
	switch c.Method {
	case "exact":
		reason := fmt.Sprintf("Exact: every one of the %s equally likely ways to deal these ranks into groups of %s was accounted for.",
			dealCount(c.Sizes), Sizes(c.Sizes))
		if c.SizesWithheld {
			reason = "Exact: every one of the equally likely ways to deal these ranks into the groups was accounted for."
		}
		if c.Automatic {
			reason = "Chosen automatically. " + reason
		}
		return reason
	case "monte-carlo":
		if !c.Automatic {
			return fmt.Sprintf("Monte Carlo, as requested: %s resamples, each a random reshuffle of the ranks among the groups (seed %d).", thousands(int64(c.Resamples)), c.Seed)
		}
		return fmt.Sprintf("Monte Carlo, chosen automatically: %s, and small groups or heavy ties make the chi-square approximation unreliable; %s resamples (seed %d) estimate p.",
			exactTooLarge, thousands(int64(c.Resamples)), c.Seed)
	}
	switch {
	case !c.Automatic:
		return "Chi-square approximation, as requested."
	case c.MonteCarloTooLong:
		return fmt.Sprintf("Chi-square approximation, chosen automatically: %s, and Monte Carlo with %s resamples of %s values would take too long for an automatic choice (ask for monte-carlo to run it); with %s values the approximation, with the tie correction, is usually close.",
			exactTooLarge, thousands(int64(c.Resamples)), thousands(int64(n)), thousands(int64(n)))
	}
	return fmt.Sprintf("Chi-square approximation, chosen automatically: %s, and every group has at least %d values with few ties, where the approximation is good.",
		exactTooLarge, SmallGroup)
}

const exactTooLarge = "the exact distribution is too large to compute here"

// ExactRefused is the reason an explicit request for the exact p-value is
// refused: what the budget found.
func ExactRefused(sizes []int, why error) string {
	return fmt.Sprintf("the exact distribution for groups of %s is beyond the budget of this tool (%v)", Sizes(sizes), why)
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

// thousands writes a count as the display policy does: 1,300.
func thousands(v int64) string { return display.Thousands(v) }

// Sizes lists group sizes as words: "5, 6 and 7".
func Sizes(sizes []int) string {
	parts := make([]string, len(sizes))
	for i, s := range sizes {
		parts[i] = fmt.Sprint(s)
	}
	if len(parts) == 1 {
		return parts[0]
	}
	return strings.Join(parts[:len(parts)-1], ", ") + " and " + parts[len(parts)-1]
}
