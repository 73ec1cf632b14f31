// Package arrange steps through the distinct arrangements of a sequence,
// for the tests that check exact distributions by complete enumeration.
package arrange

import "slices"

// Next steps a to its next distinct arrangement in lexicographic order and
// reports whether there was one (Knuth, TAOCP 7.2.1.2, algorithm L); from
// ascending order it visits every distinct arrangement once.
func Next(a []int) bool {
	i := len(a) - 2
	for i >= 0 && a[i] >= a[i+1] {
		i--
	}
	if i < 0 {
		return false
	}
	j := len(a) - 1
	for a[j] <= a[i] {
		j--
	}
	a[i], a[j] = a[j], a[i]
	slices.Reverse(a[i+1:])
	return true
}
