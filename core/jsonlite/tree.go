package jsonlite

import "fmt"

// Node is any JSON value, nested: a scalar (Kind Null, Bool, Number or
// String, with Text as in Value), an array (Kind Array, its Items) or an
// object (Kind Object, its members' Names and Members, in order).
type Node struct {
	Kind    Kind
	Text    string
	Items   []Node
	Names   []string
	Members []Node
}

// Member is the member called name, and whether there is one.
func (n Node) Member(name string) (Node, bool) {
	for i, m := range n.Names {
		if m == name {
			return n.Members[i], true
		}
	}
	return Node{}, false
}

// ParseTree reads any JSON value nested at most depth arrays and objects
// deep (a bound on the work and stack a hostile text can cause), refusing
// repeated member names and anything after the value but white space.
func ParseTree(data []byte, depth int) (Node, error) {
	p := parser{s: data}
	p.space()
	n, err := p.node(depth)
	if err != nil {
		return Node{}, err
	}
	p.space()
	if p.i != len(p.s) {
		return Node{}, p.fail("unexpected text after the value")
	}
	return n, nil
}

// node reads one value of a tree, at most depth levels deep.
func (p *parser) node(depth int) (Node, error) {
	if p.i >= len(p.s) || p.s[p.i] != '[' && p.s[p.i] != '{' {
		v, err := p.scalar()
		return Node{Kind: v.Kind, Text: v.Text}, err
	}
	if depth == 0 {
		return Node{}, p.fail("values nest too deep")
	}
	if p.s[p.i] == '{' {
		n := Node{Kind: Object}
		err := p.object(func(name string) error {
			if _, dup := n.Member(name); dup {
				return p.fail(fmt.Sprintf("the member %q appears twice", name))
			}
			m, err := p.node(depth - 1)
			n.Names, n.Members = append(n.Names, name), append(n.Members, m)
			return err
		})
		return n, err
	}
	n := Node{Kind: Array}
	p.eat('[')
	p.space()
	if p.eat(']') {
		return n, nil
	}
	for {
		p.space()
		item, err := p.node(depth - 1)
		if err != nil {
			return n, err
		}
		n.Items = append(n.Items, item)
		p.space()
		if p.eat(']') {
			return n, nil
		}
		if !p.eat(',') {
			return n, p.fail("expected ',' or ']'")
		}
	}
}

// Node writes a tree as compact JSON (numbers as written).
func (w *Writer) Node(n Node) {
	switch n.Kind {
	case Array:
		w.BeginArray()
		for _, item := range n.Items {
			w.Node(item)
		}
		w.EndArray()
	case Object:
		w.BeginObject()
		for i, name := range n.Names {
			w.Key(name)
			w.Node(n.Members[i])
		}
		w.EndObject()
	case String:
		w.String(n.Text)
	default: // null, true, false and numbers as written
		w.comma()
		w.b = append(w.b, n.Text...)
	}
}
