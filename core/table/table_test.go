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
			opt:  Options{Decimal: MarkPoint},
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
		{"decimal comma refused", "a;b\n1,5;2\n", Options{Layout: LayoutWide, Decimal: MarkPoint}, 2, 1, "a", `"1,5" is written with a decimal comma, but the decimal mark chosen is the point`},
		{"badly grouped", "a,b\n1,\"1,23,456\"\n", Options{}, 2, 2, "b", "not a number"},
		{"two thousands separators", "a\tb\n1 234\t2\n3\t1,234,567\n", Options{}, 2, 1, "a", `"1 234" has a space between thousands, but "1,234,567" (line 3, column 2) has a comma`},
		{"a mark both ways", "a;b\n1.234.567;2\n3,5;1.5\n", Options{}, 3, 2, "b", `"1.5" has a decimal point, but "1.234.567" (line 2, column 1) has a point between thousands`},
		{"value without label", "a,b\n1,2,3\n", Options{}, 2, 3, "", "no group label"},
		{"duplicate labels", "a,b,a\n1,2,3\n", Options{}, 1, 3, "a", "both labelled"},
		{"unclosed quote", "a,b\n\"1,2\n", Options{}, 2, 1, "", "never closed"},
		{"text after quote", "a,b\n\"1\"x,2\n", Options{}, 2, 1, "", "after the closing quote"},
		{"long third cell", "A,1\nB,2,9\n", Options{Layout: LayoutLong}, 2, 3, "", "third cell"},
		{"long label missing", "A,1\n,2\n", Options{Layout: LayoutLong}, 2, 1, "", "no group label"},
		{"long text value", "g,v\nA,1\nB,x\n", Options{}, 3, 2, "B", `"x" is not a number`},
		{"a date", "g\tv\nA\t1\nB\t2026-03-01\n", Options{}, 3, 2, "B", `"2026-03-01" is a date, and a date is not a measurement`},
		{"a column of labels read as values", "id,Diet,weight\n1,Diet 1,42\n2,Diet 2,51\n3,Diet 1,40\n", Options{Group: "id", Measure: "Diet"}, 2, 2, "1",
			`it looks like a column of group labels; choose it as the group column ("Groups from the column" on the page, --group "Diet" on the command line)`},
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
		in   string
		v    float64
		kind cellKind
		form form
	}{
		{"0.1", 0.1, cellNumber, form{decimal: MarkPoint}},
		{"123456789012345", 123456789012345, cellNumber, form{ungrouped: true}},
		{"1234567890123456789", 1234567890123456789, cellNumber, form{ungrouped: true}},
		{"0.30000000000000004", 0.30000000000000004, cellNumber, form{decimal: MarkPoint}},
		{"1e-400", 0, cellNumber, form{}},
		{"2.5e-3", 0.0025, cellNumber, form{decimal: MarkPoint}},
		{"1,25", 1.25, cellNumber, form{decimal: MarkComma}},
		{"1.", 1, cellNumber, form{decimal: MarkPoint}},
		{".5", 0.5, cellNumber, form{decimal: MarkPoint}},
		{"980", 980, cellNumber, form{}},
		// one to three digits, one mark, three digits: read as the whole number until the column decides
		{"52,300", 52300, cellNumber, form{ambiguous: MarkComma}},
		{"-1.250", -1250, cellNumber, form{ambiguous: MarkPoint}},
		{"0,300", 0.3, cellNumber, form{decimal: MarkComma}},   // a thousands separator never follows a leading zero
		{"1,250e2", 125, cellNumber, form{decimal: MarkComma}}, // nor comes with an exponent
		{"1234,567", 1234.567, cellNumber, form{decimal: MarkComma, ungrouped: true}},
		{"1,234,567", 1234567, cellNumber, form{thousands: MarkComma}},
		{"1,234,567.25", 1234567.25, cellNumber, form{thousands: MarkComma, decimal: MarkPoint}},
		{"1.234.567,25", 1234567.25, cellNumber, form{thousands: MarkPoint, decimal: MarkComma}},
		{"52 300", 52300, cellNumber, form{thousands: MarkSpace}},
		{"52\u00a0300,5", 52300.5, cellNumber, form{thousands: MarkSpace, decimal: MarkComma}},
		{"1\u202f234\u202f567", 1234567, cellNumber, form{thousands: MarkSpace}},
		{"1'234.5", 1234.5, cellNumber, form{thousands: MarkQuote, decimal: MarkPoint}},
		{"1\u2019234", 1234, cellNumber, form{thousands: MarkQuote}},
		{"123,456,789,012,345,678.5", 123456789012345678.5, cellNumber, form{thousands: MarkComma, decimal: MarkPoint}},
		{"1,23,456", 0, cellText, form{}},
		{"1234,567,890", 0, cellText, form{}},
		{"1,234e3", 1234, cellNumber, form{decimal: MarkComma}},
		{"1,234,567e3", 0, cellText, form{}},
		{"1 2", 0, cellText, form{}},
		{"12 min", 0, cellText, form{}},
		{"1_000", 0, cellText, form{}},
		{".", 0, cellMissing, form{}},
		{"NaN", 0, cellMissing, form{}},
		{"N/A", 0, cellMissing, form{}},
		{"-Infinity", 0, cellInfinite, form{}},
		{"∞", 0, cellInfinite, form{}},
		{"e5", 0, cellText, form{}},
		{"1e", 0, cellText, form{}},
		{"--1", 0, cellText, form{}},
		{"1.2.3", 0, cellText, form{}},
		{",", 0, cellText, form{}},
	}
	for _, tt := range tests {
		v, kind, f := parseCell([]byte(tt.in))
		if v != tt.v || kind != tt.kind || f != tt.form {
			t.Errorf("parseCell(%q) = %v, %v, %+v; want %v, %v, %+v", tt.in, v, kind, f, tt.v, tt.kind, tt.form)
		}
	}
}

