package trend

import (
	"cmp"
	"context"
	"encoding/csv"
	"errors"
	"math"
	"os"
	"slices"
	"strconv"
	"strings"
	"testing"

	"midrank/core/internal/arrange"
	"midrank/core/internal/localfarm"
	"midrank/core/montecarlo"
	"midrank/core/rank"
	"midrank/core/testfiles"
)

// ranked ranks values of groups numbered in their order.
func ranked(values []float64, groups []int32, k int) rank.Ranking {
	return rank.Rank(values, groups, k)
}

// TestAgainstR: J counted pair by pair in R, and Kendall's z (with ties),
// τ_b and normal p-values from R's cor.test(method = "kendall", exact =
// FALSE, continuity = FALSE) between the values and the group numbers, on
// R datasets with ordered groups (testdata/trend, written by
// tools/reference/trend.R, R 4.2.2).
func TestAgainstR(t *testing.T) {
	rows, err := testfiles.Rows(os.DirFS("../../testdata/trend"), "expected.tsv")
	if err != nil {
		t.Fatal(err)
	}
	for _, row := range rows[1:] { // after the header
		name, levels := row[0], strings.Split(row[1], "|")
		want := make([]float64, 5)
		for i, cell := range row[2:] {
			if want[i], err = strconv.ParseFloat(strings.TrimSpace(cell), 64); err != nil {
				t.Fatal(err)
			}
		}
		values, groups := readGroups(t, "../../testdata/trend/"+name+".csv", levels)
		test, err := Compute(ranked(values, groups, len(levels)))
		if err != nil {
			t.Fatal(err)
		}
		got := []float64{test.J, test.Z, test.TauB, test.Normal(TwoSided), test.Normal(Increasing)}
		for i, what := range []string{"J", "z", "τ_b", "p two-sided", "p increasing"} {
			if math.Abs(got[i]-want[i]) > 1e-12*math.Max(1, math.Abs(want[i])) {
				t.Errorf("%s: %s = %.17g, R %.17g", name, what, got[i], want[i])
			}
		}
	}
}

// readGroups reads a group,value CSV, numbering the groups by levels.
func readGroups(t *testing.T, path string, levels []string) ([]float64, []int32) {
	t.Helper()
	f, err := os.Open(path)
	if err != nil {
		t.Fatal(err)
	}
	defer f.Close()
	rows, err := csv.NewReader(f).ReadAll()
	if err != nil {
		t.Fatal(err)
	}
	var values []float64
	var groups []int32
	for _, row := range rows[1:] {
		v, err := strconv.ParseFloat(row[1], 64)
		if err != nil {
			t.Fatal(err)
		}
		values, groups = append(values, v), append(groups, int32(slices.Index(levels, row[0])))
	}
	return values, groups
}

// pairByPair is 2J counted over every pair of values: 2 for each pair in
// groups taken in order whose values rise, 1 for each tied one.
func pairByPair(groups []int, values []float64) int64 {
	var doubled int64
	for a := range values {
		for b := range values {
			if groups[a] < groups[b] {
				switch {
				case values[a] < values[b]:
					doubled += 2
				case values[a] == values[b]:
					doubled++
				}
			}
		}
	}
	return doubled
}

// enumerate lists every deal of the values to groups of these sizes (each
// equally likely) and tallies 2J counted pair by pair.
func enumerate(sizes []int, values []float64) map[int64]float64 {
	labels := labelsOf(sizes)
	tally := map[int64]float64{}
	total := 0.0
	for {
		tally[pairByPair(labels, values)]++
		total++
		if !arrange.Next(labels) {
			break
		}
	}
	for x := range tally {
		tally[x] /= total
	}
	return tally
}

// labelsOf numbers the values by group: sizes[0] zeros, then ones, ….
func labelsOf(sizes []int) []int {
	var labels []int
	for g, s := range sizes {
		for range s {
			labels = append(labels, g)
		}
	}
	return labels
}

// matchesEnumeration compares the exact distribution (and the one dealt
// block by block, for untied values too) with complete enumeration, and the
// observed J of the values as they stand with the pair-by-pair count.
func matchesEnumeration(t *testing.T, sizes []int, values []float64) {
	t.Helper()
	want := enumerate(sizes, values)
	labels := labelsOf(sizes)
	groups := make([]int32, len(labels))
	for i, g := range labels {
		groups[i] = int32(g)
	}
	r := ranked(values, groups, len(sizes))
	got, err := Exact(context.Background(), r)
	if err != nil {
		t.Fatal(err)
	}
	dealtToo, err := dealt(context.Background(), r)
	if err != nil {
		t.Fatal(err)
	}
	for x, p := range got.Prob {
		if math.Abs(p-want[int64(x)]) > 1e-12 || math.Abs(dealtToo.Prob[x]-want[int64(x)]) > 1e-12 {
			t.Fatalf("%v %v: P(2J = %d) = %v (dealt %v), enumeration %v", sizes, values, x, p, dealtToo.Prob[x], want[int64(x)])
		}
	}
	test, err := Compute(r)
	if err != nil && !errors.Is(err, ErrNoSpread) {
		t.Fatal(err)
	}
	if doubled := pairByPair(labels, values); test.Doubled != doubled {
		t.Errorf("%v %v: 2J = %d, pair by pair %d", sizes, values, test.Doubled, doubled)
	}
}

