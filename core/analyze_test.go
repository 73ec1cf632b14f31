package core

import (
	"bytes"
	"encoding/json"
	"errors"
	"fmt"
	"math"
	"os"
	"reflect"
	"slices"
	"strings"
	"testing"

	"midrank/core/adjust"
	"midrank/core/table"
)

func TestAnalyzeErrors(t *testing.T) {
	tests := []struct {
		name  string
		data  string
		opt   Options
		group string
		says  string
	}{
		{"one group", "A\n1\n2\n", Options{}, "A", "only group"},
		{"no groups", "\n", Options{}, "", "no data"},
		{"empty group", "A,B\n1,\n2,NA\n", Options{}, "B", "no values"},
		{"all equal", "A,B\n3,3\n3,3\n", Options{}, "", "nothing to rank"},
	}
	for _, tt := range tests {
		_, err := Analyze([]byte(tt.data), tt.opt)
		var e *table.Error
		if !errors.As(err, &e) || e.Group != tt.group || !strings.Contains(e.Error(), tt.says) {
			t.Errorf("%s: Analyze(%q) error = %v, want group %q saying %q", tt.name, tt.data, err, tt.group, tt.says)
		}
	}
}

// TestGroupEdits: leaving out, reordering and renaming groups.
func TestGroupEdits(t *testing.T) {
	data, err := os.ReadFile("../testdata/cases/plantgrowth_long.csv")
	if err != nil {
		t.Fatal(err)
	}
	full, err := Analyze(data, Options{})
	if err != nil {
		t.Fatal(err)
	}
	tests := []struct {
		name     string
		opt      Options
		labels   []string // groups shown, in order
		inData   []string
		h        float64
		excluded []Left
	}{
		// R 4.2.2: kruskal.test(weight ~ group, droplevels(subset(PlantGrowth, group != "trt1")))
		{"exclude", Options{Exclude: []string{"trt1"}}, []string{"ctrl", "trt2"}, []string{"ctrl", "trt2"}, 3.57142857142857,
			[]Left{{"trt1", 10, 0}}},
		// order and names do not change H
		{"order and rename", Options{Order: []string{"trt2", "ctrl"}, Rename: map[string]string{"ctrl": "Control <b>"}},
			[]string{"trt2", "Control <b>", "trt1"}, []string{"trt2", "ctrl", "trt1"}, full.H, []Left{}},
		// a swap of names is allowed
		{"swap names", Options{Rename: map[string]string{"ctrl": "trt1", "trt1": "ctrl"}},
			[]string{"trt1", "ctrl", "trt2"}, []string{"ctrl", "trt1", "trt2"}, full.H, []Left{}},
	}
	for _, tt := range tests {
		r, err := Analyze(data, tt.opt)
		if err != nil {
			t.Fatalf("%s: %v", tt.name, err)
		}
		var labels, inData []string
		for _, g := range r.Groups {
			labels, inData = append(labels, g.Label), append(inData, g.InData)
		}
		if !reflect.DeepEqual(labels, tt.labels) || !reflect.DeepEqual(inData, tt.inData) ||
			math.Abs(r.H-tt.h) > 1e-12 || !reflect.DeepEqual(r.Input.Excluded, tt.excluded) {
			t.Errorf("%s: groups %v from %v, H %.15g, excluded %v; want %v from %v, %.15g, %v",
				tt.name, labels, inData, r.H, r.Input.Excluded, tt.labels, tt.inData, tt.h, tt.excluded)
		}
	}
	bad := []struct {
		opt   Options
		group string
		says  string
	}{
		{Options{Order: []string{"trt3"}}, "trt3", "not in the data"},
		{Options{Order: []string{"ctrl", "ctrl"}}, "ctrl", "twice"},
		{Options{Exclude: []string{"x"}}, "x", "not in the data"},
		{Options{Rename: map[string]string{"ctrl": ""}}, "ctrl", "empty"},
		{Options{Rename: map[string]string{"ctrl": "trt1"}}, "trt1", "both be called"},
		{Options{Exclude: []string{"trt1", "trt2"}}, "ctrl", "only group"},
	}
	for _, tt := range bad {
		_, err := Analyze(data, tt.opt)
		var e *table.Error
		if !errors.As(err, &e) || e.Group != tt.group || !strings.Contains(e.Error(), tt.says) {
			t.Errorf("%+v: error %v, want group %q saying %q", tt.opt, err, tt.group, tt.says)
		}
	}
}

