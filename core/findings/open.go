package findings

import (
	"fmt"
	"slices"
	"strconv"

	"midrank/core"
	"midrank/core/display"
	"midrank/core/jsonlite"
	"midrank/core/link"
	"midrank/core/tables"
)

// depth bounds the nesting of results JSON: tables → table → values → row
// → cell is five levels under the top.
const depth = 6

// Open checks the JSON of an opened results-only link (or of a sealed link
// that held results) against the shape Encode writes — every member there
// and of its kind, every table one of Midrank's with columns of that table,
// every row as long as the columns, the settings valid — and returns it
// written anew. Whatever the bytes, it returns an error or JSON of that
// shape, never panics, and its work is bounded by the bytes' length.
func Open(raw []byte) ([]byte, error) {
	n, err := jsonlite.ParseTree(raw, depth)
	if err == nil {
		err = document(n)
	}
	if err != nil {
		return nil, &link.Error{Reason: "what it holds is not a set of Midrank results (" + err.Error() + ")"}
	}
	var w jsonlite.Writer
	w.Node(n)
	return w.Bytes(), nil
}

// check is a rule for one JSON value, at path (for the message). The
// functions that make rules are kept from being inlined: inlined, each call
// would compile its own copy of the rule's closure (27 KB of the module).
type check func(path string, n jsonlite.Node) error

//go:noinline
func kind(want ...jsonlite.Kind) check {
	return func(path string, n jsonlite.Node) error {
		if !slices.Contains(want, n.Kind) {
			return fmt.Errorf("%s is a %s, not a %s", path, n.Kind, want[0])
		}
		return nil
	}
}

var (
	text      = kind(jsonlite.String)
	flag      = kind(jsonlite.Bool)
	figure    = kind(jsonlite.Number, jsonlite.Null)
	label     = kind(jsonlite.String, jsonlite.Null)
	cellValue = kind(jsonlite.Number, jsonlite.String, jsonlite.Bool, jsonlite.Null)
)

// whole is a whole number from 0.
func whole(path string, n jsonlite.Node) error {
	if v, err := strconv.ParseUint(n.Text, 10, 31); n.Kind != jsonlite.Number || err != nil || v > 1<<30 {
		return fmt.Errorf("%s is not a whole number", path)
	}
	return nil
}

// member is a member's name and its rule.
type member struct {
	name string
	rule check
}

// object checks an object with exactly these members.
//
//go:noinline
func object(members ...member) check {
	return func(path string, n jsonlite.Node) error {
		if n.Kind != jsonlite.Object {
			return fmt.Errorf("%s is a %s, not an object", path, n.Kind)
		}
		for _, m := range members {
			v, ok := n.Member(m.name)
			if !ok {
				return fmt.Errorf("%s has no %q", path, m.name)
			}
			if err := m.rule(path+"."+m.name, v); err != nil {
				return err
			}
		}
		for _, name := range n.Names {
			if !slices.ContainsFunc(members, func(m member) bool { return m.name == name }) {
				return fmt.Errorf("%s holds %q, which is not part of Midrank's results", path, name)
			}
		}
		return nil
	}
}

// arrayOf checks an array whose items each pass item.
//
//go:noinline
func arrayOf(item check) check {
	return func(path string, n jsonlite.Node) error {
		if n.Kind != jsonlite.Array {
			return fmt.Errorf("%s is a %s, not an array", path, n.Kind)
		}
		for i, v := range n.Items {
			if err := item(fmt.Sprintf("%s[%d]", path, i), v); err != nil {
				return err
			}
		}
		return nil
	}
}

// oneOf checks a string among choices.
//
//go:noinline
func oneOf(choices []string) check {
	return func(path string, n jsonlite.Node) error {
		if n.Kind != jsonlite.String || !slices.Contains(choices, n.Text) {
			return fmt.Errorf("%s is not one of %q", path, choices)
		}
		return nil
	}
}

// document is the rule for the whole JSON.
func document(n jsonlite.Node) error {
	if f, ok := n.Member("findings"); n.Kind == jsonlite.Object && ok && f.Text != strconv.Itoa(Format) {
		return fmt.Errorf("it is in format %s of Midrank's results, and this version reads format %d; open it with the version that made it", f.Text, Format)
	}
	return object(member{"findings", whole}, member{"version", text}, member{"n", whole}, member{"k", whole},
		member{"alpha", kind(jsonlite.Number)}, member{"measure", text}, member{"significant", flag}, member{"reference", label},
		member{"p_method_reason", text}, member{"result_line", text}, member{"decision", text}, member{"protection", text},
		member{"warnings", arrayOf(text)}, member{"options", options},
		member{"groups", arrayOf(object(member{"label", text}, member{"size", text}, member{"median", figure}, member{"q1", figure},
			member{"q3", figure}, member{"mean_rank", figure}))},
		member{"tables", tableSet})("results", n)
}

// options are settings core.DecodeOptions accepts.
func options(path string, n jsonlite.Node) error {
	if n.Kind != jsonlite.Object {
		return fmt.Errorf("%s is a %s, not an object", path, n.Kind)
	}
	var w jsonlite.Writer
	w.Node(n)
	o, err := core.DecodeOptions(w.Bytes())
	if err != nil {
		return err
	}
	return o.Check()
}

// tableSet checks the tables: each one of Midrank's, its columns that
// table's, its rows as long as its columns, values and text alike.
func tableSet(path string, n jsonlite.Node) error {
	if n.Kind != jsonlite.Object {
		return fmt.Errorf("%s is a %s, not an object", path, n.Kind)
	}
	for i, name := range n.Names {
		keys := tables.Keys(name)
		if keys == nil {
			return fmt.Errorf("%s holds %q, which is not one of Midrank's tables", path, name)
		}
		t := n.Members[i]
		err := object(member{"title", text}, member{"note", text}, member{"list", flag},
			member{"columns", arrayOf(object(member{"key", oneOf(keys)}, member{"heading", text}, member{"unit", oneOf([]string{"", "measure"})},
				member{"show", oneOf(display.ShowNames())}))},
			member{"values", arrayOf(arrayOf(cellValue))}, member{"text", arrayOf(arrayOf(text))})(path+"."+name, t)
		if err != nil {
			return err
		}
		columns, _ := t.Member("columns")
		values, _ := t.Member("values")
		shown, _ := t.Member("text")
		if len(values.Items) != len(shown.Items) {
			return fmt.Errorf("%s.%s has %d rows of values and %d of text", path, name, len(values.Items), len(shown.Items))
		}
		for r := range values.Items {
			if len(values.Items[r].Items) != len(columns.Items) || len(shown.Items[r].Items) != len(columns.Items) {
				return fmt.Errorf("%s.%s row %d does not have %d cells", path, name, r+1, len(columns.Items))
			}
		}
	}
	return nil
}
