package core

import (
	"encoding/json"
	"errors"
	"fmt"
	"math"
	"math/big"
	"math/rand/v2"
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

// binomials returns C(n, a) for a = 0 … n exactly.
func binomials(n int) []*big.Int {
	c := make([]*big.Int, n+1)
	for a := range c {
		c[a] = new(big.Int).Binomial(int64(n), int64(a))
	}
	return c
}

// enumerateYesNo is the exact p-value of yes/no data by complete
// enumeration of the 2×3 table: group i holds aᵢ of the m answers 1 with
// probability ∏ C(nᵢ, aᵢ)/C(N, m), and a table reaches the observed one when
// Σ (L/nᵢ)·aᵢ² does (H orders tables so for two values), in math/big.
func enumerateYesNo(sizes []int, observed []int) float64 {
	n, m, l := 0, 0, int64(1)
	for i, s := range sizes {
		n += s
		m += observed[i]
		l = l / gcdInt(l, int64(s)) * int64(s)
	}
	stat := func(a []int) *big.Int {
		t := new(big.Int)
		for i, x := range a {
			term := big.NewInt(int64(x) * int64(x))
			t.Add(t, term.Mul(term, big.NewInt(l/int64(sizes[i]))))
		}
		return t
	}
	obs := stat(observed)
	c := [3][]*big.Int{binomials(sizes[0]), binomials(sizes[1]), binomials(sizes[2])}
	tail := new(big.Int)
	a := make([]int, 3)
	for a[0] = 0; a[0] <= sizes[0]; a[0]++ {
		for a[1] = 0; a[1] <= sizes[1]; a[1]++ {
			a[2] = m - a[0] - a[1]
			if a[2] < 0 || a[2] > sizes[2] || stat(a).Cmp(obs) < 0 {
				continue
			}
			w := new(big.Int).Mul(c[0][a[0]], c[1][a[1]])
			tail.Add(tail, w.Mul(w, c[2][a[2]]))
		}
	}
	p, _ := new(big.Rat).SetFrac(tail, new(big.Int).Binomial(int64(n), int64(m))).Float64()
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
		for g, n := range c.sizes {
			for j := range n {
				fmt.Fprintf(&b, "site %d,%d\n", g+1, min(1, max(0, c.yes[g]-j)))
			}
		}
		r, err := Analyze([]byte(b.String()), Options{PostHoc: "none"})
		if err != nil {
			t.Fatal(err)
		}
		checkValid(t, fmt.Sprint(c.sizes), r)
		want := enumerateYesNo(c.sizes, c.yes)
		if r.PMethod != "exact" || math.Abs(*r.PExact-want) > 1e-9*want {
			t.Errorf("sizes %v, yes %v: %s p %v, enumeration %v", c.sizes, c.yes, r.PMethod, r.PValue, want)
		}
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