func TestOptions(t *testing.T) {
	seed, tooLarge := uint64(7), uint64(MaxSeed+1)
	tests := []struct {
		opt    Options
		option string // "" for valid options
	}{
		{Options{}, ""},
		{Options{Layout: "long", Separator: "comma", Decimal: "point", Alpha: 0.1, PValue: "asymptotic", PostHoc: "none", Adjust: "none"}, ""},
		{Options{PValue: "monte-carlo", Resamples: 1000, Seed: &seed}, ""},
		{Options{PValue: "exact"}, ""},
		{Options{Alpha: 1.5}, "alpha"},
		{Options{Alpha: -0.05}, "alpha"},
		{Options{Layout: "tall"}, "layout"},
		{Options{Separator: "pipe"}, "separator"},
		{Options{Decimal: "comma"}, ""},
		{Options{Decimal: "dot"}, "decimal"},
		{Options{Thousands: "underscore"}, "thousands"},
		{Options{Decimal: "comma", Thousands: "comma"}, "thousands"},
		{Options{PValue: "bootstrap"}, "pvalue"},
		{Options{PostHoc: "dunn", Adjust: "sidak"}, ""},
		{Options{PostHoc: "tukey"}, "posthoc"},
		{Options{Adjust: "fdr"}, "adjust"},
		{Options{Resamples: -5}, "resamples"},
		{Options{Resamples: MaxResamples + 1}, "resamples"},
		{Options{Seed: &tooLarge}, "seed"},
		{Options{AdjustAcross: "holm"}, ""},
		{Options{AdjustAcross: "bonferroni"}, "adjust_across"},
		{Options{Measure: "A", Measures: []string{"B"}}, "measures"},
	}
	for _, tt := range tests {
		_, err := Analyze([]byte("A,B\n1,2\n3,4\n"), tt.opt)
		var oe *OptionError
		switch {
		case tt.option == "" && err != nil:
			t.Errorf("Analyze with %+v: %v, want no error", tt.opt, err)
		case tt.option != "" && (!errors.As(err, &oe) || oe.Option != tt.option):
			t.Errorf("Analyze with %+v: error %v, want an OptionError for %s", tt.opt, err, tt.option)
		}
	}
	if _, err := DecodeOptions([]byte(`{"alhpa": 0.1}`)); err == nil {
		t.Error(`DecodeOptions({"alhpa": 0.1}) accepted a misspelt key`)
	}
}

// TestUndefinedIsNull: with N = k, η²(H) is undefined and must be null.
func TestUndefinedIsNull(t *testing.T) {
	r, err := Analyze([]byte("A,B,C\n1,2,3\n"), Options{PValue: "asymptotic"})
	if err != nil {
		t.Fatal(err)
	}
	b, err := Encode(r)
	if err != nil {
		t.Fatal(err)
	}
	var m map[string]any
	if err := json.Unmarshal(b, &m); err != nil {
		t.Fatal(err)
	}
	if m["eta_squared"] != nil || m["eta_squared_size"] != nil || m["p_exact"] != nil {
		t.Errorf("eta_squared = %v, eta_squared_size = %v, p_exact = %v; want null", m["eta_squared"], m["eta_squared_size"], m["p_exact"])
	}
}

