package core

import (
	"slices"

	"midrank/core/jsonlite"
	"midrank/core/table"
)

// Levels describes the groups of a table of counts level by level: how
// many values each group has at each level of the scale, what share of the
// group that is (as R's prop.table(m, 1) gives it), and the level where
// the group's median falls.
type Levels struct {
	Names []string `json:"names"`
	// Values are the values that stand for the levels: the names when
	// every name is a number, else the positions 1, 2, 3…
	Values []float64     `json:"values"`
	Groups []LevelCounts `json:"groups"`
}

// LevelCounts is one group's values level by level.
type LevelCounts struct {
	Label  string    `json:"label"`
	Counts []int     `json:"counts"`
	Shares []float64 `json:"shares"`
	// MedianLevel names the level of the group's median, or the two levels
	// it lies between ("Agree to Strongly agree") when the group has an even
	// number of values split there
	MedianLevel string `json:"median_level"`
	// MedianFrom and MedianTo are the places (0-based) of the median's
	// level, or of the two levels it lies between
	MedianFrom, MedianTo int `json:"-"`
}

// levelsOf counts the values of a table of counts per group and level; nil
// for other tables.
func levelsOf(t *table.Table, groups []Group) *Levels {
	if t.Levels == nil {
		return nil
	}
	l := &Levels{Names: t.Levels, Values: t.LevelValues, Groups: make([]LevelCounts, len(t.Labels))}
	for g := range l.Groups {
		l.Groups[g] = LevelCounts{Label: t.Labels[g], Counts: make([]int, len(t.Levels)), Shares: make([]float64, len(t.Levels))}
	}
	for i, v := range t.Values {
		if c := slices.Index(t.LevelValues, v); c >= 0 {
			l.Groups[t.Groups[i]].Counts[c]++
		}
	}
	for g := range l.Groups {
		lc := &l.Groups[g]
		for c, n := range lc.Counts {
			lc.Shares[c] = float64(n) / float64(groups[g].N)
		}
		lc.MedianFrom, lc.MedianTo = levelOf(t, groups[g].Median)
		lc.MedianLevel = t.Levels[lc.MedianFrom]
		if lc.MedianTo != lc.MedianFrom {
			lc.MedianLevel += " to " + t.Levels[lc.MedianTo]
		}
	}
	return l
}

// levelOf finds the level of a value (a group's median, which lies on a
// level or halfway between two), as the places of the levels it lies
// between: the same place twice when it is on one.
func levelOf(t *table.Table, v float64) (from, to int) {
	for c, lv := range t.LevelValues {
		switch {
		case lv == v:
			return c, c
		case c > 0 && t.LevelValues[c-1] < v && v < lv:
			return c - 1, c
		}
	}
	return 0, 0
}

func writeLevels(w *jsonlite.Writer, l *Levels) {
	if l == nil {
		w.Null()
		return
	}
	w.BeginObject()
	w.Key("names")
	writeStrings(w, l.Names)
	w.Key("values")
	w.BeginArray()
	for _, v := range l.Values {
		w.Float(v)
	}
	w.EndArray()
	w.Key("groups")
	w.BeginArray()
	for _, g := range l.Groups {
		w.BeginObject()
		w.StringMember("label", g.Label)
		w.Key("counts")
		w.BeginArray()
		for _, n := range g.Counts {
			w.Int(int64(n))
		}
		w.EndArray()
		w.Key("shares")
		w.BeginArray()
		for _, s := range g.Shares {
			w.Float(s)
		}
		w.EndArray()
		w.StringMember("median_level", g.MedianLevel)
		w.EndObject()
	}
	w.EndArray()
	w.EndObject()
}
