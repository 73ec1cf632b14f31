// Package letters gives groups a compact letter display: groups that share
// a letter could not be told apart, groups with no letter in common differ
// significantly. It uses the insert-absorb algorithm of Piepho (2004, "An
// algorithm for a letter-based representation of all-pairwise comparisons",
// J. Comput. Graph. Statist. 13(2), 456–466).
package letters

import (
	"slices"
	"sort"
)

// Display returns the letters of each of k groups, given which pairs differ
// (differ[a][b] for a < b and b < a alike). Letters are assigned in order of
// the first group each column holds, so the first group always has "a".
func Display(k int, differ func(a, b int) bool) []string {
	// each column is a set of groups sharing one letter, as a sorted slice
	all := make([]int, k)
	for i := range all {
		all[i] = i
	}
	columns := [][]int{all}
	for a := 0; a < k; a++ {
		for b := a + 1; b < k; b++ {
			if !differ(a, b) {
				continue
			}
			// insert: split every column holding both into one without a
			// and one without b
			var next [][]int
			for _, c := range columns {
				if slices.Contains(c, a) && slices.Contains(c, b) {
					next = append(next, without(c, a), without(c, b))
				} else {
					next = append(next, c)
				}
			}
			columns = absorb(next)
		}
	}
	sort.Sort(byGroups(columns))
	out := make([]string, k)
	for i, c := range columns {
		letter := letterName(i)
		for _, g := range c {
			out[g] += letter
		}
	}
	return out
}

// byGroups orders columns by their groups, as words by their letters (a
// sort.Interface rather than a generic sort: the module holds one sort
// less).
type byGroups [][]int

func (c byGroups) Len() int           { return len(c) }
func (c byGroups) Less(i, j int) bool { return slices.Compare(c[i], c[j]) < 0 }
func (c byGroups) Swap(i, j int)      { c[i], c[j] = c[j], c[i] }

func without(c []int, g int) []int {
	out := make([]int, 0, len(c)-1)
	for _, x := range c {
		if x != g {
			out = append(out, x)
		}
	}
	return out
}

// absorb drops every column contained in another (and repeats).
func absorb(columns [][]int) [][]int {
	var kept [][]int
	for i, c := range columns {
		redundant := false
		for j, d := range columns {
			if i != j && subset(c, d) && (len(c) < len(d) || j < i) {
				redundant = true
				break
			}
		}
		if !redundant {
			kept = append(kept, c)
		}
	}
	return kept
}

// subset reports whether sorted c ⊆ sorted d.
func subset(c, d []int) bool {
	j := 0
	for _, x := range c {
		for j < len(d) && d[j] < x {
			j++
		}
		if j == len(d) || d[j] != x {
			return false
		}
	}
	return true
}

// letterName is a, b, …, z, then aa, ab, … for more columns.
func letterName(i int) string {
	if i < 26 {
		return string(rune('a' + i))
	}
	return letterName(i/26-1) + letterName(i%26)
}