// TestLargeListsArePaged: above ListLimit values the ranking is served by Page.
func TestLargeListsArePaged(t *testing.T) {
	var b strings.Builder
	b.WriteString("A,B\n")
	for i := 0; i < ListLimit/2+10; i++ {
		fmt.Fprintf(&b, "%d,%d\n", i, i+7)
	}
	r, err := Analyze([]byte(b.String()), Options{})
	if err != nil {
		t.Fatal(err)
	}
	if r.RanksComplete || len(r.Ranks) != 0 {
		t.Fatalf("ranks_complete = %v with %d ranks, want false and none", r.RanksComplete, len(r.Ranks))
	}
	p := r.Page(ListRanks, r.N-3, 10)
	if p.Total != r.N || len(p.Ranks) != 3 || p.Ranks[2].Group != "B" || p.Ranks[2].Line != ListLimit/2+11 {
		t.Errorf("last page = %+v, want the last 3 of %d values", p, r.N)
	}
	// the last A value, ListLimit/2+9, is also a B value; the B value after it is not
	if p.Ranks[1].Shared != 2 || p.Ranks[2].Shared != 1 {
		t.Errorf("shared = %d and %d, want 2 and 1", p.Ranks[1].Shared, p.Ranks[2].Shared)
	}
}

// FuzzAnalyze: every accepted input yields a result whose JSON encodes
// (so holds no NaN or Inf), with ranks summing to N(N+1)/2 and 0 ≤ p ≤ 1.
func FuzzAnalyze(f *testing.F) {
	f.Add([]byte("A\tB\tC\n1\t2\t3\n4\t\t6\n\t5\t\n7\n"), 0.05, uint8(0))
	f.Add([]byte("site,minutes\nNorth,3\nSouth,4\nNorth,NA\nEast,4\n"), 0.01, uint8(1))
	f.Add([]byte("x;y\n1,5;2\n1e300;-1e300\n"), 0.5, uint8(2))
	f.Add([]byte("band,score\nlow,1\nlow,2\nmid,2\nmid,3\nhigh,3\nhigh,5\n"), 0.05, uint8(0x60))
	f.Fuzz(func(t *testing.T, data []byte, alpha float64, mode uint8) {
		// every p-value method and post-hoc procedure, each kept quick:
		// few resamples, and the exact method only on small samples
		posthocKeys := Keys("posthoc")
		opt := Options{Alpha: alpha, PValue: "asymptotic", PostHoc: posthocKeys[int(mode)%len(posthocKeys)]}
		if mode&0x40 != 0 { // and the trend test, each way
			opt.Trend = Keys("trend")[1+int(mode>>2)%3]
		}
		switch {
		case mode&0x10 != 0:
			opt.PValue, opt.Resamples = "monte-carlo", 200
		case mode&0x20 != 0 && len(data) < 40:
			opt.PValue = "exact"
		}
		r, err := Analyze(data, opt)
		if err != nil {
			if b := EncodeError(err); !json.Valid(b) {
				t.Fatalf("EncodeError gave invalid JSON: %s", b)
			}
			return
		}
		if b, err := Encode(r); err != nil || !json.Valid(b) {
			t.Fatalf("Encode: %v, valid JSON %v", err, json.Valid(b))
		}
		if !(r.PValue >= 0 && r.PValue <= 1) || r.H < 0 || !(r.TieCorrection > 0 && r.TieCorrection <= 1) {
			t.Fatalf("p = %v, H = %v, C = %v", r.PValue, r.H, r.TieCorrection)
		}
		if tr := r.Trend; tr != nil && (!(tr.P >= 0 && tr.P <= 1) || !(tr.TauB >= -1 && tr.TauB <= 1) || tr.Variance <= 0) {
			t.Fatalf("trend %+v", tr)
		}
		var sum float64
		for _, g := range r.Groups {
			sum += g.RankSum
		}
		if n := float64(r.N); sum != n*(n+1)/2 {
			t.Fatalf("rank sums add to %v, want %v", sum, n*(n+1)/2)
		}
	})
}

