package table

import (
	"fmt"
	"unicode/utf8"
)

// Bounds of what Parse reads, each checked before the memory it guards is
// taken, so that a wrong file (a database dump, a disk image, one endless
// line) gets a message rather than exhausting the machine.
const (
	// MaxText is the largest text read: 256 MB, several million values,
	// far beyond the survey and HR exports this tool serves, and within what
	// a browser tab can hold twice (the text and its copy in the module).
	MaxText = 256 << 20
	// MaxGroups is the most groups: 10,000. More is almost always a column
	// of values or identifiers read as labels.
	MaxGroups = 10_000
	// MaxLabel is the longest group label, in characters: 1,000.
	MaxLabel = 1_000
)

// checkSize refuses a text over MaxText.
func checkSize(data []byte) error {
	if len(data) > MaxText {
		return &Error{Reason: fmt.Sprintf("the text is %s; the most that is read is %s", megabytes(len(data)), megabytes(MaxText)),
			Fix: "analyse a part of it, or save only the group and value columns"}
	}
	return nil
}

// megabytes writes a size in bytes as MB, one decimal.
func megabytes(n int) string { return fmt.Sprintf("%.1f MB", float64(n)/(1<<20)) }

// checkLabel refuses a label over MaxLabel characters at line and column.
func checkLabel(label []byte, line, column int) error {
	if len(label) <= MaxLabel || utf8.RuneCount(label) <= MaxLabel {
		return nil
	}
	return &Error{Line: line, Column: column, Found: quoteFound(label),
		Reason: fmt.Sprintf("a group label of %d characters; the most is %d", utf8.RuneCount(label), MaxLabel),
		Fix:    "check that this column holds group labels, and that quotes are closed"}
}

// tooManyGroups is the error for group number MaxGroups+1, met at line and
// column.
func tooManyGroups(line, column int) error {
	return &Error{Line: line, Column: column,
		Reason: fmt.Sprintf("there are more than %d groups", MaxGroups),
		Fix:    "check that the group column holds group labels and not values or identifiers, or choose the other layout"}
}
