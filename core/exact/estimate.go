package exact

// reachable bounds the states of a bucket: the stored groups' sums that its
// box allows, and for each group no more than the ways to hold its count of
// scores on the levels dealt so far, C(c + levels − 1, levels − 1). The
// second bound is what matters for data on a few levels with uneven tie
// blocks, whose sums are sparse in the box (a 3 × 3 table of 248 values has
// 670,000 states in boxes of 4·10⁹ cells).
func (s *space) reachable(counts []int, t, levels int) float64 {
	k := len(s.sizes)
	if s.box(counts, t, s.lo, s.hi) == 0 {
		return 0
	}
	states := 1.0
	for i := range k - 1 {
		states = float64(states * (min(float64(s.hi[i]-s.lo[i]+1), compositions(counts[i], levels))))
	}
	return min(states, tooMany)
}

// compositions is C(c + levels − 1, levels − 1), the ways to hold c scores on
// the levels, in float64 (it may be huge).
func compositions(c, levels int) float64 {
	w := 1.0
	for j := 1; j < levels && w < tooMany; j++ {
		w = w * float64(c+j) / float64(j)
	}
	return w
}

// EstimateStates bounds the size of the largest layer from the sizes and the
// scores (blocks in ascending order, dealt so), without computing it: after t scores are dealt, a stored group can
// hold c of them with a sum anywhere between the c smallest and the c
// largest, and groups of one size class are counted once per arrangement.
// The product over the stored groups is divided by the number of group counts
// that add up to t, a correction measured against real layers (it stays
// within a factor of a few of them; see the tests).
func EstimateStates(sizes []int, blocks []Block) float64 {
	sorted := ascending(sizes)
	var scores []int64
	for _, b := range blocks {
		for range b.Count {
			scores = append(scores, b.Score)
		}
	}
	n := len(scores)
	prefix := make([]int64, n+1)
	for i, x := range scores {
		prefix[i+1] = prefix[i] + x
	}
	k := len(sorted)
	all := 0 // the groups' room: more than n when some scores are dealt last
	for _, size := range sorted {
		all += size
	}
	worst := 1.0
	t := 0
	for levels, b := range blocks[:len(blocks)-1] { // layers exist after each block but the last
		t += b.Count
		est := 1.0
		for i := 0; i < k-1; i++ {
			pairs := 0.0
			for c := max(0, t-(all-sorted[i])); c <= min(sorted[i], t); c++ {
				lo := prefix[c]
				hi := prefix[t] - prefix[t-c]
				pairs += min(float64(hi-lo)+1, compositions(c, levels+1)) // the sums a count can have (see reachable)
			}
			est = float64(est * (pairs))
		}
		// arrangements within classes, and the constraint on the counts
		for i, run := 0, 1; i < k-1; i++ {
			if i > 0 && sorted[i] == sorted[i-1] {
				run++
				est /= float64(run)
			} else {
				run = 1
			}
		}
		est /= float64(min(t, sorted[k-1]) + 1)
		worst = max(worst, est)
	}
	return worst
}
