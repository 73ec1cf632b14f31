// Package protect decides which groups the outputs that leave the analyst's
// tab (reports, files, links, the copied paragraph) must hide so that no
// small group's figures can be read or worked out: small-cell suppression
// with complementary (secondary) suppression, the rule statistics offices
// and health agencies apply to published tables (e.g. the UK Office for
// National Statistics' and NHS Digital's small-number guidance: a cell under
// the threshold is suppressed, and at least one more cell with it, so that
// it cannot be found by subtracting the others from the total; from memory).
package protect

import (
	"slices"
	"strconv"
)

// Suggested is the threshold offered when protection is switched on, and
// Worth the group size under which the page offers it (staff surveys hide
// groups under 3 to 10 respondents, health agencies counts under 5 or 10;
// common practice).
const (
	Suggested = 5
	Worth     = 10
)

// Plan says which groups are hidden in what is shared.
type Plan struct {
	// Min: groups with fewer values are hidden; 0 when protection is off
	Min int
	// Small are the groups (by index) with fewer than Min values; Others
	// the groups hidden with them so that no small group's size or figures
	// follow from the total and the shown groups (complementary
	// suppression), in the order they were chosen
	Small, Others []int
}

// For plans the protection of groups of these sizes at threshold min (0:
// none). While the hidden groups' sizes could be worked out from their
// combined size (the total minus the shown groups) — one hidden group, or
// small groups that can only be all of size 1 or all of size min−1 — the
// smallest shown group is hidden too (the first in order among equals).
func For(sizes []int, min int) Plan {
	p := Plan{Min: min}
	if min <= 0 {
		return p
	}
	combined := 0
	for g, n := range sizes {
		if n < min {
			p.Small = append(p.Small, g)
			combined += n
		}
	}
	for len(p.Small) > 0 && p.forced(combined) {
		next := -1
		for g, n := range sizes {
			if !p.Hidden(g) && (next < 0 || n < sizes[next]) {
				next = g
			}
		}
		if next < 0 {
			break // every group is hidden
		}
		p.Others = append(p.Others, next)
		combined += sizes[next]
	}
	return p
}

// forced reports whether the hidden groups' sizes follow from their
// combined size: a single hidden group, or only small groups (each 1 to
// Min−1 values) whose combined size allows one split.
func (p Plan) forced(combined int) bool {
	hidden := len(p.Small) + len(p.Others)
	switch {
	case hidden == 1:
		return true
	case len(p.Others) > 0:
		return false // a group of any size can take up the difference
	}
	return combined == hidden || combined == hidden*(p.Min-1)
}

// Hidden reports whether group g is hidden in what is shared.
func (p Plan) Hidden(g int) bool { return slices.Contains(p.Small, g) || slices.Contains(p.Others, g) }

// Any reports whether any group is hidden.
func (p Plan) Any() bool { return len(p.Small) > 0 }

// Size is how a hidden group's size is shown: "< Min" for a small group,
// "not shown" for one hidden with it; "" for a group that is shown.
func (p Plan) Size(g int) string {
	switch {
	case slices.Contains(p.Small, g):
		return "< " + strconv.Itoa(p.Min)
	case slices.Contains(p.Others, g):
		return "not shown"
	}
	return ""
}
