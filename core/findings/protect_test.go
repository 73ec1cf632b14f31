package findings

import (
	"fmt"
	"slices"
	"strconv"
	"strings"
	"testing"

	"midrank/core"
	"midrank/core/display"
	"midrank/core/jsonlite"
)

// TestProtectedGroupsCannotBeWorkedOut tries to recover a protected
// group's size, rank sum and median from everything the shared results
// hold — the total minus the shown groups, the groups' rank sums (which
// with H and the total would give a hidden group's), the letters, the
// pairs' statistics, the decision and the warnings — and fails each time.
// The rule followed is complementary suppression (package protect).
func TestProtectedGroupsCannotBeWorkedOut(t *testing.T) {
	for _, c := range []struct {
		name string
		keep map[string]int
		opt  core.Options
	}{
		{"one small group, Dunn", map[string]int{"horsebean": 4}, core.Options{MinGroupSize: 5}},
		{"one small group, Conover–Iman", map[string]int{"horsebean": 4}, core.Options{MinGroupSize: 5, PostHoc: "conover"}},
		{"two small groups, DSCF", map[string]int{"horsebean": 4, "linseed": 2}, core.Options{MinGroupSize: 5, PostHoc: "dscf"}},
		{"two small groups, Mann–Whitney, trend", map[string]int{"horsebean": 4, "linseed": 2}, core.Options{MinGroupSize: 5, PostHoc: "mann-whitney", Trend: "two-sided"}},
		{"threshold 10: one small, reference group", map[string]int{"horsebean": 9}, core.Options{MinGroupSize: 10, Reference: "casein"}},
		{"exact p", map[string]int{"horsebean": 3, "linseed": 6, "soybean": 6, "sunflower": 0, "casein": 0, "meatmeal": 0},
			core.Options{MinGroupSize: 5, PValue: "exact", Trend: "increasing"}},
	} {
		data, _ := chicks(t, c.keep)
		doc, r := shared(t, data, c.opt)
		n, err := jsonlite.ParseTree(doc, depth)
		if err != nil {
			t.Fatal(err)
		}
		hidden := map[string]core.Group{}
		for g, group := range r.Groups {
			if r.Plan().Hidden(g) {
				hidden[group.Label] = group
			}
		}
		if len(hidden) < 2 {
			t.Fatalf("%s: %d groups hidden", c.name, len(hidden))
		}
		// sizes: the total minus the shown groups leaves several splits
		total, _ := strconv.Atoi(field(n, "n").Text)
		left, sizes := total, map[string][2]int{}
		for _, g := range field(n, "groups").Items {
			label, size := field(g, "label").Text, field(g, "size").Text
			if v, err := strconv.Atoi(size); err == nil {
				left -= v
				continue
			}
			top := total
			if strings.HasPrefix(size, "< ") {
				top, _ = strconv.Atoi(size[2:])
				top--
			}
			sizes[label] = [2]int{1, top}
		}
		for label, span := range sizes {
			others := 0 // the least the other hidden groups can hold
			for other := range sizes {
				if other != label {
					others++
				}
			}
			most := min(span[1], left-others)
			if most <= span[0] {
				t.Errorf("%s: %s's size follows: %d", c.name, label, most)
			}
			if most < hidden[label].N {
				t.Fatalf("%s: %s's true size %d is outside %d to %d", c.name, label, hidden[label].N, span[0], most)
			}
		}
		// rank sums and mean ranks of any group, letters, hidden figures
		for _, g := range field(n, "groups").Items {
			if field(g, "mean_rank").Kind != jsonlite.Null {
				t.Errorf("%s: %s's mean rank is shared", c.name, field(g, "label").Text)
			}
			if _, ok := hidden[field(g, "label").Text]; ok && field(g, "median").Kind != jsonlite.Null {
				t.Errorf("%s: a hidden group's median is shared", c.name)
			}
		}
		groups := field(field(n, "tables"), "groups")
		for _, col := range field(groups, "columns").Items {
			if key := field(col, "key").Text; slices.Contains([]string{"rank_sum", "mean_rank", "letters", "lowest", "highest"}, key) {
				t.Errorf("%s: the groups table has %s", c.name, key)
			}
		}
		for i, row := range field(groups, "values").Items {
			if _, ok := hidden[row.Items[0].Text]; !ok {
				continue
			}
			for j, cell := range row.Items[1:] {
				if cell.Kind == jsonlite.Number {
					t.Errorf("%s: row %d of the groups table shows figure %d of a hidden group", c.name, i+1, j+2)
				}
			}
		}
		// pairs: none with a hidden group; no joint-rank statistics
		if pairs, ok := field(n, "tables").Member("pairs"); ok {
			for _, row := range field(pairs, "values").Items {
				if _, a := hidden[row.Items[0].Text]; a {
					t.Errorf("%s: a pair with %s is shared", c.name, row.Items[0].Text)
				}
				if _, b := hidden[row.Items[1].Text]; b {
					t.Errorf("%s: a pair with %s is shared", c.name, row.Items[1].Text)
				}
			}
			for _, col := range field(pairs, "columns").Items {
				if key := field(col, "key").Text; r.PostHoc.Method.JointRanks() && (key == "statistic" || key == "p" || key == "p_adjusted") {
					t.Errorf("%s: the pairs' %s, from the ranks of all groups, is shared", c.name, key)
				}
			}
		}
		// the exact critical values and the method's reason depend on every group's size
		for _, name := range []string{"figures", "trend"} {
			if table, ok := field(n, "tables").Member(name); ok {
				for j, col := range field(table, "columns").Items {
					if field(col, "key").Text == "exact_critical_value" && field(table, "values").Items[0].Items[j].Kind != jsonlite.Null {
						t.Errorf("%s: the %s table gives the exact critical value", c.name, name)
					}
				}
			}
		}
		if reason := field(n, "p_method_reason").Text; strings.Contains(reason, "groups of") {
			t.Errorf("%s: the method's reason gives the sizes: %s", c.name, reason)
		}
		// the words: no hidden group's size or median
		words := field(n, "decision").Text
		for _, w := range field(n, "warnings").Items {
			words += " " + w.Text
		}
		for label, g := range hidden {
			median := display.Figure.Format(g.Median)
			for _, figure := range []string{label + " " + median, fmt.Sprintf("%q has %d values", label, g.N)} {
				if strings.Contains(words, figure) {
					t.Errorf("%s: the words give %s's %q", c.name, label, figure)
				}
			}
			if !strings.Contains(words, label+" not shown (protected)") {
				t.Errorf("%s: the decision does not speak of %s as protected", c.name, label)
			}
		}
		if !strings.Contains(field(n, "protection").Text, "Small groups protected") {
			t.Errorf("%s: the results do not say which protection was applied: %q", c.name, field(n, "protection").Text)
		}
	}
}

// field is n's member called name (the zero Node when there is none).
func field(n jsonlite.Node, name string) jsonlite.Node {
	m, _ := n.Member(name)
	return m
}
