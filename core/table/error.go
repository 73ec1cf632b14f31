package table

import (
	"fmt"
	"strings"
)

// Error is a problem with the input that stops the analysis. It says where the
// problem is (1-based line and column, or the group) and what to do about it.
// Zero Line, Column and empty Group mean "not tied to one place".
type Error struct {
	Line   int    // 1-based line of the text, 0 if not tied to a line
	Column int    // 1-based field number on that line, 0 if not tied to a field
	Group  string // the group concerned, "" if none
	Found  string // the text found in the cell, "" if none
	Reason string // what is wrong, as a sentence fragment without a final stop
	Fix    string // what to do, as a sentence fragment without a final stop
}

// Error renders the problem as one sentence, place first:
//
//	line 4, column 2 (group "B"): "abc" is not a number; correct the cell, or write NA there to mark the value as missing.
func (e *Error) Error() string {
	var b strings.Builder
	switch {
	case e.Line > 0 && e.Column > 0:
		fmt.Fprintf(&b, "line %d, column %d", e.Line, e.Column)
	case e.Line > 0:
		fmt.Fprintf(&b, "line %d", e.Line)
	}
	switch group := quoteFound([]byte(e.Group)); {
	case group != "" && b.Len() > 0:
		fmt.Fprintf(&b, " (group %q)", group)
	case group != "":
		fmt.Fprintf(&b, "group %q", group)
	}
	if b.Len() > 0 {
		b.WriteString(": ")
	}
	b.WriteString(e.Reason)
	if e.Fix != "" {
		b.WriteString("; ")
		b.WriteString(e.Fix)
	}
	b.WriteString(".")
	return b.String()
}

// quoteFound shortens very long cell text so that a message stays readable.
func quoteFound(cell []byte) string {
	const most = 40
	s := string(cell)
	if r := []rune(s); len(r) > most {
		s = string(r[:most]) + "…"
	}
	return s
}

// MaxProblems is how many cell problems Parse notes before it stops reading.
const MaxProblems = 100

// Problems are the cells of a text that could not be read, in text order
// (at most MaxProblems). Parse returns them once the rest of the text has
// been read; errors.As finds the first as an *Error.
type Problems []*Error

func (p Problems) Error() string {
	switch len(p) {
	case 1:
		return p[0].Error()
	case MaxProblems:
		return fmt.Sprintf("reading stopped after %d cells that cannot be read; the first: %s", MaxProblems, p[0].Error())
	}
	return fmt.Sprintf("%d cells cannot be read; the first: %s", len(p), p[0].Error())
}

// Unwrap gives every problem.
func (p Problems) Unwrap() []error {
	errs := make([]error, len(p))
	for i, e := range p {
		errs[i] = e
	}
	return errs
}
