package table

import (
	"fmt"
	"maps"
	"slices"
)

// Edits rearrange the groups after reading, without touching the text: the
// analyst's choices live beside the data, so editing the data keeps them.
// Every label named is a label as written in the data.
type Edits struct {
	Order   []string          // the groups to put first, in this order; the others follow in data order
	Exclude []string          // groups left out of the analysis
	Rename  map[string]string // the name to show for a group instead of its label
}

// For keeps the edits that name groups among labels, dropping the rest and
// renamings to an empty or unchanged name, so that edits made for a label
// can wait while the label is being retyped instead of stopping the reading.
func (e Edits) For(labels []string) Edits {
	has := make(map[string]bool, len(labels))
	for _, l := range labels {
		has[l] = true
	}
	keep := func(list []string) []string {
		var out []string
		for _, l := range list {
			if has[l] {
				out = append(out, l)
			}
		}
		return out
	}
	out := Edits{Order: keep(e.Order), Exclude: keep(e.Exclude)}
	for from, to := range e.Rename {
		if has[from] && to != "" && to != from {
			if out.Rename == nil {
				out.Rename = map[string]string{}
			}
			out.Rename[from] = to
		}
	}
	return out
}

// Excluded is a group left out by an edit, with what it held.
type Excluded struct {
	Label   string
	Values  int
	Missing int
}

// Regroup applies edits to a table read by Parse: groups are reordered,
// left out (their values removed; they are listed in Excluded) and renamed,
// in that order; Source keeps each group's label as written. Naming a label that is not in the data, naming one twice,
// or renaming to an empty or already used name is an *Error.
func (t *Table) Regroup(e Edits) error {
	index := make(map[string]int, len(t.Labels))
	for g, label := range t.Labels {
		index[label] = g
	}
	find := func(label, what string) (int, error) {
		g, ok := index[label]
		if !ok {
			return 0, &Error{Group: label, Reason: fmt.Sprintf("%s names a group that is not in the data", what),
				Fix: "check the spelling against the labels in the data, or clear the group edits"}
		}
		return g, nil
	}
	// newOrder lists old group indices in the new order
	newOrder := make([]int, 0, len(t.Labels))
	placed := make([]bool, len(t.Labels))
	for _, label := range e.Order {
		g, err := find(label, "the group order")
		if err != nil {
			return err
		}
		if placed[g] {
			return &Error{Group: label, Reason: "the group order names this group twice", Fix: "name each group once"}
		}
		placed[g] = true
		newOrder = append(newOrder, g)
	}
	for g := range t.Labels {
		if !placed[g] {
			newOrder = append(newOrder, g)
		}
	}
	dropped := make([]bool, len(t.Labels))
	for _, label := range e.Exclude {
		g, err := find(label, "the list of excluded groups")
		if err != nil {
			return err
		}
		dropped[g] = true
	}
	names := slices.Clone(t.Labels)
	for _, from := range slices.Sorted(maps.Keys(e.Rename)) {
		to := e.Rename[from]
		g, err := find(from, "a renaming")
		if err != nil {
			return err
		}
		if to == "" {
			return &Error{Group: from, Reason: "the new name is empty", Fix: "type a name, or undo the renaming"}
		}
		names[g] = to
	}
	seen := map[string]string{}
	for g, name := range names {
		if other, dup := seen[name]; dup && !dropped[g] {
			return &Error{Group: name, Reason: fmt.Sprintf("groups %q and %q would both be called %q", other, t.Labels[g], name),
				Fix: "give each group its own name"}
		}
		if !dropped[g] {
			seen[name] = t.Labels[g]
		}
	}

	newIndex := make([]int32, len(t.Labels)) // old index → new index, −1 if dropped
	var labels, source []string
	var missing []int
	for _, g := range newOrder {
		newIndex[g] = -1
		if !dropped[g] {
			newIndex[g] = int32(len(labels))
			labels = append(labels, names[g])
			source = append(source, t.Labels[g])
			missing = append(missing, t.Missing[g])
		}
	}
	counts := make([]int, len(t.Labels))
	kept := 0
	for i, g := range t.Groups {
		counts[g]++
		if ng := newIndex[g]; ng >= 0 {
			t.Values[kept], t.Groups[kept], t.Lines[kept] = t.Values[i], ng, t.Lines[i]
			kept++
		}
	}
	t.Values, t.Groups, t.Lines = t.Values[:kept], t.Groups[:kept], t.Lines[:kept]
	for _, g := range newOrder {
		if dropped[g] {
			t.Excluded = append(t.Excluded, Excluded{Label: t.Labels[g], Values: counts[g], Missing: t.Missing[g]})
		}
	}
	t.Labels, t.Source, t.Missing = labels, source, missing
	return nil
}