func ExampleAnalyze() {
	data := "ward,days\nA,3\nA,5\nA,4\nB,8\nB,6\nB,9\nC,2\nC,1\nC,3\n"
	r, err := Analyze([]byte(data), Options{})
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("H = %.3f, df = %d, chi-square p = %.4f, %s p = %.4f\n", r.H, r.DF, r.PAsymptotic, r.PMethod, r.PValue)
	for _, g := range r.Groups {
		fmt.Printf("%s: mean rank %.2f, median %g\n", g.Label, g.MeanRank, g.Median)
	}
	// R 4.2.2 kruskal.test gives 6.8796, df 2, p 0.03207 and mean ranks
	// 4.833333, 8, 2.166667 for the same data; enumerating all 1,680 deals
	// with scipy 1.10.1 scipy.stats.kruskal finds 12 with H at least as
	// large: exact p = 0.0071.

	// Output:
	// H = 6.880, df = 2, chi-square p = 0.0321, exact p = 0.0071
	// A: mean rank 4.83, median 4
	// B: mean rank 8.00, median 8
	// C: mean rank 2.17, median 2
}

// TestListsAreNeverNull: empty lists are [] in JSON, so that readers can
// iterate without a check.
func TestListsAreNeverNull(t *testing.T) {
	r, err := Analyze([]byte("A,B\n1,2\n3,4\n"), Options{})
	if err != nil {
		t.Fatal(err)
	}
	b, err := Encode(r)
	if err != nil {
		t.Fatal(err)
	}
	for _, key := range []string{`"ties":[]`, `"warnings":[`, `"ranks":[`} {
		if !strings.Contains(string(b), key) {
			t.Errorf("JSON lacks %s: %s", key, b)
		}
	}
}

// TestLettersMatchPairs: on the example cases and every post-hoc method,
// two groups share a letter exactly when their pair is not significant.
func TestLettersMatchPairs(t *testing.T) {
	for _, name := range []string{"insectsprays_ties.csv", "airquality_missing.csv", "clinic_demo_invented.tsv", "plantgrowth_long.csv"} {
		data, err := os.ReadFile("../testdata/cases/" + name)
		if err != nil {
			t.Fatal(err)
		}
		for _, method := range []string{"dunn", "conover", "dscf", "mann-whitney"} {
			r, err := Analyze(data, Options{PostHoc: method, PValue: "asymptotic"})
			if err != nil {
				t.Fatal(err)
			}
			for _, p := range r.PostHoc.Pairs {
				shared := strings.ContainsAny(r.PostHoc.Letters[p.A], r.PostHoc.Letters[p.B])
				if shared == p.Significant {
					t.Errorf("%s %s: %s (%s) and %s (%s): significant %v", name, method, p.A, r.PostHoc.Letters[p.A], p.B, r.PostHoc.Letters[p.B], p.Significant)
				}
				if *p.PAdjusted < *p.P {
					t.Errorf("%s %s: adjusted %v below raw %v", name, method, *p.PAdjusted, *p.P)
				}
			}
		}
	}
}

