package table

import (
	"errors"
	"fmt"
	"reflect"
	"strings"
	"testing"
)

// group is the expected content of one group.
type group struct {
	label   string
	values  []float64
	missing int
}

func groupsOf(t *Table) []group {
	gs := make([]group, len(t.Labels))
	for i, l := range t.Labels {
		gs[i] = group{label: l, missing: t.Missing[i]}
	}
	for i, v := range t.Values {
		g := t.Groups[i]
		gs[g].values = append(gs[g].values, v)
	}
	return gs
}

func TestParse(t *testing.T) {
	tests := []struct {
		name   string
		in     string
		opt    Options
		layout Layout
		sep    byte
		comma  bool
		want   []group
	}{
		{
			name: "wide tab with padding and missing",
			in:   "A\tB\tC\n1\t2\t3\n4\t\t6\n\t5\t\n7\n",
			sep:  '\t', layout: LayoutWide,
			want: []group{{"A", []float64{1, 4, 7}, 1}, {"B", []float64{2, 5}, 1}, {"C", []float64{3, 6}, 0}},
		},
		{
			name: "wide comma with CRLF, BOM, trailing separators and spaces",
			in:   "\xEF\xBB\xBF A , B ,\r\n 1 , 2 ,\r\n3,4,\r\n",
			sep:  ',', layout: LayoutWide,
			want: []group{{"A", []float64{1, 3}, 0}, {"B", []float64{2, 4}, 0}},
		},
		{
			name: "wide semicolon with decimal comma and markers",
			in:   "x;y\n1,5;2\nNA;n/a\n2,25;.\n-;3\n",
			sep:  ';', layout: LayoutWide, comma: true,
			want: []group{{"x", []float64{1.5, 2.25}, 2}, {"y", []float64{2, 3}, 2}},
		},
		{
			name: "numeric-looking labels are kept as written",
			in:   "6\t0.5\t007\n1\t2\t3\n",
			sep:  '\t', layout: LayoutWide,
			want: []group{{"6", []float64{1}, 0}, {"0.5", []float64{2}, 0}, {"007", []float64{3}, 0}},
		},
		{
			name: "number forms",
			in:   "a,b\n.5,+2\n1e3,1.5E1\n-0,5.\n",
			sep:  ',', layout: LayoutWide,
			want: []group{{"a", []float64{0.5, 1000, 0}, 0}, {"b", []float64{2, 15, 5}, 0}},
		},
		{
			name: "long with header, groups in order of first appearance",
			in:   "site,minutes\nNorth,3\nSouth,4\nNorth,NA\nEast,1\n\nSouth,\nNorth,2\n",
			sep:  ',', layout: LayoutLong,
			want: []group{{"North", []float64{3, 2}, 1}, {"South", []float64{4}, 1}, {"East", []float64{1}, 0}},
		},
		{
			name: "long without header, quoted labels",
			in:   "\"Site, north\",3\n\"Say \"\"hi\"\"\",4\n\"Site, north\",5\n",
			sep:  ',', layout: LayoutLong,
			want: []group{{"Site, north", []float64{3, 5}, 0}, {`Say "hi"`, []float64{4}, 0}},
		},
		{
			name: "long with a numeric group code when asked",
			in:   "1,10\n2,20\n1,30\n",
			opt:  Options{Layout: LayoutLong},
			sep:  ',', layout: LayoutLong,
			want: []group{{"1", []float64{10, 30}, 0}, {"2", []float64{20}, 0}},
		},
		{
			name: "quoted cell over two lines",
			in:   "\"first\nlabel\",b\n1,2\n",
			sep:  ',', layout: LayoutWide,
			want: []group{{"first\nlabel", []float64{1}, 0}, {"b", []float64{2}, 0}},
		},
		{
			name: "carriage returns only",
			in:   "a;b\r1;2\r3;4\r",
			sep:  ';', layout: LayoutWide,
			want: []group{{"a", []float64{1, 3}, 0}, {"b", []float64{2, 4}, 0}},
		},
		{
			name: "decimal point on request",
			in:   "a\tb\n1.5\t2\n",
			opt:  Options{DecimalPoint: true},
			sep:  '\t', layout: LayoutWide,
			want: []group{{"a", []float64{1.5}, 0}, {"b", []float64{2}, 0}},
		},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			got, err := Parse([]byte(tt.in), tt.opt)
			if err != nil {
				t.Fatalf("Parse(%q) error: %v", tt.in, err)
			}
			if got.Layout != tt.layout || got.Separator != tt.sep || got.DecimalComma != tt.comma {
				t.Errorf("Parse(%q) read as %v %q comma=%v, want %v %q comma=%v", tt.in,
					got.Layout, got.Separator, got.DecimalComma, tt.layout, tt.sep, tt.comma)
			}
			if g := groupsOf(got); !reflect.DeepEqual(g, tt.want) {
				t.Errorf("Parse(%q) groups = %+v, want %+v", tt.in, g, tt.want)
			}
		})
	}
}

