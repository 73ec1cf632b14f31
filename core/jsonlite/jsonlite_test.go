package jsonlite

import (
	"bytes"
	"encoding/json"
	"fmt"
	"math"
	"reflect"
	"strings"
	"testing"
)

// stdlib is encoding/json with HTML escaping off, the reference.
func stdlib(v any) []byte {
	var b bytes.Buffer
	enc := json.NewEncoder(&b)
	enc.SetEscapeHTML(false)
	enc.Encode(v)
	return bytes.TrimSuffix(b.Bytes(), []byte("\n"))
}

func TestStringsMatchEncodingJSON(t *testing.T) {
	for _, s := range []string{"", "plain", `q"uote\back`, "tab\tnew\nline\r\x00\x1f", "<b>&amp;</b>", "Süd ∞ 🙂",
		"line\u2028sep\u2029", "bad \xff utf8 \xe2\x82", "\u007f"} {
		var w Writer
		w.String(s)
		if got, want := w.Bytes(), stdlib(s); !bytes.Equal(got, want) {
			t.Errorf("String(%q) = %s, encoding/json %s", s, got, want)
		}
	}
}

func TestFloatsMatchEncodingJSON(t *testing.T) {
	for _, f := range []float64{0, 1, -1, 0.1, 1e-7, 1.5e-7, 1e20, 1e21, 123456789.125, 5e-324, math.MaxFloat64, -2.5e-12, 0.000001} {
		if got, want := appendFloat(nil, f), stdlib(f); !bytes.Equal(got, want) {
			t.Errorf("appendFloat(%v) = %s, encoding/json %s", f, got, want)
		}
	}
}

func TestWriterShapes(t *testing.T) {
	var w Writer
	w.BeginObject()
	w.Key("a")
	w.Int(1)
	w.Key("b")
	w.BeginArray()
	w.Bool(true)
	w.Null()
	w.BeginObject()
	w.EndObject()
	w.EndArray()
	w.Key("c")
	w.Raw([]byte(`{"x":2}`))
	w.EndObject()
	if got := string(w.Bytes()); got != `{"a":1,"b":[true,null,{}],"c":{"x":2}}` {
		t.Errorf("shapes = %s", got)
	}
}

func TestParseObject(t *testing.T) {
	names, values, err := ParseObject([]byte(` {"alpha": 0.05, "pvalue":"exact", "x": null, "b": true, "s": "a\u00e9\ud83d\ude42\n\"", "n": -1.5e3} `))
	if err != nil {
		t.Fatal(err)
	}
	if !reflect.DeepEqual(names, []string{"alpha", "pvalue", "x", "b", "s", "n"}) {
		t.Errorf("names %v", names)
	}
	want := map[string]Value{"alpha": {Kind: Number, Text: "0.05"}, "pvalue": {Kind: String, Text: "exact"}, "x": {Kind: Null, Text: "null"},
		"b": {Kind: Bool, Text: "true"}, "s": {Kind: String, Text: "aé🙂\n\""}, "n": {Kind: Number, Text: "-1.5e3"}}
	if !reflect.DeepEqual(values, want) {
		t.Errorf("values %v, want %v", values, want)
	}
	_, nested, err := ParseObject([]byte(`{"order":["B","A"],"none":[],"rename":{"A":"North","B":""}}`))
	if err != nil {
		t.Fatal(err)
	}
	wantNested := map[string]Value{"order": {Kind: List, Items: []string{"B", "A"}}, "none": {Kind: List, Items: []string{}},
		"rename": {Kind: Record, Fields: []Field{{"A", "North"}, {"B", ""}}}}
	if !reflect.DeepEqual(nested, wantNested) {
		t.Errorf("nested %v, want %v", nested, wantNested)
	}
	for _, bad := range []string{``, `[]`, `{"a":1,}`, `{"a":01}`, `{"a":1.}`, `{"a":"x}`, `{"a":1} x`, `{"a":1,"a":2}`, "{\"a\":\"\x01\"}", `{"a":tru}`, `{a:1}`, `{"a":2e308}`, `{"a":[1]}`, `{"a":["x",]}`, `{"a":["x"}`, `{"a":{"b":2}}`, `{"a":{"b":"1","b":"2"}}`, `{"a":[["x"]]}`, `{"a":{"b":{}}}`, `{"a":-1` + strings.Repeat("0", 400) + `}`} {
		if _, _, err := ParseObject([]byte(bad)); err == nil {
			t.Errorf("ParseObject(%q) accepted", bad)
		}
	}
}

// FuzzParseObject: never panics; what it accepts encoding/json accepts with
// the same values, and writing it back reads back the same.
func FuzzParseObject(f *testing.F) {
	f.Add([]byte(`{"alpha":0.05,"data":"A,B\n1,2","seed":7}`))
	f.Add([]byte(`{"s":"\ud83d\ude42 \u2028"}`))
	f.Add([]byte(`{}`))
	f.Add([]byte(`{"order":["B","A"],"exclude":[],"rename":{"A":"North","B":"\u00e9"}}`))
	f.Fuzz(func(t *testing.T, data []byte) {
		names, values, err := ParseObject(data)
		if err != nil {
			return
		}
		var ref map[string]any
		if err := json.Unmarshal(data, &ref); err != nil {
			t.Fatalf("accepted %q, encoding/json refuses: %v", data, err)
		}
		var w Writer
		w.BeginObject()
		for _, n := range names {
			v := values[n]
			w.Key(n)
			switch v.Kind {
			case String:
				w.String(v.Text)
				if ref[n] != v.Text {
					t.Fatalf("%q: %q, encoding/json %q", n, v.Text, ref[n])
				}
			case List:
				w.Strings(v.Items)
				if got := fmt.Sprint(ref[n]); got != fmt.Sprint(v.Items) {
					t.Fatalf("%q: %q, encoding/json %q", n, v.Items, got)
				}
			case Record:
				w.Fields(v.Fields)
				m, _ := ref[n].(map[string]any)
				for _, f := range v.Fields {
					if m[f.Name] != f.Text {
						t.Fatalf("%q.%q: %q, encoding/json %q", n, f.Name, f.Text, m[f.Name])
					}
				}
			default:
				w.Raw([]byte(v.Text))
			}
		}
		w.EndObject()
		_, again, err := ParseObject(w.Bytes())
		if err != nil || !reflect.DeepEqual(again, values) {
			t.Fatalf("round trip of %q: %v", data, err)
		}
	})
}

func ExampleParseObject() {
	names, values, _ := ParseObject([]byte(`{"alpha": 0.1, "exclude": ["B"], "rename": {"A": "North"}}`))
	for _, n := range names {
		v := values[n]
		fmt.Println(n, v.Kind, v.Text, v.Items, v.Fields)
	}
	// Output:
	// alpha number 0.1 [] []
	// exclude list  [B] []
	// rename record  [] [{A North}]
}
