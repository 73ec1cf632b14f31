package testfiles

import (
	"reflect"
	"testing"
	"testing/fstest"
)

func TestCasesAndRows(t *testing.T) {
	fsys := fstest.MapFS{
		"b.csv":          {Data: []byte("A,B\n1,2\n")},
		"b.json":         {Data: []byte("{}")},
		"a.tsv":          {Data: []byte("A\tB\n1\t2\n")},
		"a.json":         {Data: []byte("{}")},
		"a.options.json": {Data: []byte(`{"alpha":0.1}`)},
		"table.tsv":      {Data: []byte("dataset\tvalue\nx\t1.5\ny\t2\n")},
	}
	cases, err := Cases(fsys)
	if err != nil {
		t.Fatal(err)
	}
	want := []Case{
		{Name: "a", Input: "a.tsv", Options: "a.options.json", Golden: "a.json"},
		{Name: "b", Input: "b.csv", Golden: "b.json"},
		{Name: "table", Input: "table.tsv", Golden: "table.json"},
	}
	if !reflect.DeepEqual(cases, want) {
		t.Errorf("Cases = %+v, want %+v", cases, want)
	}
	rows, err := Rows(fsys, "table.tsv")
	if err != nil || !reflect.DeepEqual(rows, [][]string{{"x", "1.5"}, {"y", "2"}}) {
		t.Errorf("Rows = %q, %v", rows, err)
	}
}
