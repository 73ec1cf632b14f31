package core

import (
	"encoding/json"
	"errors"
	"fmt"
	"maps"
	"math"
	"math/big"
	"math/rand/v2"
	"os"
	"path/filepath"
	"slices"
	"strings"
	"testing"

	"midrank/core/table"
)

// The data these tests generate has the shapes that analysts bring —
// rating scales, yes/no answers, unequal groups, thousands of values — at
// sizes where arithmetic overflows and budgets matter. It is generated with
// a fixed seed, so every run sees the same values; the check values come
// from outside the method under test: complete enumeration with exact
// rational arithmetic, and the chi-square approximation where N is large.

// sample writes long-layout text of groups of the given sizes, value j of
// group g drawn by draw(g).
func sample(sizes []int, seed uint64, draw func(r *rand.Rand, g int) string) []byte {
	r := rand.New(rand.NewPCG(seed, 2))
	var b strings.Builder
	b.WriteString("unit,answer\n")
	for g, n := range sizes {
		for range n {
			fmt.Fprintf(&b, "U%d,%s\n", g+1, draw(r, g))
		}
	}
	return []byte(b.String())
}

// rating draws an answer on a 1–5 scale, group g shifted by shift·g.
func rating(shift float64) func(r *rand.Rand, g int) string {
	return func(r *rand.Rand, g int) string {
		x := math.Round(r.NormFloat64()*1.2 + 3 + shift*float64(g))
		return fmt.Sprint(max(1, min(5, x)))
	}
}

func yesNo(r *rand.Rand, _ int) string {
	if r.IntN(2) == 0 {
		return "0"
	}
	return "1"
}

func continuous(r *rand.Rand, g int) string { return fmt.Sprint(r.ExpFloat64()*10 + float64(g)/20) }

// checkValid: the answer encodes to valid JSON with every number finite and
// its p-values in [0, 1].
func checkValid(t *testing.T, name string, r *Result) {
	t.Helper()
	b, err := Encode(r)
	if err != nil || !json.Valid(b) {
		t.Fatalf("%s: Encode: %v, valid %v", name, err, json.Valid(b))
	}
	for _, p := range []float64{r.PValue, r.PAsymptotic} {
		if !(p >= 0 && p <= 1) {
			t.Errorf("%s: p-value %v outside [0, 1]", name, p)
		}
	}
}

// TestMonteCarloUnequalGroups: with groups of 701, 753, 811 and 785 answers
// on a rating scale (lcm of the sizes about 3.4·10¹¹, so Σ (L/nᵢ)·sᵢ²
// overflows 64 bits), the Monte Carlo p-value agrees with the chi-square p
// within the Monte Carlo error plus 0.01 for the approximation (N = 3,050:
// both approximate the same permutation p-value). A large shift gives a p
// far below 1/(B+1), where the estimate must be that floor.
func TestMonteCarloUnequalGroups(t *testing.T) {
	sizes := []int{701, 753, 811, 785}
	for _, shift := range []float64{0, 0.03, 0.15} {
		data := sample(sizes, 5, rating(shift))
		const resamples = 20_000
		r, err := Analyze(data, Options{PValue: "monte-carlo", Resamples: resamples, PostHoc: "none"})
		if err != nil {
			t.Fatal(err)
		}
		name := fmt.Sprintf("shift %v", shift)
		checkValid(t, name, r)
		chi := r.PAsymptotic
		t.Logf("%s: H = %.2f, chi-square p %.3g, Monte Carlo p %.3g", name, r.H, chi, r.PValue)
		if chi < 1e-6 {
			if floor := 1.0 / (resamples + 1); r.PValue != floor {
				t.Errorf("%s: chi-square p %.3g, Monte Carlo p %.3g, want %.3g", name, chi, r.PValue, floor)
			}
			continue
		}
		se := math.Sqrt(chi * (1 - chi) / resamples)
		if math.Abs(r.PValue-chi) > 4*se+0.01 {
			t.Errorf("%s: Monte Carlo p %.4f, chi-square p %.4f (H = %.2f)", name, r.PValue, chi, r.H)
		}
	}
}

