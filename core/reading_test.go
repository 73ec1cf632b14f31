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
// kruskal.test for the intended columns, and the sum of the values read
// against R's sum (so that numbers with thousands separators are read at
// their size, which the ranks alone would not show): chosen by name, and,
// where the automatic reading is expected to take them, without a choice.
// Where it is not (ChickWeight, whose first code column is Time; the
// states, whose last measurement column is Area), the reading must name the
// intended column among its other readings.
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
		sum, _ := strconv.ParseFloat(row[8], 64)
		automatic := row[9]
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
			total := 0.0
			for _, v := range r.Ranks {
				total += v.Value
			}
			if math.Abs(total-sum) > 1e-9*math.Abs(sum) {
				t.Errorf("%s %s: the values read sum to %v; R: %v", file, how, total, sum)
			}
			if r.Input.GroupColumn != group || r.Input.MeasureColumn != measure {
				t.Errorf("%s %s: read groups from %q and values from %q", file, how, r.Input.GroupColumn, r.Input.MeasureColumn)
			}
			return r
		}
		check("chosen by name", Options{Group: group, Measure: measure})
		if automatic == "offered" {
			r, err := Analyze(data, Options{PostHoc: "none"})
			if err != nil || r.Input.OtherReadings == nil || !strings.Contains(*r.Input.OtherReadings, strconv.Quote(group)) &&
				!strings.Contains(*r.Input.OtherReadings, strconv.Quote(measure)) {
				t.Errorf("%s: the automatic reading offers neither %s nor %s: %+v %v", file, group, measure, r.Input, err)
			}
			continue
		}
		if r := check("read automatically", Options{}); r != nil && file == "morley_expt_speed.csv" &&
			(r.Input.OtherReadings == nil || !strings.Contains(*r.Input.OtherReadings, "one column per group")) {
			t.Errorf("%s: two columns of numbers read as codes and values without naming the other reading", file)
		}
	}
}

// TestReadingSpreadsheets reads the same R datasets from .xlsx and .ods
// files (testdata/sheets, written by tools/reference/sheets.py with
// openpyxl and odfpy) and checks k, N, H, df and p against R's
// kruskal.test, as in TestReadingOpenDatasets; the sheet is the first by
// default, or chosen by name or number.
func TestReadingSpreadsheets(t *testing.T) {
	rows, err := testfiles.Rows(os.DirFS("../testdata/reading"), "expected.tsv")
	if err != nil {
		t.Fatal(err)
	}
	want := map[string][]string{}
	for _, row := range rows {
		want[row[0]] = row
	}
	tests := []struct {
		file, sheet, source string
	}{
		{"chickweight", "", "chickweight_id_diet_weight.csv"},
		{"chickweight", "Morley", "morley_expt_speed.csv"},
		{"npk", "npk", "npk.csv"},
		{"npk", "2", "npk.csv"},
		{"states", "", "states_thousands_comma.csv"},
	}
	for _, ext := range []string{"xlsx", "ods"} {
		for _, tt := range tests {
			row := want[tt.source]
			data, err := os.ReadFile(filepath.Join("../testdata/sheets", tt.file+"."+ext))
			if err != nil {
				t.Fatal(err)
			}
			r, err := Analyze(data, Options{Sheet: tt.sheet, Group: row[1], Measure: row[2], PostHoc: "none", PValue: "asymptotic"})
			if err != nil {
				t.Errorf("%s.%s sheet %q: %v", tt.file, ext, tt.sheet, err)
				continue
			}
			h, _ := strconv.ParseFloat(row[5], 64)
			p, _ := strconv.ParseFloat(row[7], 64)
			if strconv.Itoa(r.K) != row[3] || strconv.Itoa(r.N) != row[4] || math.Abs(r.H-h) > 1e-9*h || math.Abs(r.PValue-p) > 1e-9*p {
				t.Errorf("%s.%s sheet %q: k %d N %d H %v p %v; R: k %s N %s H %v p %v", tt.file, ext, tt.sheet, r.K, r.N, r.H, r.PValue, row[3], row[4], h, p)
			}
			if r.Input.Sheet == nil || tt.sheet != "" && tt.sheet != "2" && *r.Input.Sheet != tt.sheet {
				t.Errorf("%s.%s: input.sheet %v, want %q", tt.file, ext, r.Input.Sheet, tt.sheet)
			}
		}
	}
	// a title merged over the table and a header on two rows ("Loom" merged over wool and tension)
	data, err := os.ReadFile("../testdata/sheets/warpbreaks_merged.xlsx")
	if err != nil {
		t.Fatal(err)
	}
	row := want["warpbreaks.csv"]
	h, _ := strconv.ParseFloat(row[5], 64)
	r, err := Analyze(data, Options{Group: "Loom tension", Measure: "Breaks", PostHoc: "none", PValue: "asymptotic"})
	if err != nil || strconv.Itoa(r.N) != row[4] || math.Abs(r.H-h) > 1e-9*h || !strings.Contains(r.Input.Reason, "header is on lines 2 and 3") {
		t.Errorf("warpbreaks_merged.xlsx: %v %+v; R: N %s H %v", err, r, row[4], h)
	}
	if _, err := Analyze([]byte("PK\x03\x04 not a spreadsheet"), Options{}); err == nil || !strings.Contains(err.Error(), "spreadsheet cannot be read") {
		t.Errorf("a damaged spreadsheet: %v", err)
	}
}
