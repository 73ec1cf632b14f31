package exact

import (
	"context"
	"errors"
	"fmt"
	"math"
	"slices"
	"testing"

	"midrank/core/internal/arrange"
)

// bruteForce lists every assignment of the scores to groups of the given
// sizes (as sequences of group labels, each equally likely) and tallies T.
func bruteForce(sizes []int, scores []int64) map[int64]float64 {
	n := len(scores)
	labels := make([]int, 0, n)
	for g, s := range sizes {
		for range s {
			labels = append(labels, g)
		}
	}
	counts := map[int64]float64{}
	total := 0.0
	sums := make([]int64, len(sizes))
	for {
		clear(sums)
		for i, g := range labels {
			sums[g] += scores[i]
		}
		counts[Statistic(sizes, sums)]++
		total++
		if !arrange.Next(labels) {
			break
		}
	}
	for t := range counts {
		counts[t] /= total
	}
	return counts
}

func blocksOf(scores []int64) []Block {
	var b []Block
	for _, s := range scores {
		if len(b) > 0 && b[len(b)-1].Score == s {
			b[len(b)-1].Count++
		} else {
			b = append(b, Block{s, 1})
		}
	}
	return b
}

// TestAgainstEnumeration: for size patterns with N ≤ 12, with and without
// ties, the distribution equals complete enumeration to 1e-12.
func TestAgainstEnumeration(t *testing.T) {
	patterns := [][]int{{2, 2, 2}, {3, 3, 3}, {1, 2, 3}, {4, 4, 4}, {2, 2, 2, 2}, {3, 3, 3, 3}, {5, 4, 3},
		{2, 3, 3, 4}, {1, 1, 1, 1, 1, 1}, {2, 2, 2, 2, 2, 2}, {6, 6}, {1, 11}, {2, 2, 3, 3},
		{1, 1, 1, 1, 1, 1, 1, 1}, {1, 1, 1, 1, 1, 1, 1, 2}} // eight groups: rows bounded by fewer sets of groups
	scoreSets := map[string]func(n int) []int64{
		"untied": func(n int) []int64 {
			s := make([]int64, n)
			for i := range s {
				s[i] = int64(i)
			}
			return s
		},
		"pairs tied": func(n int) []int64 {
			s := make([]int64, n)
			for i := range s {
				s[i] = int64(i / 2)
			}
			return s
		},
		"rating scale": func(n int) []int64 {
			s := make([]int64, n)
			for i := range s {
				s[i] = int64(i * 4 / n)
			}
			return s
		},
		"one big block": func(n int) []int64 {
			s := make([]int64, n)
			for i := range s {
				if i > n/3 {
					s[i] = int64(i - n/3)
				}
			}
			return s
		},
	}
	for _, sizes := range patterns {
		n := 0
		for _, s := range sizes {
			n += s
		}
		for name, make := range scoreSets {
			if err := matchesEnumeration(sizes, make(n)); err != nil {
				t.Errorf("%s: %v", name, err)
			}
		}
	}
}

// matchesEnumeration compares Permutation, with dense arrays where they fit
// and with hash tables throughout, each with every score dealt in the layers
// and with the rarer parity's dealt last (when there are at most
// maxDeferred of them and a third of all) after the others in each order of
// windows (at most three), with complete enumeration to 1e-12.
func matchesEnumeration(sizes []int, scores []int64) error {
	want := bruteForce(sizes, scores)
	for _, c := range []struct {
		lim  Limits
		rule planRule
	}{
		{Limits{MaxCells: 1 << 22, MaxStates: 1 << 20}, wholeOnly},
		{Limits{MaxStates: 1 << 20}, wholeOnly},
		{Limits{MaxCells: 1 << 22, MaxStates: 1 << 20}, deferredOnly},
		{Limits{MaxStates: 1 << 20}, deferredOnly},
		{Limits{MaxCells: 1 << 22, MaxStates: 1 << 20}, deferredOnly + 1},
		{Limits{MaxStates: 1 << 20}, deferredOnly + 1},
		{Limits{MaxCells: 1 << 22, MaxStates: 1 << 20}, deferredOnly + 2},
		{Limits{MaxStates: 1 << 20}, deferredOnly + 2},
	} {
		lim := c.lim
		got, err := permute(context.Background(), sizes, blocksOf(scores), lim, nil, c.rule)
		if err != nil {
			return fmt.Errorf("%v %v (plan %d): %v", sizes, scores, c.rule, err)
		}
		if len(got.Stat) != len(want) {
			return fmt.Errorf("%v %v (%+v): %d attained values, enumeration has %d", sizes, scores, lim, len(got.Stat), len(want))
		}
		for i, s := range got.Stat {
			if math.Abs(got.Prob[i]-want[s]) > 1e-12 {
				return fmt.Errorf("%v %v (%+v): P(T=%d) = %v, enumeration %v", sizes, scores, lim, s, got.Prob[i], want[s])
			}
		}
	}
	return nil
}

