package core

import (
	"context"
	"math"
	"slices"
	"strings"

	"midrank/core/adjust"
	"midrank/core/jsonlite"
	"midrank/core/letters"
	"midrank/core/posthoc"
	"midrank/core/rank"
	"midrank/core/report"
)

// PostHoc is the result of the pairwise comparisons.
type PostHoc struct {
	Method     posthoc.Method `json:"method"`
	Adjust     adjust.Method  `json:"adjust"`
	Confidence float64        `json:"confidence"` // of each Hodges–Lehmann interval (see intervalLevel)
	// Together: the intervals hold together at 1 − alpha (a family-wise
	// adjustment); else each holds on its own at Confidence
	Together bool `json:"intervals_together"`
	// Reference is the group every other was compared with (its label as
	// shown), nil when every pair was compared
	Reference *string           `json:"reference"`
	Pairs     []PairResult      `json:"pairs"`
	Letters   map[string]string `json:"letters"` // groups sharing a letter are not distinguishable at alpha; empty when Reference is set
	// Undefined: the procedure gives no test for the pairs (see
	// posthoc.Pair); Infinite counts the pairs whose statistic is infinite
	Undefined bool `json:"-"`
	Infinite  int  `json:"-"`
}

// PairResult is one comparison, a before b in input order.
type PairResult struct {
	A string `json:"a"`
	B string `json:"b"`
	// Statistic is signed, positive when a tends higher (U of a for
	// mann-whitney); null when it is infinite or undefined. P (two-sided) and
	// PAdjusted are null when the test is undefined for the pair.
	Statistic   *float64 `json:"statistic"`
	P           *float64 `json:"p"`
	PAdjusted   *float64 `json:"p_adjusted"`
	Significant bool     `json:"significant"` // p_adjusted ≤ alpha
	Exact       bool     `json:"exact"`       // mann-whitney: exact null distribution
	// effect sizes
	ProbSuperiority float64 `json:"probability_of_superiority"` // P(a > b) + ½P(a = b)
	CliffsDelta     float64 `json:"cliffs_delta"`
	Shift           float64 `json:"hodges_lehmann"` // median of a − b
	ShiftLow        float64 `json:"hodges_lehmann_low"`
	ShiftHigh       float64 `json:"hodges_lehmann_high"`
}

// MaxPairGroups is the most groups whose pairs are compared: 100 groups make
// 4,950 pairs, beyond what a table of pairs can show a reader, and the work
// and the answer grow with the square of the groups (1,000 groups of three
// took 14 s and 160 MB of JSON).
const MaxPairGroups = 100

// comparePairs runs the post-hoc procedure on groups with the tie-corrected
// h, on every pair or on the reference group's with each other, adjusts the
// p-values over those comparisons and, for every pair, letters the groups;
// nil when no pairs were asked for or there are more than MaxPairGroups
// groups.
func comparePairs(ctx context.Context, s settings, ranking rank.Ranking, groups []Group, h float64) (*PostHoc, error) {
	if !s.pairs || len(groups) > MaxPairGroups {
		return nil, nil
	}
	k := len(groups)
	reference := -1
	if s.reference != "" {
		reference = slices.IndexFunc(groups, func(g Group) bool { return g.InData == s.reference })
		if reference < 0 {
			labels := make([]string, k)
			for i, g := range groups {
				labels[i] = g.InData
			}
			return nil, &OptionError{Option: "reference", Value: s.reference, Reason: "no group in the test is labelled so; choose one of " + strings.Join(labels, ", ")}
		}
	}
	family := k * (k - 1) / 2
	if reference >= 0 {
		family = k - 1
	}
	confidence, together := intervalLevel(s.adjust, s.alpha, family)
	var pairs []posthoc.Pair
	var err error
	if reference >= 0 {
		pairs, err = posthoc.Against(ctx, s.posthoc, ranking, h, confidence, reference)
	} else {
		pairs, err = posthoc.Compare(ctx, s.posthoc, ranking, h, confidence)
	}
	if err != nil {
		return nil, err
	}
	// the family is the pairs that have a p
	var raw []float64
	for _, p := range pairs {
		if !p.Undefined {
			raw = append(raw, p.P)
		}
	}
	adjusted, err := adjust.Adjust(raw, s.adjust)
	if err != nil {
		return nil, err
	}
	ph := &PostHoc{Method: s.posthoc, Adjust: s.adjust, Confidence: confidence, Together: together, Letters: map[string]string{}}
	differ := make([]bool, k*k)
	next := 0
	for _, p := range pairs {
		pr := PairResult{A: groups[p.A].Label, B: groups[p.B].Label, Exact: p.Exact,
			ProbSuperiority: p.ProbSuperiority, CliffsDelta: p.CliffsDelta,
			Shift: p.Shift, ShiftLow: p.ShiftLow, ShiftHigh: p.ShiftHigh}
		if !p.Undefined {
			pr.P, pr.PAdjusted = &p.P, &adjusted[next]
			pr.Significant = report.Significant(adjusted[next], s.alpha)
			next++
		}
		if !p.Undefined && !p.Infinite {
			pr.Statistic = &p.Statistic
		}
		ph.Undefined = ph.Undefined || p.Undefined
		if p.Infinite {
			ph.Infinite++
		}
		differ[p.A*k+p.B], differ[p.B*k+p.A] = pr.Significant, pr.Significant
		ph.Pairs = append(ph.Pairs, pr)
	}
	if reference >= 0 { // letters speak of every pair
		ph.Reference = &groups[reference].Label
		return ph, nil
	}
	for g, l := range letters.Display(k, func(a, b int) bool { return differ[a*k+b] }) {
		ph.Letters[groups[g].Label] = l
	}
	return ph, nil
}

