package core

import (
	"math"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"

	"midrank/core/testfiles"
)

// TestReadingOpenDatasets reads R datasets as analysts export them
// (testdata/reading, written by tools/reference/reading.R: row names in an
// unnamed column, numeric group codes, a decimal comma, an id column, the
// measure first) and checks k, N, H, df and the chi-square p against R's
// kruskal.test for the intended columns: chosen by name, and, where the
// automatic reading is expected to find them, without a choice. Where it
// is not (ChickWeight, whose first code column is Time), the reading must
// name the intended one among its other readings.
func TestReadingOpenDatasets(t *testing.T) {
	const dir = "../testdata/reading"
	rows, err := testfiles.Rows(os.DirFS(dir), "expected.tsv")
	if err != nil {
		t.Fatal(err)
	}
	for _, row := range rows {
		file, group, measure := row[0], row[1], row[2]
		k, _ := strconv.Atoi(row[3])
		n, _ := strconv.Atoi(row[4])
		h, _ := strconv.ParseFloat(row[5], 64)
		df, _ := strconv.Atoi(row[6])
		p, _ := strconv.ParseFloat(row[7], 64)
		data, err := os.ReadFile(filepath.Join(dir, file))
		if err != nil {
			t.Fatal(err)
		}
		check := func(how string, opt Options) *Result {
			t.Helper()
			opt.PostHoc, opt.PValue = "none", "asymptotic"
			r, err := Analyze(data, opt)
			if err != nil {
				t.Errorf("%s %s: %v", file, how, err)
				return nil
			}
			if r.K != k || r.N != n || r.DF != df || math.Abs(r.H-h) > 1e-9*h || math.Abs(r.PValue-p) > 1e-9*p {
				t.Errorf("%s %s: k %d N %d H %v df %d p %v; R: k %d N %d H %v df %d p %v", file, how, r.K, r.N, r.H, r.DF, r.PValue, k, n, h, df, p)
			}
			if r.Input.GroupColumn != group || r.Input.MeasureColumn != measure {
				t.Errorf("%s %s: read groups from %q and values from %q", file, how, r.Input.GroupColumn, r.Input.MeasureColumn)
			}
			return r
		}
		check("chosen by name", Options{Group: group, Measure: measure})
		if file == "chickweight.csv" {
			r, err := Analyze(data, Options{PostHoc: "none"})
			if err != nil || r.Input.OtherReadings == nil || !strings.Contains(*r.Input.OtherReadings, `groups from "Diet"`) {
				t.Errorf("%s: the automatic reading does not offer Diet: %+v %v", file, r.Input, err)
			}
			continue
		}
		if r := check("read automatically", Options{}); r != nil && file == "morley_expt_speed.csv" &&
			(r.Input.OtherReadings == nil || !strings.Contains(*r.Input.OtherReadings, "one column per group")) {
			t.Errorf("%s: two columns of numbers read as codes and values without naming the other reading", file)
		}
	}
}