// FuzzDecodeOptions: any options JSON either decodes or fails with an
// *OptionError, and decoded options analyse without a panic.
func FuzzDecodeOptions(f *testing.F) {
	f.Add([]byte(`{"alpha":0.1,"pvalue":"exact","posthoc":"dscf"}`))
	f.Add([]byte(`{"seed":-1}`))
	f.Add([]byte(`{"resamples":1e9}`))
	f.Add([]byte(`{"order":["C","A"],"exclude":["B"],"rename":{"A":"x","C":"y"}}`))
	f.Add([]byte(`{"measures":["2","3"],"adjust_across":"holm"}`))
	f.Fuzz(func(t *testing.T, options []byte) {
		opt, err := DecodeOptions(options)
		if err != nil {
			var oe *OptionError
			if !errors.As(err, &oe) {
				t.Fatalf("error %T %v", err, err)
			}
			return
		}
		if again, err := DecodeOptions(opt.JSON()); err != nil || !reflect.DeepEqual(again, opt) {
			t.Fatalf("options %+v written as %s read back as %+v (%v)", opt, opt.JSON(), again, err)
		}
		if opt.Resamples > 10_000 {
			opt.Resamples = 10_000 // keep each run short
		}
		if _, err := Analyze([]byte("A,B,C\n1,2,3\n4,5,6\n"), opt); err != nil {
			var oe *OptionError
			var te *table.Error // group edits naming labels that are not there
			if !errors.As(err, &oe) && !errors.As(err, &te) {
				t.Fatalf("Analyze error %T %v", err, err)
			}
		}
	})
}

// TestDefaults: the written-out defaults mean what no settings mean.
func TestDefaults(t *testing.T) {
	data := []byte("A,B,C\n1,2,3\n4,5,6\n7,8,9\n")
	a, err := Analyze(data, Defaults())
	if err != nil {
		t.Fatal(err)
	}
	b, _ := Analyze(data, Options{})
	ja, _ := Encode(a)
	jb, _ := Encode(b)
	if string(ja) != string(jb) {
		t.Errorf("Defaults() gives\n%s\nno settings give\n%s", ja, jb)
	}
}

// TestRankedPage: the ranking by rank lists values smallest first, tied
// values together in text order, with the lines they came from.
func TestRankedPage(t *testing.T) {
	r, err := Analyze([]byte("A,B\n3,1\n2,3\n5,2\n"), Options{PostHoc: "none"})
	if err != nil {
		t.Fatal(err)
	}
	p := r.Page(ListRanked, 0, 10)
	var got []string
	for _, v := range p.Ranks {
		got = append(got, fmt.Sprintf("%s%g@%d:%g", v.Group, v.Value, v.Line, v.Rank))
	}
	// hand-worked: 1 < 2 = 2 < 3 = 3 < 5, midranks 1, 2.5, 4.5, 6
	want := []string{"B1@2:1", "A2@3:2.5", "B2@4:2.5", "A3@2:4.5", "B3@3:4.5", "A5@4:6"}
	if !slices.Equal(got, want) || p.Total != 6 {
		t.Errorf("ranked page %v (total %d), want %v", got, p.Total, want)
	}
	if p := r.Page(ListRanked, 4, 10); len(p.Ranks) != 2 || p.Ranks[0].Value != 3 {
		t.Errorf("second page %+v", p)
	}
}

// TestMenus: every choice that the menus offer is accepted as it is by the
// option parser, the first is the default, and every label is words.
func TestMenus(t *testing.T) {
	defaults := Defaults()
	firsts := map[string]string{"pvalue": defaults.PValue, "posthoc": defaults.PostHoc, "adjust": defaults.Adjust, "adjust_across": defaults.AdjustAcross, "trend": defaults.Trend}
	for _, m := range Menus {
		if m.Choices[0].Key != firsts[m.Option] {
			t.Errorf("%s: first choice %q, default %q", m.Option, m.Choices[0].Key, firsts[m.Option])
		}
		for _, c := range m.Choices {
			opt, err := DecodeOptions([]byte(fmt.Sprintf(`{%q:%q}`, m.Option, c.Key)))
			if err == nil {
				_, err = opt.validate()
			}
			if err != nil || c.Label == "" {
				t.Errorf("%s %q (%q): %v", m.Option, c.Key, c.Label, err)
			}
		}
	}
	if !bytes.Contains(EncodeMenus(), []byte(`{"key":"none","label":"no pairwise comparison"}`)) {
		t.Errorf("EncodeMenus = %s", EncodeMenus())
	}
}

