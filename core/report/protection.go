package report

import "fmt"

// ProtectionNote says in a sentence which protection of small groups the
// shared outputs apply: min the threshold, small the groups under it,
// others those hidden with them (see package protect), all whether every
// group is hidden.
func ProtectionNote(min int, small, others []string, all bool) string {
	if len(small) == 0 {
		return fmt.Sprintf("Small groups protected (fewer than %d values): no group is that small, so none is hidden.", min)
	}
	note := fmt.Sprintf("Small groups protected: %s %s fewer than %d values", quoted(small), plural(len(small), "has", "have"), min)
	if len(others) > 0 {
		note += fmt.Sprintf(", and %s %s hidden with %s so that %s cannot be worked out from the total",
			quoted(others), plural(len(others), "is", "are"), plural(len(small), "it", "them"), plural(len(small), "its figures", "their figures"))
	}
	if all {
		note += " (every group: only the total number of values is shown)"
	}
	return note + ". Their sizes, medians, quartiles and pairs are not shown, and no group's rank sum or mean rank is (with the H statistic they would give the hidden groups' away); no group's lowest or highest value is shown."
}

// quoted joins labels as “A”, “B” and “C”.
func quoted(labels []string) string {
	q := make([]string, len(labels))
	for i, l := range labels {
		q[i] = "\u201c" + l + "\u201d"
	}
	return listLabels(q)
}
