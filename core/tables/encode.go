package tables

import (
	"fmt"

	"midrank/core"
	"midrank/core/jsonlite"
)

// unitNames are the keys of Unit in JSON, in the order of the constants.
var unitNames = [...]string{"", "measure"}

// Encode writes tables as the JSON the page renders from:
//
//	{"figures": table, "trend": table, "groups": table, "levels": table, "pairs": table}
//
// (a table missing from tables is left out), where a table is
//
//	{"title", "note", "list", "columns": [{"key", "heading", "unit", "show"}, …],
//	 "values": [[…], …], "text": [[…], …]}
//
// ("list": one row of figures that reads down the page)
//
// with one array of values (full precision, for files) and one of the
// values as shown (for people) per row. A value that is not finite is an
// error: it has no place in a table.
func Encode(tables []Table) ([]byte, error) {
	var w jsonlite.Writer
	w.BeginObject()
	for _, t := range tables {
		w.Key(t.Name)
		writeTable(&w, t)
	}
	w.EndObject()
	return w.Bytes(), w.Err()
}

// writeTable writes one table as Encode describes it.
func writeTable(w *jsonlite.Writer, t Table) {
	w.BeginObject()
	w.StringMember("title", t.Title)
	w.StringMember("note", t.Note)
	w.BoolMember("list", t.List)
	w.Key("columns")
	w.BeginArray()
	for _, c := range t.Columns {
		w.BeginObject()
		w.StringMember("key", c.Key)
		w.StringMember("heading", c.Heading)
		w.StringMember("unit", unitNames[c.Unit])
		w.StringMember("show", c.Show.String())
		w.EndObject()
	}
	w.EndArray()
	w.Key("values")
	w.BeginArray()
	for _, row := range t.Rows {
		w.BeginArray()
		for _, c := range row {
			writeValue(w, c.Value)
		}
		w.EndArray()
	}
	w.EndArray()
	w.Key("text")
	w.BeginArray()
	for _, row := range t.Rows {
		w.BeginArray()
		for _, c := range row {
			w.String(c.Text)
		}
		w.EndArray()
	}
	w.EndArray()
	w.EndObject()
}

// EncodeBattery writes the tables of a battery of measures:
//
//	{"overview": table, "measures": [tables, …]}
//
// with each measure's tables as Encode writes them, in the battery's
// order, or null for a measure that could not be analysed.
func EncodeBattery(b *core.Battery) ([]byte, error) {
	return EncodeMeasures(Overview(b), b, func(r *core.Result) ([]byte, error) { return Encode(Of(r)) })
}

// EncodeMeasures writes {"overview": overview, "measures": [each measure's
// JSON by each, or null for a measure that could not be analysed]}.
func EncodeMeasures(overview Table, b *core.Battery, each func(*core.Result) ([]byte, error)) ([]byte, error) {
	var w jsonlite.Writer
	w.BeginObject()
	w.Key("overview")
	writeTable(&w, overview)
	w.Key("measures")
	w.BeginArray()
	for _, m := range b.Measures {
		if m.Result == nil {
			w.Null()
			continue
		}
		one, err := each(m.Result)
		if err != nil {
			return nil, err
		}
		w.Raw(one)
	}
	w.EndArray()
	w.EndObject()
	return w.Bytes(), w.Err()
}

func writeValue(w *jsonlite.Writer, v any) {
	switch v := v.(type) {
	case nil:
		w.Null()
	case string:
		w.String(v)
	case bool:
		w.Bool(v)
	case int:
		w.Int(int64(v))
	case float64:
		w.Float(v)
	default:
		panic(fmt.Sprintf("tables: a value of type %T", v))
	}
}
