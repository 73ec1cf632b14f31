package tables_test

import (
	"fmt"
	"strings"

	"midrank/core"
	"midrank/core/tables"
)

// printTable walks a table as every renderer walks it: the headings, then
// each row as shown.
func printTable(t tables.Table) {
	var headings []string
	for _, c := range t.Columns {
		headings = append(headings, c.Heading)
	}
	fmt.Println(strings.Join(headings, " | "))
	for _, row := range t.Rows {
		var cells []string
		for _, cell := range row {
			cells = append(cells, cell.Text)
		}
		fmt.Println(strings.Join(cells, " | "))
	}
}

// The groups of a small invented example, as the analyst's screen shows
// them (the test's figures come first).
func ExampleOf() {
	r, err := core.Analyze([]byte("site,minutes\nA,12\nA,15\nA,11\nB,20\nB,22\nB,19\nC,14\nC,30\nC,25\n"), core.Options{PostHoc: "none"})
	if err != nil {
		panic(err)
	}
	printTable(tables.Of(r)[1])
	// Output:
	// Group | Values | Missing | Median | Lower quartile | Upper quartile | Lowest | Highest | Mean rank | Rank sum
	// A | 3 | 0 | 12 | 11.5 | 13.5 | 11 | 15 | 2.333 | 7
	// B | 3 | 0 | 20 | 19.5 | 21 | 19 | 22 | 6 | 18
	// C | 3 | 0 | 25 | 19.5 | 27.5 | 14 | 30 | 6.667 | 20
}

// The same kind of table as shared with small groups protected: site A,
// under 5 values, is hidden, and so is B, the smallest of the others, so
// that A's figures cannot be worked out from the total.
func ExampleShared() {
	r, err := core.Analyze([]byte("site,minutes\nA,12\nA,15\nA,11\nB,20\nB,22\nB,19\nB,24\nB,21\nB,18\n"+
		"C,14\nC,30\nC,25\nC,17\nC,28\nC,26\nC,23\n"), core.Options{PostHoc: "none", MinGroupSize: 5})
	if err != nil {
		panic(err)
	}
	printTable(tables.Shared(r)[1])
	// Output:
	// Group | Values | Missing | Median | Lower quartile | Upper quartile
	// A | < 5 | not shown | not shown | not shown | not shown
	// B | not shown | not shown | not shown | not shown | not shown
	// C | 7 | 0 | 25 | 20 | 27
}