// intervalLevel is the confidence of each pair's Hodges–Lehmann interval,
// so that the intervals agree with how the p-values are adjusted: for the
// adjustments that hold the family-wise error rate, the Bonferroni level
// 1 − α/m (Holm, Bonferroni, Hochberg) or the Šidák level (1 − α)^(1/m)
// (Šidák 1967), at which the m intervals hold together at 1 − α; for those
// that hold the false discovery rate (Benjamini–Hochberg,
// Benjamini–Yekutieli) or none, no simultaneous interval matches, and each
// holds on its own at 1 − α.
func intervalLevel(m adjust.Method, alpha float64, pairs int) (confidence float64, together bool) {
	switch m {
	case adjust.Holm, adjust.Bonferroni, adjust.Hochberg:
		return 1 - alpha/float64(pairs), true
	case adjust.Sidak:
		return math.Pow(1-alpha, 1/float64(pairs)), true
	}
	return 1 - alpha, false
}

// writePostHoc writes the pairwise comparisons with the names of PostHoc's
// json tags, or null.
func writePostHoc(w *jsonlite.Writer, ph *PostHoc) {
	if ph == nil {
		w.Null()
		return
	}
	w.BeginObject()
	w.StringMember("method", string(ph.Method))
	w.StringMember("adjust", string(ph.Adjust))
	w.FloatMember("confidence", ph.Confidence)
	w.BoolMember("intervals_together", ph.Together)
	w.Key("reference")
	w.OptString(ph.Reference)
	w.Key("pairs")
	w.BeginArray()
	for _, p := range ph.Pairs {
		w.BeginObject()
		w.StringMember("a", p.A)
		w.StringMember("b", p.B)
		w.OptFloatMember("statistic", p.Statistic)
		w.OptFloatMember("p", p.P)
		w.OptFloatMember("p_adjusted", p.PAdjusted)
		w.BoolMember("significant", p.Significant)
		w.BoolMember("exact", p.Exact)
		for _, f := range []struct {
			name string
			v    float64
		}{{"probability_of_superiority", p.ProbSuperiority}, {"cliffs_delta", p.CliffsDelta},
			{"hodges_lehmann", p.Shift}, {"hodges_lehmann_low", p.ShiftLow}, {"hodges_lehmann_high", p.ShiftHigh}} {
			w.Key(f.name)
			w.Float(f.v)
		}
		w.EndObject()
	}
	w.EndArray()
	w.Key("letters")
	w.BeginObject()
	labels := make([]string, 0, len(ph.Letters))
	for l := range ph.Letters {
		labels = append(labels, l)
	}
	slices.Sort(labels) // as encoding/json orders map keys
	for _, l := range labels {
		w.Key(l)
		w.String(ph.Letters[l])
	}
	w.EndObject()
	w.EndObject()
}