// TestUnits: one unit written beside the values is taken off them and
// named; two units, a unit on a few values only, or a word before the
// number are errors.
func TestUnits(t *testing.T) {
	tests := []struct {
		name, in string
		want     []float64
		unit     string
		measure  string
		says     string // a part of the error, "" for none
	}{
		{"minutes", "site\twait\nA\t12 min\nB\t15 min\nA\t9 min\nB\t20 min\nA\t7 min\n", []float64{12, 15, 9, 20, 7}, "min", "wait (min)", ""},
		{"a currency before", "A;B\n€ 40;€ 55,50\n€ 41;€ 38\n", []float64{40, 55.5, 41, 38}, "€", "€", ""},
		{"percent, no space", "A\tB\n35%\t40%\n12.5%\t50%\n", []float64{35, 40, 12.5, 50}, "%", "%", ""},
		{"two units", "A\tB\n12 min\t1 h\n", nil, "", "", `"1 h" is in "h", but "12 min" (line 2, column 1) is in "min"`},
		{"a unit on a few values", "A\tB\n12\t13\n14\t15 min\n16\t17\n", nil, "", "", `"15 min" has the unit "min", which 5 of the 6 values lack`},
		{"a word before the number", "A\tB\nWard 3\t4\n", nil, "", "", `"Ward 3" is not a number`},
		{"a sign is no unit", "A\tB\n75+\t4\n", nil, "", "", `"75+" is not a number`},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			got, err := Parse([]byte(tt.in), Options{})
			if tt.says != "" {
				if err == nil || !strings.Contains(err.Error(), tt.says) {
					t.Errorf("Parse(%q): error %v, want one saying %q", tt.in, err, tt.says)
				}
				return
			}
			if err != nil {
				t.Fatalf("Parse(%q): %v", tt.in, err)
			}
			if !reflect.DeepEqual(got.Values, tt.want) || got.Unit != tt.unit || got.Measure != tt.measure {
				t.Errorf("Parse(%q) = %v, unit %q, measure %q; want %v, %q, %q", tt.in, got.Values, got.Unit, got.Measure, tt.want, tt.unit, tt.measure)
			}
		})
	}
}

