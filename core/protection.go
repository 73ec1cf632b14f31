package core

import (
	"fmt"
	"strings"

	"midrank/core/jsonlite"
	"midrank/core/protect"
	"midrank/core/report"
)

// Protection is the protection of small groups in what is shared (see
// Options.MinGroupSize and package protect): the threshold, the groups
// under it and the groups hidden with them, by label.
type Protection struct {
	MinGroupSize int      `json:"min_group_size"`
	Small        []string `json:"small"`
	Others       []string `json:"others"`
}

func protectionOf(r *Result) *Protection {
	p := &Protection{MinGroupSize: r.plan.Min, Small: []string{}, Others: []string{}}
	for _, g := range r.plan.Small {
		p.Small = append(p.Small, r.Groups[g].Label)
	}
	for _, g := range r.plan.Others {
		p.Others = append(p.Others, r.Groups[g].Label)
	}
	return p
}

// Plan is the protection of the groups in what is shared (no group hidden
// when protection is off).
func (r *Result) Plan() protect.Plan { return r.plan }

// SharedDecision is the decision as outputs that leave the analyst's
// screen give it: the hidden groups without their figures.
func (r *Result) SharedDecision() string { return report.Decision(r.facts(r.plan)) }

// SharedMethodReason is how p was found, as shared: with groups hidden,
// without the groups' sizes.
func (r *Result) SharedMethodReason() string {
	if !r.plan.Any() {
		return r.PMethodReason
	}
	c := r.choice
	c.SizesWithheld = true
	return report.MethodReason(c)
}

// SharedWarnings are the warnings as shared: no cell of the data, the
// hidden groups without their sizes.
func (r *Result) SharedWarnings() []string { return warnings(r, r.plan, true) }

// ProtectionNote says in a sentence which protection the shared outputs
// apply, "" when none was asked for.
func (r *Result) ProtectionNote() string {
	p := r.Protection
	switch {
	case p == nil:
		return ""
	case len(p.Small) == 0:
		return fmt.Sprintf("Small groups protected (fewer than %d values): no group is that small, so none is hidden.", p.MinGroupSize)
	}
	note := fmt.Sprintf("Small groups protected: %s %s fewer than %d values", quoteList(p.Small), pronoun(len(p.Small), "has", "have"), p.MinGroupSize)
	if len(p.Others) > 0 {
		note += fmt.Sprintf(", and %s %s hidden with %s so that %s cannot be worked out from the total",
			quoteList(p.Others), pronoun(len(p.Others), "is", "are"), pronoun(len(p.Small), "it", "them"), pronoun(len(p.Small), "its figures", "their figures"))
	}
	if len(p.Small)+len(p.Others) == len(r.Groups) {
		note += " (every group: only the total number of values is shown)"
	}
	return note + ". Their sizes, medians, quartiles and pairs are not shown, and no group's rank sum or mean rank is (with the H statistic they would give the hidden groups' away); no group's lowest or highest value is shown."
}

// quoteList joins labels as “A”, “B” and “C”.
func quoteList(labels []string) string {
	quoted := make([]string, len(labels))
	for i, l := range labels {
		quoted[i] = "\u201c" + l + "\u201d"
	}
	if len(quoted) == 1 {
		return quoted[0]
	}
	return strings.Join(quoted[:len(quoted)-1], ", ") + " and " + quoted[len(quoted)-1]
}

func pronoun(n int, one, many string) string {
	if n == 1 {
		return one
	}
	return many
}

// writeProtection writes the protection as its JSON tags say, or null.
func writeProtection(w *jsonlite.Writer, p *Protection) {
	if p == nil {
		w.Null()
		return
	}
	w.BeginObject()
	w.IntMember("min_group_size", p.MinGroupSize)
	w.Key("small")
	w.Strings(p.Small)
	w.Key("others")
	w.Strings(p.Others)
	w.EndObject()
}