func TestParseLines(t *testing.T) {
	in := "a,b\n\n1,2\n\"x\ny\",3\n4\n"
	got, err := Parse([]byte(in), Options{Layout: LayoutWide})
	if err == nil {
		t.Fatalf("Parse(%q) = %+v, want an error for the text cell", in, got)
	}
	var e *Error
	if !errors.As(err, &e) || e.Line != 4 || e.Column != 1 {
		t.Fatalf("Parse(%q) error %v, want line 4, column 1", in, err)
	}
	in = "g,v\nA,1\n\nB,2\n\"A\",3\n"
	got, err = Parse([]byte(in), Options{})
	if err != nil {
		t.Fatal(err)
	}
	if want := []int32{2, 4, 5}; !reflect.DeepEqual(got.Lines, want) {
		t.Errorf("Parse(%q).Lines = %v, want %v", in, got.Lines, want)
	}
	if got.Measure != "v" || !got.Header {
		t.Errorf("Parse(%q) header = %v measure %q, want true \"v\"", in, got.Header, got.Measure)
	}
}

func TestParseErrors(t *testing.T) {
	tests := []struct {
		name         string
		in           string
		opt          Options
		line, column int
		group        string
		says         string
	}{
		{"text in wide", "a\tb\n1\t2\n3\tabc\n", Options{}, 3, 2, "b", `"abc" is not a number`},
		{"infinity", "a,b\n1,inf\n", Options{}, 2, 2, "b", "infinite"},
		{"overflow", "a,b\n1,1e400\n", Options{}, 2, 2, "b", "infinite"},
		{"hexadecimal", "a,b\n1,0x10\n", Options{}, 2, 2, "b", "not a number"},
		{"digit separator", "a,b\n1,1_000\n", Options{}, 2, 2, "b", "not a number"},
		{"decimal comma refused", "a;b\n1,5;2\n", Options{Layout: LayoutWide, DecimalPoint: true}, 2, 1, "a", `"1,5" is not a number`},
		{"value without label", "a,b\n1,2,3\n", Options{}, 2, 3, "", "no group label"},
		{"duplicate labels", "a,b,a\n1,2,3\n", Options{}, 1, 3, "a", "both labelled"},
		{"unclosed quote", "a,b\n\"1,2\n", Options{}, 2, 1, "", "never closed"},
		{"text after quote", "a,b\n\"1\"x,2\n", Options{}, 2, 1, "", "after the closing quote"},
		{"long third cell", "A,1\nB,2,9\n", Options{Layout: LayoutLong}, 2, 3, "", "third cell"},
		{"long label missing", "A,1\n,2\n", Options{Layout: LayoutLong}, 2, 1, "", "no group label"},
		{"long text value", "g,v\nA,1\nB,x\n", Options{}, 3, 2, "B", `"x" is not a number`},
		{"empty", "\n\n", Options{}, 0, 0, "", "no data"},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			_, err := Parse([]byte(tt.in), tt.opt)
			var e *Error
			if !errors.As(err, &e) {
				t.Fatalf("Parse(%q) error = %v, want *Error", tt.in, err)
			}
			if e.Line != tt.line || e.Column != tt.column || e.Group != tt.group || !strings.Contains(e.Error(), tt.says) {
				t.Errorf("Parse(%q) error = %q (line %d, column %d, group %q), want line %d, column %d, group %q, saying %q",
					tt.in, e.Error(), e.Line, e.Column, e.Group, tt.line, tt.column, tt.group, tt.says)
			}
		})
	}
}

func TestDetectLayout(t *testing.T) {
	tests := []struct {
		in   string
		want Layout
	}{
		{"site,minutes\nNorth,3\nSouth,4\n", LayoutLong},
		{"North,3\nSouth,4\nNorth,2\n", LayoutLong},
		{"a,b\n1,2\n3,4\n", LayoutWide},
		{"1,10\n2,20\n", LayoutWide}, // numeric codes need --layout long (documented)
	}
	for _, tt := range tests {
		got, err := Parse([]byte(tt.in), Options{})
		if err != nil {
			t.Errorf("Parse(%q): %v", tt.in, err)
			continue
		}
		if got.Layout != tt.want {
			t.Errorf("Parse(%q).Layout = %v, want %v", tt.in, got.Layout, tt.want)
		}
	}
}

