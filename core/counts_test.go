package core

import (
	"fmt"
	"math"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"

	"midrank/core/testfiles"
)

// TestCounts reads tables of counts (testdata/counts, written by
// tools/reference/counts.R): the five-level counts of two groups quoted in
// scipy issue 4017, and R's esoph (controls by age group and alcohol
// consumption) as a counts table and as a long table with a count column.
// k, N, H, df and p equal R's kruskal.test on the rep()-expanded values,
// and each group's shares equal R's prop.table(m, 1).
func TestCounts(t *testing.T) {
	const dir = "../testdata/counts"
	rows, err := testfiles.Rows(os.DirFS(dir), "expected.tsv")
	if err != nil {
		t.Fatal(err)
	}
	shareRows, err := testfiles.Rows(os.DirFS(dir), "shares.tsv")
	if err != nil {
		t.Fatal(err)
	}
	options := map[string]Options{
		"scipy4017_counts.csv": {},                  // read as counts without being told
		"esoph_counts.csv":     {Layout: "counts"},  // and when told
		"esoph_long_count.csv": {Count: "controls"}, // a long table whose rows are counted
	}
	for _, row := range rows {
		file := row[0]
		data, err := os.ReadFile(filepath.Join(dir, file))
		if err != nil {
			t.Fatal(err)
		}
		opt := options[file]
		opt.PostHoc, opt.PValue = "none", "asymptotic"
		r, err := Analyze(data, opt)
		if err != nil {
			t.Errorf("%s: %v", file, err)
			continue
		}
		h, _ := strconv.ParseFloat(row[3], 64)
		p, _ := strconv.ParseFloat(row[5], 64)
		if strconv.Itoa(r.K) != row[1] || strconv.Itoa(r.N) != row[2] || strconv.Itoa(r.DF) != row[4] ||
			math.Abs(r.H-h) > 1e-9*h || math.Abs(r.PValue-p) > 1e-9*p {
			t.Errorf("%s: k %d N %d H %v df %d p %v; R: %v", file, r.K, r.N, r.H, r.DF, r.PValue, row[1:6])
		}
		if strings.HasSuffix(file, "_counts.csv") {
			if r.Input.Layout != "counts" || r.Levels == nil {
				t.Errorf("%s: read as %s, levels %v", file, r.Input.Layout, r.Levels)
				continue
			}
			for _, sr := range shareRows {
				if sr[0] != file {
					continue
				}
				g := r.Levels.group(sr[1])
				if g == nil {
					t.Errorf("%s: no group %q in the levels", file, sr[1])
					continue
				}
				for i, s := range strings.Split(sr[2], ",") {
					want, _ := strconv.ParseFloat(s, 64)
					if math.Abs(g.Shares[i]-want) > 1e-12 {
						t.Errorf("%s group %s level %d: share %v; R %v", file, sr[1], i+1, g.Shares[i], want)
					}
				}
			}
		}
	}
}

func (l *Levels) group(label string) *LevelCounts {
	for i := range l.Groups {
		if l.Groups[i].Label == label {
			return &l.Groups[i]
		}
	}
	return nil
}

func ExampleAnalyze_counts() {
	// the five-level counts of two groups quoted in scipy issue 4017
	data := "group;1;2;3;4;5\nfirst;163;81;40;6;2\nsecond;1007;362;99;27;13\n"
	r, err := Analyze([]byte(data), Options{PostHoc: "none", PValue: "asymptotic"})
	if err != nil {
		panic(err)
	}
	g := r.Levels.Groups[1]
	fmt.Println(r.Input.Layout, r.N, g.Label, g.Counts, g.MedianLevel, r.ResultLine)
	// R 4.2.2, kruskal.test on the rep()-expanded counts: chi-squared = 15.264, df = 1 (testdata/counts/expected.tsv)
	// Output: counts 1800 second [1007 362 99 27 13] 1 H(1) = 15.26, p < .001, ε² = 0.01, N = 1,800
}
