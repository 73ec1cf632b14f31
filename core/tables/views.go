package tables

import (
	"slices"

	"midrank/core"
	"midrank/core/protect"
)

// Of gives the tables of an analysis in the order a report shows them: the
// test's figures, the trend test when asked for, the groups, for a table of counts the groups level by
// level and, when pairs were compared, the pairs.
func Of(r *core.Result) []Table { return of(r, view{}) }

// Shared gives the tables as outputs that leave the analyst's screen may
// show them (results-only links; reports and files when small groups are
// protected): no group's lowest or highest value, which are single
// people's values; and when r.Plan hides groups (see package protect),
// their rows without figures, their pairs left out, and no group's rank sum
// or mean rank, nor the pairs' statistics and p-values of a procedure that
// ranks all groups together: with the H statistic and the total, these
// would let the hidden groups' rank sums be worked out; nor the exact
// critical values, which depend on every group's size.
func Shared(r *core.Result) []Table { return of(r, view{shared: true, plan: r.Plan()}) }

// view is what a set of tables may show.
type view struct {
	shared bool         // for sharing: no lowest or highest values
	plan   protect.Plan // the groups hidden
}

func of(r *core.Result, v view) []Table {
	out := []Table{Figures(r)}
	if r.Trend != nil {
		out = append(out, Trend(r))
	}
	if v.plan.Any() {
		for i := range out {
			withhold(out[i], func(int) bool { return true }, "exact_critical_value")
		}
	}
	out = append(out, groups(r, v))
	if r.Levels != nil {
		out = append(out, levels(r, v))
	}
	if r.PostHoc != nil {
		out = append(out, pairs(r, v))
	}
	return out
}

// withhold replaces the cells of the columns keys in the rows that hide
// reports as hidden by "not shown".
func withhold(t Table, hide func(row int) bool, keys ...string) {
	for j, c := range t.Columns {
		if !slices.Contains(keys, c.Key) {
			continue
		}
		for i := range t.Rows {
			if hide(i) {
				t.Rows[i][j] = Cell{Text: withheld}
			}
		}
	}
}

// Keys are the column keys a table called name can have, in order (nil
// for a name that is no table's): what a results-only link's tables are
// checked against when it is opened.
func Keys(name string) []string {
	switch name {
	case "figures":
		return keysOf(figureColumns)
	case "trend":
		return keysOf(trendColumns)
	case "groups":
		return keysOf(groupColumns)
	case "levels":
		return keysOf(levelColumns)
	case "pairs":
		return keysOf(pairColumns)
	}
	return nil
}

func keysOf[T any](columns []column[T]) []string {
	keys := make([]string, len(columns))
	for i, c := range columns {
		keys[i] = c.Key
	}
	return keys
}
