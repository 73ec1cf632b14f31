package tables_test

import (
	"fmt"
	"strings"

	"midrank/core"
	"midrank/core/tables"
)

// The groups of a small invented example, walked as every renderer walks
// them: the headings, then each row as shown.
func ExampleGroups() {
	r, err := core.Analyze([]byte("site,minutes\nA,12\nA,15\nA,11\nB,20\nB,22\nB,19\nC,14\nC,30\nC,25\n"), core.Options{PostHoc: "none"})
	if err != nil {
		panic(err)
	}
	g := tables.Groups(r)
	var headings []string
	for _, c := range g.Columns[:5] {
		headings = append(headings, c.Heading)
	}
	fmt.Println(strings.Join(headings, " | "))
	for _, row := range g.Rows {
		var cells []string
		for _, cell := range row[:5] {
			cells = append(cells, cell.Text)
		}
		fmt.Println(strings.Join(cells, " | "))
	}
	// Output:
	// Group | Values | Missing | Median | Lower quartile
	// A | 3 | 0 | 12 | 11.5
	// B | 3 | 0 | 20 | 19.5
	// C | 3 | 0 | 25 | 19.5
}
