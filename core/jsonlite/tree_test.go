package jsonlite

import (
	"bytes"
	"encoding/json"
	"strings"
	"testing"
)

// sameAsStdlib checks that a tree written back is the same JSON as
// encoding/json reads from the text (the reference), numbers compared as
// numbers.
func sameAsStdlib(t *testing.T, text string, n Node) {
	t.Helper()
	var w Writer
	w.Node(n)
	var want, got any
	if err := json.Unmarshal([]byte(text), &want); err != nil {
		t.Fatalf("encoding/json refuses %q, which ParseTree read: %v", text, err)
	}
	if err := json.Unmarshal(w.Bytes(), &got); err != nil {
		t.Fatalf("written back %q is not JSON: %v", w.Bytes(), err)
	}
	if !bytes.Equal(stdlib(want), stdlib(got)) {
		t.Errorf("%q read and written back as %q", text, w.Bytes())
	}
}

func TestParseTree(t *testing.T) {
	for _, text := range []string{`{}`, `[]`, `1`, `"x"`, `null`, ` {"a": [1, [2, {"b": null}], "c\u00e9"], "d": {"e": true}} `,
		`[[[]]]`, `{"t": {"columns": [{"key": "h"}], "values": [[1.5, null, "a", false]]}}`} {
		n, err := ParseTree([]byte(text), 4)
		if err != nil {
			t.Errorf("ParseTree(%q): %v", text, err)
			continue
		}
		sameAsStdlib(t, text, n)
	}
	for _, c := range []struct{ text, says string }{
		{`[[[[[1]]]]]`, "too deep"},
		{`{"a": 1, "a": 2}`, "appears twice"},
		{`[1, 2`, "expected"},
		{`{"a": 1} x`, "after the value"},
		{`[01]`, "expected"},
		{``, "expected a value"},
	} {
		if _, err := ParseTree([]byte(c.text), 4); err == nil || !strings.Contains(err.Error(), c.says) {
			t.Errorf("ParseTree(%q) = %v, want an error saying %q", c.text, err, c.says)
		}
	}
	obj, _ := ParseTree([]byte(`{"a": 1, "b": [2]}`), 2)
	if b, ok := obj.Member("b"); !ok || b.Kind != Array || b.Items[0].Text != "2" {
		t.Errorf(`Member("b") = %+v, %v`, b, ok)
	}
	if _, ok := obj.Member("c"); ok {
		t.Error(`Member("c") found`)
	}
}

// FuzzParseTree: whatever the text, no panic; a tree read is JSON that
// encoding/json reads alike.
func FuzzParseTree(f *testing.F) {
	for _, s := range []string{`{"a":[1,{"b":"c"}]}`, `[[["x"]]]`, `{"a":{"b":{"c":{"d":1}}}}`, `[1e400]`, `"\ud800"`} {
		f.Add(s)
	}
	f.Fuzz(func(t *testing.T, text string) {
		n, err := ParseTree([]byte(text), 6)
		if err == nil {
			sameAsStdlib(t, text, n)
		}
	})
}
