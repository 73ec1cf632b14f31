package table

import (
	"errors"
	"math"
	"strconv"
	"strings"
	"testing"
)

// TestAutomaticReading: which columns the reading takes groups and values
// from, for the shapes analysts' exports have (invented cells, each a shape
// named beside it).
func TestAutomaticReading(t *testing.T) {
	likert := "Team A,Team B,Team C\n1,2,3\n2,2,4\n3,2,5\n1,3,4\n2,3,5\n3,1,4\n"
	for _, c := range []struct {
		name, text     string
		layout         Layout
		group, measure int // 1-based, long only
		others         bool
		reasonSays     string
	}{
		{"labels and values", "site,minutes\nNorth,3\nSouth,4\n", LayoutLong, 1, 2, false, "labels"},
		{"no header, labels and values", "North,3\nSouth,4\nNorth,5\n", LayoutLong, 1, 2, false, "labels"},
		{"one column per group", "A,B,C\n1.5,2.5,3.5\n2.25,4.5,6.5\n", LayoutWide, 0, 0, false, "one column per group"},
		{"ratings, one column per group", likert, LayoutWide, 0, 0, false, "ratings"},
		{"two columns of ratings", "x,y\n1,2\n2,2\n1,3\n2,3\n1,1\n2,1\n", LayoutWide, 0, 0, true, "ratings"},
		{"codes and values", "dept,days\n1,30.5\n2,41\n1,28\n3,55.5\n2,40\n3,61\n", LayoutLong, 1, 2, true, "codes of groups"},
		{"id, labels, values", "id,Diet,weight\n1,Diet 1,42\n2,Diet 1,51\n3,Diet 2,40\n4,Diet 2,49\n", LayoutLong, 2, 3, false, "labels"},
		{"names and departments", "name,dept,score\nAna,HR,3.5\nBo,IT,4.25\nCy,HR,2.5\nDi,IT,4.75\n", LayoutLong, 2, 3, true, "\"dept\""},
		{"row numbers, codes and values", rowNumbered(), LayoutLong, 2, 3, false, "codes"},
	} {
		tab, err := Parse([]byte(c.text), Options{})
		if err != nil {
			t.Errorf("%s: %v", c.name, err)
			continue
		}
		if tab.Layout != c.layout || tab.GroupColumn != c.group || tab.MeasureColumn != c.measure ||
			(tab.Others != "") != c.others || !strings.Contains(tab.Reason, c.reasonSays) {
			t.Errorf("%s: read %v, groups from column %d, values from %d, reason %q, others %q", c.name, tab.Layout,
				tab.GroupColumn, tab.MeasureColumn, tab.Reason, tab.Others)
		}
	}
}

// rowNumbered is a long table with a row number, group codes and values.
func rowNumbered() string {
	var b strings.Builder
	b.WriteString("row,clinic,minutes\n")
	for i := 1; i <= 30; i++ {
		b.WriteString(strings.Join([]string{strconv.Itoa(i), strconv.Itoa(1 + i%3), strconv.Itoa(10+i*7%23) + ".5"}, ",") + "\n")
	}
	return b.String()
}

func itoa(i int) string {
	return strings.TrimSpace(strings.Repeat(" ", 0) + string(rune('0'+i/10)) + string(rune('0'+i%10)))
}

func TestChosenColumns(t *testing.T) {
	text := "id,Diet,weight,Time\n1,Diet 1,42,0\n2,Diet 1,51,2\n3,Diet 2,40,0\n4,Diet 2,49,2\n"
	for _, c := range []struct {
		name           string
		opt            Options
		group, measure int
		fails          string
	}{
		{"by name", Options{Group: "Diet", Measure: "weight"}, 2, 3, ""},
		{"by number", Options{Group: "2", Measure: "4"}, 2, 4, ""},
		{"in any letter case", Options{Group: "diet", Measure: "WEIGHT"}, 2, 3, ""},
		{"the measure only", Options{Measure: "Time"}, 2, 4, ""},
		{"the group only", Options{Group: "Diet"}, 2, 3, ""},
		{"no such column", Options{Group: "Feed"}, 0, 0, `there is no column "Feed" for the group`},
		{"the same column", Options{Group: "weight", Measure: "3"}, 0, 0, "chosen for two roles"},
		{"with the wide layout", Options{Group: "Diet", Layout: LayoutWide}, 0, 0, "the layout chosen is wide"},
	} {
		tab, err := Parse([]byte(text), c.opt)
		var e *Error
		switch {
		case c.fails != "":
			if !errors.As(err, &e) || !strings.Contains(e.Error(), c.fails) {
				t.Errorf("%s: error %v, want one saying %q", c.name, err, c.fails)
			}
		case err != nil:
			t.Errorf("%s: %v", c.name, err)
		case tab.GroupColumn != c.group || tab.MeasureColumn != c.measure || !tab.Header || !strings.Contains(tab.Reason, "as chosen"):
			t.Errorf("%s: groups from %d, values from %d (header %v, reason %q), want %d and %d", c.name, tab.GroupColumn, tab.MeasureColumn,
				tab.Header, tab.Reason, c.group, c.measure)
		}
	}
}

// FuzzColumns: whatever the text and the columns chosen, Parse does not
// panic, and a long reading's values are exactly the numbers of the chosen
// measure column (written with the column's unit or none), line by line:
// no other column's cells leak in.
func FuzzColumns(f *testing.F) {
	f.Add([]byte("id,Diet,weight\n1,Diet 1,42\n2,Diet 1,51\n3,Diet 2,40\n"), "Diet", "weight")
	f.Add([]byte("a;b;c\n1;2,5;x\n1;3;y\n2;NA;z\n"), "", "2")
	f.Add([]byte("x\ty\n1\t2\n"), "3", "")
	f.Fuzz(func(t *testing.T, data []byte, group, measure string) {
		tab, err := Parse(data, Options{Group: group, Measure: measure})
		if err != nil || tab.Layout != LayoutLong {
			return
		}
		records := Records(data, tab.Separator, math.MaxInt32)
		byLine := map[int][]string{}
		for _, r := range records {
			byLine[r.Line] = r.Cells
		}
		for i, v := range tab.Values {
			cells := byLine[int(tab.Lines[i])]
			if tab.MeasureColumn > len(cells) {
				t.Fatalf("value %v on line %d, which has no column %d", v, tab.Lines[i], tab.MeasureColumn)
			}
			want, kind, form, unit := parseValue([]byte(cells[tab.MeasureColumn-1])) // a number, or one with the column's unit
			if form.ambiguous != NoMark && tab.Thousands != form.ambiguous {
				want /= 1000 // read as a decimal on the evidence of the whole column
			}
			if kind != cellNumber || unit != tab.Unit && unit != "" || want != v && !(want == 0 && v == 0) {
				t.Fatalf("value %v on line %d, but column %d holds %q", v, tab.Lines[i], tab.MeasureColumn, cells[tab.MeasureColumn-1])
			}
		}
	})
}
