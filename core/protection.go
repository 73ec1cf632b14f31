package core

import (
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
	if p := r.Protection; p != nil {
		return report.ProtectionNote(p.MinGroupSize, p.Small, p.Others, len(p.Small)+len(p.Others) == len(r.Groups))
	}
	return ""
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