func TestCritical(t *testing.T) {
	d := &Distribution{Stat: []int64{1, 2, 3, 4}, Prob: []float64{0.5, 0.3, 0.15, 0.05}}
	if c, a, ok := d.Critical(0.05); !ok || c != 4 || a != 0.05 {
		t.Errorf("Critical(0.05) = %d, %v, %v; want 4, 0.05, true", c, a, ok)
	}
	if c, a, ok := d.Critical(0.2); !ok || c != 3 || math.Abs(a-0.2) > 1e-15 {
		t.Errorf("Critical(0.2) = %d, %v, %v; want 3, 0.2, true", c, a, ok)
	}
	if _, _, ok := d.Critical(0.01); ok {
		t.Error("Critical(0.01) found a value; none is that rare")
	}
	if p := d.Upper(3); math.Abs(p-0.2) > 1e-15 {
		t.Errorf("Upper(3) = %v, want 0.2", p)
	}
}

func TestTooLarge(t *testing.T) {
	scores := make([]int64, 40)
	for i := range scores {
		scores[i] = int64(i)
	}
	_, err := Permutation(context.Background(), []int{10, 10, 10, 10}, blocksOf(scores), Limits{MaxCells: 1000, MaxStates: 1000}, nil)
	if err == nil {
		t.Fatal("no error beyond the state limit")
	}
	// beyond the arrays' budget, where hash tables would not fit either: refused before any layer is built
	built := 0
	lim := Limits{MaxCells: 1 << 23, MaxStates: 1 << 22}
	watchLayers(t, func(*layer) { built++ })
	if _, err := Permutation(context.Background(), []int{10, 10, 10, 10}, blocksOf(scores), lim, nil); !errors.Is(err, ErrTooLarge) || built > 0 {
		t.Fatalf("err %v after %d layers; want ErrTooLarge before any", err, built)
	}
	ctx, cancel := context.WithCancel(context.Background())
	cancel()
	if _, err := Permutation(ctx, []int{3, 3}, blocksOf(scores[:6]), Limits{MaxCells: 1000, MaxStates: 1000}, nil); err == nil {
		t.Fatal("a cancelled computation went on")
	}
}

func ExamplePermutation() {
	// three groups of two, scores 0…5 (ranks minus one): 90 equally likely deals
	scores := []Block{{0, 1}, {1, 1}, {2, 1}, {3, 1}, {4, 1}, {5, 1}}
	d, _ := Permutation(context.Background(), []int{2, 2, 2}, scores, Limits{MaxCells: 1000, MaxStates: 1000}, nil)
	// the most extreme split, {0,1} {2,3} {4,5}: T = 1 + 25 + 81
	fmt.Printf("P(T ≥ %d) = %.4f\n", 107, d.Upper(107))
	// Output: P(T ≥ 107) = 0.0667
}

