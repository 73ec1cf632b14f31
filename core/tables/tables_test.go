package tables

import (
	"context"
	"encoding/json"
	"math"
	"os"
	"slices"
	"strings"
	"testing"

	"midrank/core"
	"midrank/core/display"
)

// plantGrowth analyses R's PlantGrowth (datasets package) as the golden
// case writes it.
func plantGrowth(t *testing.T, options core.Options) *core.Result {
	t.Helper()
	data, err := os.ReadFile("../../testdata/cases/plantgrowth_long.csv")
	if err != nil {
		t.Fatal(err)
	}
	r, err := core.Analyze(data, options)
	if err != nil {
		t.Fatal(err)
	}
	return r
}

func TestTablesAreWhole(t *testing.T) {
	r := plantGrowth(t, core.Options{})
	all := Of(r)
	if names := []string{all[0].Name, all[1].Name, all[2].Name}; !slices.Equal(names, []string{"figures", "groups", "pairs"}) {
		t.Fatalf("tables %v", names)
	}
	for _, tab := range all {
		keys := map[string]bool{}
		for _, c := range tab.Columns {
			if keys[c.Key] || c.Heading == "" || c.Key != strings.ToLower(c.Key) {
				t.Errorf("%s: column %+v repeated, unnamed or not lower case", tab.Name, c)
			}
			keys[c.Key] = true
		}
		for i, row := range tab.Rows {
			if len(row) != len(tab.Columns) {
				t.Errorf("%s row %d has %d cells for %d columns", tab.Name, i, len(row), len(tab.Columns))
			}
		}
	}
	groups := all[1]
	if got := groups.Rows[0][3]; got.Value != 5.154999999999999 || got.Text != "5.155" {
		t.Errorf("ctrl's median cell = %+v", got)
	}
	if got := groups.Note; !strings.Contains(got, "In the units of \u201cvalue\u201d: median, lower quartile,") {
		t.Errorf("groups note %q does not name the measure's units", got)
	}
	figures := all[0]
	if got := figures.Rows[0][3]; got.Value != "exact" && got.Value != "asymptotic" && got.Value != "monte-carlo" {
		t.Errorf("p_method cell %+v", got)
	}
}

func TestEncodeIsValidJSON(t *testing.T) {
	r := plantGrowth(t, core.Options{PostHoc: "none"})
	b, err := Encode(Of(r))
	if err != nil {
		t.Fatal(err)
	}
	var got map[string]struct {
		Title   string
		Columns []struct{ Key, Heading, Unit, Show string }
		Values  [][]any
		Text    [][]string
	}
	if err := json.Unmarshal(b, &got); err != nil {
		t.Fatalf("%v\n%s", err, b)
	}
	if _, ok := got["pairs"]; ok {
		t.Error("pairs encoded although none were compared")
	}
	g := got["groups"]
	if len(g.Values) != 3 || len(g.Text) != 3 || g.Columns[3].Unit != "measure" || g.Columns[3].Show != "figure" {
		t.Errorf("groups encoded as %+v", g)
	}
	if g.Values[0][3] != r.Groups[0].Median {
		t.Errorf("the values lose precision: %v", g.Values[0][3])
	}
}

func TestEncodeRefusesNonFinite(t *testing.T) {
	tab := Table{Name: "groups", Columns: []Column{{Key: "x", Heading: "X", Show: display.Figure}}, Rows: [][]Cell{{{Value: math.NaN(), Text: "NaN"}}}}
	if _, err := Encode([]Table{tab}); err == nil {
		t.Error("Encode wrote NaN without an error")
	}
}

// TestAColumnIsAddedInOnePlace adds a column to the definition and finds it
// in the table and its JSON, which every renderer walks.
func TestAColumnIsAddedInOnePlace(t *testing.T) {
	saved := groupColumns
	t.Cleanup(func() { groupColumns = saved })
	groupColumns = append(slices.Clip(groupColumns), column[groupRow]{Column{"spread", "Spread", MeasureUnit, display.Figure},
		func(g groupRow) any { return g.Q3 - g.Q1 }})
	r := plantGrowth(t, core.Options{})
	g := groups(r, view{})
	last := g.Columns[len(g.Columns)-1]
	if last.Key != "spread" || g.Rows[0][len(g.Columns)-1].Value != r.Groups[0].Q3-r.Groups[0].Q1 {
		t.Errorf("added column missing: %+v", last)
	}
	b, _ := Encode([]Table{g})
	if !strings.Contains(string(b), `"heading":"Spread"`) || !strings.Contains(g.Note, "highest, spread.") {
		t.Errorf("added column not in the JSON: %s", b)
	}
}

// FuzzTables: for any text that analyses, every table is whole, its JSON
// valid, and no cell shows NaN or Inf.
func FuzzTables(f *testing.F) {
	f.Add("A,B,C\n1,4,7\n2,5,8\n3,6,9\n", "dunn")
	f.Add("g,v\na,1e-300\na,2\nb,1e300\nb,-0\nc,5\nc,5\n", "mann-whitney")
	f.Add("x\ty\n1\t1\n1\t1\n2\t\n", "none")
	f.Fuzz(func(t *testing.T, data, posthoc string) {
		r, err := core.Analyze([]byte(data), core.Options{PostHoc: posthoc})
		if err != nil {
			return
		}
		all := Of(r)
		b, err := Encode(all)
		if err != nil || !json.Valid(b) {
			t.Fatalf("Encode: %v, valid %v", err, json.Valid(b))
		}
		for _, tab := range all {
			for _, row := range tab.Rows {
				if len(row) != len(tab.Columns) {
					t.Fatalf("%s: %d cells for %d columns", tab.Name, len(row), len(tab.Columns))
				}
				for _, c := range row {
					if strings.Contains(c.Text, "NaN") || strings.Contains(c.Text, "Inf") {
						t.Fatalf("%s: cell shown as %q", tab.Name, c.Text)
					}
				}
			}
		}
	})
}

// TestEncodeBattery: a battery's tables hold the overview, one row per
// measure, and each measure's own tables, null for a measure that could
// not be analysed.
func TestEncodeBattery(t *testing.T) {
	data := []byte("site,wait,note\nA,3,x\nA,4,y\nB,8,z\nB,9,x\nC,1,y\nC,2,z\n")
	b, err := core.AnalyzeMeasures(context.Background(), data, core.Options{Group: "site", Measures: []string{"wait", "note"}}, nil)
	if err != nil {
		t.Fatal(err)
	}
	out, err := EncodeBattery(b)
	if err != nil {
		t.Fatal(err)
	}
	var got struct {
		Overview struct{ Values [][]any }
		Measures []map[string]struct{ Values [][]any }
	}
	if err := json.Unmarshal(out, &got); err != nil {
		t.Fatalf("%v\n%s", err, out)
	}
	if len(got.Overview.Values) != 2 || len(got.Measures) != 2 || got.Measures[1] != nil || len(got.Measures[0]["groups"].Values) != 3 {
		t.Errorf("battery tables %s", out)
	}
}