func TestParseCell(t *testing.T) {
	tests := []struct {
		in    string
		comma bool
		v     float64
		kind  cellKind
	}{
		{"0.1", false, 0.1, cellNumber},
		{"123456789012345", false, 123456789012345, cellNumber},
		{"1234567890123456789", false, 1234567890123456789, cellNumber},
		{"0.30000000000000004", false, 0.30000000000000004, cellNumber},
		{"1e-400", false, 0, cellNumber},
		{"2.5e-3", false, 0.0025, cellNumber},
		{"1,25", true, 1.25, cellNumber},
		{"1,25", false, 0, cellText},
		{"1.", false, 1, cellNumber},
		{".", false, 0, cellMissing},
		{"NaN", false, 0, cellMissing},
		{"N/A", false, 0, cellMissing},
		{"-Infinity", false, 0, cellInfinite},
		{"∞", false, 0, cellInfinite},
		{"e5", false, 0, cellText},
		{"1e", false, 0, cellText},
		{"--1", false, 0, cellText},
		{"1.2.3", false, 0, cellText},
	}
	for _, tt := range tests {
		v, kind, _ := parseCell([]byte(tt.in), tt.comma)
		if v != tt.v || kind != tt.kind {
			t.Errorf("parseCell(%q, %v) = %v, %v; want %v, %v", tt.in, tt.comma, v, kind, tt.v, tt.kind)
		}
	}
}

// TestProblems: every unreadable cell is reported at its place, up to
// MaxProblems, and errors.As finds the first.
func TestProblems(t *testing.T) {
	tests := []struct {
		name  string
		text  string
		opt   Options
		where [][2]int // line, column of each problem
	}{
		{"wide", "A,B\n1,x\ny,2\n3,4,5\n", Options{}, [][2]int{{2, 2}, {3, 1}, {4, 3}}},
		{"long", "A,1\nB,two\n,3\nA,1,2\nB,4\n", Options{Layout: LayoutLong}, [][2]int{{2, 2}, {3, 1}, {4, 3}}},
	}
	for _, tt := range tests {
		_, err := Parse([]byte(tt.text), tt.opt)
		var ps Problems
		if !errors.As(err, &ps) {
			t.Fatalf("%s: error %v is not Problems", tt.name, err)
		}
		var where [][2]int
		for _, e := range ps {
			where = append(where, [2]int{e.Line, e.Column})
		}
		if !reflect.DeepEqual(where, tt.where) {
			t.Errorf("%s: problems at %v, want %v", tt.name, where, tt.where)
		}
		var first *Error
		if !errors.As(err, &first) || first != ps[0] {
			t.Errorf("%s: errors.As gives %v, want the first problem", tt.name, first)
		}
		if !strings.HasPrefix(err.Error(), fmt.Sprintf("%d cells cannot be read; the first: line 2", len(tt.where))) {
			t.Errorf("%s: message %q", tt.name, err)
		}
	}
	_, err := Parse([]byte("A\n"+strings.Repeat("x\n", 2*MaxProblems)), Options{})
	var ps Problems
	if !errors.As(err, &ps) || len(ps) != MaxProblems || !strings.HasPrefix(err.Error(), "reading stopped after") {
		t.Errorf("many bad cells: %d problems, %v", len(ps), err)
	}
}

func ExampleTable_Regroup() {
	t, _ := Parse([]byte("North,South,East\n3,8,2\n5,6,NA\n"), Options{})
	_ = t.Regroup(Edits{Order: []string{"East"}, Exclude: []string{"South"}, Rename: map[string]string{"North": "N"}})
	fmt.Println(t.Labels, t.Source, t.Missing, len(t.Values), t.Excluded)
	// Output: [East N] [East North] [1 0] 3 [{South 2 0}]
}

// TestEditsFor: edits naming absent labels, and renamings that change
// nothing, are left out; the others stay as they were.
func TestEditsFor(t *testing.T) {
	e := Edits{Order: []string{"C", "X", "A"}, Exclude: []string{"Y", "B"},
		Rename: map[string]string{"A": "North", "B": "", "C": "C", "Z": "Far"}}
	got := e.For([]string{"A", "B", "C"})
	want := Edits{Order: []string{"C", "A"}, Exclude: []string{"B"}, Rename: map[string]string{"A": "North"}}
	if !reflect.DeepEqual(got, want) {
		t.Errorf("For = %+v, want %+v", got, want)
	}
	if got := (Edits{Order: []string{"X"}}).For([]string{"A"}); !reflect.DeepEqual(got, Edits{}) {
		t.Errorf("For of edits that all name absent labels = %+v, want none", got)
	}
}
