package findings

import (
	"bytes"
	"context"
	"fmt"
	"os"
	"slices"
	"strings"
	"testing"

	"midrank/core"
	"midrank/core/jsonlite"
	"midrank/core/link"
	"midrank/core/testfiles"
)

// chicks is testfiles.Chicks from the project's testdata.
func chicks(t *testing.T, keep map[string]int) ([]byte, []string) {
	t.Helper()
	data, weights, err := testfiles.Chicks(os.DirFS("../../testdata"), keep)
	if err != nil {
		t.Fatal(err)
	}
	return data, weights
}

// shared analyses data and returns the results as shared, after a trip
// through a results-only link, and the full result.
func shared(t *testing.T, data []byte, opt core.Options) ([]byte, *core.Result) {
	t.Helper()
	r, err := core.Analyze(data, opt)
	if err != nil {
		t.Fatal(err)
	}
	fragment, err := Link(r, opt)
	if err != nil {
		t.Fatal(err)
	}
	raw, err := link.Decode(fragment)
	if err != nil {
		t.Fatal(err)
	}
	doc, err := Open(raw)
	if err != nil {
		t.Fatal(err)
	}
	if !bytes.Equal(doc, raw) {
		t.Errorf("Open changed the JSON Encode wrote:\n%s\n%s", raw, doc)
	}
	return doc, r
}

// TestNoValueLeaves: the results as shared hold none of the weights and no
// list of values or ranks, where the full answer holds every weight (so
// the check can find one), with and without protection, for each way of
// comparing pairs.
func TestNoValueLeaves(t *testing.T) {
	data, weights := chicks(t, map[string]int{"horsebean": 4, "meatmeal": 10})
	for _, opt := range []core.Options{{}, {MinGroupSize: 5}, {PostHoc: "mann-whitney"}, {PostHoc: "dscf", MinGroupSize: 5},
		{Trend: "increasing", MinGroupSize: 5}, {Reference: "casein", PostHoc: "conover"}} {
		doc, r := shared(t, data, opt)
		full, err := core.Encode(r)
		if err != nil {
			t.Fatal(err)
		}
		for _, w := range weights {
			if !bytes.Contains(full, []byte(strings.TrimRight(w, "0"))) {
				t.Fatalf("the check cannot see weight %s in the full answer", w)
			}
			if bytes.Contains(doc, []byte(strings.TrimRight(w, "0"))) {
				t.Errorf("%+v: weight %s is in the shared results", opt, w)
			}
		}
		for _, key := range []string{`"ranks"`, `"ties"`, `"rank"`, `"value"`, `"min"`, `"max"`, `"lowest"`, `"highest"`} {
			if bytes.Contains(doc, []byte(key)) {
				t.Errorf("%+v: the shared results hold %s", opt, key)
			}
		}
	}
}

// TestOpenRefuses: JSON that is not Midrank's results is refused with a
// message that says what is wrong.
func TestOpenRefuses(t *testing.T) {
	data, _ := chicks(t, nil)
	doc, _ := shared(t, data, core.Options{})
	tests := []struct{ name, from, to, says string }{
		{"another format", `{"findings":1,`, `{"findings":2,`, "format 2"},
		{"a member more", `"k":6,`, `"k":6,"data":"x",`, `"data"`},
		{"a member less", `"k":6,`, ``, `no "k"`},
		{"a table not Midrank's", `"tables":{"figures"`, `"tables":{"people"`, `"people"`},
		{"a column not the table's", `{"key":"median"`, `{"key":"salary"`, "not one of"},
		{"a row too short", `[["horsebean",`, `[[`, "cells"},
		{"a bad setting", `"options":{}`, `"options":{"alpha":7}`, "alpha"},
		{"a number as text", `"n":71`, `"n":"71"`, "not a whole number"},
	}
	for _, tt := range tests {
		bad := strings.Replace(string(doc), tt.from, tt.to, 1)
		if bad == string(doc) {
			t.Fatalf("%s: %q not in the JSON", tt.name, tt.from)
		}
		_, err := Open([]byte(bad))
		if err == nil || !strings.Contains(err.Error(), tt.says) {
			t.Errorf("%s: Open = %v, want an error saying %s", tt.name, err, tt.says)
		}
	}
}

// FuzzOpen: whatever the bytes, Open returns an error or JSON that opens
// again unchanged; seeds are a real document and pieces of one.
func FuzzOpen(f *testing.F) {
	r, err := core.Analyze([]byte("site,minutes\nA,12\nA,15\nB,20\nB,22\nB,19\nC,14\nC,30\nC,25\n"), core.Options{MinGroupSize: 3})
	if err != nil {
		f.Fatal(err)
	}
	doc, err := Encode(r, core.Options{MinGroupSize: 3})
	if err != nil {
		f.Fatal(err)
	}
	f.Add(doc)
	f.Add(doc[:len(doc)/2])
	f.Add([]byte(`{"findings":1}`))
	f.Add([]byte(`{"findings":1,"tables":{"groups":{"columns":[[[[[[[]]]]]]]}}}`))
	f.Fuzz(func(t *testing.T, raw []byte) {
		out, err := Open(raw)
		if err != nil {
			return
		}
		again, err := Open(out)
		if err != nil || !bytes.Equal(again, out) {
			t.Fatalf("Open(Open(x)) = %q, %v; want %q", again, err, out)
		}
		if _, err := jsonlite.ParseTree(out, depth); err != nil {
			t.Fatal(err)
		}
	})
}