// enumerateTable is the exact p-value of data on a few ordered levels by
// complete enumeration of its contingency table: counts[g][l] values of
// group g lie on level l. With the row (group) and column (level) totals
// fixed, a table of cells x has probability ∏_g multinomial(n_g; x_g1 …
// x_gL) / Σ over all tables of the same, and it reaches the observed table
// when Σ (L/n_g)·s_g² does, s_g = Σ_l x_gl·d_l with d_l the doubled midrank
// of level l; in whole numbers (math/big for the weights), so nothing is
// rounded until the last division.
func enumerateTable(counts [][]int) float64 {
	k, levels := len(counts), len(counts[0])
	sizes, margins := make([]int, k), make([]int, levels)
	for g, row := range counts {
		for l, x := range row {
			sizes[g] += x
			margins[l] += x
		}
	}
	scores := make([]int64, levels) // doubled midranks
	below := 0
	for l, m := range margins {
		scores[l] = int64(2*below + m + 1)
		below += m
	}
	lcm := int64(1)
	for _, n := range sizes {
		lcm = lcm / gcdInt(lcm, int64(n)) * int64(n)
	}
	// T in int64: its largest value, every group holding top scores, must fit
	var top float64
	for _, n := range sizes {
		top += float64(lcm/int64(n)) * math.Pow(float64(n)*float64(scores[levels-1]), 2)
	}
	if top >= 1<<62 {
		panic("enumerateTable: the statistic would overflow int64")
	}
	stat := func(table [][]int) int64 {
		var t int64
		for g, row := range table {
			var s int64
			for l, x := range row {
				s += int64(x) * scores[l]
			}
			t += lcm / int64(sizes[g]) * s * s
		}
		return t
	}
	rows := map[int][]*big.Int{} // C(n, 0 … n), each row made once
	choose := func(n, x int) *big.Int {
		row, ok := rows[n]
		if !ok {
			row = make([]*big.Int, n+1)
			row[0] = big.NewInt(1)
			for j := 1; j <= n; j++ { // C(n, j) = C(n, j−1)·(n−j+1)/j, exactly
				c := new(big.Int).Mul(row[j-1], big.NewInt(int64(n-j+1)))
				row[j] = c.Quo(c, big.NewInt(int64(j)))
			}
			rows[n] = row
		}
		return row[x]
	}
	// ∏_g multinomial(n_g; x_g1 … x_gL), which is proportional to the
	// probability just as the product over levels is
	weight := func(table [][]int) *big.Int {
		w := big.NewInt(1)
		for g, row := range table {
			left := sizes[g]
			for _, x := range row[:levels-1] { // the last level takes what is left: C(left, left) = 1
				w.Mul(w, choose(left, x))
				left -= x
			}
		}
		return w
	}
	observed := stat(counts)
	tail, all := new(big.Int), new(big.Int)
	table := make([][]int, k)
	for g := range table {
		table[g] = make([]int, levels)
	}
	left := slices.Clone(margins) // what the columns still hold
	var fill func(g, l, room int)
	fill = func(g, l, room int) {
		if g == k-1 { // the last group takes what is left
			copy(table[g], left)
			w := weight(table)
			all.Add(all, w)
			if stat(table) >= observed {
				tail.Add(tail, w)
			}
			return
		}
		if l == levels-1 {
			if room > left[l] {
				return
			}
			table[g][l], left[l] = room, left[l]-room
			fill(g+1, 0, sizes[g+1])
			left[l] += room
			return
		}
		for x := 0; x <= min(room, left[l]); x++ {
			table[g][l], left[l] = x, left[l]-x
			fill(g, l+1, room-x)
			left[l] += x
		}
	}
	fill(0, 0, sizes[0])
	p, _ := new(big.Rat).SetFrac(tail, all).Float64()
	return p
}

func gcdInt(a, b int64) int64 {
	for b != 0 {
		a, b = b, a%b
	}
	return a
}