// TestAgainstEnumeration: for size patterns with N ≤ 10, untied and tied,
// the exact distribution (both ways) equals complete enumeration.
func TestAgainstEnumeration(t *testing.T) {
	for _, sizes := range [][]int{{2, 2, 2}, {3, 3, 3}, {1, 2, 3}, {2, 3, 4}, {2, 2, 2, 2}, {1, 1, 1, 1, 1}, {5, 5}, {1, 9}, {3, 3, 4}} {
		n := 0
		for _, s := range sizes {
			n += s
		}
		for name, score := range map[string]func(i int) float64{
			"untied":       func(i int) float64 { return float64(i) },
			"pairs tied":   func(i int) float64 { return float64(i / 2) },
			"rating scale": func(i int) float64 { return float64(i * 4 / n) },
			"one big block": func(i int) float64 {
				return float64(max(0, i-n/2))
			},
		} {
			values := make([]float64, n)
			for i := range values {
				values[i] = score((i*7 + 3) % n) // the values in no particular order among the groups
			}
			t.Run(name, func(t *testing.T) { matchesEnumeration(t, sizes, values) })
		}
	}
}

// FuzzAgainstEnumeration: any sizes and values with N ≤ 9.
func FuzzAgainstEnumeration(f *testing.F) {
	f.Add([]byte{3, 3, 2}, []byte{0, 1, 1, 2, 3, 3, 3, 4})
	f.Add([]byte{2, 2, 2, 2}, []byte{0, 0, 0, 0, 0, 0, 1, 1})
	f.Fuzz(func(t *testing.T, sizeBytes, valueBytes []byte) {
		var sizes []int
		n := 0
		for _, b := range sizeBytes {
			if s := int(b%4) + 1; n+s <= 9 && len(sizes) < 5 {
				sizes, n = append(sizes, s), n+s
			}
		}
		if len(sizes) < 2 {
			return
		}
		values := make([]float64, n)
		for i := range values {
			if i < len(valueBytes) {
				values[i] = float64(valueBytes[i] % 5)
			}
		}
		matchesEnumeration(t, sizes, values)
	})
}

// TestCritical: the exact critical value of untied groups of 3, 3 and 3
// leaves at most alpha above it, and one step less would not.
func TestCritical(t *testing.T) {
	r := ranked([]float64{1, 2, 3, 4, 5, 6, 7, 8, 9}, []int32{0, 0, 0, 1, 1, 1, 2, 2, 2}, 3)
	d, err := Exact(context.Background(), r)
	if err != nil {
		t.Fatal(err)
	}
	for _, alt := range Alternatives {
		x, attained, ok := d.Critical(0.05, alt)
		if !ok {
			t.Fatalf("%s: no critical value", alt)
		}
		tail, step := d.Upper, int64(-1)
		if alt == Decreasing {
			tail, step = d.Lower, 1
		}
		half := map[Alternative]float64{TwoSided: 0.025}[alt]
		level := cmp.Or(half, 0.05)
		if got := tail(x); got != attained || got > level {
			t.Errorf("%s: critical 2J %d leaves %v (attained %v), want at most %v", alt, x, got, attained, level)
		}
		for y := x + step; y >= 0 && y < int64(len(d.Prob)); y += step {
			if d.Prob[y] > 0 {
				if tail(y) <= level {
					t.Errorf("%s: 2J %d leaves %v, also within %v", alt, y, tail(y), level)
				}
				break
			}
		}
	}
}

// TestMonteCarloHoldsExact: on tied groups of 4, 5 and 6 the Monte Carlo
// estimate's 99% interval holds the exact p for each alternative, and the
// answer does not depend on how the work is shared (it is the same for the
// same seed).
func TestMonteCarloHoldsExact(t *testing.T) {
	values := []float64{1, 2, 2, 3, 3, 3, 4, 5, 5, 6, 7, 7, 8, 9, 9}
	groups := []int32{0, 0, 1, 0, 1, 2, 0, 1, 2, 1, 2, 1, 2, 2, 2}
	r := ranked(values, groups, 3)
	test, err := Compute(r)
	if err != nil {
		t.Fatal(err)
	}
	d, err := Exact(context.Background(), r)
	if err != nil {
		t.Fatal(err)
	}
	for _, alt := range Alternatives {
		exact := d.P(test.Doubled, alt)
		mc, err := MonteCarlo(context.Background(), r, test.Doubled, alt, 20000, 7, nil)
		if err != nil {
			t.Fatal(err)
		}
		if exact < mc.Low || exact > mc.High {
			t.Errorf("%s: exact p %v outside the Monte Carlo interval %v–%v (p̂ %v)", alt, exact, mc.Low, mc.High, mc.P)
		}
		again, _ := MonteCarlo(context.Background(), r, test.Doubled, alt, 20000, 7, nil)
		if again != mc {
			t.Errorf("%s: %+v then %+v with the same seed", alt, mc, again)
		}
		// shared with a farm of three helpers, through the job's JSON: the same to the last bit
		alone, _ := MonteCarlo(context.Background(), r, test.Doubled, alt, 50000, 7, nil)
		shared, err := MonteCarlo(montecarlo.WithFarm(context.Background(), localfarm.Farm{N: 3}), r, test.Doubled, alt, 50000, 7, nil)
		if err != nil || shared != alone {
			t.Errorf("%s: with a farm %+v (%v), alone %+v", alt, shared, err, alone)
		}
	}
}