// FuzzAgainstEnumeration: for any split of up to 10 scores into groups,
// with any tie pattern, the distribution equals complete enumeration, with
// dense arrays and with hash tables.
func FuzzAgainstEnumeration(f *testing.F) {
	f.Add([]byte{3, 3, 2}, []byte{0, 1, 1, 2, 3, 3, 3, 4})
	f.Add([]byte{2, 2, 2, 2}, []byte{0, 0, 0, 0, 0, 0, 1, 1})
	f.Add([]byte{1, 4, 5}, []byte{0, 2, 4, 6, 8, 10, 12, 14, 16, 18})
	f.Fuzz(func(t *testing.T, sizeBytes, gaps []byte) {
		var sizes []int
		n := 0
		for _, b := range sizeBytes {
			if s := int(b%5) + 1; n+s <= 10 && len(sizes) < 6 {
				sizes = append(sizes, s)
				n += s
			}
		}
		if len(sizes) < 2 {
			return
		}
		// ascending scores: each the one before plus a gap of 0 (a tie) to 3
		scores := make([]int64, n)
		for i := 1; i < n; i++ {
			gap := int64(1)
			if i-1 < len(gaps) {
				gap = int64(gaps[i-1] % 4)
			}
			scores[i] = scores[i-1] + gap
		}
		if scores[n-1] == 0 {
			return // a single block: nothing to deal
		}
		if err := matchesEnumeration(sizes, scores); err != nil {
			t.Fatal(err)
		}
	})
}

// TestOverflowRefused: where the whole-number statistic T = Σ (L/nᵢ)·sᵢ²
// could pass 2⁶² — sizes whose least common multiple is that large, or
// scores that large — the computation is refused as too large, not
// computed wrongly.
func TestOverflowRefused(t *testing.T) {
	primes := []int{2, 3, 5, 7, 11, 13, 17, 19, 23, 29, 31, 37, 41, 43, 47, 53}
	if _, ok := lcmOf(primes); ok { // their product is about 3.3·10¹⁹
		t.Error("lcmOf of the first 16 primes fits 62 bits")
	}
	if l, ok := lcmOf(primes[:15]); !ok || l != 614889782588491410 { // 47#, the primorial
		t.Errorf("lcmOf of the first 15 primes = %d, %v", l, ok)
	}
	huge := []Block{{0, 1}, {1 << 31, 1}, {1 << 32, 1}, {3 << 31, 1}}
	_, err := Permutation(context.Background(), []int{2, 2}, huge, Limits{MaxCells: 1 << 20, MaxStates: 1 << 20}, nil)
	if !errors.Is(err, ErrTooLarge) {
		t.Errorf("scores near 2³²: error %v, want one that says too large", err)
	}
}

// TestTiedPairsDealtLast: with a few tied pairs (midranks ending in ½) the
// cheaper plan deals them last, the others in one of the orders of windows
// (from a stretch in the middle in some cases), and its distribution equals
// the one that deals every score in its place, beyond the sizes enumeration
// can check.
func TestTiedPairsDealtLast(t *testing.T) {
	middle := 0 // plans dealing from a stretch in the middle
	for _, c := range []struct {
		sizes []int
		at    []int // the first rank of each tied pair
	}{
		{[]int{6, 6, 6, 6}, []int{10}},
		{[]int{6, 6, 6, 6}, []int{3, 11}},
		{[]int{4, 5, 6}, []int{1, 14}}, // ties at both ends
		{[]int{15, 15, 15}, []int{20}},
		{[]int{3, 3, 3, 3, 3}, []int{7}},
		// the longest stretch without a gap in the middle: dealt from there
		{[]int{6, 6, 6, 6}, []int{3, 19}},
		{[]int{4, 5, 6}, []int{3, 11}},
		{[]int{3, 3, 3, 3, 3}, []int{2, 11}},
		{[]int{15, 15, 15}, []int{9, 30}},
	} {
		n := 0
		for _, s := range c.sizes {
			n += s
		}
		blocks := tiedPairs(n, c.at...)
		p, err := choose(c.sizes, blocks, benchLimits, cheaper)
		if err != nil || !p.s.deferred {
			t.Errorf("%v pairs at %v: not dealt last (%v)", c.sizes, c.at, err)
			continue
		}
		orders := windows(p.s.sorted)
		for i := 1; i < len(orders)-1; i++ {
			if slices.Equal(orders[i], p.s.blocks) {
				middle++
			}
		}
		whole, err1 := permute(context.Background(), c.sizes, blocks, benchLimits, nil, wholeOnly)
		late, err2 := permute(context.Background(), c.sizes, blocks, benchLimits, nil, cheaper)
		if err1 != nil || err2 != nil {
			t.Fatalf("%v: %v, %v", c.sizes, err1, err2)
		}
		if !slices.Equal(whole.Stat, late.Stat) {
			t.Errorf("%v pairs at %v: %d attained values dealing in place, %d dealing last", c.sizes, c.at, len(whole.Stat), len(late.Stat))
			continue
		}
		for i := range whole.Stat {
			if u, v := whole.Upper(whole.Stat[i]), late.Upper(late.Stat[i]); math.Abs(u-v) > 1e-12*max(u, 1e-300) && math.Abs(u-v) > 1e-15 {
				t.Errorf("%v pairs at %v: P(T ≥ %d) = %v in place, %v last", c.sizes, c.at, whole.Stat[i], u, v)
				break
			}
		}
	}
	if middle == 0 {
		t.Error("no plan dealt the others from a stretch in the middle")
	}
}