// TestExactYesNoLarge: the exact p-value of yes/no answers at N = 1,500 (and
// unequal groups at N = 1,200) equals complete enumeration of the 2×3 table
// in exact rational arithmetic to 1e-9 relative (binomial coefficients such
// as C(1500, 750) overflow float64; the method works with their logarithms).
func TestExactYesNoLarge(t *testing.T) {
	for _, c := range []struct{ sizes, yes []int }{
		{[]int{500, 500, 500}, []int{240, 255, 262}},
		{[]int{300, 400, 500}, []int{170, 190, 260}},
	} {
		var b strings.Builder
		counts := make([][]int, len(c.sizes))
		for g, n := range c.sizes {
			counts[g] = []int{n - c.yes[g], c.yes[g]}
			for j := range n {
				fmt.Fprintf(&b, "site %d,%d\n", g+1, min(1, max(0, c.yes[g]-j)))
			}
		}
		r, err := Analyze([]byte(b.String()), Options{PostHoc: "none"})
		if err != nil {
			t.Fatal(err)
		}
		checkValid(t, fmt.Sprint(c.sizes), r)
		want := enumerateTable(counts)
		if r.PMethod != "exact" || math.Abs(*r.PExact-want) > 1e-9*want {
			t.Errorf("sizes %v, yes %v: %s p %v, enumeration %v", c.sizes, c.yes, r.PMethod, r.PValue, want)
		}
	}
}

// TestExactOnOpenDatasets: on two open datasets shipped with R, the exact
// p-value equals complete enumeration of their tables (here, in exact
// rational arithmetic) to 1e-12 relative: R's mtcars, transmission (0/1) by
// cylinders (2 × 3, N = 32), and R's infert, induced abortions (0, 1, 2+) by
// education (3 × 3, N = 248). Their chi-square figures are checked against R
// and scipy in TestAgainstReferences.
func TestExactOnOpenDatasets(t *testing.T) {
	for _, name := range []string{"mtcars_am", "infert_induced"} {
		data, err := os.ReadFile(filepath.Join("..", "testdata", "reference", name+".csv"))
		if err != nil {
			t.Fatal(err)
		}
		r, err := Analyze(data, Options{PostHoc: "none"})
		if err != nil {
			t.Fatal(err)
		}
		// the table of the data: groups in order of appearance, levels ascending
		tb, err := table.Parse(data, table.Options{})
		if err != nil {
			t.Fatal(err)
		}
		levels := slices.Sorted(maps.Keys(func() map[float64]bool {
			m := map[float64]bool{}
			for _, v := range tb.Values {
				m[v] = true
			}
			return m
		}()))
		counts := make([][]int, len(tb.Labels))
		for g := range counts {
			counts[g] = make([]int, len(levels))
		}
		for i, v := range tb.Values {
			counts[tb.Groups[i]][slices.Index(levels, v)]++
		}
		want := enumerateTable(counts)
		if r.PMethod != "exact" || math.Abs(*r.PExact-want) > 1e-12*want {
			t.Errorf("%s (table %v): %s p %.17g, enumeration %.17g", name, counts, r.PMethod, r.PValue, want)
		}
		t.Logf("%s: exact p %.6g, enumeration %.6g, chi-square %.6g", name, r.PValue, want, r.PAsymptotic)
	}
}