// TestNumberFormats: the decimal mark and the thousands separator are
// decided on every value of the reading, and a cell that could be read two
// ways follows the others (README, "Numbers").
func TestNumberFormats(t *testing.T) {
	tests := []struct {
		name      string
		in        string
		opt       Options
		want      []float64
		comma     bool
		thousands Mark
		other     string // a part of OtherNumbers, "" for none
	}{
		// salaries formatted #,##0 and pasted from a spreadsheet: a comma between thousands, the other reading named
		{"grouped salaries", "pay\n52,300\n980\n61,250\n", Options{}, []float64{52300, 980, 61250}, false, MarkComma, `"52,300" (line 2, column 1) and 1 more cell like it were read with a comma between thousands (52300), but the comma may be a decimal comma (52.3)`},
		{"decimal comma seen elsewhere", "x\n1,250\n3,5\n", Options{}, []float64{1.25, 3.5}, true, NoMark, ""},
		{"decimal point seen elsewhere", "x\n1,250\n3.5\n", Options{}, []float64{1250, 3.5}, false, MarkComma, ""},
		{"grouping seen elsewhere", "x\n1,250\n1,234,567\n", Options{}, []float64{1250, 1234567}, false, MarkComma, ""},
		{"a long whole part without a separator", "x\n1,250\n1500\n", Options{}, []float64{1.25, 1500}, true, NoMark, "the comma may separate thousands (1250)"},
		{"decimal comma chosen", "x\n52,300\n980\n", Options{Decimal: MarkComma}, []float64{52.3, 980}, true, NoMark, ""},
		{"no thousands chosen", "x\n52,300\n980\n", Options{Thousands: MarkNone}, []float64{52.3, 980}, true, NoMark, ""},
		{"a point alone is a decimal point", "x\n1.250\n2\n", Options{}, []float64{1.25, 2}, false, NoMark, "the point may separate thousands (1250): if so, choose the thousands separator point"},
		{"semicolon-separated: a presumed decimal comma", "x;y\n1.250;1,250\n2;3\n", Options{Separator: ';'}, []float64{1250, 1.25, 2, 3}, true, MarkPoint, `"1,250" (line 2, column 2) was read with a decimal comma (1.25), but the comma may separate thousands (1250)`},
		{"points between thousands", "x\n1.250\n2,5\n", Options{}, []float64{1250, 2.5}, true, MarkPoint, ""},
		{"points chosen between thousands", "x\n1.250\n2\n", Options{Thousands: MarkPoint}, []float64{1250, 2}, false, MarkPoint, ""},
		{"spaces", "x\n52 300,5\n1,250\n", Options{}, []float64{52300.5, 1.25}, true, MarkSpace, ""},
		{"both marks", "x\n1,234.5\n1.250\n2,500\n", Options{}, []float64{1234.5, 1.25, 2500}, false, MarkComma, ""},
		{"decimals both ways, nothing ambiguous", "x;y\n3,5;2.5\n", Options{Separator: ';'}, []float64{3.5, 2.5}, true, NoMark, ""},
		{"quoted in a comma-separated text", "a,b\n\"52,300\",\"1,250.5\"\n", Options{Separator: ','}, []float64{52300, 1250.5}, false, MarkComma, ""},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			opt := tt.opt
			if opt.Separator == 0 {
				opt.Separator = '\t' // one column, as pasted
			}
			got, err := Parse([]byte(tt.in), opt)
			if err != nil {
				t.Fatalf("Parse(%q): %v", tt.in, err)
			}
			if !reflect.DeepEqual(got.Values, tt.want) || got.DecimalComma != tt.comma || got.Thousands != tt.thousands {
				t.Errorf("Parse(%q) = %v, decimal comma %v, thousands %v; want %v, %v, %v", tt.in, got.Values, got.DecimalComma, got.Thousands, tt.want, tt.comma, tt.thousands)
			}
			if (tt.other == "") != (got.OtherNumbers == "") || !strings.Contains(got.OtherNumbers, tt.other) {
				t.Errorf("Parse(%q) other reading %q, want one with %q", tt.in, got.OtherNumbers, tt.other)
			}
		})
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