// TestBatteryShared: a battery of two measures of R's chickwts (the
// weights, and the same weights made distinctive another way), protected:
// the results as shared hold none of the values, every measure says its
// protection, and the overview names no highest or lowest group.
func TestBatteryShared(t *testing.T) {
	data, weights := chicks(t, map[string]int{"horsebean": 4, "meatmeal": 10})
	var b strings.Builder
	b.WriteString("feed,weight,again\n")
	for i, line := range strings.Split(strings.TrimSpace(string(data)), "\n")[1:] {
		feed, w, _ := strings.Cut(line, ",")
		fmt.Fprintf(&b, "%s,%s,%d.%d\n", feed, w, 1000+i, 7*i%10)
	}
	opt := core.Options{Group: "feed", Measures: []string{core.AllMeasures}, MinGroupSize: 5}
	battery, err := core.AnalyzeMeasures(context.Background(), []byte(b.String()), opt, nil)
	if err != nil {
		t.Fatal(err)
	}
	doc, err := EncodeBattery(battery, opt)
	if err != nil {
		t.Fatal(err)
	}
	for _, w := range weights {
		if bytes.Contains(doc, []byte(strings.TrimRight(w, "0"))) {
			t.Errorf("weight %s is in the shared battery", w)
		}
	}
	n, err := jsonlite.ParseTree(doc, depth+2)
	if err != nil {
		t.Fatal(err)
	}
	measures := field(n, "measures").Items
	if len(measures) != 2 {
		t.Fatalf("%d measures", len(measures))
	}
	for i, m := range measures {
		var w jsonlite.Writer
		w.Node(m)
		if _, err := Open(w.Bytes()); err != nil {
			t.Errorf("measure %d: %v", i+1, err)
		}
		if !strings.Contains(field(m, "protection").Text, "horsebean") {
			t.Errorf("measure %d does not say its protection", i+1)
		}
	}
	overview := field(n, "overview")
	for r, row := range field(overview, "text").Items {
		for j, col := range field(overview, "columns").Items {
			if key := field(col, "key").Text; (key == "highest" || key == "lowest") && row.Items[j].Text != "not shown" {
				t.Errorf("row %d names the %s group: %s", r+1, key, row.Items[j].Text)
			}
		}
	}
}

// TestNoCellInWarnings: R's chickwts weights in hundreds of grams written
// with a decimal comma and three decimals ("1,790"), which could also be
// read with a comma between thousands: the analyst's warning quotes a
// cell, the shared one does not.
func TestNoCellInWarnings(t *testing.T) {
	data, _ := chicks(t, map[string]int{"horsebean": 4, "meatmeal": 10})
	var b strings.Builder
	b.WriteString("feed;weight\n")
	var cells []string
	for _, line := range strings.Split(strings.TrimSpace(string(data)), "\n")[1:] {
		feed, w, _ := strings.Cut(line, ",")
		grams, _, _ := strings.Cut(w, ".")
		cell := grams[:len(grams)-2] + "," + grams[len(grams)-2:] + "0"
		cells = append(cells, cell)
		fmt.Fprintf(&b, "%s;%s\n", feed, cell)
	}
	r, err := core.Analyze([]byte(b.String()), core.Options{})
	if err != nil {
		t.Fatal(err)
	}
	quoted := strings.Join(r.Warnings, " ")
	if !slices.ContainsFunc(cells, func(c string) bool { return strings.Contains(quoted, c) }) {
		t.Fatalf("the analyst's warnings quote no cell (the check would not see one): %q", quoted)
	}
	doc, err := Encode(r, core.Options{})
	if err != nil {
		t.Fatal(err)
	}
	for _, c := range cells {
		if bytes.Contains(doc, []byte(`"`+c+`"`)) || bytes.Contains(doc, []byte("\\\""+c+"\\\"")) {
			t.Errorf("the shared results quote the cell %s", c)
		}
	}
	if !bytes.Contains(doc, []byte("could be read two ways")) {
		t.Error("the shared results do not say that numbers could be read two ways")
	}
}

// FuzzShared: whatever the data and the threshold, the results as shared
// are JSON that Open takes back unchanged, every hidden group's row shows
// no figure, and at least two groups are hidden or none (unless there are
// fewer groups).
func FuzzShared(f *testing.F) {
	f.Add([]byte("site,minutes\nA,12\nA,15\nB,20\nB,22\nB,19\nC,14\nC,30\nC,25\n"), uint8(3))
	f.Add([]byte("A\tB\tC\n1\t2\t3\n4\t\t6\n\t5\t\n7\n"), uint8(5))
	f.Fuzz(func(t *testing.T, data []byte, min uint8) {
		opt := core.Options{MinGroupSize: int(min % 12), PValue: "asymptotic", PostHoc: []string{"dunn", "mann-whitney"}[min/12%2]}
		r, err := core.Analyze(data, opt)
		if err != nil {
			return
		}
		doc, err := Encode(r, opt)
		if err != nil {
			t.Fatal(err)
		}
		back, err := Open(doc)
		if err != nil || !bytes.Equal(back, doc) {
			t.Fatalf("Open(Encode) = %v:\n%s", err, doc)
		}
		plan := r.Plan()
		hidden := 0
		for g := range r.Groups {
			if plan.Hidden(g) {
				hidden++
			}
		}
		if hidden == 1 && len(r.Groups) > 1 {
			t.Fatalf("one group hidden alone: %+v", plan)
		}
		n, _ := jsonlite.ParseTree(doc, depth)
		for i, row := range field(field(field(n, "tables"), "groups"), "values").Items {
			for _, cell := range row.Items[1:] {
				if plan.Hidden(i) && cell.Kind == jsonlite.Number {
					t.Fatalf("hidden group %d shows a figure: %s", i, doc)
				}
			}
		}
	})
}