// TestRealisticSweep: default settings on rating scales, yes/no answers and
// continuous values from N = 300 to 300,000 in three to five groups, equal
// and unequal: every answer is valid JSON with finite numbers, and where the
// p-value is not the chi-square one it agrees with it within 0.02 at these
// sizes (the exact or Monte Carlo p and the approximation estimate the same
// permutation p-value). Speed is measured by the benchmarks, not here.
func TestRealisticSweep(t *testing.T) {
	cases := []struct {
		kind  string
		sizes []int
		draw  func(r *rand.Rand, g int) string
	}{
		{"rating", []int{100, 100, 100}, rating(0.1)},
		{"rating", []int{70, 90, 110, 130}, rating(0.05)},
		{"rating", []int{7000, 7500, 8000, 7500}, rating(0)},
		{"yes/no", []int{100, 100, 100, 100}, yesNo},
		{"yes/no", []int{1000, 1000, 1000}, yesNo},
		{"yes/no", []int{20_000, 30_000, 25_000}, yesNo},
		{"continuous", []int{60, 60, 60, 60, 60}, continuous},
		{"continuous", []int{20_000, 15_000, 15_000}, continuous},
		{"continuous", []int{100_000, 100_000, 100_000}, continuous},
	}
	for i, c := range cases {
		data := sample(c.sizes, uint64(i), c.draw)
		r, err := Analyze(data, Options{PostHoc: "none"})
		if err != nil {
			t.Fatal(err)
		}
		name := fmt.Sprintf("%s %v", c.kind, c.sizes)
		checkValid(t, name, r)
		if math.Abs(r.PValue-r.PAsymptotic) > 0.02 {
			t.Errorf("%s: %s p %.4f, chi-square p %.4f", name, r.PMethod, r.PValue, r.PAsymptotic)
		}
		t.Logf("%s: %s p %.4f, chi-square %.4f", name, r.PMethod, r.PValue, r.PAsymptotic)
	}
}

// FuzzPValues draws data of realistic shapes (three to six groups of up to
// two thousand values each, continuous or on two to seven levels, groups
// shifted or not) and asks for each p-value method (exact only for smaller
// samples, the automatic choice for the rest): every answer is valid
// JSON with p in [0, 1], an exact request is answered or refused as too
// large, never failed otherwise, and where every group has at least 30
// values, the exact or Monte Carlo p agrees with the chi-square p within
// 0.03 plus four Monte Carlo standard errors.
func FuzzPValues(f *testing.F) {
	f.Add(uint64(1), uint8(3), uint8(2), uint16(40), uint8(0), uint8(0))
	f.Add(uint64(2), uint8(4), uint8(5), uint16(300), uint8(1), uint8(1))
	f.Add(uint64(3), uint8(5), uint8(0), uint16(90), uint8(2), uint8(2))
	f.Add(uint64(4), uint8(3), uint8(7), uint16(2000), uint8(0), uint8(1))
	f.Fuzz(func(t *testing.T, seed uint64, groups, levels uint8, scale uint16, method, shift uint8) {
		r := rand.New(rand.NewPCG(seed, 7))
		k := 3 + int(groups)%4
		sizes := make([]int, k)
		for i := range sizes {
			sizes[i] = 1 + r.IntN(1+int(scale)%2000)
		}
		levels %= 8
		step := float64(shift%4) / 10
		data := sample(sizes, seed, func(r *rand.Rand, g int) string {
			x := r.NormFloat64() + step*float64(g)
			if levels < 2 {
				return fmt.Sprint(x)
			}
			return fmt.Sprint(max(0, min(float64(levels-1), math.Round(x+float64(levels)/2))))
		})
		const resamples = 2000
		opt := Options{PValue: []string{"auto", "exact", "monte-carlo"}[method%3], Resamples: resamples, PostHoc: "none"}
		if opt.PValue == "exact" && len(sizes)*slices.Max(sizes) > 1200 {
			opt.PValue = "auto" // an explicit request may take seconds within its budget: too slow to fuzz
		}
		res, err := Analyze(data, opt)
		var oe *OptionError
		switch {
		case errors.As(err, &oe) && opt.PValue == "exact":
			return // refused as too large, with a message
		case err != nil:
			var te *table.Error
			if errors.As(err, &te) && strings.Contains(te.Reason, "nothing to rank") {
				return
			}
			t.Fatalf("sizes %v, %d levels, %s: %v", sizes, levels, opt.PValue, err)
		}
		checkValid(t, fmt.Sprint(sizes), res)
		if slices.Min(sizes) < 30 || res.PMethod == "asymptotic" {
			return
		}
		chi := res.PAsymptotic
		tol := 0.03
		if res.PMethod == "monte-carlo" {
			tol += 4 * math.Sqrt(max(chi*(1-chi), 1e-4)/resamples)
		}
		if math.Abs(res.PValue-chi) > tol {
			t.Fatalf("sizes %v, %d levels: %s p %.4f, chi-square p %.4f", sizes, levels, res.PMethod, res.PValue, chi)
		}
	})
}