// TestTitlesAndTwoLineHeaders: title lines above a table are passed over,
// and a header on two lines (a cell merged over several columns) is joined,
// each said in the reason; other texts are read as they stand.
func TestTitlesAndTwoLineHeaders(t *testing.T) {
	tests := []struct {
		name, in string
		opt      Options
		values   []float64
		lines    []int32
		reason   string // a part of the reason, "" when nothing is passed over or joined
	}{
		{"a title", "Staff survey 2026\n\nsite,wait\nNorth,12\nSouth,15\nNorth,11\n", Options{},
			[]float64{12, 15, 11}, []int32{4, 5, 6}, `the title "Staff survey 2026" above the table is passed over`},
		{"a header on two lines", "Site,Waiting time,\n,min,max\nNorth,12,30\nSouth,15,40\nNorth,11,25\n", Options{Group: "Site", Measure: "Waiting time max"},
			[]float64{30, 40, 25}, []int32{3, 4, 5}, `the header is on lines 1 and 2 (a cell merged over several columns), read as "Site", "Waiting time min", "Waiting time max"`},
		{"a bad first value is no header", "site,minutes\nNorth,x\nSouth,3\n", Options{}, nil, nil, ""},
		{"one column is no title", "A\tB\n1\t2\n3\t4\n", Options{}, []float64{1, 2, 3, 4}, []int32{2, 2, 3, 3}, ""},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			got, err := Parse([]byte(tt.in), tt.opt)
			if tt.values == nil {
				if err == nil || strings.Contains(got.Reason, "header is on lines") {
					t.Errorf("Parse(%q) = %v, %v; want an error for the bad cell, read as it stands", tt.in, got, err)
				}
				return
			}
			if err != nil {
				t.Fatalf("Parse(%q): %v", tt.in, err)
			}
			if !reflect.DeepEqual(got.Values, tt.values) || !reflect.DeepEqual(got.Lines, tt.lines) {
				t.Errorf("Parse(%q) = %v on lines %v, want %v on %v", tt.in, got.Values, got.Lines, tt.values, tt.lines)
			}
			if (tt.reason == "") == strings.Contains(got.Reason, "; the") || !strings.Contains(got.Reason, tt.reason) {
				t.Errorf("Parse(%q) reason %q, want one with %q", tt.in, got.Reason, tt.reason)
			}
		})
	}
}

// TestRemeasure: reading another measure column with the profile of an
// earlier reading gives the same table as reading it afresh.
func TestRemeasure(t *testing.T) {
	data := []byte("site,wait,stay,score\nA,12,3,4\nB,15,,5\nA,9,2,4\nC,30,7,1\nB,14,4,\n")
	first, err := Parse(data, Options{Group: "site", Measure: "wait"})
	if err != nil {
		t.Fatal(err)
	}
	for _, measure := range []string{"stay", "score", "4"} {
		opt := Options{Group: "site", Measure: measure}
		want, err1 := Parse(data, opt)
		got, err2 := first.Remeasure(data, opt)
		if err1 != nil || err2 != nil {
			t.Fatalf("%s: %v, %v", measure, err1, err2)
		}
		if !reflect.DeepEqual(got, want) {
			t.Errorf("%s: remeasured\n%+v\nread afresh\n%+v", measure, got, want)
		}
	}
}
