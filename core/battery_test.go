package core

import (
	"context"
	"encoding/json"
	"fmt"
	"math"
	"os"
	"strconv"
	"strings"
	"testing"

	"midrank/core/adjust"
	"midrank/core/testfiles"
)

// TestBatteryAgainstR: R's airquality (Ozone, Solar.R, Wind and Temp by
// Month) and mtcars (six measures by cyl), each measure's H and p from
// kruskal.test and p.adjust across the measures by BH and Holm (R 4.2.2,
// tools/reference/battery.R, testdata/battery/expected.tsv).
func TestBatteryAgainstR(t *testing.T) {
	rows, err := testfiles.Rows(os.DirFS("../testdata/battery"), "expected.tsv")
	if err != nil {
		t.Fatal(err)
	}
	type want struct{ h, p, bh, holm float64 }
	expected := map[string]map[string]want{}
	groups := map[string]string{}
	var order = map[string][]string{}
	for _, row := range rows[1:] { // after the header
		var w want
		for i, f := range []*float64{&w.h, &w.p, &w.bh, &w.holm} {
			if *f, err = strconv.ParseFloat(strings.TrimSpace(row[3+i]), 64); err != nil { // R pads numbers to one width
				t.Fatal(err)
			}
		}
		if expected[row[0]] == nil {
			expected[row[0]] = map[string]want{}
		}
		expected[row[0]][row[2]], groups[row[0]] = w, row[1]
		order[row[0]] = append(order[row[0]], row[2])
	}
	for dataset, measures := range order {
		data, err := os.ReadFile("../testdata/battery/" + dataset + ".csv")
		if err != nil {
			t.Fatal(err)
		}
		for _, across := range AcrossMethods {
			b, err := AnalyzeMeasures(context.Background(), data, Options{Group: groups[dataset], PValue: "asymptotic", Measures: measures, AdjustAcross: string(across)}, nil)
			if err != nil {
				t.Fatalf("%s: %v", dataset, err)
			}
			for _, m := range b.Measures {
				w := expected[dataset][m.Measure]
				if m.Result == nil {
					t.Fatalf("%s %s: %v", dataset, m.Measure, m.Err)
				}
				adjusted := map[adjust.Method]float64{adjust.BH: w.bh, adjust.Holm: w.holm}[across]
				if !near(m.Result.H, w.h) || !near(m.Result.PValue, w.p) || !near(*m.PAdjustedAcross, adjusted) {
					t.Errorf("%s %s (%s): H %v p %v adjusted %v; R %v %v %v", dataset, m.Measure, across,
						m.Result.H, m.Result.PValue, *m.PAdjustedAcross, w.h, w.p, adjusted)
				}
				if m.DiffersAcross() != (adjusted <= DefaultAlpha) {
					t.Errorf("%s %s (%s): differs %v with R's adjusted p %v", dataset, m.Measure, across, m.DiffersAcross(), adjusted)
				}
			}
		}
	}
}

func near(got, want float64) bool { return math.Abs(got-want) <= 1e-9*math.Max(math.Abs(want), 1e-300) }

// TestBatteryAll: "all" takes every numeric column but the group column and
// the row names, keeps a measure that cannot be analysed as an error in its
// row, and the JSON holds each measure's result with its adjusted p.
func TestBatteryAll(t *testing.T) {
	data := []byte("id,team,score,same,wait\n1,A,3,5,12\n2,A,4,5,15\n3,B,8,5,NA\n4,B,9,5,30\n5,C,1,5,7\n6,C,2,5,9\n")
	b, err := AnalyzeMeasures(context.Background(), data, Options{Group: "team", Measures: []string{AllMeasures}}, nil)
	if err != nil {
		t.Fatal(err)
	}
	var names []string
	for _, m := range b.Measures {
		names = append(names, m.Measure)
	}
	if len(names) != 3 || names[0] != "score" || names[1] != "same" || names[2] != "wait" || b.AdjustAcross != adjust.BH {
		t.Fatalf("measures %q, across %s", names, b.AdjustAcross)
	}
	if b.Measures[1].Result != nil || b.Measures[1].Err == nil || b.Measures[1].PAdjustedAcross != nil {
		t.Errorf("a measure of equal values was analysed: %+v", b.Measures[1])
	}
	out, err := EncodeBattery(b)
	if err != nil {
		t.Fatal(err)
	}
	var decoded struct {
		AdjustAcross string `json:"adjust_across"`
		Measures     []struct {
			Measure         string   `json:"measure"`
			H               *float64 `json:"h"`
			PAdjustedAcross *float64 `json:"p_adjusted_across"`
			Error           *struct {
				Message string `json:"message"`
			} `json:"error"`
		} `json:"measures"`
	}
	if err := json.Unmarshal(out, &decoded); err != nil {
		t.Fatalf("%v\n%s", err, out)
	}
	m := decoded.Measures
	if decoded.AdjustAcross != "bh" || len(m) != 3 || m[0].H == nil || m[0].PAdjustedAcross == nil || m[1].Error == nil || m[2].PAdjustedAcross == nil {
		t.Errorf("JSON: %s", out)
	}
	if !strings.HasPrefix(b.Summary, "3 measures compared across the groups of \u201cteam\u201d: ") || !strings.Contains(b.Summary, "One measure could not be analysed") {
		t.Errorf("summary %q", b.Summary)
	}
}

// BenchmarkBattery60: 60 measures × 5,000 rows × 8 groups, every setting
// the default (issue target: ≤ 1 s natively).
func BenchmarkBattery60(b *testing.B) {
	var text strings.Builder
	text.WriteString("group")
	for m := range 60 {
		fmt.Fprintf(&text, ",item%d", m+1)
	}
	text.WriteString("\n")
	state := uint64(1)
	next := func() uint64 { state = state*6364136223846793005 + 1442695040888963407; return state >> 33 }
	for row := range 5000 {
		g := row % 8
		fmt.Fprintf(&text, "site%d", g+1)
		for range 60 {
			fmt.Fprintf(&text, ",%d", 1+(next()%5+uint64(g)/3)%5) // a five-point scale leaning by site
		}
		text.WriteString("\n")
	}
	data := []byte(text.String())
	for b.Loop() {
		if _, err := AnalyzeMeasures(context.Background(), data, Options{Group: "group", Measures: []string{AllMeasures}}, nil); err != nil {
			b.Fatal(err)
		}
	}
}

func ExampleAnalyzeMeasures() {
	data, err := os.ReadFile("../testdata/battery/airquality.csv") // R's airquality
	if err != nil {
		panic(err)
	}
	b, err := AnalyzeMeasures(context.Background(), data, Options{Group: "Month", Measures: []string{"Ozone", "Wind"}, AdjustAcross: "holm"}, nil)
	if err != nil {
		panic(err)
	}
	for _, m := range b.Measures {
		fmt.Printf("%s: H = %.2f, p = %.3g, Holm across the measures %.3g\n", m.Measure, m.Result.H, m.Result.PValue, *m.PAdjustedAcross)
	}
	// Output:
	// Ozone: H = 29.27, p = 6.9e-06, Holm across the measures 1.38e-05
	// Wind: H = 12.52, p = 0.0139, Holm across the measures 0.0139
}
