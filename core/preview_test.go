package core

import (
	"bytes"
	"context"
	"fmt"
	"testing"
)

// TestPreview: how texts are read, checked against the texts themselves
// (hand-worked: cells, groups with their counts, the places of bad cells).
func TestPreview(t *testing.T) {
	tests := []struct {
		name     string
		data     string
		opt      Options
		layout   string
		rows     int
		groups   string
		problems string // line:column of each
		option   string
	}{
		{"wide", "A;B\n1,5;2\n;3\n", Options{}, "wide", 3, "[{A 1 0} {B 2 0}]", "", ""},
		{"bad cells", "A,B\n1,x\ny,2\n", Options{}, "wide", 3, "[{A 1 0} {B 1 0}]", "2:2 3:1 ", ""},
		{"quote never closed", "A,B\n\"1,2\n", Options{}, "wide", 1, "[]", "2:1 ", ""},
		{"bad setting", "A,B\n1,2\n", Options{Separator: "pipe"}, "", 0, "[]", "", "separator"},
		{"forced separator", "A;B\n1;2\n", Options{Separator: "comma"}, "wide", 2, "[{A;B 0 0}]", "2:1 ", ""},
	}
	for _, tt := range tests {
		p := PreviewOf([]byte(tt.data), tt.opt)
		var problems string
		for _, pr := range p.Problems {
			problems += fmt.Sprintf("%d:%d ", *pr.Line, *pr.Column)
		}
		option := ""
		if p.Option != nil {
			option = *p.Option
		}
		if p.Input.Layout != tt.layout || len(p.Rows) != tt.rows || fmt.Sprint(p.Groups) != tt.groups || problems != tt.problems || option != tt.option {
			t.Errorf("%s: layout %q, %d rows, groups %v, problems %q, option %q; want %q, %d, %s, %q, %q",
				tt.name, p.Input.Layout, len(p.Rows), p.Groups, problems, option, tt.layout, tt.rows, tt.groups, tt.problems, tt.option)
		}
		if got, want := EncodePreview(p), stdJSON(t, p); !bytes.Equal(got, want) {
			t.Errorf("%s: EncodePreview differs from encoding/json:\n%s\n%s", tt.name, got, want)
		}
	}
}

// FuzzPreview: any text and reading settings give a preview, encoded as
// encoding/json would.
func FuzzPreview(f *testing.F) {
	f.Add([]byte("A,B\n1,x\n\"q\"\"\n"), "auto", "auto")
	f.Add([]byte("g;v\nA;1,5\nB;2\n"), "long", "point")
	f.Fuzz(func(t *testing.T, data []byte, layout, decimal string) {
		p := PreviewOf(data, Options{Layout: layout, Decimal: decimal})
		if got, want := EncodePreview(p), stdJSON(t, p); !bytes.Equal(got, want) {
			t.Fatalf("EncodePreview differs from encoding/json:\n%s\n%s", got, want)
		}
	})
}

func ExamplePreviewOf() {
	p := PreviewOf([]byte("A;B\n1,5;x\n2;3\n"), Options{})
	fmt.Println(p.Input.Layout, p.Input.Separator, p.Input.DecimalMark, len(p.Rows), p.Groups)
	for _, q := range p.Problems {
		fmt.Println(q.Message)
	}
	// Output:
	// wide semicolon comma 3 [{A 2 0} {B 1 0}]
	// line 2, column 2 (group "B"): "x" is not a number; correct the cell, or write NA there to mark the value as missing.
}

// TestWorkspace: one reading gives the preview (groups as written, before
// the edits) and the analysis, which leaves out edits naming absent labels
// where Analyze refuses them, and otherwise answers as Analyze does.
func TestWorkspace(t *testing.T) {
	data := []byte("North,South,East\n3,8,2\n5,6,1\n4,9,3\n")
	opt := Options{Order: []string{"East", "West"}, Exclude: []string{"South"}, Rename: map[string]string{"Nort": "N"}}
	var p Preview
	r, err := Workspace(context.Background(), data, opt, func(got Preview) { p = got }, nil)
	if err != nil {
		t.Fatal(err)
	}
	if fmt.Sprint(p.Groups) != "[{North 3 0} {South 3 0} {East 3 0}]" {
		t.Errorf("preview groups %v", p.Groups)
	}
	if _, err := Analyze(data, opt); err == nil {
		t.Error("Analyze accepted edits that name absent labels")
	}
	want, err := Analyze(data, Options{Order: []string{"East"}, Exclude: []string{"South"}})
	if err != nil {
		t.Fatal(err)
	}
	got, _ := Encode(r)
	if w, _ := Encode(want); !bytes.Equal(got, w) {
		t.Errorf("Workspace\n%s\nAnalyze with the edits that apply\n%s", got, w)
	}
	_, err = Workspace(context.Background(), []byte("A,B\n1,x\n"), Options{}, func(got Preview) { p = got }, nil)
	if err == nil || len(p.Problems) != 1 || *p.Problems[0].Line != 2 {
		t.Errorf("unreadable cell: error %v, preview problems %+v", err, p.Problems)
	}
}