// TestWindows: the orders start from the first, the longest and the last
// stretch of scores without a gap (each once) and take the longer
// neighbouring stretch first, so that the scores dealt are always a run of
// the sorted ones.
func TestWindows(t *testing.T) {
	for _, c := range []struct {
		scores []int64
		want   [][]int64
	}{
		{[]int64{0, 1, 2, 5, 6, 7, 8, 11}, [][]int64{
			{0, 1, 2, 5, 6, 7, 8, 11},
			{5, 6, 7, 8, 2, 1, 0, 11},
			{11, 8, 7, 6, 5, 2, 1, 0},
		}},
		{[]int64{0, 1, 2, 3, 6, 9, 10}, [][]int64{ // the longest is the first
			{0, 1, 2, 3, 6, 9, 10},
			{9, 10, 6, 3, 2, 1, 0},
		}},
		{[]int64{0, 1, 4, 5, 6, 7}, [][]int64{ // the longest is the last
			{0, 1, 4, 5, 6, 7},
			{4, 5, 6, 7, 1, 0},
		}},
		{[]int64{0, 1, 2}, [][]int64{{0, 1, 2}}}, // no gap: one order
	} {
		var blocks []Block
		for _, x := range c.scores {
			blocks = append(blocks, Block{x, 1})
		}
		orders := windows(blocks)
		if len(orders) != len(c.want) {
			t.Errorf("%v: %d orders, want %d", c.scores, len(orders), len(c.want))
			continue
		}
		for i, order := range orders {
			var got []int64
			for _, b := range order {
				got = append(got, b.Score)
			}
			if !slices.Equal(got, c.want[i]) {
				t.Errorf("%v: order %d is %v, want %v", c.scores, i, got, c.want[i])
			}
			s, err := newSpace([]int{len(blocks) - len(blocks)/2, len(blocks) / 2}, countsOf(order), 0)
			if err != nil {
				t.Fatal(err)
			}
			s.blocks, s.sorted = order, blocks
			s.order() // panics unless each layer's scores are a run of the sorted ones
		}
	}
}

// TestDenseMassAsTable: T's probabilities added up in an array by T give
// the distribution, to the last bit, that a hash table gives (each T's
// probability is added up in the same order either way), untied, with
// tied pairs dealt last, and with unequal sizes.
func TestDenseMassAsTable(t *testing.T) {
	for _, c := range []struct {
		sizes  []int
		blocks []Block
	}{
		{[]int{6, 6, 6, 6}, untied(24)},
		{[]int{6, 6, 6, 6}, tiedPairs(24, 3, 11)},
		{[]int{4, 5, 6}, tiedRuns(15, 3, 4)},
		{[]int{2, 3, 7}, distinct(12, 4)},
	} {
		inArray, err := Permutation(context.Background(), c.sizes, c.blocks, benchLimits, nil)
		if err != nil {
			t.Fatal(err)
		}
		was := denseMass
		denseMass = 0
		inTable, err := Permutation(context.Background(), c.sizes, c.blocks, benchLimits, nil)
		denseMass = was
		if err != nil {
			t.Fatal(err)
		}
		if !slices.Equal(inArray.Stat, inTable.Stat) || !slices.Equal(inArray.Prob, inTable.Prob) {
			t.Errorf("%v %v: %d values of T in an array, %d in a table, or their probabilities differ", c.sizes, c.blocks, len(inArray.Stat), len(inTable.Stat))
		}
	}
}
