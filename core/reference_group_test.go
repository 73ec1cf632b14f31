package core

import (
	"errors"
	"math"
	"os"
	"strconv"
	"strings"
	"testing"

	"midrank/core/testfiles"
)

// TestReferenceGroup: each group compared with one reference group by
// Dunn's test, the p-values adjusted over those k−1 comparisons only,
// against R 4.2.2 (tools/reference/reference_group.R: Dunn's z by its
// formula and p.adjust) on PlantGrowth with ctrl and InsectSprays with spray
// C as the reference (testdata/reference_group/expected.tsv).
func TestReferenceGroup(t *testing.T) {
	rows, err := testfiles.Rows(os.DirFS("../testdata/reference_group"), "expected.tsv")
	if err != nil {
		t.Fatal(err)
	}
	header := rows[0]
	for _, adjust := range []string{"holm", "bonferroni", "hochberg", "bh"} {
		col := -1
		for i, h := range header {
			if h == adjust {
				col = i
			}
		}
		results := map[string]*Result{}
		for _, row := range rows[1:] {
			dataset, reference, other := row[0], row[1], row[2]
			res := results[dataset]
			if res == nil {
				data, err := os.ReadFile("../testdata/reference/" + dataset + ".csv")
				if err != nil {
					t.Fatal(err)
				}
				if res, err = Analyze(data, Options{Reference: reference, Adjust: adjust}); err != nil {
					t.Fatal(err)
				}
				results[dataset] = res
				if ph := res.PostHoc; ph.Reference == nil || *ph.Reference != reference || len(ph.Pairs) != res.K-1 || len(ph.Letters) != 0 {
					t.Errorf("%s: reference %v, %d pairs, letters %v", dataset, ph.Reference, len(ph.Pairs), ph.Letters)
				}
				if !strings.Contains(res.Decision, "compared with the reference group "+reference+" (not with one another)") {
					t.Errorf("%s: decision %q", dataset, res.Decision)
				}
			}
			want := map[string]float64{}
			for name, i := range map[string]int{"z": 3, "p": 4, "adjusted": col} {
				if want[name], err = strconv.ParseFloat(strings.TrimSpace(row[i]), 64); err != nil {
					t.Fatal(err)
				}
			}
			found := false
			for _, p := range res.PostHoc.Pairs {
				if p.A != reference || p.B != other {
					continue
				}
				found = true
				if math.Abs(*p.Statistic-want["z"]) > 1e-12 || math.Abs(*p.P-want["p"]) > 1e-12*want["p"] || math.Abs(*p.PAdjusted-want["adjusted"]) > 1e-12*want["adjusted"] {
					t.Errorf("%s %s vs %s (%s): z %v p %v adjusted %v, R %v", dataset, reference, other, adjust, *p.Statistic, *p.P, *p.PAdjusted, want)
				}
			}
			if !found {
				t.Errorf("%s: no pair %s vs %s", dataset, reference, other)
			}
		}
	}
	data, _ := os.ReadFile("../testdata/reference/plantgrowth.csv")
	for _, c := range []struct{ opt Options }{
		{Options{Reference: "ctrl", PostHoc: "dscf"}}, {Options{Reference: "ctrl", PostHoc: "none"}}, {Options{Reference: "placebo"}},
		{Options{Reference: "ctrl", Exclude: []string{"ctrl"}}},
	} {
		var oe *OptionError
		if _, err := Analyze(data, c.opt); !errors.As(err, &oe) || oe.Option != "reference" {
			t.Errorf("%+v: %v, want a reference option error", c.opt, err)
		}
	}
}
