package posthoc

import (
	"context"
	"math"
	"midrank/core/testfiles"
	"os"
	"slices"
	"strconv"
	"testing"

	"midrank/core/kruskal"
	"midrank/core/rank"
	"midrank/core/table"
)

// dataset reads one of R's open datasets exported to testdata/reference.
func dataset(t *testing.T, name string) (*table.Table, rank.Ranking, float64) {
	t.Helper()
	data, err := os.ReadFile("../../testdata/reference/" + name + ".csv")
	if err != nil {
		t.Fatal(err)
	}
	tab, err := table.Parse(data, table.Options{})
	if err != nil {
		t.Fatal(err)
	}
	r := rank.Rank(tab.Values, tab.Groups, len(tab.Labels))
	h := kruskal.Compute(r.Sizes, r.RankSums, r.TieSum).H
	return tab, r, h
}

// rows reads a reference table of testdata/reference (see package testfiles).
func rows(t *testing.T, name string) [][]string {
	t.Helper()
	out, err := testfiles.Rows(os.DirFS("../../testdata/reference"), name)
	if err != nil {
		t.Fatal(err)
	}
	return out
}

func num(s string) float64 {
	v, _ := strconv.ParseFloat(s, 64)
	return v
}

// pairsOf runs a method on a dataset and indexes the pairs by labels.
func pairsOf(t *testing.T, name string, method Method) (map[[2]string]Pair, *table.Table) {
	tab, r, h := dataset(t, name)
	pairs, err := Compare(context.Background(), method, r, h, 0.95)
	if err != nil {
		t.Fatal(err)
	}
	m := map[[2]string]Pair{}
	for _, p := range pairs {
		m[[2]string{tab.Labels[p.A], tab.Labels[p.B]}] = p
	}
	return m, tab
}

// TestAgainstIndependentImplementation: Dunn, Conover–Iman, DSCF, the
// probability of superiority and the Hodges–Lehmann shift on InsectSprays,
// chickwts, PlantGrowth and airquality (R's datasets), against the numpy /
// scipy implementation in tools/reference/posthoc.py (testdata/reference/posthoc.tsv).
func TestAgainstIndependentImplementation(t *testing.T) {
	cache := map[string]map[[2]string]Pair{}
	checked := 0
	for _, row := range rows(t, "posthoc.tsv") {
		method := row[1]
		runAs := method
		if method == "superiority" || method == "hodges_lehmann" {
			runAs = "dunn"
		}
		key := row[0] + "/" + runAs
		if cache[key] == nil {
			cache[key], _ = pairsOf(t, row[0], Method(runAs))
		}
		p, ok := cache[key][[2]string{row[2], row[3]}]
		if !ok {
			t.Fatalf("%s: no pair %s–%s", row[0], row[2], row[3])
		}
		stat, want := num(row[4]), num(row[5])
		var got, gotP float64
		pTol := 1e-10
		switch method {
		case "superiority":
			got, gotP, want = p.ProbSuperiority, 0, 0
		case "hodges_lehmann":
			got, gotP, want = p.Shift, 0, 0
		default:
			got, gotP = p.Statistic, p.P
			if method == "dscf" {
				pTol = 1e-6 // the reference uses df = 1e7 for infinity
			}
		}
		if math.Abs(got-stat) > 1e-12*math.Max(1, math.Abs(stat)) || math.Abs(gotP-want) > pTol*math.Max(want, 1e-3) {
			t.Errorf("%s %s %s–%s: statistic %.15g p %.15g, want %.15g and %.15g (%s)", row[0], method, row[2], row[3], got, gotP, stat, want, row[6])
		}
		checked++
	}
	if checked != 215 {
		t.Errorf("checked %d values, want 215", checked)
	}
}

