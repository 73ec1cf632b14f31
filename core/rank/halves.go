package rank

// halvesFrom is the number of values from which they are sorted in two
// halves side by side (see sortInHalves); a variable so that tests can
// split short samples.
var halvesFrom = 1 << 17

// sortInHalves is sortTagged's radix sort on two cores: each half of the
// values is sorted on its own (keys, keys2, tags and tags2 shared, each half
// in its own part of them), the same passes skipped in both (those in which
// every key of both halves has one digit), so that both end in the same
// arrays; then the halves are merged, stably, into the other arrays.
func sortInHalves(values []float64, keys, keys2 []uint64, tags, tags2 []int32) ([]float64, []int32) {
	n := len(values)
	m := n / 2
	var countA, countB [passes][buckets]int32
	done := make(chan struct{})
	go func() { histogram(values[m:], keys[m:], &countB); done <- struct{}{} }()
	histogram(values[:m], keys[:m], &countA)
	<-done
	skip := trivial(keys[0], &countA, &countB, n)
	go func() { radix(keys[m:], keys2[m:], tags[m:], tags2[m:], &countB, skip); done <- struct{}{} }()
	sortedA, _ := radix(keys[:m], keys2[:m], tags[:m], tags2[:m], &countA, skip)
	<-done
	// both halves are in the arrays that sortedA lies in (the same passes
	// ran); merge them into the others, the first half's key first among
	// equal ones
	src, srcTags, dst, dstTags := keys, tags, keys2, tags2
	if &sortedA[0] == &keys2[0] {
		src, srcTags, dst, dstTags = keys2, tags2, keys, tags
	}
	i, j := 0, m
	for out := range dst {
		if j == n || (i < m && src[i] <= src[j]) {
			dst[out], dstTags[out] = src[i], srcTags[i]
			i++
		} else {
			dst[out], dstTags[out] = src[j], srcTags[j]
			j++
		}
	}
	return decode(dst), dstTags
}