// TestConoverWithoutDegreesOfFreedom: with one value per group Conover–Iman's
// t has N − k = 0 degrees of freedom and is undefined: no statistic, no p,
// nothing significant, and a caution says why; with groups each constant
// but different its t is infinite (null) with p = 0 (the limit of the
// formula in core/posthoc, common practice to report as p < any level).
func TestConoverWithoutDegreesOfFreedom(t *testing.T) {
	r, err := Analyze([]byte("A,B,C\n1,2,3\n"), Options{PostHoc: "conover"})
	if err != nil {
		t.Fatal(err)
	}
	for _, p := range r.PostHoc.Pairs {
		if p.Statistic != nil || p.P != nil || p.PAdjusted != nil || p.Significant {
			t.Errorf("%s–%s: statistic %v p %v adjusted %v significant %v, want none", p.A, p.B, p.Statistic, p.P, p.PAdjusted, p.Significant)
		}
	}
	if !strings.Contains(strings.Join(r.Warnings, " "), "no statistic and no p") {
		t.Errorf("warnings %q, want the reason the pairs have no test", r.Warnings)
	}
	r, err = Analyze([]byte("A,B,C\n1,2,3\n1,2,3\n1,2,3\n"), Options{PostHoc: "conover"})
	if err != nil {
		t.Fatal(err)
	}
	for _, p := range r.PostHoc.Pairs {
		if p.Statistic != nil || p.P == nil || *p.P != 0 || !p.Significant {
			t.Errorf("%s–%s: statistic %v p %v significant %v, want an infinite statistic with p 0", p.A, p.B, p.Statistic, p.P, p.Significant)
		}
	}
	if !strings.Contains(strings.Join(r.Warnings, " "), "In 3 pairs every group's values are all equal") {
		t.Errorf("warnings %q, want the infinite statistics named", r.Warnings)
	}
}

// TestResultLineOfPlantGrowth: R's PlantGrowth (testdata/cases/plantgrowth_long.csv)
// with the chi-square p: R 4.2.2's kruskal.test(weight ~ group) gives
// chi-squared = 7.9882, df = 2, p-value = 0.01842, and ε² = H/(N − 1) = 0.2755.
func TestResultLineOfPlantGrowth(t *testing.T) {
	data, err := os.ReadFile("../testdata/cases/plantgrowth_long.csv")
	if err != nil {
		t.Fatal(err)
	}
	r, err := Analyze(data, Options{PValue: "asymptotic"})
	if err != nil {
		t.Fatal(err)
	}
	if want := "H(2) = 7.99, p = .018, ε² = 0.28, N = 30"; r.ResultLine != want {
		t.Errorf("result line %q, want %q", r.ResultLine, want)
	}
}

// TestIntervalLevel: each pair's Hodges–Lehmann interval is taken at the
// level that matches the adjustment: Bonferroni's 1 − α/m for the
// family-wise adjustments, Šidák's (1 − α)^(1/m) for Šidák, and 1 − α, each
// pair on its own, for the false-discovery-rate ones and none (the
// definitions, common practice; the figures worked by hand for α = 0.05 and
// m = 6 pairs).
func TestIntervalLevel(t *testing.T) {
	tests := []struct {
		method   adjust.Method
		want     float64
		together bool
	}{
		{adjust.Holm, 1 - 0.05/6, true},
		{adjust.Bonferroni, 1 - 0.05/6, true},
		{adjust.Hochberg, 1 - 0.05/6, true},
		{adjust.Sidak, 0.9914876, true},
		{adjust.BH, 0.95, false},
		{adjust.BY, 0.95, false},
		{adjust.None, 0.95, false},
	}
	for _, tt := range tests {
		got, together := intervalLevel(tt.method, 0.05, 6)
		if math.Abs(got-tt.want) > 1e-7 || together != tt.together {
			t.Errorf("%s: %v together %v, want %v %v", tt.method, got, together, tt.want, tt.together)
		}
	}
}