// TestMannWhitneyAgainstR: U and two-sided p against R's wilcox.test, exact
// or normal as R chooses (testdata/reference/wilcox.tsv).
func TestMannWhitneyAgainstR(t *testing.T) {
	cache := map[string]map[[2]string]Pair{}
	for _, row := range rows(t, "wilcox.tsv") {
		if cache[row[0]] == nil {
			cache[row[0]], _ = pairsOf(t, row[0], "mann-whitney")
		}
		p := cache[row[0]][[2]string{row[1], row[2]}]
		u, want, exact := num(row[3]), num(row[4]), row[5] == "TRUE"
		if p.Statistic != u || math.Abs(p.P-want) > 1e-10*math.Max(want, 1e-6) || p.Exact != exact {
			t.Errorf("%s %s–%s: U %v p %.15g exact %v, want %v %.15g %v (%s)", row[0], row[1], row[2], p.Statistic, p.P, p.Exact, u, want, exact, row[6])
		}
	}
}

// TestSymmetry: swapping the groups flips the sign of the statistic only.
func TestSymmetry(t *testing.T) {
	_, r, h := dataset(t, "chickwts")
	for _, method := range []Method{Dunn, Conover, DSCF} {
		pairs, _ := Compare(context.Background(), method, r, h, 0.95)
		for _, p := range pairs {
			swapped := r
			swapped.Groups = make([]int32, len(r.Groups))
			for i, g := range r.Groups {
				switch int(g) {
				case p.A:
					swapped.Groups[i] = int32(p.B)
				case p.B:
					swapped.Groups[i] = int32(p.A)
				default:
					swapped.Groups[i] = g
				}
			}
			swapped.Sizes = append([]int(nil), r.Sizes...)
			swapped.RankSums = append([]float64(nil), r.RankSums...)
			swapped.Sizes[p.A], swapped.Sizes[p.B] = r.Sizes[p.B], r.Sizes[p.A]
			swapped.RankSums[p.A], swapped.RankSums[p.B] = r.RankSums[p.B], r.RankSums[p.A]
			again, _ := Compare(context.Background(), method, swapped, h, 0.95)
			for _, q := range again {
				if q.A == p.A && q.B == p.B && (math.Abs(q.Statistic+p.Statistic) > 1e-12 || math.Abs(q.P-p.P) > 1e-12) {
					t.Errorf("%s pair %d–%d: %v %v swapped to %v %v", method, p.A, p.B, p.Statistic, p.P, q.Statistic, q.P)
				}
			}
		}
	}
}

// TestKthDifference: against sorting all differences, with ties, negatives
// and both small and listable sizes.
func TestKthDifference(t *testing.T) {
	cases := [][2][]float64{
		{{1, 2, 3}, {1, 2, 3}},
		{{-5, 0, 0, 2.5, 7}, {-1, 0, 3}},
		{{0.1, 0.2, 0.3, 0.4}, {0.3}},
	}
	big := [2][]float64{make([]float64, 300), make([]float64, 250)}
	for i := range big[0] {
		big[0][i] = float64(i%37) * 0.7
	}
	for i := range big[1] {
		big[1][i] = float64(i%23)*1.3 - 4
	}
	// many distinct values, so that bisection runs before the listing
	many := [2][]float64{make([]float64, 900), make([]float64, 700)}
	for i := range many[0] {
		many[0][i] = float64((i*7919)%611) * 0.25
	}
	for i := range many[1] {
		many[1][i] = float64((i*104729)%503)*0.5 - 20
	}
	for _, c := range [][2][]float64{big, many} {
		slices.Sort(c[0])
		slices.Sort(c[1])
		cases = append(cases, c)
	}
	for _, c := range cases {
		var all []float64
		for _, x := range c[0] {
			for _, y := range c[1] {
				all = append(all, x-y)
			}
		}
		slices.Sort(all)
		for k := 1; k <= len(all); k += max(1, len(all)/997) {
			if got := kthDifference(tallyOf(c[0]), tallyOf(c[1]), k); got != all[k-1] {
				t.Fatalf("kthDifference(%d) = %v, want %v", k, got, all[k-1])
			}
		}
	}
}
